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
 * <p>The fast path {@link #ofArrays} takes primitive arrays directly (copied once); the core loops
 * then run on primitive arrays without any {@code Complex} objects.
 */
public final class MeasuredLoop implements LoopResponse {
    private final double[] w;
    private final double[] re;
    private final double[] im;
    private final double[] logW;
    private final double[] logMag;
    private final double[] phase;
    private final double ts;            // 0: continuous
    private final int integrators;
    private final boolean integratorsStated;
    private final int unstable;         // -1: not stated
    private final double anchorRad;     // NaN: default anchor

    private MeasuredLoop(double[] w, double[] re, double[] im, double ts, int integrators, boolean stated, int unstable, double anchorRad) {
        this.w = w;
        this.re = re;
        this.im = im;
        this.ts = ts;
        this.unstable = unstable;
        this.anchorRad = anchorRad;
        int n = w.length;
        logW = new double[n];
        logMag = new double[n];
        phase = new double[n];
        for (int i = 0; i < n; i++) {
            logW[i] = Math.log(w[i]);
            logMag[i] = 0.5 * Math.log(re[i] * re[i] + im[i] * im[i]);
            phase[i] = Math.atan2(im[i], re[i]);
        }
        for (int i = 1; i < n; i++) phase[i] = phase[i - 1] + ModelLoop.principal(phase[i] - phase[i - 1]);
        this.integratorsStated = stated;
        this.integrators = stated ? integrators : estimateIntegrators();
        double anchor = Double.isNaN(anchorRad) ? -this.integrators * Math.PI / 2 : anchorRad;
        double shift = 2 * Math.PI * Math.round((anchor - phase[0]) / (2 * Math.PI));
        for (int i = 0; i < n; i++) phase[i] += shift;
    }

    /** A measured continuous-time loop gain. */
    public static MeasuredLoop of(Frf loopGain) {
        return ofArrays(loopGain.omegaRadPerS(), loopGain.real(), loopGain.imag());
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
        return new MeasuredLoop(m.w, m.re, m.im, sampleTimeS, 0, false, -1, Double.NaN);
    }

    /**
     * Fast path: L given as primitive arrays (rad/s, real, imaginary; copied). The grid must be strictly
     * increasing and positive, values finite, at least two points.
     */
    public static MeasuredLoop ofArrays(double[] omegaRadPerS, double[] re, double[] im) {
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
        return new MeasuredLoop(omegaRadPerS.clone(), re.clone(), im.clone(), 0, 0, false, -1, Double.NaN);
    }

    /** Same data with a stated number of open-loop unstable poles (needed for the Nyquist criterion). */
    public MeasuredLoop withOpenLoopUnstablePoles(int count) {
        if (count < 0) throw new IllegalArgumentException("the number of unstable open-loop poles cannot be negative, got " + count);
        return new MeasuredLoop(w, re, im, ts, integrators, integratorsStated, count, anchorRad);
    }

    /** Same data with a stated number of net integrators (instead of the slope estimate). */
    public MeasuredLoop withIntegrators(int count) {
        if (count < -3 || count > 4) throw new IllegalArgumentException("net integrator count " + count + " is implausible; give a number in -3..4");
        return new MeasuredLoop(w, re, im, ts, count, true, unstable, anchorRad);
    }

    /** Same data with the phase branch fixed: the lowest point's phase is the one nearest {@code anchorDeg}. */
    public MeasuredLoop withPhaseAnchorDeg(double anchorDeg) {
        if (!Double.isFinite(anchorDeg)) throw new IllegalArgumentException("phase anchor must be finite, got " + anchorDeg);
        return new MeasuredLoop(w, re, im, ts, integrators, integratorsStated, unstable, Math.toRadians(anchorDeg));
    }

    private int estimateIntegrators() {
        int n = w.length;
        if (n < 2) return 0;
        int j = 1;
        while (j < n - 1 && logW[j] - logW[0] < Math.log(1.5)) j++;
        double slope = (logMag[j] - logMag[0]) / (logW[j] - logW[0]);
        long k = Math.round(-slope);
        return (int) Math.max(-3, Math.min(4, k));
    }

    @Override public int size() { return w.length; }

    @Override public double omegaRadPerS(int i) { return w[i]; }

    @Override public double re(int i) { return re[i]; }

    @Override public double im(int i) { return im[i]; }

    @Override public double phaseRad(int i) { return phase[i]; }

    /** Interpolation in log ω on log|L| and unwrapped phase (no extrapolation: ω is clamped to the bracket). */
    @Override public void valueAt(double omega, int i, double[] out) {
        int j = Math.max(0, Math.min(i, w.length - 2));
        double x = Math.log(omega);
        double t = (x - logW[j]) / (logW[j + 1] - logW[j]);
        t = Math.max(0, Math.min(1, t));
        double lm = logMag[j] + t * (logMag[j + 1] - logMag[j]);
        double p = phase[j] + t * (phase[j + 1] - phase[j]);
        double m = Math.exp(lm);
        out[0] = m * Math.cos(p);
        out[1] = m * Math.sin(p);
        out[2] = p;
    }

    /** log|L| at grid point i (natural log). */
    double logMagnitude(int i) { return logMag[i]; }

    double logOmega(int i) { return logW[i]; }

    @Override public boolean isExact() { return false; }

    @Override public OptionalDouble sampleTimeS() { return ts > 0 ? OptionalDouble.of(ts) : OptionalDouble.empty(); }

    @Override public int netIntegrators() { return integrators; }

    /** Whether the integrator count was stated (true) or estimated from the low-frequency slope (false). */
    public boolean integratorsStated() { return integratorsStated; }

    @Override public OptionalInt openLoopUnstablePoles() { return unstable < 0 ? OptionalInt.empty() : OptionalInt.of(unstable); }

    @Override public int openLoopPolesOnAxis() { return Math.max(0, integrators); }

    @Override public String describe() {
        return "measured data, " + w.length + " points, " + Units.formatHz(Units.radPerSToHz(w[0])) + " .. "
                + Units.formatHz(Units.radPerSToHz(w[w.length - 1])) + (ts > 0 ? ", sampled at " + Units.formatHz(1 / ts) : "");
    }

    @Override public String toString() { return "MeasuredLoop[" + describe() + "]"; }
}
