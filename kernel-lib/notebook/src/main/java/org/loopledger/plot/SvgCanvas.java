package org.loopledger.plot;

import java.awt.Color;
import java.awt.Font;
import java.awt.font.FontRenderContext;
import java.util.Locale;
import java.util.zip.CRC32;

/**
 * Writes a figure as compact SVG: each polyline one {@code <path>} (absolute first point, then relative
 * steps in tenths of a pixel, which no screen shows), consecutive lines with the same stroke merged into
 * one path (grids), text as {@code <text>} in the document's shared font, stroke and text styles written
 * once per run of equal styles. Deterministic: clip ids come from a checksum of the drawing, so the same
 * figure gives the same bytes, and two different figures inlined into one HTML page do not share ids.
 */
final class SvgCanvas implements Canvas {
    private static final FontRenderContext FRC = new FontRenderContext(null, true, true);
    private static final String CLIP_ID = "\u0000";

    private final int widthPx, heightPx;
    private final StringBuilder body = new StringBuilder(32 * 1024);
    private final StringBuilder path = new StringBuilder(8 * 1024);
    private Pen pathPen;
    private String textGroup;
    private int clips;

    SvgCanvas(int widthPx, int heightPx) {
        this.widthPx = widthPx;
        this.heightPx = heightPx;
    }

    @Override
    public void fill(double x, double y, double w, double h, Color fill, double opacity) {
        flush();
        body.append("<rect x=\"").append(n(x)).append("\" y=\"").append(n(y)).append("\" width=\"").append(n(w)).append("\" height=\"").append(n(h))
                .append("\" fill=\"").append(hex(fill)).append('"');
        if (opacity < 1) body.append(" fill-opacity=\"").append(String.format(Locale.ROOT, "%.2f", opacity)).append('"');
        body.append("/>\n");
    }

    @Override
    public void outline(double x, double y, double w, double h, Pen pen) {
        double[] xs = {x, x + w, x + w, x, x}, ys = {y, y, y + h, y + h, y};
        polyline(xs, ys, 5, pen);
    }

