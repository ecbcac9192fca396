package org.loopledger.plot;

import java.awt.AlphaComposite;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Composite;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.geom.AffineTransform;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;

/** Draws a figure's primitives on a Java2D {@link Graphics2D} (anti-aliased), for PNG output. */
final class RasterCanvas implements Canvas {
    private final Graphics2D g;
    private final Shape baseClip;

    RasterCanvas(Graphics2D g) {
        this.g = g;
        this.baseClip = g.getClip();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
        g.setRenderingHint(RenderingHints.KEY_FRACTIONALMETRICS, RenderingHints.VALUE_FRACTIONALMETRICS_ON);
    }

    @Override
    public void fill(double x, double y, double w, double h, Color fill, double opacity) {
        Composite old = g.getComposite();
        if (opacity < 1) g.setComposite(AlphaComposite.getInstance(AlphaComposite.SRC_OVER, (float) opacity));
        g.setColor(fill);
        g.fill(new Rectangle2D.Double(x, y, w, h));
        g.setComposite(old);
    }

    @Override
    public void outline(double x, double y, double w, double h, Pen pen) {
        stroke(pen);
        g.draw(new Rectangle2D.Double(x, y, w, h));
    }

    @Override
    public void polyline(double[] x, double[] y, int n, Pen pen) {
        Path2D.Double p = new Path2D.Double(Path2D.WIND_NON_ZERO, Math.max(2, n));
        boolean down = false;
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(y[i])) { down = false; continue; }
            if (down) p.lineTo(x[i], y[i]);
            else p.moveTo(x[i], y[i]);
            down = true;
        }
        stroke(pen);
        g.draw(p);
    }

    @Override
    public void dots(double[] x, double[] y, int n, double r, Color fill) {
        g.setColor(fill);
        for (int i = 0; i < n; i++) {
            if (Double.isFinite(x[i]) && Double.isFinite(y[i])) g.fill(new Ellipse2D.Double(x[i] - r, y[i] - r, 2 * r, 2 * r));
        }
    }

    @Override
    public void text(String s, double x, double y, Anchor anchor, Type type, Color color, boolean vertical) {
        g.setFont(SvgCanvas.font(type));
        g.setColor(color);
        double w = anchor == Anchor.START ? 0 : textWidth(s, type);
        double shift = anchor == Anchor.START ? 0 : anchor == Anchor.MIDDLE ? w / 2 : w;
        if (!vertical) {
            g.drawString(s, (float) (x - shift), (float) y);
            return;
        }
        AffineTransform old = g.getTransform();
        g.rotate(-Math.PI / 2, x, y);
        g.drawString(s, (float) (x - shift), (float) y);
        g.setTransform(old);
    }

    @Override
    public double textWidth(String s, Type type) { return SvgCanvas.font(type).getStringBounds(s, g.getFontRenderContext()).getWidth(); }

    @Override
    public void clip(double x, double y, double w, double h) { g.clip(new Rectangle2D.Double(x, y, w, h)); }

    @Override
    public void unclip() { g.setClip(baseClip); }

    private void stroke(Pen pen) {
        g.setColor(pen.color());
        g.setStroke(pen.dashPx() == null
                ? new BasicStroke(pen.widthPx(), pen.widthPx() > 1.2f ? BasicStroke.CAP_ROUND : BasicStroke.CAP_BUTT, pen.widthPx() > 1.2f ? BasicStroke.JOIN_ROUND : BasicStroke.JOIN_MITER)
                : new BasicStroke(pen.widthPx(), BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, pen.dashPx(), 0f));
    }
}
