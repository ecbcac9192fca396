package org.loopledger.frf;

import org.apache.commons.math3.complex.Complex;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.Arrays;
import java.util.Optional;

/**
 * Frequency response function data: complex values on a strictly increasing grid of positive
 * frequencies (rad/s), with optional coherence (0..1 per point) and optional per-point uncertainty
 * (standard deviation of the complex value, same units as the value).
 *
 * <p>Immutable; arrays are copied in and out. Arithmetic with another {@code Frf} requires the same
 * grid (use {@link #resampledTo} first; interpolation is in log-frequency on log-magnitude and
 * unwrapped phase, never on real and imaginary parts). Arithmetic with a model evaluates the model on
 * this grid. Coherence and uncertainty survive scaling by a model (uncertainty scaled by |model|);
 * a product or quotient of two measured {@code Frf}s drops both, since their joint statistics are unknown.
 * An {@code Frf} knows whether it holds measured data or a model's response ({@link #isComputedFromModel}),
 * so analyses describe it truthfully.
 */
public final class Frf {
    private final double[] omega;
    private final double[] re;
    private final double[] im;
    private final double[] coherence;   // null when absent
    private final double[] uncertainty; // null when absent
    private final boolean computed;     // true: evaluated from models only, false: holds measured data

    private Frf(double[] omega, double[] re, double[] im, double[] coherence, double[] uncertainty, boolean computed) {
        this.computed = computed;
        this.omega = omega;
        this.re = re;
        this.im = im;
        this.coherence = coherence;
        this.uncertainty = uncertainty;
    }

    /** From a grid in rad/s and the real and imaginary parts (all copied). */
    public static Frf ofParts(double[] omegaRadPerS, double[] re, double[] im) {
        validateGrid(omegaRadPerS);
        if (re == null || im == null) throw new IllegalArgumentException("FRF real and imaginary parts must be given (got null)");
        if (re.length != omegaRadPerS.length || im.length != omegaRadPerS.length) {
            throw new IllegalArgumentException("FRF arrays have different lengths: " + omegaRadPerS.length + " frequencies, "
                    + re.length + " real parts, " + im.length + " imaginary parts; give one value per frequency");
        }
        for (int i = 0; i < re.length; i++) {
            if (!Double.isFinite(re[i]) || !Double.isFinite(im[i])) {
                throw new IllegalArgumentException("FRF value at index " + i + " (" + Units.formatHz(Units.radPerSToHz(omegaRadPerS[i]))
                        + ") is not finite: " + re[i] + " + j" + im[i] + "; drop or restrict that point");
            }
        }
        return new Frf(omegaRadPerS.clone(), re.clone(), im.clone(), null, null, false);
    }

    /** From a grid in Hz (converted to rad/s) and the real and imaginary parts. */
    public static Frf ofPartsHz(double[] frequencyHz, double[] re, double[] im) {
        double[] w = new double[frequencyHz.length];
        for (int i = 0; i < w.length; i++) w[i] = Units.hzToRadPerS(frequencyHz[i]);
        return ofParts(w, re, im);
    }

    /** A model evaluated on a grid (rad/s). */
    public static Frf ofModel(TransferFunction g, double[] omegaRadPerS) {
        validateGrid(omegaRadPerS);
        double[] re = new double[omegaRadPerS.length], im = new double[omegaRadPerS.length];
        g.response(omegaRadPerS, re, im);
        Frf f = ofParts(omegaRadPerS, re, im);
        return new Frf(f.omega, f.re, f.im, null, null, true);
    }

    /**
     * Where the values come from: true when computed from models only ({@link #ofModel}, and arithmetic
     * between computed responses and models), false when they hold measured data ({@link #ofParts},
     * estimates, and anything multiplied by them). Not part of {@link #equals}: equal values are equal data.
     */
    public boolean isComputedFromModel() { return computed; }

