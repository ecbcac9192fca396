package org.loopledger.plot;

import org.knowm.xchart.XYChart;

import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.util.List;

/**
 * One or more panels laid out on a grid (row by row) under an optional title: a Bode plot is two panels
 * in one column, a Gang of Four panel four in two columns. Each panel is described by an XChart
 * {@link XYChart} (series, colours, strokes, axis titles, log axes, fixed ranges, legend); the figure
 * draws itself with its own layout ({@code FigureDrawing}) as compact SVG ({@link #svg()}) or on a
 * Java2D surface ({@link #paint}, {@link #toImage}), so both show the same picture.
 */
public final class Figure {
    private final String title;
    private final List<XYChart> panels;
    private final int columns;

    private Figure(String title, List<XYChart> panels, int columns) {
        if (panels.isEmpty()) throw new IllegalArgumentException("a figure needs at least one panel");
        if (columns < 1) throw new IllegalArgumentException("a figure needs at least one column, got " + columns);
        this.title = title == null ? "" : title;
        this.panels = List.copyOf(panels);
        this.columns = Math.min(columns, panels.size());
    }

    /** Panels stacked in one column. */
    public static Figure column(String title, List<XYChart> panels) { return new Figure(title, panels, 1); }

    /** Panels on a grid with {@code columns} columns, filled row by row. */
    public static Figure grid(String title, int columns, List<XYChart> panels) { return new Figure(title, panels, columns); }

    /** A single chart. */
    public static Figure single(XYChart chart) { return new Figure("", List.of(chart), 1); }

    public String title() { return title; }

    /** The panels (the charts themselves, for inspection of their data series). */
    public List<XYChart> panels() { return panels; }

    public int columns() { return columns; }

    private int rows() { return (panels.size() + columns - 1) / columns; }

    int cellWidth() { return panels.stream().mapToInt(XYChart::getWidth).max().orElse(600); }

    int cellHeight() { return panels.stream().mapToInt(XYChart::getHeight).max().orElse(300); }

    private int titleHeight() { return title.isEmpty() ? 0 : FigureDrawing.TITLE_PX; }

    public int widthPx() { return columns * cellWidth(); }

    public int heightPx() { return titleHeight() + rows() * cellHeight(); }

    /** Paints the whole figure at (0, 0) with size {@link #widthPx()} x {@link #heightPx()}. */
    public void paint(Graphics2D g) {
        FigureDrawing.draw(this, new RasterCanvas(g));
    }

    /**
     * The figure as an SVG element (no XML prolog): one {@code <path>} per series, text as {@code <text>},
     * coordinates to a tenth of a pixel. The same figure gives the same bytes.
     */
    public String svg() {
        SvgCanvas c = new SvgCanvas(widthPx(), heightPx());
        FigureDrawing.draw(this, c);
        return c.document();
    }

    /** A raster image of the figure at {@code scale} (1 = one pixel per point). */
    public BufferedImage toImage(double scale) {
        int w = (int) Math.ceil(widthPx() * scale), h = (int) Math.ceil(heightPx() * scale);
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.scale(scale, scale);
            paint(g);
        } finally {
            g.dispose();
        }
        return img;
    }

    @Override public String toString() {
        return "Figure[" + (title.isEmpty() ? "untitled" : title) + ", " + panels.size() + " panel(s), " + widthPx() + "x" + heightPx() + " px]";
    }
}
