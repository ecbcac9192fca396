package org.loopledger.frf;

import org.apache.commons.math3.complex.Complex;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Logarithmically spaced frequency grids; each name says the unit it returns. {@link #logRadPerS} and
 * {@link #logSpacedRadPerS} return rad/s (what {@code TransferFunction.response} and {@code Frf} take);
 * {@link #logSpacedHz} returns Hz (for labels, tables and Hz-based APIs).
 */
public final class FrequencyGrid {
    private FrequencyGrid() {}

    /** {@code n} points from {@code loRadPerS} to {@code hiRadPerS} inclusive, equally spaced in log ω. */
    public static double[] logRadPerS(double loRadPerS, double hiRadPerS, int n) {
        if (!(loRadPerS > 0) || !(hiRadPerS > loRadPerS) || Double.isInfinite(hiRadPerS)) {
            throw new IllegalArgumentException("a log grid needs 0 < low < high < inf, got " + loRadPerS + " .. " + hiRadPerS + " rad/s");
        }
        if (n < 2) throw new IllegalArgumentException("a log grid needs at least 2 points, got " + n);
        double a = Math.log10(loRadPerS), b = Math.log10(hiRadPerS);
        double[] w = new double[n];
        for (int i = 0; i < n; i++) w[i] = Math.pow(10, a + (b - a) * i / (n - 1));
        w[0] = loRadPerS;
        w[n - 1] = hiRadPerS;
        return w;
    }

    /**
     * {@code n} log-spaced points from {@code fromHz} to {@code toHz} (limits in Hz), returned in rad/s
     * (2π·f), ready for {@code TransferFunction.response} and {@code Frf.ofModel}:
     * {@code logSpacedRadPerS(1, 1000, n)[0]} is 6.283. For the same grid in Hz use {@link #logSpacedHz}.
     */
    public static double[] logSpacedRadPerS(double fromHz, double toHz, int n) {
        return logRadPerS(Units.hzToRadPerS(fromHz), Units.hzToRadPerS(toHz), n);
    }

    /** The top of {@link #logSpacedRadPerSBelowNyquist}, as a fraction of the Nyquist frequency. */
    public static final double BELOW_NYQUIST = 0.999;

    /**
     * A grid for a sampled loop: {@code n} log-spaced points from {@code loHz} up to just below the Nyquist frequency
     * 1/(2T), at {@value #BELOW_NYQUIST} of it, <b>returned in rad/s</b>. Stopping short of Nyquist matters: a Tustin
     * low-pass (or any filter with zeros at z = -1) is exactly zero there, and a measured-loop analysis refuses a
     * curve with an exactly zero point; at 0.999 of Nyquist a double zero at z = -1 still leaves
     * |1 + e<sup>jωT</sup>|² = 4cos²(0.999π/2) ≈ 1e-5 of the curve (-100 dB), finite and non-zero.
     */
    public static double[] logSpacedRadPerSBelowNyquist(double loHz, double sampleTimeS, int n) {
        if (!(sampleTimeS > 0) || Double.isInfinite(sampleTimeS)) {
            throw new IllegalArgumentException("sample time must be a finite positive number of seconds, got " + sampleTimeS);
        }
        double top = BELOW_NYQUIST * 0.5 / sampleTimeS;
        if (!(loHz < top)) {
            throw new IllegalArgumentException("the grid's low end " + loHz + " Hz must lie below " + Units.formatHz(top)
                    + " (just below the Nyquist frequency " + Units.formatHz(0.5 / sampleTimeS) + ")");
        }
        return logSpacedRadPerS(loHz, top, n);
    }

    /**
     * {@code n} points from {@code loHz} to {@code hiHz} inclusive, equally spaced in log f, <b>returned
     * in Hz</b> (the same grid as {@link #logSpacedRadPerS}, divided by 2π; end points exact).
     */
    public static double[] logSpacedHz(double loHz, double hiHz, int n) {
        if (!(loHz > 0) || !(hiHz > loHz) || Double.isInfinite(hiHz)) {
            throw new IllegalArgumentException("a log grid needs 0 < low < high < inf, got " + loHz + " .. " + hiHz + " Hz");
        }
        if (n < 2) throw new IllegalArgumentException("a log grid needs at least 2 points, got " + n);
        double a = Math.log10(loHz), b = Math.log10(hiHz);
        double[] f = new double[n];
        for (int i = 0; i < n; i++) f[i] = Math.pow(10, a + (b - a) * i / (n - 1));
        f[0] = loHz;
        f[n - 1] = hiHz;
        return f;
    }

    /** Phase lag ωτ in rad of a model's delay at the top of a continuous {@link #forModelRadPerS} grid: 4π, two turns. */
    public static final double DELAY_TOP_RAD = 4 * Math.PI;

    /** Points per decade of {@link #forModelRadPerS}. */
    public static final int MODEL_POINTS_PER_DECADE = 100;

    /** Damping ratio under which {@link #forModelRadPerS} inserts a root's natural frequency and a cluster around it. */
    public static final double LIGHT_DAMPING = 0.5;

    /**
     * A grid in rad/s that shows a model's features, for plotting it without choosing a band. Continuous: from a
     * hundredth of the lowest pole/zero natural frequency to a hundred times the highest (two decades either side;
     * a delay τ counts as a feature at 1/τ; with no feature at all, 0.01 .. 100 rad/s). With a delay the top is
     * lowered to where the delay alone lags two turns, ω = 4π/τ ({@link #DELAY_TOP_RAD}), but kept at least a
     * decade above the highest pole or zero: beyond that the picture is the delay's phase roll only (a 250 µs delay
     * would otherwise put the grid near 64 kHz). Sampled: from the same low end
     * (roots mapped through s = ln(z)/T; at most a thousandth of Nyquist) up to {@link #BELOW_NYQUIST} of the Nyquist
     * frequency, as {@link #logSpacedRadPerSBelowNyquist}. {@value #MODEL_POINTS_PER_DECADE} log-spaced points per
     * decade, plus, for every root with damping ratio below {@value #LIGHT_DAMPING}, its natural frequency itself and
     * points spaced ζ/4 in ln ω around it, so a lightly damped peak or notch is drawn at its true depth. Roots at the
     * origin (z = 1) are no feature; for roots on the stability boundary (ζ = 0) the natural frequency itself, where
     * the response is infinite, is left out.
     */
    public static double[] forModelRadPerS(TransferFunction g) {
        boolean sampled = g.isDiscrete();
        double ts = sampled ? g.sampleTimeS() : 0;
        double top = sampled ? BELOW_NYQUIST * Math.PI / ts : Double.POSITIVE_INFINITY;
        List<double[]> features = new ArrayList<>(); // {ωn rad/s, ζ}
        List<Complex> roots = new ArrayList<>(g.poles());
        roots.addAll(g.zeros());
        for (Complex r : roots) {
            Complex sr = r;
            if (sampled) {
                if (r.abs() == 0 || r.subtract(Complex.ONE).abs() <= 1e-9) continue;
                sr = r.log().divide(ts);
            } else if (r.abs() <= 1e-9) {
                continue;
            }
            double wn = sr.abs();
            if (!(wn > 0) || !Double.isFinite(wn)) continue;
            features.add(new double[] {wn, Math.abs(-sr.getReal() / wn)});
        }
        if (g.hasDelay()) features.add(new double[] {1 / g.delayS(), 1});
        double fmin = Double.POSITIVE_INFINITY, fmax = 0;
        for (double[] f : features) { fmin = Math.min(fmin, f[0]); fmax = Math.max(fmax, f[0]); }
        if (fmax == 0) { fmin = 1; fmax = 1; }
        double lo, hi;
        if (sampled) {
            hi = top;
            lo = Math.min(fmin / 100, hi / 1000);
        } else {
            lo = fmin / 100;
            hi = g.hasDelay() && g.delayS() > 0 ? delayTopRadPerS(features, fmax * 100, g.delayS()) : fmax * 100;
        }
        int n = Math.max(2, (int) Math.ceil(Math.log10(hi / lo) * MODEL_POINTS_PER_DECADE) + 1);
        double[] base = sampled ? logSpacedRadPerSBelowNyquist(Units.radPerSToHz(lo), ts, n) : logRadPerS(lo, hi, n);
        List<Double> pts = new ArrayList<>();
        for (double v : base) pts.add(v);
        List<Double> onBoundary = new ArrayList<>();
        for (double[] f : features) {
            if (f[1] >= LIGHT_DAMPING) continue;
            if (f[1] < 1e-9) { onBoundary.add(f[0]); continue; }
            for (int k = -40; k <= 40; k++) pts.add(f[0] * Math.exp(k * f[1] / 4));
        }
        for (double wb : onBoundary) for (int k = 1; k <= 20; k++) { pts.add(wb * (1 - 1e-4 * k)); pts.add(wb * (1 + 1e-4 * k)); }
        double[] a = pts.stream().mapToDouble(Double::doubleValue)
                .filter(v -> v >= lo && v <= hi && onBoundary.stream().noneMatch(wb -> Math.abs(v - wb) <= 1e-6 * wb)).toArray();
        Arrays.sort(a);
        int k = 0;
        for (int i = 0; i < a.length; i++) if (k == 0 || a[i] > a[k - 1] * (1 + 1e-12)) a[k++] = a[i];
        return Arrays.copyOf(a, k);
    }

    /** min(hi, max(10·highest root, 4π/τ)); the delay is the last feature. */
    private static double delayTopRadPerS(List<double[]> features, double hi, double delayS) {
        double rootsMax = 0;
        for (int i = 0; i < features.size() - 1; i++) rootsMax = Math.max(rootsMax, features.get(i)[0]);
        return Math.min(hi, Math.max(10 * rootsMax, DELAY_TOP_RAD / delayS));
    }
}
