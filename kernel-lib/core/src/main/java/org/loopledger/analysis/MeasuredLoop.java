package org.loopledger.analysis;

import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * A measured loop gain: values on the measured grid only. Between grid points L is interpolated
 * linearly in log ω on log|L| and on the unwrapped phase (the same rule as {@link Frf#resampledTo});
 * outside the band nothing is said.
 *
 * <p>The phase is unwrapped along the grid and its branch fixed at the lowest measured frequency:
 * nearest to -90° per net integrator, the count being estimated from the low-frequency magnitude slope
 * unless stated ({@link #withIntegrators}); {@link #withPhaseAnchorDeg} fixes the branch explicitly
 * (for instance -180° for a loop whose low-frequency gain is negative).
 *
 * <p>The fast path {@link #ofArrays} (and {@link Margins#ofArrays}, which does not even copy) takes primitive arrays directly; the core loops
 * then run on primitive arrays without any {@code Complex} objects.
 */
public final class MeasuredLoop implements LoopResponse {
    private final double[] w;
    private final double[] re;
    private final double[] im;
    /** Unwrapped phase = atan2(im, re) + 2π·turns[i]; found without atan2 from negative-real-axis crossings. */
    private final int[] turns;
    private final double ts;            // 0: continuous
    private final int integrators;
    private final boolean integratorsStated;
    private final int unstable;         // -1: not stated
    private final double anchorRad;     // NaN: default anchor

    private final boolean computed;     // the Frf was computed from models, not measured

    private MeasuredLoop(double[] w, double[] re, double[] im, double ts, int integrators, boolean stated, int unstable, double anchorRad,
            boolean computed) {
        this.computed = computed;
        this.w = w;
        this.re = re;
        this.im = im;
        this.ts = ts;
        this.unstable = unstable;
        this.anchorRad = anchorRad;
        int n = w.length;
        // unwrap by counting crossings of the negative real axis (the branch cut of atan2): crossing it
        // anticlockwise (upper to lower half plane) adds a turn, clockwise removes one. No atan2 per point.
        turns = new int[n];
        int k = 0;
        for (int i = 1; i < n; i++) {
            k += negativeAxisCrossing(re[i - 1], im[i - 1], re[i], im[i]);
            turns[i] = k;
        }
        this.integratorsStated = stated;
        this.integrators = stated ? integrators : estimateIntegrators();
        double anchor = Double.isNaN(anchorRad) ? -this.integrators * Math.PI / 2 : anchorRad;
        double p0 = Math.atan2(im[0], re[0]);
        int shift = (int) Math.round((anchor - p0) / (2 * Math.PI));
        for (int i = 0; i < n; i++) turns[i] += shift;
    }

    /**
     * +1 when the shorter arc from a to b crosses the negative real axis anticlockwise (atan2 jumps from +π
     * to -π), -1 clockwise, 0 otherwise. The upper half plane includes Im = 0.
     */
    static int negativeAxisCrossing(double ar, double ai, double br, double bi) {
        boolean aUp = ai >= 0, bUp = bi >= 0;
        if (aUp == bUp) return 0;
        double cross = ar * bi - ai * br;
        if (aUp) return cross > 0 || (cross == 0 && ar < 0) ? 1 : 0;
        return cross < 0 || (cross == 0 && ar < 0) ? -1 : 0;
    }

    /** A measured continuous-time loop gain. */
    public static MeasuredLoop of(Frf loopGain) {
        MeasuredLoop m = ofArrays(loopGain.omegaRadPerS(), loopGain.real(), loopGain.imag());
        return loopGain.isComputedFromModel() ? new MeasuredLoop(m.w, m.re, m.im, 0, 0, false, -1, Double.NaN, true) : m;
    }

    /**
     * A loop gain measured on a sampled system with sample time {@code sampleTimeS}: every frequency
     * must lie at or below the Nyquist frequency π/T.
     */
    public static MeasuredLoop ofSampled(Frf loopGain, double sampleTimeS) {
        if (!(sampleTimeS > 0) || Double.isInfinite(sampleTimeS)) {
            throw new IllegalArgumentException("sample time must be a finite positive number of seconds, got " + sampleTimeS);
        }
        double nyq = Math.PI / sampleTimeS;
        if (loopGain.maxOmegaRadPerS() > nyq * (1 + 1e-12)) {
            throw new IllegalArgumentException("the FRF reaches " + Units.formatHz(Units.radPerSToHz(loopGain.maxOmegaRadPerS()))
                    + ", above the Nyquist frequency " + Units.formatHz(0.5 / sampleTimeS) + " of the stated sample time "
                    + Units.g4(sampleTimeS) + " s; a sampled loop has no response there; restrict the FRF to the band below Nyquist");
        }
        MeasuredLoop m = of(loopGain);
        return new MeasuredLoop(m.w, m.re, m.im, sampleTimeS, 0, false, -1, Double.NaN, m.computed);
    }

    /**
     * Fast path: L given as primitive arrays (rad/s, real, imaginary; copied). The grid must be strictly
     * increasing and positive, values finite, at least two points.
     */
    public static MeasuredLoop ofArrays(double[] omegaRadPerS, double[] re, double[] im) {
        validate(omegaRadPerS, re, im);
        return new MeasuredLoop(omegaRadPerS.clone(), re.clone(), im.clone(), 0, 0, false, -1, Double.NaN, false);
    }

    /** Validated but not copied: only for callers that do not let the loop escape while the arrays may change. */
    static MeasuredLoop validatedView(double[] omegaRadPerS, double[] re, double[] im) {
        validate(omegaRadPerS, re, im);
        return new MeasuredLoop(omegaRadPerS, re, im, 0, 0, false, -1, Double.NaN, false);
    }

    private static void validate(double[] omegaRadPerS, double[] re, double[] im) {
        if (omegaRadPerS == null || re == null || im == null) throw new IllegalArgumentException("frequency, real and imaginary arrays must not be null");
        if (re.length != omegaRadPerS.length || im.length != omegaRadPerS.length) {
            throw new IllegalArgumentException("arrays have different lengths: " + omegaRadPerS.length + " frequencies, " + re.length
                    + " real parts, " + im.length + " imaginary parts; give one value per frequency");
        }
        if (omegaRadPerS.length < 2) throw new IllegalArgumentException("a measured loop needs at least 2 frequencies, got " + omegaRadPerS.length);
        for (int i = 0; i < omegaRadPerS.length; i++) {
            double v = omegaRadPerS[i];
            if (!(v > 0) || Double.isInfinite(v) || (i > 0 && !(v > omegaRadPerS[i - 1]))) {
                throw new IllegalArgumentException("frequency at index " + i + " is " + v + " rad/s; frequencies must be positive, finite and strictly increasing");
            }
            if (!Double.isFinite(re[i]) || !Double.isFinite(im[i]) || (re[i] == 0 && im[i] == 0)) {
                throw new IllegalArgumentException("loop value at index " + i + " is " + re[i] + " + j" + im[i]
                        + "; values must be finite and non-zero; drop that point");
            }
        }
    }

    /** Same data with a stated number of open-loop unstable poles (needed for the Nyquist criterion). */
    public MeasuredLoop withOpenLoopUnstablePoles(int count) {
        if (count < 0) throw new IllegalArgumentException("the number of unstable open-loop poles cannot be negative, got " + count);
        return new MeasuredLoop(w, re, im, ts, integrators, integratorsStated, count, anchorRad, computed);
    }

    /** Same data with a stated number of net integrators (instead of the slope estimate). */
    public MeasuredLoop withIntegrators(int count) {
        if (count < -3 || count > 4) throw new IllegalArgumentException("net integrator count " + count + " is implausible; give a number in -3..4");
        return new MeasuredLoop(w, re, im, ts, count, true, unstable, anchorRad, computed);
    }

    /** Same data with the phase branch fixed: the lowest point's phase is the one nearest {@code anchorDeg}. */
    public MeasuredLoop withPhaseAnchorDeg(double anchorDeg) {
        if (!Double.isFinite(anchorDeg)) throw new IllegalArgumentException("phase anchor must be finite, got " + anchorDeg);
        return new MeasuredLoop(w, re, im, ts, integrators, integratorsStated, unstable, Math.toRadians(anchorDeg), computed);
    }

    private int estimateIntegrators() {
        int n = w.length;
        int j = 1;
        while (j < n - 1 && w[j] < 1.5 * w[0]) j++;
        double slope = (logMagnitude(j) - logMagnitude(0)) / Math.log(w[j] / w[0]);
        long k = Math.round(-slope);
        return (int) Math.max(-3, Math.min(4, k));
    }

    @Override public int size() { return w.length; }

    @Override public double omegaRadPerS(int i) { return w[i]; }

    @Override public double re(int i) { return re[i]; }

    @Override public double im(int i) { return im[i]; }

    @Override public double phaseRad(int i) { return Math.atan2(im[i], re[i]) + 2 * Math.PI * turns[i]; }

    /** Interpolation in log ω on log|L| and unwrapped phase (no extrapolation: ω is clamped to the bracket). */
    @Override public void valueAt(double omega, int i, double[] out) {
        int j = Math.max(0, Math.min(i, w.length - 2));
        double t = Math.log(omega / w[j]) / Math.log(w[j + 1] / w[j]);
        t = Math.max(0, Math.min(1, t));
        double lm0 = logMagnitude(j), lm1 = logMagnitude(j + 1);
        double p0 = phaseRad(j), p1 = phaseRad(j + 1);
        double m = Math.exp(lm0 + t * (lm1 - lm0));
        double p = p0 + t * (p1 - p0);
        out[0] = m * Math.cos(p);
        out[1] = m * Math.sin(p);
        out[2] = p;
    }

    /** log|L| at grid point i (natural log). */
    double logMagnitude(int i) { return 0.5 * Math.log(re[i] * re[i] + im[i] * im[i]); }

    @Override public boolean isExact() { return false; }

    @Override public OptionalDouble sampleTimeS() { return ts > 0 ? OptionalDouble.of(ts) : OptionalDouble.empty(); }

    @Override public int netIntegrators() { return integrators; }

    /** Whether the integrator count was stated (true) or estimated from the low-frequency slope (false). */
    public boolean integratorsStated() { return integratorsStated; }

    @Override public OptionalInt openLoopUnstablePoles() { return unstable < 0 ? OptionalInt.empty() : OptionalInt.of(unstable); }

    @Override public int openLoopPolesOnAxis() { return Math.max(0, integrators); }

    /** True when the data were computed from models (an {@link Frf#isComputedFromModel} response), false when measured. */
    public boolean computedFromModel() { return computed; }

    @Override public String describe() {
        return (computed ? "model response on a grid, " : "measured data, ") + w.length + " points, " + Units.formatHz(Units.radPerSToHz(w[0])) + " .. "
                + Units.formatHz(Units.radPerSToHz(w[w.length - 1])) + (ts > 0 ? ", sampled at " + Units.formatHz(1 / ts) : "");
    }

    @Override public String toString() { return "MeasuredLoop[" + describe() + "]"; }
}
