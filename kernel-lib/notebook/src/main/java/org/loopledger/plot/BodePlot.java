package org.loopledger.plot;

import org.knowm.xchart.XYChart;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.ArrayList;
import java.util.List;

/**
 * Bode plot: magnitude (dB) and phase (degrees) over frequency (Hz, log axis), several overlays,
 * optional point markers (crossovers, margins). Built with {@link #create()}, then {@link #figure()}.
 */
public final class BodePlot {
    private record Curve(String label, Frf frf) {}

    private record Mark(String label, double hz, double magDb, double phaseDeg) {}

    private final List<Curve> curves = new ArrayList<>();
    private final List<Mark> marks = new ArrayList<>();
    private String title = "";
    private String magnitudeUnit = "";
    private int widthPx = 640;
    private int panelHeightPx = 260;

    private BodePlot() {}

    public static BodePlot create() { return new BodePlot(); }

    /** Shortcut: a Bode figure of one FRF. */
    public static Figure of(String label, Frf frf) { return create().add(label, frf).figure(); }

    /** Shortcut: a Bode figure of one model, on the grid of {@link #add(String, TransferFunction)}. */
    public static Figure of(String label, TransferFunction model) { return create().add(label, model).figure(); }

    public BodePlot title(String title) { this.title = title == null ? "" : title; return this; }

    /**
     * The unit the magnitude is relative to, shown on its axis as "Magnitude (dB re 1 UNIT)"; for a plant
     * use {@code Motion.plantUnit} (e.g. "(m/s)/A" for a linear axis to velocity). Empty: plain "Magnitude (dB)".
     */
    public BodePlot magnitudeUnit(String unit) {
        this.magnitudeUnit = java.util.Objects.requireNonNull(unit, "unit (\"\" for none)");
        return this;
    }

    public BodePlot sizePx(int widthPx, int panelHeightPx) {
        if (widthPx < 200 || panelHeightPx < 120) throw new IllegalArgumentException("a Bode panel needs at least 200x120 px, got " + widthPx + "x" + panelHeightPx);
        this.widthPx = widthPx;
        this.panelHeightPx = panelHeightPx;
        return this;
    }

    /** Row {@code row} of {@code curve} (hz, values...) at {@code hz}, linear in log frequency; NaN outside its band. */
    private static double atHz(double[][] curve, int row, double hz) {
        double[] f = curve[0], v = curve[row];
        if (!(hz >= f[0] && hz <= f[f.length - 1])) return Double.NaN;
        int k = java.util.Arrays.binarySearch(f, hz);
        if (k >= 0) return v[k];
        int hi = -k - 1, lo = hi - 1;
        double t = Math.log(hz / f[lo]) / Math.log(f[hi] / f[lo]);
        return v[lo] + t * (v[hi] - v[lo]);
    }

    /** "Bode plot: " and the curves' labels, for a figure the user gave no title. */
    private String defaultTitle() {
        return "Bode plot: " + String.join(", ", curves.stream().map(Curve::label).distinct().toList());
    }

    /** Adds a curve. */
    public BodePlot add(String label, Frf frf) { curves.add(new Curve(label, frf)); return this; }

    /**
     * Adds a model's curve on a grid chosen from the model ({@link FrequencyGrid#forModelRadPerS}): two decades
     * around its poles' and zeros' natural frequencies with every lightly damped one on the grid (continuous), or up
     * to just below the Nyquist frequency (sampled). A continuous model with a pure delay τ stops where the delay lags
     * two turns (ω = 4π/τ), or a decade above its highest pole or zero if that is higher. A model's phase is unwrapped
     * point to point, and a model curve never adds the coherence note. For a chosen band use
     * {@code add(label, Frf.ofModel(model, grid))}.
     */
    public BodePlot add(String label, TransferFunction model) {
        java.util.Objects.requireNonNull(model, "model");
        return add(label, Frf.ofModel(model, FrequencyGrid.forModelRadPerS(model)));
    }

    /**
     * Adds a marker drawn on both panels at {@code hz}, named in the legend (once per label). A NaN magnitude or phase
     * puts the marker on the first curve at {@code hz} (interpolated in log frequency).
     */
    public BodePlot mark(String label, double hz, double magDb, double phaseDeg) {
        marks.add(new Mark(label, hz, magDb, phaseDeg));
        return this;
    }

    public Figure figure() {
        if (curves.isEmpty()) throw new IllegalArgumentException("a Bode plot needs at least one curve: call add(label, frf)");
        XYChart mag = ChartStyle.newChart(widthPx, panelHeightPx, null, "", magnitudeUnit.isEmpty() ? "Magnitude (dB)" : "Magnitude (dB re 1 " + magnitudeUnit + ")");
        XYChart ph = ChartStyle.newChart(widthPx, panelHeightPx, null, "Frequency (Hz)", "Phase (deg)");
        mag.getStyler().setXAxisLogarithmic(true);
        ph.getStyler().setXAxisLogarithmic(true);
        ph.getStyler().setLegendVisible(false);
        boolean trendUnwrapped = false;
        double[][] first = null; // hz, magnitude dB, display phase deg of the first curve, for markers without a value
        for (int i = 0; i < curves.size(); i++) {
            Curve c = curves.get(i);
            double[] f = c.frf().frequencyHz();
            PlotPhase.Branch branch = PlotPhase.alongTrendDeg(c.frf());
            if (i == 0) first = new double[][] {f, c.frf().magnitudeDb(), branch.phaseDeg()};
            trendUnwrapped |= branch.differsFromPlainUnwrap();
            double[][] m = Decimation.forPanel(f, c.frf().magnitudeDb(), true, widthPx, panelHeightPx);
            double[][] p = Decimation.forPanel(f, branch.phaseDeg(), true, widthPx, panelHeightPx);
            ChartStyle.curve(mag, c.label(), m[0], m[1], i);
            ChartStyle.curve(ph, c.label(), p[0], p[1], i);
        }
        java.util.Set<String> labelled = new java.util.HashSet<>();
        for (Mark k : marks) {
            boolean inLegend = labelled.add(k.label());
            double m = Double.isNaN(k.magDb()) ? atHz(first, 1, k.hz()) : k.magDb();
            double p = Double.isNaN(k.phaseDeg()) ? atHz(first, 2, k.hz()) : k.phaseDeg();
            ChartStyle.markers(mag, k.label(), new double[] {k.hz()}, new double[] {m}, Palette.BRICK, inLegend);
            ChartStyle.markers(ph, k.label(), new double[] {k.hz()}, new double[] {p}, Palette.BRICK, false);
        }
        // 0 dB and -180 deg mean something for a loop gain: drawn where the data's range comes to them, never widening it
        Figure f = Figure.column(title.isEmpty() ? defaultTitle() : title, List.of(mag, ph))
                .withGuides(List.of(new Figure.Guide(0, 0), new Figure.Guide(1, -180)));
        return trendUnwrapped ? f.withNote(PlotPhase.TREND_NOTE) : f;
    }
}
