package org.loopledger.plot;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

/**
 * One axis of a panel: its data range, whether it is logarithmic, where its ticks and grid lines go
 * and how their labels read. Linear ticks step by 1, 2 or 5 times a power of ten (common practice);
 * logarithmic ones sit on decades, with grid lines at 2..9 times each decade, and with labels at 2 and 5
 * times as well when the axis spans less than two decades.
 */
record Axis(double lo, double hi, boolean log, double[] major, String[] labels, double[] minor) {

    /** Fraction 0..1 of the way from lo to hi (outside for values outside; NaN for non-positive on a log axis). */
    double fraction(double v) {
        if (log) return v > 0 ? (Math.log10(v) - Math.log10(lo)) / (Math.log10(hi) - Math.log10(lo)) : Double.NaN;
        return (v - lo) / (hi - lo);
    }

    /** An axis over [lo, hi] (hi &gt; lo; both &gt; 0 when log) with ticks about {@code spacingPx} apart on {@code lengthPx}. */
    static Axis of(double lo, double hi, boolean log, double lengthPx, double spacingPx) {
        return log ? logAxis(lo, hi) : linear(lo, hi, lengthPx, spacingPx);
    }

    private static Axis linear(double lo, double hi, double lengthPx, double spacingPx) {
        int target = (int) Math.max(2, Math.floor(lengthPx / spacingPx));
        double raw = (hi - lo) / target;
        double p = Math.pow(10, Math.floor(Math.log10(raw)));
        double m = raw / p;
        double step = (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
        int decimals = (int) Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
        List<Double> ticks = new ArrayList<>();
        for (long k = (long) Math.ceil(lo / step - 1e-9); k * step <= hi + step * 1e-9; k++) ticks.add(k * step);
        double[] major = new double[ticks.size()];
        String[] labels = new String[ticks.size()];
        for (int i = 0; i < major.length; i++) {
            major[i] = ticks.get(i);
            labels[i] = label(major[i], decimals);
        }
        return new Axis(lo, hi, false, major, labels, new double[0]);
    }

    private static Axis logAxis(double lo, double hi) {
        int d0 = (int) Math.floor(Math.log10(lo) + 1e-9), d1 = (int) Math.floor(Math.log10(hi) + 1e-9);
        List<Double> major = new ArrayList<>(), minor = new ArrayList<>();
        int decadesInside = 0;
        for (int d = d0; d <= d1; d++) if (inside(Math.pow(10, d), lo, hi)) decadesInside++;
        boolean fine = decadesInside < 2;
        for (int d = d0; d <= d1; d++) {
            double p = Math.pow(10, d);
            for (int m = 1; m <= 9; m++) {
                double v = m * p;
                if (!inside(v, lo, hi)) continue;
                if (m == 1 || (fine && (m == 2 || m == 5))) major.add(v);
                else minor.add(v);
            }
        }
        double[] mj = major.stream().mapToDouble(Double::doubleValue).toArray();
        String[] labels = new String[mj.length];
        for (int i = 0; i < mj.length; i++) labels[i] = logLabel(mj[i]);
        return new Axis(lo, hi, true, mj, labels, minor.stream().mapToDouble(Double::doubleValue).toArray());
    }

    private static boolean inside(double v, double lo, double hi) { return v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9); }

    private static String label(double v, int decimals) {
        String s = new BigDecimal(v).setScale(decimals, java.math.RoundingMode.HALF_EVEN).toPlainString();
        return s.matches("-0(\\.0*)?") ? s.substring(1) : s;
    }

    /** 0.01, 0.1, 1, 10, ..., 100000 in plain digits; beyond, 1e6, 2e-4. */
    private static String logLabel(double v) {
        int e = (int) Math.floor(Math.log10(v) + 1e-9);
        if (e >= -3 && e <= 5) return new BigDecimal(v).round(new java.math.MathContext(1)).stripTrailingZeros().toPlainString();
        return Math.round(v / Math.pow(10, e)) + "e" + e;
    }
}