    /** The same values, marked as computed from models (for responses built from model arrays, e.g. a loop around a model plant). */
    public Frf asComputedFromModel() { return computed ? this : new Frf(omega, re, im, coherence, uncertainty, true); }

    private static void validateGrid(double[] w) {
        if (w == null || w.length == 0) throw new IllegalArgumentException("an FRF needs at least one frequency");
        for (int i = 0; i < w.length; i++) {
            if (!(w[i] > 0) || Double.isInfinite(w[i])) {
                throw new IllegalArgumentException("frequency at index " + i + " is " + w[i] + " rad/s; FRF frequencies must be finite and positive");
            }
            if (i > 0 && !(w[i] > w[i - 1])) {
                throw new IllegalArgumentException("FRF frequencies must be strictly increasing, but index " + i + " (" + w[i]
                        + " rad/s) is not above index " + (i - 1) + " (" + w[i - 1] + " rad/s); sort the data and drop duplicates");
            }
        }
    }

    /** Same values with a coherence per point (0..1, copied). */
    public Frf withCoherence(double[] coherence) {
        if (coherence.length != omega.length) {
            throw new IllegalArgumentException("coherence has " + coherence.length + " values for " + omega.length + " frequencies");
        }
        for (int i = 0; i < coherence.length; i++) {
            if (!(coherence[i] >= 0 && coherence[i] <= 1 + 1e-12)) {
                throw new IllegalArgumentException("coherence at index " + i + " is " + coherence[i] + "; it must lie in [0, 1]");
            }
        }
        return new Frf(omega, re, im, coherence.clone(), uncertainty, computed);
    }

    /** Same values with a per-point uncertainty (standard deviation, non-negative, copied). */
    public Frf withUncertainty(double[] uncertainty) {
        if (uncertainty.length != omega.length) {
            throw new IllegalArgumentException("uncertainty has " + uncertainty.length + " values for " + omega.length + " frequencies");
        }
        for (int i = 0; i < uncertainty.length; i++) {
            if (!(uncertainty[i] >= 0) || Double.isInfinite(uncertainty[i])) {
                throw new IllegalArgumentException("uncertainty at index " + i + " is " + uncertainty[i] + "; it must be finite and non-negative");
            }
        }
        return new Frf(omega, re, im, coherence, uncertainty.clone(), computed);
    }

    public int size() { return omega.length; }

    public double[] omegaRadPerS() { return omega.clone(); }

    public double[] frequencyHz() {
        double[] f = new double[omega.length];
        for (int i = 0; i < f.length; i++) f[i] = Units.radPerSToHz(omega[i]);
        return f;
    }

    public double omegaAt(int i) { return omega[i]; }

    public double minOmegaRadPerS() { return omega[0]; }

    public double maxOmegaRadPerS() { return omega[omega.length - 1]; }

    public double[] real() { return re.clone(); }

    public double[] imag() { return im.clone(); }

    public double realAt(int i) { return re[i]; }

    public double imagAt(int i) { return im[i]; }

    public Complex valueAt(int i) { return new Complex(re[i], im[i]); }

    public boolean hasCoherence() { return coherence != null; }

    public Optional<double[]> coherence() { return coherence == null ? Optional.empty() : Optional.of(coherence.clone()); }

    public Optional<double[]> uncertainty() { return uncertainty == null ? Optional.empty() : Optional.of(uncertainty.clone()); }

    public double[] magnitude() {
        double[] m = new double[re.length];
        for (int i = 0; i < m.length; i++) m[i] = Math.hypot(re[i], im[i]);
        return m;
    }

    public double[] magnitudeDb() {
        double[] m = magnitude();
        for (int i = 0; i < m.length; i++) m[i] = Units.ratioToDb(m[i]);
        return m;
    }

    /** Phase in rad, unwrapped along the grid, starting on the principal branch at the first point. */
    public double[] phaseRadUnwrapped() { return Phase.unwrapRad(Phase.angleRad(re, im)); }

