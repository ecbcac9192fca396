package org.loopledger.tune;

import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Finds lightly damped resonances in a measured plant FRF (current or torque to velocity).
 *
 * <p>The rigid-body trend of a velocity plant falls at -20 dB/decade; multiplying |P| by ω flattens it,
 * so a resonance shows as a peak of 20·log10(|P|·ω) above its running median (over one octave around
 * each point). A peak counts when it stands at least {@code minProminenceDb} above that trend. Its
 * half-power width is read where the curve falls 3 dB below the peak on both sides, and the damping is
 * estimated as ζ ≈ Δf/(2f) (half-power bandwidth method; common practice, e.g. Ewins, Modal Testing,
 * 2nd ed., §4.3, from memory). The method needs the peak resolved by the grid: when the half-power width
 * is narrower than the frequency spacing at the peak, or fewer than three points lie above the half-power
 * level, the resonance carries a {@link ResonanceWarning.Kind#DAMPING_NOT_RESOLVED} warning (the sampled top
 * sits below the true one, so the width and damping are artefacts of the grid).
 */
public final class Resonances {
    /** Points above the half-power level for the peak to count as resolved (common practice: a few points across the peak). */
    static final int MIN_POINTS_ABOVE_HALF_POWER = 3;

    private Resonances() {}

    /** Resonances standing at least {@code minProminenceDb} (&gt; 0) above the rigid-body trend, strongest first. */
    public static List<Resonance> find(Frf plantToVelocity, double minProminenceDb) {
        if (!(minProminenceDb > 0)) throw new IllegalArgumentException("minimum prominence must be a positive number of dB, got " + minProminenceDb);
        double[] w = plantToVelocity.omegaRadPerS();
        double[] mag = plantToVelocity.magnitude();
        int n = w.length;
        double[] y = new double[n];
        for (int i = 0; i < n; i++) y[i] = 20 * Math.log10(mag[i] * w[i]);
        double[] trend = runningMedianOverOctave(w, y);
        List<Resonance> out = new ArrayList<>();
        for (int i = 1; i < n - 1; i++) {
            if (!(y[i] >= y[i - 1] && y[i] > y[i + 1])) continue;
            double prom = y[i] - trend[i];
            if (prom < minProminenceDb) continue;
            int a = i, b = i;
            while (a > 0 && y[a] > y[i] - 3) a--;
            while (b < n - 1 && y[b] > y[i] - 3) b++;
            if (y[a] > y[i] - 3 || y[b] > y[i] - 3) continue; // the half-power points are outside the band
            double fa = interpolateHz(w, y, a, a + 1, y[i] - 3), fb = interpolateHz(w, y, b - 1, b, y[i] - 3);
            double f = w[i] / (2 * Math.PI);
            double width = fb - fa;
            double spacingHz = Math.max(w[i + 1] - w[i], w[i] - w[i - 1]) / (2 * Math.PI);
            int above = b - a - 1;
            List<ResonanceWarning> warnings = new ArrayList<>();
            if (width < spacingHz || above < MIN_POINTS_ABOVE_HALF_POWER) {
                warnings.add(new ResonanceWarning(ResonanceWarning.Kind.DAMPING_NOT_RESOLVED, f, String.format(java.util.Locale.ROOT,
                        "damping not resolved at %s: the half-power width %s spans %d grid point%s (spacing %s there); the peak's height, width "
                                + "and damping ≈ %s are set by the grid, not the mechanics. Measure with a finer frequency resolution near %s "
                                + "(a spacing below %s, i.e. a longer period or record)", Units.formatHz(f), Units.formatHz(width), above,
                        above == 1 ? "" : "s", Units.formatHz(spacingHz), Units.g4(width / (2 * f)), Units.formatHz(f),
                        Units.formatHz(Math.max(width, 0) / MIN_POINTS_ABOVE_HALF_POWER))));
            }
            out.add(new Resonance(f, prom, width, width / (2 * f), warnings));
        }
        out.sort(Comparator.comparingDouble(Resonance::prominenceDb).reversed());
        return out;
    }

    private static double interpolateHz(double[] w, double[] y, int i, int j, double level) {
        double t = (level - y[i]) / (y[j] - y[i]);
        if (!Double.isFinite(t)) t = 0;
        return Math.exp(Math.log(w[i]) + t * (Math.log(w[j]) - Math.log(w[i]))) / (2 * Math.PI);
    }

    private static double[] runningMedianOverOctave(double[] w, double[] y) {
        int n = w.length;
        double[] r = new double[n];
        int lo = 0, hi = 0;
        for (int i = 0; i < n; i++) {
            while (w[lo] < w[i] / Math.sqrt(2)) lo++;
            while (hi < n - 1 && w[hi + 1] <= w[i] * Math.sqrt(2)) hi++;
            double[] win = java.util.Arrays.copyOfRange(y, lo, hi + 1);
            java.util.Arrays.sort(win);
            r[i] = win[win.length / 2];
        }
        return r;
    }
}