    @Override
    public void polyline(double[] x, double[] y, int n, Pen pen) {
        if (!pen.sameAs(pathPen)) {
            flush();
            pathPen = pen;
        }
        long px = 0, py = 0;
        boolean down = false, relative = false;
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(y[i])) { down = false; continue; }
            long tx = Math.round(x[i] * 10), ty = Math.round(y[i] * 10);
            if (!down) {
                path.append('M').append(t(tx)).append(sep(ty)).append(t(ty));
                down = true;
                relative = false;
            } else {
                if (tx == px && ty == py) continue;
                long dx = tx - px, dy = ty - py;
                if (relative) path.append(sep(dx));
                else path.append('l');
                relative = true;
                path.append(t(dx)).append(sep(dy)).append(t(dy));
            }
            px = tx;
            py = ty;
        }
    }

    @Override
    public void dots(double[] x, double[] y, int n, double r, Color fill) {
        flush();
        StringBuilder d = new StringBuilder();
        long rr = Math.round(r * 10);
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(y[i])) continue;
            long cx = Math.round(x[i] * 10), cy = Math.round(y[i] * 10);
            // a circle as two arcs: M(cx - r, cy) a r r 0 1 0 2r 0 a r r 0 1 0 -2r 0
            d.append('M').append(t(cx - rr)).append(' ').append(t(cy)).append('a').append(t(rr)).append(' ').append(t(rr)).append(" 0 1 0 ")
                    .append(t(2 * rr)).append(" 0a").append(t(rr)).append(' ').append(t(rr)).append(" 0 1 0 ").append(t(-2 * rr)).append(" 0");
        }
        if (d.length() > 0) body.append("<path fill=\"").append(hex(fill)).append("\" d=\"").append(d).append("\"/>\n");
    }

    @Override
    public void text(String s, double x, double y, Anchor anchor, Type type, Color color, boolean vertical) {
        flushPath();
        String group = "font-size=\"" + trim(type.sizePx()) + "\"" + (type.bold() ? " font-weight=\"bold\"" : "")
                + (anchor == Anchor.START ? "" : " text-anchor=\"" + (anchor == Anchor.MIDDLE ? "middle" : "end") + "\"")
                + (color.equals(Palette.INK) ? "" : " fill=\"" + hex(color) + "\"");
        if (!group.equals(textGroup)) {
            closeText();
            body.append("<g ").append(group).append(">\n");
            textGroup = group;
        }
        body.append("<text x=\"").append(n(x)).append("\" y=\"").append(n(y)).append('"');
        if (vertical) body.append(" transform=\"rotate(-90 ").append(n(x)).append(' ').append(n(y)).append(")\"");
        body.append('>').append(escape(s)).append("</text>\n");
    }

    @Override
    public double textWidth(String s, Type type) { return font(type).getStringBounds(s, FRC).getWidth(); }

    static Font font(Type type) { return new Font(Font.SANS_SERIF, type.bold() ? Font.BOLD : Font.PLAIN, 1).deriveFont(type.sizePx()); }

    @Override
    public void clip(double x, double y, double w, double h) {
        flush();
        clips++;
        body.append("<clipPath id=\"").append(CLIP_ID).append(clips).append("\"><rect x=\"").append(n(x)).append("\" y=\"").append(n(y))
                .append("\" width=\"").append(n(w)).append("\" height=\"").append(n(h)).append("\"/></clipPath>\n<g clip-path=\"url(#")
                .append(CLIP_ID).append(clips).append(")\">\n");
    }

    @Override
    public void unclip() {
        flush();
        body.append("</g>\n");
    }

    /** The finished document: an {@code <svg>} element without XML prolog, ready to inline or to save. */
    String document() {
        flush();
        CRC32 crc = new CRC32();
        crc.update(body.toString().getBytes(java.nio.charset.StandardCharsets.UTF_8));
        String id = String.format(Locale.ROOT, "ll%08x-", crc.getValue());
        return "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + widthPx + "\" height=\"" + heightPx + "\" viewBox=\"0 0 " + widthPx + " " + heightPx
                + "\" font-family=\"" + FONT_FAMILY + "\" fill=\"" + hex(Palette.INK) + "\">\n" + body.toString().replace(CLIP_ID, id) + "</svg>\n";
    }

    private void flush() {
        flushPath();
        closeText();
    }

    private void closeText() {
        if (textGroup != null) {
            body.append("</g>\n");
            textGroup = null;
        }
    }

    private void flushPath() {
        if (pathPen != null && path.length() > 0) {
            body.append("<path fill=\"none\" stroke=\"").append(hex(pathPen.color())).append('"');
            if (pathPen.widthPx() != 1f) body.append(" stroke-width=\"").append(trim(pathPen.widthPx())).append('"');
            if (pathPen.dashPx() != null) {
                body.append(" stroke-dasharray=\"");
                for (int i = 0; i < pathPen.dashPx().length; i++) body.append(i == 0 ? "" : " ").append(trim(pathPen.dashPx()[i]));
                body.append('"');
            } else if (pathPen.widthPx() > 1.2f) {
                body.append(" stroke-linejoin=\"round\" stroke-linecap=\"round\"");
            }
            body.append(" d=\"").append(path).append("\"/>\n");
        }
        path.setLength(0);
        pathPen = null;
    }

    /** Tenths of a pixel as the shortest decimal: 125 -> 12.5, 120 -> 12, -5 -> -.5. */
    static String t(long tenths) {
        long a = Math.abs(tenths);
        String s = a % 10 == 0 ? Long.toString(a / 10) : a < 10 ? "." + a : (a / 10) + "." + (a % 10);
        return tenths < 0 ? "-" + s : s;
    }

    /** A separator before a number: none before a minus sign. */
    private static String sep(long next) { return next < 0 ? "" : " "; }

    private static String n(double px) { return t(Math.round(px * 10)); }

    private static String trim(float v) { return t(Math.round(v * 10)); }

    static String hex(Color c) { return String.format(Locale.ROOT, "#%02x%02x%02x", c.getRed(), c.getGreen(), c.getBlue()); }

    static String escape(String s) {
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '&' -> b.append("&amp;");
                case '"' -> b.append("&quot;");
                default -> { if (c >= 0x20 || c == '\t') b.append(c); }
            }
        }
        return b.toString();
    }
}
