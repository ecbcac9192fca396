package org.loopledger.plot;

import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.lines.SeriesLines;
import org.knowm.xchart.style.markers.SeriesMarkers;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;

/**
 * Loopledger's chart style: white plot, solid light grid (solid strokes keep vector output small),
 * no markers on curves, a compact legend, sans-serif type, no tooltips or cursors (they would add
 * scripts and non-deterministic content).
 */
public final class ChartStyle {
    static final BasicStroke CURVE = new BasicStroke(1.6f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    static final BasicStroke THIN = new BasicStroke(1.0f);
    static final BasicStroke DASHED = new BasicStroke(1.0f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {5f, 4f}, 0f);

    private ChartStyle() {}

    /** A new chart with our style. */
    public static XYChart newChart(int widthPx, int heightPx, String title, String xTitle, String yTitle) {
        XYChart c = new XYChartBuilder().width(widthPx).height(heightPx).title(title == null ? "" : title)
                .xAxisTitle(xTitle).yAxisTitle(yTitle).build();
        XYStyler s = c.getStyler();
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotBackgroundColor(Color.WHITE);
        s.setPlotBorderVisible(true);
        s.setPlotBorderColor(Palette.REFERENCE);
        s.setPlotGridLinesVisible(true);
        s.setPlotGridLinesColor(Palette.GRID);
        s.setPlotGridLinesStroke(THIN);
        s.setChartFontColor(Palette.INK);
        s.setAxisTickLabelsColor(Palette.INK);
        s.setBaseFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        s.setChartTitleFont(new Font(Font.SANS_SERIF, Font.BOLD, 12));
        s.setChartTitleVisible(title != null && !title.isEmpty());
        s.setChartTitleBoxVisible(false);
        s.setAxisTitleFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        s.setAxisTickLabelsFont(new Font(Font.SANS_SERIF, Font.PLAIN, 10));
        s.setLegendFont(new Font(Font.SANS_SERIF, Font.PLAIN, 10));
        s.setLegendPosition(Styler.LegendPosition.InsideNE);
        s.setLegendBorderColor(Palette.GRID);
        s.setLegendBackgroundColor(new Color(255, 255, 255, 230));
        s.setSeriesColors(Palette.cycle());
        s.setMarkerSize(0);
        s.setToolTipsEnabled(false);
        s.setCursorEnabled(false);
        s.setAntiAlias(true);
        s.setChartPadding(6);
        s.setPlotMargin(0);
        s.setDefaultSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        return c;
    }

    /** Adds a curve in the {@code index}-th palette colour. */
    static XYSeries curve(XYChart c, String name, double[] x, double[] y, int index) {
        XYSeries s = c.addSeries(uniqueName(c, name), x, y);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(Palette.series(index));
        s.setLineStyle(CURVE);
        return s;
    }

    /** Adds a reference line (grey, dashed) that stays out of the legend. */
    static XYSeries reference(XYChart c, String name, double[] x, double[] y, Color color, boolean dashed) {
        XYSeries s = c.addSeries(uniqueName(c, name), x, y);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(color);
        s.setLineStyle(dashed ? DASHED : THIN);
        s.setShowInLegend(false);
        return s;
    }

    /** Adds single markers (no line), e.g. crossover points. */
    static XYSeries markers(XYChart c, String name, double[] x, double[] y, Color color, boolean inLegend) {
        XYSeries s = c.addSeries(uniqueName(c, name), x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.CIRCLE);
        s.setMarkerColor(color);
        s.setLineStyle(SeriesLines.NONE);
        s.setShowInLegend(inLegend);
        c.getStyler().setMarkerSize(7);
        return s;
    }

    private static String uniqueName(XYChart c, String name) {
        String n = name == null || name.isBlank() ? "series" : name;
        String candidate = n;
        for (int i = 2; c.getSeriesMap().containsKey(candidate); i++) candidate = n + " (" + i + ")";
        return candidate;
    }
}