    public double[] phaseDegUnwrapped() {
        double[] p = phaseRadUnwrapped();
        for (int i = 0; i < p.length; i++) p[i] = Units.radToDeg(p[i]);
        return p;
    }

    /** This·other on the same grid (coherence and uncertainty dropped). */
    public Frf times(Frf other) {
        requireSameGrid(other, "product");
        double[] r = new double[re.length], m = new double[re.length];
        for (int i = 0; i < r.length; i++) {
            r[i] = re[i] * other.re[i] - im[i] * other.im[i];
            m[i] = re[i] * other.im[i] + im[i] * other.re[i];
        }
        return new Frf(omega, r, m, null, null, computed && other.computed);
    }

    /** This/other on the same grid (coherence and uncertainty dropped). */
    public Frf dividedBy(Frf other) { return times(other.inverse()); }

    /** This + other on the same grid (coherence and uncertainty dropped). */
    public Frf plus(Frf other) {
        requireSameGrid(other, "sum");
        double[] r = new double[re.length], m = new double[re.length];
        for (int i = 0; i < r.length; i++) {
            r[i] = re[i] + other.re[i];
            m[i] = im[i] + other.im[i];
        }
        return new Frf(omega, r, m, null, null, computed && other.computed);
    }

    /** This·G with the model evaluated on this grid; coherence kept, uncertainty scaled by |G|. */
    public Frf times(TransferFunction g) {
        double[] gr = new double[omega.length], gi = new double[omega.length];
        g.response(omega, gr, gi);
        return scaledBy(gr, gi);
    }

    /** This/G with the model evaluated on this grid. */
    public Frf dividedBy(TransferFunction g) {
        double[] gr = new double[omega.length], gi = new double[omega.length];
        g.response(omega, gr, gi);
        for (int i = 0; i < gr.length; i++) {
            double d = gr[i] * gr[i] + gi[i] * gi[i];
            if (d == 0) throw new IllegalArgumentException("model is zero at " + Units.formatHz(Units.radPerSToHz(omega[i])) + "; cannot divide by it");
            gr[i] = gr[i] / d;
            gi[i] = -gi[i] / d;
        }
        return scaledBy(gr, gi);
    }

    /** This + G with the model evaluated on this grid (coherence and uncertainty kept). */
    public Frf plus(TransferFunction g) {
        double[] gr = new double[omega.length], gi = new double[omega.length];
        g.response(omega, gr, gi);
        for (int i = 0; i < gr.length; i++) {
            gr[i] += re[i];
            gi[i] += im[i];
        }
        return new Frf(omega, gr, gi, coherence, uncertainty, computed);
    }

    public Frf times(double k) {
        if (!Double.isFinite(k)) throw new IllegalArgumentException("scale factor must be finite, got " + k);
        double[] gr = new double[omega.length], gi = new double[omega.length];
        Arrays.fill(gr, k);
        return scaledBy(gr, gi);
    }

    private Frf scaledBy(double[] gr, double[] gi) {
        double[] r = new double[re.length], m = new double[re.length];
        double[] u = uncertainty == null ? null : new double[re.length];
        for (int i = 0; i < r.length; i++) {
            r[i] = re[i] * gr[i] - im[i] * gi[i];
            m[i] = re[i] * gi[i] + im[i] * gr[i];
            if (u != null) u[i] = uncertainty[i] * Math.hypot(gr[i], gi[i]);
        }
        return new Frf(omega, r, m, coherence, u, computed);
    }

    /** 1/this point by point; throws where a value is exactly zero. */
    public Frf inverse() {
        double[] r = new double[re.length], m = new double[re.length];
        for (int i = 0; i < r.length; i++) {
            double d = re[i] * re[i] + im[i] * im[i];
            if (d == 0) throw new IllegalArgumentException("FRF is zero at " + Units.formatHz(Units.radPerSToHz(omega[i])) + "; it has no inverse there");
            r[i] = re[i] / d;
            m[i] = -im[i] / d;
        }
        return new Frf(omega, r, m, coherence, null, computed);
    }

