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
    static final int NOTE_PX = 18;
    private static final int PAD = 6;
    private static final Canvas.Type FIGURE_TITLE = new Canvas.Type(13, true);
    private static final Canvas.Type PANEL_TITLE = new Canvas.Type(12, true);
    private static final Canvas.Type AXIS_TITLE = new Canvas.Type(11, false);
    private static final Canvas.Type TICK = new Canvas.Type(10, false);
    private static final Canvas.Type LEGEND = new Canvas.Type(10, false);
    private static final Canvas.Type NOTE = new Canvas.Type(10, false);
    private static final Canvas.Pen GUIDE = new Canvas.Pen(Palette.REFERENCE, 1f, new float[] {5f, 4f});
    private static final Canvas.Pen GRID = new Canvas.Pen(Palette.GRID, 1f, null);
    private static final Canvas.Pen MINOR_GRID = new Canvas.Pen(new Color(0xF0, 0xF2, 0xF4), 1f, null);
    private static final Canvas.Pen BORDER = new Canvas.Pen(Palette.REFERENCE, 1f, null);
    private static final Canvas.Pen LEGEND_BORDER = new Canvas.Pen(Palette.GRID, 1f, null);

    private FigureDrawing() {}

    /** Where a panel's parts go, in figure pixels: the plot area, its axes, the series in pixels and the legend. */
    record PanelLayout(XYChart chart, double ox, double oy, double w, double h,
                       double left, double top, double plotWidth, double plotHeight, Axis xAxis, Axis yAxis,
                       List<XYSeries> series, List<double[][]> seriesPx, LegendBox legend) {
        double right() { return left + plotWidth; }

        double bottom() { return top + plotHeight; }
    }

    /** The legend's box; {@code outside}: below the panel's plot area (no inside corner was free of data). */
    record LegendBox(double x, double y, double w, double h, boolean outside, List<XYSeries> entries, int perRow, double entryWidth) {}

    static void draw(Figure f, Canvas c) {
        c.fill(0, 0, f.widthPx(), f.heightPx(), Color.WHITE, 1);
        if (!f.title().isEmpty()) c.text(f.title(), 8, 17, Canvas.Anchor.START, FIGURE_TITLE, Palette.INK, false);
        List<PanelLayout> layout = layout(f, c);
        for (int i = 0; i < layout.size(); i++) panel(layout.get(i), f, i, c);
        if (!f.note().isEmpty()) c.text(f.note(), 8, f.heightPx() - 7, Canvas.Anchor.START, NOTE, Palette.REFERENCE, false);
    }

    /**
     * The layout of every panel. Panels in one column share the left and right edges of their plot areas (the
     * widest tick labels of the column set the left edge), and panels in one row share the top edge, so a Bode
     * figure's magnitude and phase line up on one frequency axis. Each legend goes into the first inside corner
     * (the panel's preferred one first) that no data series passes through, else below the plot area.
     */
    static List<PanelLayout> layout(Figure f, Canvas c) {
        List<XYChart> panels = f.panels();
        int n = panels.size();
        int cw = f.cellWidth(), ch = f.cellHeight(), top0 = f.panelsTop();
        double[][] yr = new double[n][], xr = new double[n][];
        List<List<XYSeries>> series = new ArrayList<>();
        double[] legendBelow = new double[n]; // height taken from the plot area for a legend outside
        for (int i = 0; i < n; i++) {
            XYChart p = panels.get(i);
            XYStyler st = p.getStyler();
            List<XYSeries> s = new ArrayList<>(p.getSeriesMap().values());
            series.add(s);
            xr[i] = range(s, true, st.isXAxisLogarithmic(), st.getXAxisMin(), st.getXAxisMax(), 0.015);
            yr[i] = range(s, false, st.isYAxisLogarithmic(), st.getYAxisMin(), st.getYAxisMax(), 0.04);
        }
        List<PanelLayout> out = new ArrayList<>();
        for (int pass = 0; pass < 3; pass++) {
            double[] tops = new double[n], bottoms = new double[n], lefts = new double[n], rights = new double[n];
            Axis[] ya = new Axis[n];
            double[] leftOffset = new double[f.columns()];
            for (int i = 0; i < n; i++) {
                XYChart p = panels.get(i);
                XYStyler st = p.getStyler();
                double ox = (i % f.columns()) * cw, oy = top0 + (i / f.columns()) * ch;
                String title = nz(p.getTitle()), xTitle = nz(p.getXAxisTitle()), yTitle = nz(p.getYAxisTitle());
                tops[i] = oy + PAD + (title.isEmpty() || !st.isChartTitleVisible() ? 0 : 20);
                bottoms[i] = oy + p.getHeight() - PAD - (xTitle.isEmpty() ? 0 : 16) - 15 - legendBelow[i];
                rights[i] = ox + p.getWidth() - PAD - 4;
                ya[i] = Axis.of(yr[i][0], yr[i][1], st.isYAxisLogarithmic(), bottoms[i] - tops[i], 32);
                double labelW = 0;
                for (String l : ya[i].labels()) labelW = Math.max(labelW, c.textWidth(l, TICK));
                double off = PAD + (yTitle.isEmpty() ? 0 : 18) + labelW + 6;
                leftOffset[i % f.columns()] = Math.max(leftOffset[i % f.columns()], off);
                // room for the half of the last x tick label that reaches past the plot's right edge
                Axis xProvisional = Axis.of(xr[i][0], xr[i][1], st.isXAxisLogarithmic(), rights[i] - ox - off, 64);
                int last = xProvisional.major().length - 1;
                if (last >= 0) {
                    double reach = (1 - xProvisional.fraction(xProvisional.major()[last])) * (rights[i] - ox - off);
                    double overflow = c.textWidth(xProvisional.labels()[last], TICK) / 2 - reach - 2;
                    if (overflow > 0) rights[i] -= overflow;
                }
            }
            // shared edges: left per column (widest labels), right per column, top per row
            double[] rightEdge = new double[f.columns()];
            java.util.Arrays.fill(rightEdge, Double.POSITIVE_INFINITY);
            for (int i = 0; i < n; i++) rightEdge[i % f.columns()] = Math.min(rightEdge[i % f.columns()], rights[i] - (i % f.columns()) * cw);
            int rows = (n + f.columns() - 1) / f.columns();
            double[] rowTop = new double[rows];
            for (int i = 0; i < n; i++) rowTop[i / f.columns()] = Math.max(rowTop[i / f.columns()], tops[i] - (top0 + (i / f.columns()) * ch));
            out.clear();
            boolean changed = false;
            for (int i = 0; i < n; i++) {
                XYChart p = panels.get(i);
                XYStyler st = p.getStyler();
                int col = i % f.columns(), row = i / f.columns();
                double ox = col * cw, oy = top0 + row * ch;
                lefts[i] = ox + leftOffset[col];
                double top = oy + rowTop[row], pw = ox + rightEdge[col] - lefts[i], ph = bottoms[i] - top;
                Axis y = top == tops[i] ? ya[i] : Axis.of(yr[i][0], yr[i][1], st.isYAxisLogarithmic(), ph, 32);
                Axis x = Axis.of(xr[i][0], xr[i][1], st.isXAxisLogarithmic(), pw, 64);
                List<double[][]> px = new ArrayList<>();
                for (XYSeries s : series.get(i)) px.add(toPixels(s, x, y, lefts[i], top, pw, ph));
                double belowY = top + ph + 15 + (nz(p.getXAxisTitle()).isEmpty() ? 0 : 16) + 4;
                LegendBox lb = st.isLegendVisible() ? legendBox(c, series.get(i), px, st.getLegendPosition(), lefts[i], top, pw, ph, legendBelow[i] > 0, belowY) : null;
                if (lb != null && lb.outside() && legendBelow[i] == 0) {
                    legendBelow[i] = lb.h() + 4;
                    changed = true;
                }
                out.add(new PanelLayout(p, ox, oy, p.getWidth(), p.getHeight(), lefts[i], top, pw, ph, x, y, series.get(i), px, lb));
            }
            if (!changed) break;
        }
        return out;
    }

    private static String nz(String s) { return s == null ? "" : s; }

    private static double[][] toPixels(XYSeries s, Axis xa, Axis ya, double left, double top, double pw, double ph) {
        double[] x = s.getXData(), y = s.getYData();
        int n = Math.min(x.length, y.length);
        double[] px = new double[n], py = new double[n];
        double bottom = top + ph;
        for (int i = 0; i < n; i++) {
            px[i] = left + clamp(xa.fraction(x[i])) * pw;
            py[i] = bottom - clamp(ya.fraction(y[i])) * ph;
        }
        return new double[][] {px, py};
    }

    private static void panel(PanelLayout L, Figure f, int index, Canvas c) {
        XYChart chart = L.chart();
        XYStyler st = chart.getStyler();
        String title = nz(chart.getTitle()), xTitle = nz(chart.getXAxisTitle()), yTitle = nz(chart.getYAxisTitle());
        double left = L.left(), top = L.top(), pw = L.plotWidth(), ph = L.plotHeight(), bottom = L.bottom();
        Axis xa = L.xAxis(), ya = L.yAxis();

        // grid, minor first
        gridLines(c, xa.minor(), xa, left, top, pw, ph, true, MINOR_GRID);
        gridLines(c, ya.minor(), ya, left, top, pw, ph, false, MINOR_GRID);
        gridLines(c, xa.major(), xa, left, top, pw, ph, true, GRID);
        gridLines(c, ya.major(), ya, left, top, pw, ph, false, GRID);

        // reference lines inside the range only
        for (Figure.Guide g : f.guides()) {
            if (g.panel() != index) continue;
            double fr = ya.fraction(g.y());
            if (!(fr >= 0 && fr <= 1)) continue;
            double py = bottom - fr * ph;
            c.polyline(new double[] {left, left + pw}, new double[] {py, py}, 2, GUIDE);
        }

        // series
        c.clip(left, top, pw, ph);
        for (int k = 0; k < L.series().size(); k++) {
            XYSeries s = L.series().get(k);
            if (!s.isEnabled()) continue;
            double[][] p = L.seriesPx().get(k);
            if (drawsLine(s)) c.polyline(p[0], p[1], p[0].length, pen(s));
            if (drawsMarker(s)) c.dots(p[0], p[1], p[0].length, st.getMarkerSize() / 2.0, markerColor(s));
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
        if (!title.isEmpty() && st.isChartTitleVisible()) c.text(title, left + pw / 2, L.oy() + PAD + 12, Canvas.Anchor.MIDDLE, PANEL_TITLE, Palette.INK, false);
        if (!xTitle.isEmpty()) c.text(xTitle, left + pw / 2, bottom + 15 + 13, Canvas.Anchor.MIDDLE, AXIS_TITLE, Palette.INK, false);
        if (!yTitle.isEmpty()) c.text(yTitle, L.ox() + PAD + 11, top + ph / 2, Canvas.Anchor.MIDDLE, AXIS_TITLE, Palette.INK, true);

        if (L.legend() != null) legend(c, L.legend(), st.getMarkerSize());
    }

    private static final double LEGEND_ROW = 15;

    /**
     * The series a legend must not cover: all but grey lines kept out of the legend ({@link Palette#REFERENCE}: unit
     * circle, M-contours), which are decoration; a Nyquist plot's mirror for negative frequencies or an Ms circle counts.
     */
    private static boolean isData(XYSeries s) {
        return s.isEnabled() && (s.isShowInLegend() || drawsMarker(s) || !Palette.REFERENCE.equals(s.getLineColor()));
    }

    private static LegendBox legendBox(Canvas c, List<XYSeries> series, List<double[][]> px, Styler.LegendPosition preferred,
                                       double left, double top, double pw, double ph, boolean forceOutside, double belowY) {
        List<XYSeries> shown = series.stream().filter(s -> s.isEnabled() && s.isShowInLegend()).toList();
        if (shown.isEmpty()) return null;
        double textW = 0;
        for (XYSeries s : shown) textW = Math.max(textW, c.textWidth(s.getName(), LEGEND));
        double bw = 8 + 22 + 6 + textW + 8, bh = 6 + LEGEND_ROW * shown.size() + 2;
        if (!forceOutside) {
            List<Styler.LegendPosition> order = new ArrayList<>(List.of(Styler.LegendPosition.InsideNE, Styler.LegendPosition.InsideNW,
                    Styler.LegendPosition.InsideSE, Styler.LegendPosition.InsideSW));
            if (order.remove(preferred)) order.add(0, preferred);
            for (Styler.LegendPosition pos : order) {
                boolean west = pos == Styler.LegendPosition.InsideNW || pos == Styler.LegendPosition.InsideSW;
                boolean south = pos == Styler.LegendPosition.InsideSW || pos == Styler.LegendPosition.InsideSE;
                double bx = west ? left + 8 : left + pw - 8 - bw, by = south ? top + ph - 8 - bh : top + 8;
                if (bw > pw - 16 || bh > ph - 16) break;
                if (dataUnder(series, px, bx, by, bw, bh) == 0) return new LegendBox(bx, by, bw, bh, false, shown, 1, 0);
            }
        }
        // below the plot area (under the x-axis title), entries side by side, wrapping
        double entryW = 8 + 22 + 6 + textW + 4;
        int perRow = (int) Math.max(1, Math.min(shown.size(), Math.floor((pw - 8) / entryW)));
        int rows = (shown.size() + perRow - 1) / perRow;
        return new LegendBox(left, belowY, Math.min(pw, perRow * entryW + 8), 4 + LEGEND_ROW * rows, true, shown, perRow, entryW);
    }

    /**
     * How many data points and segments lie under the box (enlarged by 2 px): segments by clipping each against the
     * box (Liang and Barsky, "A new concept and method for line clipping", ACM TOG 3(1), 1984), markers by their centres.
     */
    static int dataUnder(List<XYSeries> series, List<double[][]> px, double bx, double by, double bw, double bh) {
        double x0 = bx - 2, y0 = by - 2, x1 = bx + bw + 2, y1 = by + bh + 2;
        int count = 0;
        for (int k = 0; k < series.size(); k++) {
            XYSeries s = series.get(k);
            if (!isData(s)) continue;
            double[] x = px.get(k)[0], y = px.get(k)[1];
            boolean line = drawsLine(s);
            for (int i = 0; i < x.length; i++) {
                if (!Double.isFinite(x[i]) || !Double.isFinite(y[i])) continue;
                if (x[i] >= x0 && x[i] <= x1 && y[i] >= y0 && y[i] <= y1) { count++; continue; }
                if (line && i > 0 && Double.isFinite(x[i - 1]) && Double.isFinite(y[i - 1]) && segmentHits(x[i - 1], y[i - 1], x[i], y[i], x0, y0, x1, y1)) count++;
            }
        }
        return count;
    }

    private static boolean segmentHits(double ax, double ay, double bx, double by, double x0, double y0, double x1, double y1) {
        if ((ax < x0 && bx < x0) || (ax > x1 && bx > x1) || (ay < y0 && by < y0) || (ay > y1 && by > y1)) return false;
        double dx = bx - ax, dy = by - ay, t0 = 0, t1 = 1;
        double[] p = {-dx, dx, -dy, dy}, q = {ax - x0, x1 - ax, ay - y0, y1 - ay};
        for (int k = 0; k < 4; k++) {
            if (p[k] == 0) {
                if (q[k] < 0) return false;
                continue;
            }
            double r = q[k] / p[k];
            if (p[k] < 0) t0 = Math.max(t0, r);
            else t1 = Math.min(t1, r);
            if (t0 > t1) return false;
        }
        return true;
    }

    private static void legend(Canvas c, LegendBox b, int markerSize) {
        double bx = b.x(), by = b.y();
        if (b.outside()) {
            for (int i = 0; i < b.entries().size(); i++) {
                entry(c, b.entries().get(i), bx + (i % b.perRow()) * b.entryWidth(), by + LEGEND_ROW * (i / b.perRow()), markerSize);
            }
            return;
        }
        c.fill(bx, by, b.w(), b.h(), Color.WHITE, 0.9);
        c.outline(bx, by, b.w(), b.h(), LEGEND_BORDER);
        for (int i = 0; i < b.entries().size(); i++) entry(c, b.entries().get(i), bx, by + 6 + LEGEND_ROW * i, markerSize);
    }

    private static void entry(Canvas c, XYSeries s, double bx, double rowTop, int markerSize) {
        double cy = rowTop + LEGEND_ROW / 2 - 1;
        if (drawsLine(s)) c.polyline(new double[] {bx + 8, bx + 30}, new double[] {cy, cy}, 2, pen(s));
        if (drawsMarker(s)) c.dots(new double[] {bx + 19}, new double[] {cy}, 1, markerSize / 2.0, markerColor(s));
        c.text(s.getName(), bx + 36, cy + 3.5, Canvas.Anchor.START, LEGEND, Palette.INK, false);
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
