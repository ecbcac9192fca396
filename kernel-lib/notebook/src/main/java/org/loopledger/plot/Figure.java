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
    /**
     * A dashed horizontal reference line (0 dB, -180 deg) on panel {@code panel} at {@code y}: drawn only where
     * it falls inside the panel's axis range, never widening that range, and not part of the plotted data.
     */
    record Guide(int panel, double y) {}

    private final String title;
    private final List<XYChart> panels;
    private final int columns;
    private final List<Guide> guides;
    private final String note;

    private Figure(String title, List<XYChart> panels, int columns, List<Guide> guides, String note) {
        if (panels.isEmpty()) throw new IllegalArgumentException("a figure needs at least one panel");
        if (columns < 1) throw new IllegalArgumentException("a figure needs at least one column, got " + columns);
        this.title = title == null ? "" : title;
        this.panels = List.copyOf(panels);
        this.columns = Math.min(columns, panels.size());
        this.guides = List.copyOf(guides);
        this.note = note == null ? "" : note;
    }

    private Figure(String title, List<XYChart> panels, int columns) { this(title, panels, columns, List.of(), ""); }

    /** This figure with reference lines added (package use: the plot builders decide where they mean something). */
    Figure withGuides(List<Guide> more) {
        List<Guide> all = new java.util.ArrayList<>(guides);
        all.addAll(more);
        return new Figure(title, panels, columns, all, note);
    }

    /** This figure with a one-line note under the panels (how the figure was made, e.g. how phase was unwrapped). */
    Figure withNote(String note) { return new Figure(title, panels, columns, guides, note); }

    /**
     * The panels of {@code upper} and then of {@code lower} in one column under {@code title}, keeping both
     * figures' reference lines and notes (e.g. a Bode figure with a coherence panel below).
     */
    public static Figure stacked(String title, Figure upper, Figure lower) {
        List<XYChart> p = new java.util.ArrayList<>(upper.panels);
        p.addAll(lower.panels);
        List<Guide> g = new java.util.ArrayList<>(upper.guides);
        for (Guide k : lower.guides) g.add(new Guide(k.panel() + upper.panels.size(), k.y()));
        String n = upper.note.isEmpty() ? lower.note : lower.note.isEmpty() || lower.note.equals(upper.note) ? upper.note : upper.note + " " + lower.note;
        return new Figure(title, p, 1, g, n);
    }

    /** Panels stacked in one column. */
    public static Figure column(String title, List<XYChart> panels) { return new Figure(title, panels, 1); }

    /** Panels on a grid with {@code columns} columns, filled row by row. */
    public static Figure grid(String title, int columns, List<XYChart> panels) { return new Figure(title, panels, columns); }

    /** A single chart. */
    public static Figure single(XYChart chart) { return new Figure("", List.of(chart), 1); }

    public String title() { return title; }

    /** The note under the panels, "" for none. */
    public String note() { return note; }

    List<Guide> guides() { return guides; }

    /** The panels (the charts themselves, for inspection of their data series). */
    public List<XYChart> panels() { return panels; }

    public int columns() { return columns; }

    private int rows() { return (panels.size() + columns - 1) / columns; }

    int cellWidth() { return panels.stream().mapToInt(XYChart::getWidth).max().orElse(600); }

    int cellHeight() { return panels.stream().mapToInt(XYChart::getHeight).max().orElse(300); }

    private int titleHeight() { return title.isEmpty() ? 0 : FigureDrawing.TITLE_PX; }

    public int widthPx() { return columns * cellWidth(); }

    public int heightPx() { return titleHeight() + rows() * cellHeight() + (note.isEmpty() ? 0 : FigureDrawing.NOTE_PX); }

    /** Top of the panel grid (below the title). */
    int panelsTop() { return titleHeight(); }

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
