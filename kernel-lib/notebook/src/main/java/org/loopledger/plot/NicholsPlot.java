package org.loopledger.plot;

import org.knowm.xchart.XYChart;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;

/**
 * Nichols chart: open-loop gain (dB) against open-loop phase (degrees), with contours of constant
 * closed-loop magnitude |T| = |L/(1+L)| (the classic M-contours, common practice) and the critical
 * point (-180°, 0 dB).
 *
 * <p>Contours: with L = r·e<sup>jφ</sup>, |L|/|1+L| = M gives r²(1 - M²) - 2M²r·cos φ - M² = 0, solved
 * for r &gt; 0 at each φ (derivation by hand).
 */
public final class NicholsPlot {
    private static final double[] CONTOURS_DB = {-6, -3, 0, 1, 3, 6};
    private final List<String> labels = new ArrayList<>();
    private final List<Frf> loops = new ArrayList<>();
    private String title = "";

    private NicholsPlot() {}

    public static NicholsPlot create() { return new NicholsPlot(); }

    public static Figure of(String label, Frf loop) { return create().add(label, loop).figure(); }

    public NicholsPlot title(String title) { this.title = title == null ? "" : title; return this; }

    public NicholsPlot add(String label, Frf loopGain) {
        labels.add(label);
        loops.add(loopGain);
        return this;
    }

    public Figure figure() {
        if (loops.isEmpty()) throw new IllegalArgumentException("a Nichols chart needs at least one loop gain: call add(label, frf)");
        XYChart c = ChartStyle.newChart(640, 480, null, "Open-loop phase (deg)", "Open-loop gain (dB)");
        c.getStyler().setXAxisMin(-360.0);
        c.getStyler().setXAxisMax(0.0);
        c.getStyler().setYAxisMin(-40.0);
        c.getStyler().setYAxisMax(40.0);
        for (double mDb : CONTOURS_DB) addContour(c, mDb);
        boolean trendUnwrapped = false;
        for (int i = 0; i < loops.size(); i++) {
            Frf l = loops.get(i);
            PlotPhase.Branch branch = PlotPhase.alongTrendDeg(l);
            trendUnwrapped |= branch.differsFromPlainUnwrap();
            double[] ph = branch.phaseDeg();
            double[] db = l.magnitudeDb();
            double[][] d = Decimation.forPanel(ph, db, false, 640, 480, new double[] {-360, 0}, new double[] {-40, 40});
            ChartStyle.curve(c, labels.get(i), d[0], d[1], i);
        }
        ChartStyle.markers(c, "critical point", new double[] {-180}, new double[] {0}, Palette.BRICK, false);
        Figure f = Figure.column(title.isEmpty() ? "Nichols chart: " + String.join(", ", labels) : title, List.of(c));
        return trendUnwrapped ? f.withNote(PlotPhase.TREND_NOTE) : f;
    }

    private static void addContour(XYChart c, double mDb) {
        double m = Units.dbToRatio(mDb), m2 = m * m;
        int n = 361;
        List<double[]> branchA = new ArrayList<>(), branchB = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            double phDeg = -359.0 + 358.0 * k / (n - 1);
            double cs = Math.cos(Math.toRadians(phDeg));
            if (Math.abs(1 - m2) < 1e-12) {
                if (cs < 0) branchA.add(new double[] {phDeg, Units.ratioToDb(-1.0 / (2 * cs))});
                continue;
            }
            double disc = m2 * m2 * cs * cs + m2 * (1 - m2);
            if (disc < 0) continue;
            double r1 = (m2 * cs + Math.sqrt(disc)) / (1 - m2);
            double r2 = (m2 * cs - Math.sqrt(disc)) / (1 - m2);
            if (r1 > 0) branchA.add(new double[] {phDeg, Units.ratioToDb(r1)});
            if (r2 > 0) branchB.add(new double[] {phDeg, Units.ratioToDb(r2)});
        }
        addBranch(c, "|T| = " + Units.g4(mDb) + " dB", branchA);
        addBranch(c, "|T| = " + Units.g4(mDb) + " dB", branchB);
    }

    private static void addBranch(XYChart c, String name, List<double[]> pts) {
        if (pts.size() < 2) return;
        double[] x = new double[pts.size()], y = new double[pts.size()];
        for (int i = 0; i < x.length; i++) { x[i] = pts.get(i)[0]; y[i] = Math.max(-60, Math.min(60, pts.get(i)[1])); }
        double[][] d = Decimation.forPanel(x, y, false, 640, 480);
        ChartStyle.reference(c, name, d[0], d[1], Palette.REFERENCE, true);
    }
}