    public Frf negate() { return times(-1.0); }

    /** The points with low &lt;= ω &lt;= high (rad/s). Throws when none remain. */
    public Frf restrictedToRadPerS(double lowRadPerS, double highRadPerS) {
        if (Double.isNaN(lowRadPerS) || Double.isNaN(highRadPerS) || !(lowRadPerS <= highRadPerS)) {
            throw new IllegalArgumentException("band " + lowRadPerS + " .. " + highRadPerS + " rad/s is not a band; give low <= high, both numbers");
        }
        int a = 0;
        while (a < omega.length && omega[a] < lowRadPerS) a++;
        int b = omega.length;
        while (b > a && omega[b - 1] > highRadPerS) b--;
        if (b <= a) {
            throw new IllegalArgumentException("no FRF point lies in " + Units.formatHz(Units.radPerSToHz(lowRadPerS)) + " .. "
                    + Units.formatHz(Units.radPerSToHz(highRadPerS)) + "; the data cover " + describeBand());
        }
        return slice(a, b);
    }

    public Frf restrictedToHz(double lowHz, double highHz) {
        return restrictedToRadPerS(Units.hzToRadPerS(lowHz), Units.hzToRadPerS(highHz));
    }

    private Frf slice(int a, int b) {
        return new Frf(Arrays.copyOfRange(omega, a, b), Arrays.copyOfRange(re, a, b), Arrays.copyOfRange(im, a, b),
                coherence == null ? null : Arrays.copyOfRange(coherence, a, b),
                uncertainty == null ? null : Arrays.copyOfRange(uncertainty, a, b), computed);
    }

    /**
     * This FRF interpolated onto {@code omegaRadPerS} (must lie inside the measured band; no
     * extrapolation): linear in log ω on log|G| and on the unwrapped phase. Coherence is interpolated
     * linearly in log ω; uncertainty likewise.
     */
    public Frf resampledTo(double[] omegaRadPerS) {
        validateGrid(omegaRadPerS);
        double lo = omega[0], hi = omega[omega.length - 1];
        if (omegaRadPerS[0] < lo * (1 - 1e-12) || omegaRadPerS[omegaRadPerS.length - 1] > hi * (1 + 1e-12)) {
            throw new IllegalArgumentException("cannot resample outside the measured band " + describeBand() + " (no extrapolation); restrict the target grid");
        }
        double[] logMag = new double[omega.length];
        for (int i = 0; i < logMag.length; i++) {
            double mag = Math.hypot(re[i], im[i]);
            if (mag == 0) {
                throw new IllegalArgumentException("FRF value at index " + i + " (" + Units.formatHz(Units.radPerSToHz(omega[i]))
                        + ") is exactly zero; interpolation on log-magnitude needs non-zero values (drop or restrict that point)");
            }
            logMag[i] = Math.log(mag);
        }
        double[] ph = phaseRadUnwrapped();
        double[] lw = new double[omega.length];
        for (int i = 0; i < lw.length; i++) lw[i] = Math.log(omega[i]);
        int n = omegaRadPerS.length;
        double[] r = new double[n], m = new double[n];
        double[] c = coherence == null ? null : new double[n];
        double[] u = uncertainty == null ? null : new double[n];
        int k = 0;
        for (int j = 0; j < n; j++) {
            double x = Math.log(Math.min(hi, Math.max(lo, omegaRadPerS[j])));
            while (k < lw.length - 2 && lw[k + 1] < x) k++;
            double t = lw.length == 1 ? 0 : (x - lw[k]) / (lw[k + 1] - lw[k]);
            int k1 = lw.length == 1 ? 0 : k + 1;
            double mag = Math.exp(lerp(logMag[k], logMag[k1], t));
            double p = lerp(ph[k], ph[k1], t);
            r[j] = mag * Math.cos(p);
            m[j] = mag * Math.sin(p);
            if (c != null) c[j] = lerp(coherence[k], coherence[k1], t);
            if (u != null) u[j] = lerp(uncertainty[k], uncertainty[k1], t);
        }
        return new Frf(omegaRadPerS.clone(), r, m, c, u, computed);
    }

