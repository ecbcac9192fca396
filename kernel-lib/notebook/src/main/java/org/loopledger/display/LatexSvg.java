package org.loopledger.display;

import de.erichseifert.vectorgraphics2d.Document;
import de.erichseifert.vectorgraphics2d.VectorGraphics2D;
import de.erichseifert.vectorgraphics2d.svg.SVGProcessor;
import de.erichseifert.vectorgraphics2d.util.PageSize;
import org.scilab.forge.jlatexmath.TeXConstants;
import org.scilab.forge.jlatexmath.TeXFormula;
import org.scilab.forge.jlatexmath.TeXIcon;

import java.awt.Color;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.regex.Pattern;

/**
 * Typesets a LaTeX formula (math mode, the subset jlatexmath understands) as an SVG picture for the tuning
 * record, which runs no script and so cannot typeset in the browser as Jupyter does with MathJax.
 *
 * <p>jlatexmath lays the formula out with its own Computer Modern fonts; the glyphs are drawn into
 * VectorGraphics2D (already on the class path through XChart) as filled outlines, so the SVG needs no font
 * and looks the same in every browser and in print. Coordinates are rounded to 1/1000 of a unit, far below
 * a printed pixel.
 */
public final class LatexSvg {
    /** A typeset formula: SVG text and its size in CSS pixels; {@code depthPx} lies below the baseline. */
    public record Picture(String svg, int widthPx, int heightPx, int depthPx) {
        /** The picture as a {@code data:image/svg+xml;base64,} URI. */
        public String dataUri() {
            return "data:image/svg+xml;base64," + Base64.getEncoder().encodeToString(svg.getBytes(StandardCharsets.UTF_8));
        }
    }

    /** Text size of inline formulas in CSS pixels: Computer Modern looks smaller than a sans-serif of equal size; 16 px sits level with the record's 14 px body text (judged by eye in Chromium). */
    static final float INLINE_PX = 16f;
    /** Text size of display formulas. */
    static final float DISPLAY_PX = 17f;

    /** Recently typeset formulas (a record often repeats one); writing the SVG costs most of the time. */
    private static final Map<String, Picture> CACHE = new LinkedHashMap<>(64, 0.75f, true) {
        @Override protected boolean removeEldestEntry(Map.Entry<String, Picture> eldest) { return size() > 256; }
    };

    private static final Pattern LONG_DECIMALS = Pattern.compile("(\\d+\\.\\d{3})\\d+");

    private LatexSvg() {}

    /**
     * Typesets {@code tex} (without {@code $} delimiters) in display or text style.
     *
     * @throws IllegalArgumentException naming jlatexmath's complaint when the formula cannot be typeset
     */
    public static synchronized Picture render(String tex, boolean display) {
        String key = (display ? "D" : "T") + tex;
        Picture cached = CACHE.get(key);
        if (cached != null) return cached;
        Picture p = typeset(tex, display);
        CACHE.put(key, p);
        return p;
    }

    private static Picture typeset(String tex, boolean display) {
        TeXIcon icon;
        try {
            icon = new TeXFormula(tex).createTeXIcon(display ? TeXConstants.STYLE_DISPLAY : TeXConstants.STYLE_TEXT, display ? DISPLAY_PX : INLINE_PX);
        } catch (RuntimeException | Error e) {
            if (e instanceof VirtualMachineError vm) throw vm;
            throw new IllegalArgumentException("LaTeX not typeset (" + (e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage().strip()) + ")");
        }
        icon.setForeground(Color.BLACK);
        int w = Math.max(1, icon.getIconWidth()), h = Math.max(1, icon.getIconHeight());
        VectorGraphics2D g = new OutlineText();
        icon.paintIcon(null, g, 0, 0);
        Document doc = new SVGProcessor().getDocument(g.getCommands(), new PageSize(0, 0, w, h));
        ByteArrayOutputStream out = new ByteArrayOutputStream(16 * 1024);
        try {
            doc.writeTo(out);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        String svg = LONG_DECIMALS.matcher(ChartRenderer.stripProlog(out.toString(StandardCharsets.UTF_8))).replaceAll("$1");
        return new Picture(svg, w, h, Math.max(0, icon.getIconDepth()));
    }

    /** Draws every string as the filled outline of its glyphs, so the SVG carries paths instead of font names. */
    private static final class OutlineText extends VectorGraphics2D {
        @Override
        public void drawString(String str, float x, float y) {
            if (str != null && !str.isEmpty()) fill(getFont().createGlyphVector(getFontRenderContext(), str).getOutline(x, y));
        }

        @Override
        public void drawString(String str, int x, int y) { drawString(str, (float) x, (float) y); }

        @Override
        public void drawChars(char[] data, int offset, int length, int x, int y) { drawString(new String(data, offset, length), (float) x, (float) y); }
    }
}
