package org.loopledger.plot;

import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.markers.SeriesMarkers;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.ArrayList;
import java.util.List;

/**
 * Lays a {@link Figure} out and draws it on a {@link Canvas}: the figure title, then per panel its
 * title, axes with ticks, labels and grid, the series (each one polyline, clipped to the plot area),
 * markers and the legend. The panels' XChart objects serve as the description (series data, colours,
 * strokes, axis titles, log axes, fixed ranges, legend position); XChart itself paints nothing, so SVG
 * and PNG come from one layout and cost time in proportion to the points drawn.
 */
final class FigureDrawing {
    static final int TITLE_PX = 24;
    private static final int PAD = 6;
    private static final Canvas.Type FIGURE_TITLE = new Canvas.Type(13, true);
    private static final Canvas.Type PANEL_TITLE = new Canvas.Type(12, true);
    private static final Canvas.Type AXIS_TITLE = new Canvas.Type(11, false);
    private static final Canvas.Type TICK = new Canvas.Type(10, false);
    private static final Canvas.Type LEGEND = new Canvas.Type(10, false);
    private static final Canvas.Pen GRID = new Canvas.Pen(Palette.GRID, 1f, null);
    private static final Canvas.Pen MINOR_GRID = new Canvas.Pen(new Color(0xF0, 0xF2, 0xF4), 1f, null);
    private static final Canvas.Pen BORDER = new Canvas.Pen(Palette.REFERENCE, 1f, null);
    private static final Canvas.Pen LEGEND_BORDER = new Canvas.Pen(Palette.GRID, 1f, null);

    private FigureDrawing() {}

    static void draw(Figure f, Canvas c) {
        c.fill(0, 0, f.widthPx(), f.heightPx(), Color.WHITE, 1);
        if (!f.title().isEmpty()) c.text(f.title(), 8, 17, Canvas.Anchor.START, FIGURE_TITLE, Palette.INK, false);
        int cw = f.cellWidth(), ch = f.cellHeight(), top = f.title().isEmpty() ? 0 : TITLE_PX;
        List<XYChart> panels = f.panels();
        for (int i = 0; i < panels.size(); i++) {
            int col = i % f.columns(), row = i / f.columns();
            XYChart p = panels.get(i);
            panel(p, c, col * cw, top + row * ch, p.getWidth(), p.getHeight());
        }
    }

    private static void panel(XYChart chart, Canvas c, double ox, double oy, double w, double h) {
        XYStyler st = chart.getStyler();
        String title = chart.getTitle() == null ? "" : chart.getTitle();
        String xTitle = chart.getXAxisTitle() == null ? "" : chart.getXAxisTitle();
        String yTitle = chart.getYAxisTitle() == null ? "" : chart.getYAxisTitle();
        double top = oy + PAD + (title.isEmpty() || !st.isChartTitleVisible() ? 0 : 20);
        double bottom = oy + h - PAD - (xTitle.isEmpty() ? 0 : 16) - 15;
        double left = ox + PAD + (yTitle.isEmpty() ? 0 : 18);
        double right = ox + w - PAD - 4;

        List<XYSeries> series = new ArrayList<>(chart.getSeriesMap().values());
        double[] xr = range(series, true, st.isXAxisLogarithmic(), st.getXAxisMin(), st.getXAxisMax(), 0.015);
        double[] yr = range(series, false, st.isYAxisLogarithmic(), st.getYAxisMin(), st.getYAxisMax(), 0.04);
        Axis ya = Axis.of(yr[0], yr[1], st.isYAxisLogarithmic(), bottom - top, 32);
        double labelW = 0;
        for (String l : ya.labels()) labelW = Math.max(labelW, c.textWidth(l, TICK));
        left += labelW + 6;
        Axis xa = Axis.of(xr[0], xr[1], st.isXAxisLogarithmic(), right - left, 64);
        double pw = right - left, ph = bottom - top;

        // grid, minor first
        gridLines(c, xa.minor(), xa, left, top, pw, ph, true, MINOR_GRID);
        gridLines(c, ya.minor(), ya, left, top, pw, ph, false, MINOR_GRID);
        gridLines(c, xa.major(), xa, left, top, pw, ph, true, GRID);
        gridLines(c, ya.major(), ya, left, top, pw, ph, false, GRID);

        // series
        c.clip(left, top, pw, ph);
        for (XYSeries s : series) {
            if (!s.isEnabled()) continue;
            double[] x = s.getXData(), y = s.getYData();
            int n = Math.min(x.length, y.length);
            double[] px = new double[n], py = new double[n];
            for (int i = 0; i < n; i++) {
                px[i] = left + clamp(xa.fraction(x[i])) * pw;
                py[i] = bottom - clamp(ya.fraction(y[i])) * ph;
            }
            if (drawsLine(s)) c.polyline(px, py, n, pen(s));
            if (drawsMarker(s)) c.dots(px, py, n, st.getMarkerSize() / 2.0, markerColor(s));
        }
        c.unclip();
        c.outline(left, top, pw, ph, BORDER);

        // tick labels and titles
        for (int i = 0; i < xa.major().length; i++) {
            c.text(xa.labels()[i], left + xa.fraction(xa.major()[i]) * pw, bottom + 13, Canvas.Anchor.MIDDLE, TICK, Palette.INK, false);
        }
        for (int i = 0; i < ya.major().length; i++) {
            c.text(ya.labels()[i], left - 5, bottom - ya.fraction(ya.major()[i]) * ph + 3.5, Canvas.Anchor.END, TICK, Palette.INK, false);
        }
        if (!title.isEmpty() && st.isChartTitleVisible()) c.text(title, left + pw / 2, oy + PAD + 12, Canvas.Anchor.MIDDLE, PANEL_TITLE, Palette.INK, false);
        if (!xTitle.isEmpty()) c.text(xTitle, left + pw / 2, oy + h - PAD - 3, Canvas.Anchor.MIDDLE, AXIS_TITLE, Palette.INK, false);
        if (!yTitle.isEmpty()) c.text(yTitle, ox + PAD + 11, top + ph / 2, Canvas.Anchor.MIDDLE, AXIS_TITLE, Palette.INK, true);

        if (st.isLegendVisible()) legend(c, series, st.getLegendPosition(), left, top, pw, ph, st.getMarkerSize());
    }

