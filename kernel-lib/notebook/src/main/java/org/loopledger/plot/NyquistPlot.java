package org.loopledger.plot;

import org.knowm.xchart.XYChart;
import org.loopledger.frf.Frf;

import java.util.ArrayList;
import java.util.List;

/**
 * Nyquist plot of a loop gain L(jω) for ω &gt; 0 (solid) and its mirror for ω &lt; 0 (dashed), with the
 * unit circle, the critical point -1 and, when a sensitivity limit Ms is given, the circle of radius
 * 1/Ms around -1 that the curve must stay outside of (common practice).
 */
public final class NyquistPlot {
    private final List<String> labels = new ArrayList<>();
    private final List<Frf> loops = new ArrayList<>();
    private String title = "";
    private double msLimit = Double.NaN;
    private double halfWidth = 2.5;

    private NyquistPlot() {}

    public static NyquistPlot create() { return new NyquistPlot(); }

    public static Figure of(String label, Frf loop) { return create().add(label, loop).figure(); }

    public NyquistPlot title(String title) { this.title = title == null ? "" : title; return this; }

    public NyquistPlot add(String label, Frf loopGain) {
        labels.add(label);
        loops.add(loopGain);
        return this;
    }

    /** Draws the circle |1 + L| = 1/Ms around -1. */
    public NyquistPlot sensitivityLimit(double maxSensitivityPeak) {
        if (!(maxSensitivityPeak > 1)) throw new IllegalArgumentException("a sensitivity peak limit Ms must exceed 1, got " + maxSensitivityPeak);
        this.msLimit = maxSensitivityPeak;
        return this;
    }

    /** Half the width of the square view window around -0.5 + 0j (default 2.5). */
    public NyquistPlot viewHalfWidth(double halfWidth) {
        if (!(halfWidth > 0)) throw new IllegalArgumentException("view half-width must be positive, got " + halfWidth);
        this.halfWidth = halfWidth;
        return this;
    }

    public Figure figure() {
        if (loops.isEmpty()) throw new IllegalArgumentException("a Nyquist plot needs at least one loop gain: call add(label, frf)");
        XYChart c = ChartStyle.newChart(520, 520, null, "Re L", "Im L");
        c.getStyler().setXAxisMin(-0.5 - halfWidth);
        c.getStyler().setXAxisMax(-0.5 + halfWidth);
        c.getStyler().setYAxisMin(-halfWidth);
        c.getStyler().setYAxisMax(halfWidth);
        circle(c, "unit circle", 0, 1, false);
        if (!Double.isNaN(msLimit)) circle(c, "Ms limit", -1, 1 / msLimit, true);
        for (int i = 0; i < loops.size(); i++) {
            Frf l = loops.get(i);
            double[] re = clip(l.real()), im = clip(l.imag());
            double[][] d = Decimation.forPanel(re, im, false, 520, 520, new double[] {-0.5 - halfWidth, -0.5 + halfWidth}, new double[] {-halfWidth, halfWidth});
            ChartStyle.curve(c, labels.get(i), d[0], d[1], i);
            double[] mirror = d[1].clone();
            for (int k = 0; k < mirror.length; k++) mirror[k] = -mirror[k];
            ChartStyle.reference(c, labels.get(i) + " (negative frequencies)", d[0], mirror, Palette.series(i), true);
        }
        ChartStyle.markers(c, "-1", new double[] {-1}, new double[] {0}, Palette.BRICK, false);
        return Figure.column(title.isEmpty() ? "Nyquist plot: " + String.join(", ", labels) : title, List.of(c));
    }

    /** Keeps far-away points finite for drawing (they are outside the view window anyway). */
    private static double[] clip(double[] v) {
        double[] r = v.clone();
        for (int i = 0; i < r.length; i++) r[i] = Math.max(-1e6, Math.min(1e6, r[i]));
        return r;
    }

    private static void circle(XYChart c, String name, double centreRe, double radius, boolean dashed) {
        int n = 181;
        double[] x = new double[n], y = new double[n];
        for (int k = 0; k < n; k++) {
            double a = 2 * Math.PI * k / (n - 1);
            x[k] = centreRe + radius * Math.cos(a);
            y[k] = radius * Math.sin(a);
        }
        ChartStyle.reference(c, name, x, y, dashed ? Palette.BRICK : Palette.REFERENCE, dashed);
    }
}
