package org.loopledger.plot;

import java.awt.Color;

/**
 * Where a figure's drawing goes: compact SVG text ({@link SvgCanvas}) or a Java2D raster
 * ({@link RasterCanvas}). Coordinates are pixels, y downwards. {@link FigureDrawing} lays a figure out
 * once and sends the same primitives to either, so the SVG and the PNG show the same picture.
 */
interface Canvas {
    /** A stroke: colour, width in px, dash pattern in px (null for a solid line). */
    record Pen(Color color, float widthPx, float[] dashPx) {
        boolean sameAs(Pen o) {
            return o != null && color.equals(o.color) && widthPx == o.widthPx && java.util.Arrays.equals(dashPx, o.dashPx);
        }
    }

    /** Type size in px and weight. */
    record Type(float sizePx, boolean bold) {}

    enum Anchor { START, MIDDLE, END }

    /** Sans-serif type, as both canvases draw it. */
    String FONT_FAMILY = "sans-serif";

    /** Fills the rectangle. */
    void fill(double x, double y, double w, double h, Color fill, double opacity);

    /** Strokes the rectangle's outline. */
    void outline(double x, double y, double w, double h, Pen pen);

    /** A polyline through the first {@code n} points; a non-finite coordinate breaks it into pieces. */
    void polyline(double[] x, double[] y, int n, Pen pen);

    /** Filled circles of radius {@code r} at the first {@code n} points (non-finite ones are skipped). */
    void dots(double[] x, double[] y, int n, double r, Color fill);

    /** Text with its baseline at {@code y}; {@code vertical} turns it 90° anticlockwise about (x, y). */
    void text(String s, double x, double y, Anchor anchor, Type type, Color color, boolean vertical);

    /** The advance width of {@code s} in px. */
    double textWidth(String s, Type type);

    /** Clips what follows to the rectangle until {@link #unclip()}. */
    void clip(double x, double y, double w, double h);

    void unclip();
}