    /**
     * The value at one frequency in Hz, interpolated exactly as {@link #resampledTo} does (linear in log ω on
     * log|G| and on the unwrapped phase); at a grid point, the stored value itself. Refuses frequencies outside
     * the grid (no extrapolation).
     */
    public Complex atHz(double hz) {
        if (!(hz > 0) || Double.isInfinite(hz)) {
            throw new IllegalArgumentException("frequency " + hz + " Hz is not a finite positive number; give a frequency inside " + describeBand());
        }
        double w = Units.hzToRadPerS(hz);
        int i = Arrays.binarySearch(omega, w);
        if (i >= 0) return valueAt(i);
        if (w < omega[0] * (1 - 1e-12) || w > omega[omega.length - 1] * (1 + 1e-12)) {
            throw new IllegalArgumentException("frequency " + Units.formatHz(hz) + " lies outside the FRF's grid (" + describeBand()
                    + "); an FRF is not extrapolated: ask for a frequency inside the grid or compute the FRF on a wider one");
        }
        Frf one = resampledTo(new double[] {w});
        return one.valueAt(0);
    }

    /** |G| in dB at one frequency in Hz, interpolated as {@link #atHz}. */
    public double magnitudeDbAtHz(double hz) {
        Complex g = atHz(hz);
        return Units.ratioToDb(Math.hypot(g.getReal(), g.getImaginary())); // as magnitude(): the same value at grid points
    }

    /**
     * Phase in degrees at one frequency in Hz, on the same branch as {@link #phaseDegUnwrapped} (interpolated
     * between the unwrapped phases of the neighbouring grid points; at a grid point, that point's unwrapped phase).
     */
    public double phaseDegAtHz(double hz) {
        atHz(hz); // validates the frequency
        double[] ph = phaseDegUnwrapped();
        double w = Units.hzToRadPerS(hz);
        int i = Arrays.binarySearch(omega, w);
        if (i >= 0) return ph[i];
        int k = Math.min(omega.length - 2, Math.max(0, -i - 2));
        if (omega.length == 1) return ph[0];
        double t = (Math.log(w) - Math.log(omega[k])) / (Math.log(omega[k + 1]) - Math.log(omega[k]));
        return lerp(ph[k], ph[k + 1], Math.min(1, Math.max(0, t)));
    }

    private static double lerp(double a, double b, double t) { return a + (b - a) * t; }

    private void requireSameGrid(Frf other, String what) {
        if (!Arrays.equals(omega, other.omega)) {
            throw new IllegalArgumentException("FRF " + what + ": the two FRFs are on different frequency grids (" + describeBand() + ", "
                    + other.describeBand() + "); resample one onto the other's grid first with resampledTo(...)");
        }
    }

    /** Whether both are on exactly the same grid. */
    public boolean sameGridAs(Frf other) { return Arrays.equals(omega, other.omega); }

    private String describeBand() {
        return omega.length + " points, " + Units.formatHz(Units.radPerSToHz(omega[0])) + " .. "
                + Units.formatHz(Units.radPerSToHz(omega[omega.length - 1]));
    }

    @Override public boolean equals(Object o) {
        return o instanceof Frf f && Arrays.equals(omega, f.omega) && Arrays.equals(re, f.re) && Arrays.equals(im, f.im)
                && Arrays.equals(coherence, f.coherence) && Arrays.equals(uncertainty, f.uncertainty);
    }

    @Override public int hashCode() {
        return 31 * (31 * Arrays.hashCode(omega) + Arrays.hashCode(re)) + Arrays.hashCode(im);
    }

    @Override public String toString() {
        return "Frf[" + describeBand() + (coherence != null ? ", with coherence" : "") + (uncertainty != null ? ", with uncertainty" : "") + "]";
    }
}
