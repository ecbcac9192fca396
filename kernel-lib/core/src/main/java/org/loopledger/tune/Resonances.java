package org.loopledger.tune;

import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * Finds lightly damped resonances (peaks) and antiresonances (dips) in a measured plant FRF, from
 * current, torque or force to position, velocity or acceleration.
 *
 * <p>The rigid-body trend of a plant with n net integrators falls at -20·n dB/decade (n = 2 to position,
 * 1 to velocity, 0 to acceleration; a negative n for differentiators); multiplying |P| by ω<sup>n</sup>
 * flattens it, so a resonance shows as a peak of 20·log10(|P|·ω<sup>n</sup>) above its running median (over one
 * octave around each point) and an antiresonance as a dip below it. A peak (dip) counts when it stands at
 * least {@code minProminenceDb} above (below) that trend. Its half-power width is read where the curve
 * falls 3 dB below the peak (rises 3 dB above the dip) on both sides, and the damping is estimated as
 * ζ ≈ Δf/(2f) (half-power bandwidth method; common practice, e.g. Ewins, Modal Testing, 2nd ed., §4.3, from
 * memory; for a dip |1 - x² + 2jζx| doubles its squared value at x ≈ 1 ± ζ, the same width, derivation by hand).
 * The frequency is that of the extreme grid point: the grid's resolution limits it. The method needs the
 * extreme resolved by the grid: when the half-power width is narrower than the frequency spacing there, or
 * fewer than three points lie beyond the half-power level, the result carries a
 * {@link ResonanceWarning.Kind#DAMPING_NOT_RESOLVED} warning (the sampled top sits below the true one, so the
 * width and damping are artefacts of the grid).
 */
public final class Resonances {
    /** Net integrators of a plant to position (current → position: 1/s²). */
    public static final int TO_POSITION = 2;
    /** Net integrators of a plant to velocity (current → velocity: 1/s), the default. */
    public static final int TO_VELOCITY = 1;
    /** Net integrators of a plant to acceleration (current → acceleration: a constant). */
    public static final int TO_ACCELERATION = 0;
    /** Points above the half-power level for the peak to count as resolved (common practice: a few points across the peak). */
    static final int MIN_POINTS_ABOVE_HALF_POWER = 3;

    private Resonances() {}

    /** Resonances of a plant to velocity standing at least {@code minProminenceDb} (&gt; 0) above the rigid-body trend, strongest first. */
    public static List<Resonance> find(Frf plantToVelocity, double minProminenceDb) {
        return find(plantToVelocity, TO_VELOCITY, minProminenceDb);
    }

    /**
     * Resonances of a plant with {@code integrators} net integrators in its rigid-body trend ({@link #TO_POSITION},
     * {@link #TO_VELOCITY}, {@link #TO_ACCELERATION}, or any other whole number, negative for differentiators),
     * standing at least {@code minProminenceDb} (&gt; 0) above that trend, strongest first.
     */
    public static List<Resonance> find(Frf plant, int integrators, double minProminenceDb) {
        List<Resonance> out = new ArrayList<>();
        for (double[] e : extremes(plant, integrators, minProminenceDb, +1)) {
            out.add(new Resonance(e[0], e[1], e[2], e[2] / (2 * e[0]), resolution(e, "peak")));
        }
        out.sort(Comparator.comparingDouble(Resonance::prominenceDb).reversed());
        return out;
    }

    /** Antiresonances of a plant to velocity at least {@code minDepthDb} (&gt; 0) below the rigid-body trend, deepest first. */
    public static List<Antiresonance> findAntiresonances(Frf plantToVelocity, double minDepthDb) {
        return findAntiresonances(plantToVelocity, TO_VELOCITY, minDepthDb);
    }

    /** As {@link #find(Frf, int, double)}, for dips: antiresonances at least {@code minDepthDb} (&gt; 0) below the trend, deepest first. */
    public static List<Antiresonance> findAntiresonances(Frf plant, int integrators, double minDepthDb) {
        List<Antiresonance> out = new ArrayList<>();
        for (double[] e : extremes(plant, integrators, minDepthDb, -1)) {
            out.add(new Antiresonance(e[0], e[1], e[2], e[2] / (2 * e[0]), resolution(e, "dip")));
        }
        out.sort(Comparator.comparingDouble(Antiresonance::depthDb).reversed());
        return out;
    }

    /** The DAMPING_NOT_RESOLVED warning for an extreme {f, dB, width, spacing, points beyond half power}, or none. */
    private static List<ResonanceWarning> resolution(double[] e, String what) {
        double f = e[0], width = e[2], spacingHz = e[3];
        int above = (int) e[4];
        if (width >= spacingHz && above >= MIN_POINTS_ABOVE_HALF_POWER) return List.of();
        return List.of(new ResonanceWarning(ResonanceWarning.Kind.DAMPING_NOT_RESOLVED, java.util.OptionalDouble.of(f), String.format(java.util.Locale.ROOT,
                "damping not resolved at %s: the half-power width %s spans %d grid point%s (spacing %s there); the %s's height, width "
                        + "and damping ≈ %s are set by the grid, not the mechanics. Measure with a finer frequency resolution near %s "
                        + "(a spacing below %s, i.e. a longer period or record)", Units.formatHz(f), Units.formatHz(width), above,
                above == 1 ? "" : "s", Units.formatHz(spacingHz), what, Units.g4(width / (2 * f)), Units.formatHz(f),
                Units.formatHz(Math.max(width, 0) / MIN_POINTS_ABOVE_HALF_POWER))));
    }

    /**
     * {frequency Hz, height above (sign +1) or depth below (sign -1) the trend in dB, half-power width Hz,
     * grid spacing at the extreme Hz, points beyond the half-power level} per extreme.
     */
    private static List<double[]> extremes(Frf plant, int integrators, double minDb, int sign) {
        if (!(minDb > 0)) throw new IllegalArgumentException("minimum prominence must be a positive number of dB, got " + minDb);
        if (Math.abs(integrators) > 6) {
            throw new IllegalArgumentException("a plant with " + integrators + " net integrators is not a mechanical axis; give 2 (to position), 1 (to velocity) or 0 (to acceleration)");
        }
        double[] w = plant.omegaRadPerS();
        double[] mag = plant.magnitude();
        int n = w.length;
        double[] y = new double[n];
        for (int i = 0; i < n; i++) y[i] = sign * 20 * Math.log10(mag[i] * Math.pow(w[i], integrators));
        double[] trend = runningMedianOverOctave(w, y);
        List<double[]> out = new ArrayList<>();
        for (int i = 1; i < n - 1; i++) {
            if (!(y[i] >= y[i - 1] && y[i] > y[i + 1])) continue;
            double prom = y[i] - trend[i];
            if (prom < minDb) continue;
            int a = i, b = i;
            while (a > 0 && y[a] > y[i] - 3) a--;
            while (b < n - 1 && y[b] > y[i] - 3) b++;
            if (y[a] > y[i] - 3 || y[b] > y[i] - 3) continue; // the half-power points are outside the band
            double fa = interpolateHz(w, y, a, a + 1, y[i] - 3), fb = interpolateHz(w, y, b - 1, b, y[i] - 3);
            double spacingHz = Math.max(w[i + 1] - w[i], w[i] - w[i - 1]) / (2 * Math.PI);
            out.add(new double[] {w[i] / (2 * Math.PI), prom, fb - fa, spacingHz, b - a - 1});
        }
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
            double[] win = Arrays.copyOfRange(y, lo, hi + 1);
            Arrays.sort(win);
            r[i] = win[win.length / 2];
        }
        return r;
    }
}