    private static void legend(Canvas c, List<XYSeries> series, Styler.LegendPosition pos, double left, double top, double pw, double ph, int markerSize) {
        List<XYSeries> shown = series.stream().filter(s -> s.isEnabled() && s.isShowInLegend()).toList();
        if (shown.isEmpty()) return;
        double textW = 0;
        for (XYSeries s : shown) textW = Math.max(textW, c.textWidth(s.getName(), LEGEND));
        double rowH = 15, bw = 8 + 22 + 6 + textW + 8, bh = 6 + rowH * shown.size() + 2;
        boolean west = pos == Styler.LegendPosition.InsideNW || pos == Styler.LegendPosition.InsideSW;
        boolean south = pos == Styler.LegendPosition.InsideSW || pos == Styler.LegendPosition.InsideSE || pos == Styler.LegendPosition.InsideS;
        double bx = west ? left + 8 : left + pw - 8 - bw, by = south ? top + ph - 8 - bh : top + 8;
        c.fill(bx, by, bw, bh, Color.WHITE, 0.9);
        c.outline(bx, by, bw, bh, LEGEND_BORDER);
        for (int i = 0; i < shown.size(); i++) {
            XYSeries s = shown.get(i);
            double cy = by + 6 + rowH * i + rowH / 2 - 1;
            if (drawsLine(s)) c.polyline(new double[] {bx + 8, bx + 30}, new double[] {cy, cy}, 2, pen(s));
            if (drawsMarker(s)) c.dots(new double[] {bx + 19}, new double[] {cy}, 1, markerSize / 2.0, markerColor(s));
            c.text(s.getName(), bx + 36, cy + 3.5, Canvas.Anchor.START, LEGEND, Palette.INK, false);
        }
    }

    private static void gridLines(Canvas c, double[] at, Axis a, double left, double top, double pw, double ph, boolean vertical, Canvas.Pen pen) {
        if (at.length == 0) return;
        double[] x = new double[3 * at.length], y = new double[3 * at.length];
        for (int i = 0; i < at.length; i++) {
            double f = a.fraction(at[i]);
            if (vertical) {
                double px = Math.round(left + f * pw) + 0.5;
                x[3 * i] = px; x[3 * i + 1] = px; y[3 * i] = top; y[3 * i + 1] = top + ph;
            } else {
                double py = Math.round(top + ph - f * ph) + 0.5;
                y[3 * i] = py; y[3 * i + 1] = py; x[3 * i] = left; x[3 * i + 1] = left + pw;
            }
            x[3 * i + 2] = Double.NaN;
            y[3 * i + 2] = Double.NaN;
        }
        c.polyline(x, y, x.length, pen);
    }

    static boolean drawsLine(XYSeries s) {
        BasicStroke st = s.getLineStyle();
        return s.getXYSeriesRenderStyle() != XYSeries.XYSeriesRenderStyle.Scatter && st != null && st.getLineWidth() > 0 && s.getLineColor() != null;
    }

    static boolean drawsMarker(XYSeries s) { return s.getMarker() != null && s.getMarker() != SeriesMarkers.NONE; }

    private static Color markerColor(XYSeries s) { return s.getMarkerColor() != null ? s.getMarkerColor() : s.getLineColor() != null ? s.getLineColor() : Palette.INK; }

    private static Canvas.Pen pen(XYSeries s) {
        BasicStroke st = s.getLineStyle();
        return new Canvas.Pen(s.getLineColor(), st.getLineWidth(), st.getDashArray() == null ? null : st.getDashArray().clone());
    }

    /** Keeps far-away points drawable (the clip hides them): at most 20 plot sizes outside. */
    private static double clamp(double f) { return Double.isNaN(f) ? Double.NaN : Math.max(-20, Math.min(21, f)); }

    /** Axis range: the fixed limits where set, else the data (positive data on a log axis), padded by {@code pad} of the span (of the logarithms on a log axis). */
    private static double[] range(List<XYSeries> series, boolean x, boolean log, Double min, Double max, double pad) {
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (XYSeries s : series) {
            if (!s.isEnabled()) continue;
            for (double v : x ? s.getXData() : s.getYData()) {
                if (Double.isFinite(v) && (!log || v > 0)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
            }
        }
        if (!(lo <= hi)) { lo = log ? 1 : 0; hi = log ? 10 : 1; }
        if (min == null && max == null && hi > lo) {
            if (log) {
                double f = Math.pow(hi / lo, pad);
                lo /= f;
                hi *= f;
            } else {
                double span = hi - lo;
                lo -= span * pad;
                hi += span * pad;
            }
        }
        if (min != null) lo = min;
        if (max != null) hi = max;
        if (!(hi > lo)) {
            if (log) { lo /= 2; hi = lo * 4; }
            else { double d = lo == 0 ? 1 : Math.abs(lo) * 0.1; lo -= d; hi += d; }
        }
        return new double[] {lo, hi};
    }
}
