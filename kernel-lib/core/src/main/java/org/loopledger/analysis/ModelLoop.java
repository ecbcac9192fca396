package org.loopledger.analysis;

import org.apache.commons.math3.complex.Complex;
import org.loopledger.lti.Polynomial;
import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * A model loop gain (continuous or sampled {@link TransferFunction}, with or without delay) on a
 * dense adaptive grid.
 *
 * <p>The grid runs from a hundredth of the lowest pole/zero natural frequency to a hundred times the
 * highest (ten times for loops with delay, whose phase crossovers never end; continuous only) or to
 * the Nyquist frequency π/T (sampled). It contains the exact gain and phase crossovers' neighbourhoods,
 * clusters of points around every lightly damped pole and zero, and is refined by bisection in log ω
 * until consecutive points differ by at most {@value #MAX_PHASE_STEP_DEG}° in phase and about 1 dB in magnitude.
 *
 * <p>Poles and zeros count as on the imaginary axis (unit circle) when their distance to it is below
 * {@value #AXIS_TOLERANCE}·max(1, |p|): an integrator computed as -1e-15 is an integrator.
 */
public final class ModelLoop implements LoopResponse {
    /** Relative distance to the stability boundary under which a pole counts as on it. */
    public static final double AXIS_TOLERANCE = 1e-9;
    static final double MAX_PHASE_STEP_DEG = 5.0;
    private static final double MAX_LOG_MAG_STEP = 0.115; // natural log, about 1 dB
    private static final int MAX_POINTS = 400_000;

    private final TransferFunction loop;
    private final TransferFunction rational;
    private final double ts;      // 0 when continuous
    private final double tau;
    private final double[] w;
    private final double[] re;
    private final double[] im;
    private final double[] phaseRational; // unwrapped, anchored
    private final int integrators;
    private final FactoredResponse eval;  // the rational part, integrator factors in closed form
    private final int unstable;
    private final int onAxis;
    private final double[] exactGc; // null when not available
    private final double[] exactPc; // null when not available

    private ModelLoop(TransferFunction loop) {
        loop.requireProper("loop analysis");
        this.loop = loop;
        this.rational = loop.withoutDelay();
        this.ts = loop.timeBase() instanceof TimeBase.Sampled sm ? sm.sampleTimeS() : 0;
        this.tau = loop.delayS();
        if (loop.numerator().isZero()) {
            throw new IllegalArgumentException("the loop gain is identically zero; there is no loop to analyse");
        }
        // integrator factors s (or z - 1) split off first, so that their count is exact and they are evaluated in closed form
        this.eval = new FactoredResponse(rational);
        Polynomial numRest = eval.numeratorRest(), denRest = eval.denominatorRest();
        List<Complex> poles = denRest.degree() > 0 ? denRest.roots() : List.of();
        List<Complex> zeros = numRest.degree() > 0 ? numRest.roots() : List.of();
        int polesAtOrigin = eval.denominatorFactors(), zerosAtOrigin = eval.numeratorFactors(), un = 0, ax = eval.denominatorFactors();
        for (Complex p : poles) {
            if (atOrigin(p)) polesAtOrigin++;
            double margin = stabilityDistance(p);
            if (margin > AXIS_TOLERANCE * Math.max(1, p.abs())) un++;
            else if (margin >= -AXIS_TOLERANCE * Math.max(1, p.abs())) ax++;
        }
        for (Complex z : zeros) if (atOrigin(z)) zerosAtOrigin++;
        this.integrators = polesAtOrigin - zerosAtOrigin;
        this.unstable = un;
        this.onAxis = ax;

        // natural frequencies (rad/s) and damping of the roots away from the origin
        List<double[]> features = new ArrayList<>();
        for (Complex r : poles) if (!atOrigin(r)) features.add(naturalFrequency(r));
        for (Complex r : zeros) if (!atOrigin(r)) features.add(naturalFrequency(r));
        features.removeIf(f -> !(f[0] > 0) || !Double.isFinite(f[0]));

        double[] gc = null, pc = null;
        double sigma = centre(features);
        if (ts == 0) {
            gc = OmegaSquared.gainCrossovers(loop.numerator(), loop.denominator(), sigma);
            if (tau == 0) pc = OmegaSquared.phaseCrossovers(loop.numerator(), loop.denominator(), sigma);
        }
        double fmin = Double.POSITIVE_INFINITY, fmax = 0;
        for (double[] f : features) { fmin = Math.min(fmin, f[0]); fmax = Math.max(fmax, f[0]); }
        if (gc != null) for (double v : gc) { fmin = Math.min(fmin, v); fmax = Math.max(fmax, v); }
        if (pc != null) for (double v : pc) { fmin = Math.min(fmin, v); fmax = Math.max(fmax, v); }
        if (fmax == 0) { fmin = 1; fmax = 1; }
        double nyq = ts > 0 ? Math.PI / ts : Double.POSITIVE_INFINITY;
        // with a delay the phase crossovers never end: cover ten times the highest feature and at least
        // the first three crossings the delay alone would make (ωτ = 6π)
        double hi = ts > 0 ? nyq : (tau > 0 ? Math.max(10 * fmax, 6 * Math.PI / tau) : 100 * fmax);
        double lo = Math.min(fmin / 100, hi / 1e4);

        List<Double> pts = new ArrayList<>();
        int decades = (int) Math.ceil(Math.log10(hi / lo));
        int n0 = Math.max(2, decades * 60 + 1);
        for (int i = 0; i < n0; i++) pts.add(lo * Math.pow(hi / lo, i / (double) (n0 - 1)));
        for (double[] f : features) {
            double zeta = Math.max(f[1], 1e-7);
            if (zeta < 0.5) {
                for (int k = -40; k <= 40; k++) pts.add(f[0] * Math.exp(k * zeta / 4));
            }
        }
        for (double[] set : new double[][] {gc, pc}) {
            if (set == null) continue;
            for (double v : set) { pts.add(v * (1 - 1e-3)); pts.add(v * (1 + 1e-3)); }
        }
        double[] grid = sortedInBand(pts, lo, hi);
        double[][] resp = respond(grid);
        // bisect (in log ω) every interval whose phase or magnitude step is too large; only new points are evaluated
        for (int pass = 0; pass < 30; pass++) {
            int n = grid.length, flagged = 0;
            boolean[] split = new boolean[n];
            for (int i = 0; i + 1 < n; i++) {
                double dph = Math.abs(principal(Math.atan2(resp[1][i + 1], resp[0][i + 1]) - Math.atan2(resp[1][i], resp[0][i])));
                double dm = Math.abs(0.5 * Math.log((sq(resp[0][i + 1]) + sq(resp[1][i + 1])) / (sq(resp[0][i]) + sq(resp[1][i]))));
                double dDelay = tau * (grid[i + 1] - grid[i]);
                if ((dph + dDelay > Math.toRadians(MAX_PHASE_STEP_DEG) || dm > MAX_LOG_MAG_STEP) && grid[i + 1] > grid[i] * (1 + 1e-12)) {
                    split[i] = true;
                    flagged++;
                }
            }
            if (flagged == 0 || n + flagged > MAX_POINTS) break;
            double[] mids = new double[flagged];
            for (int i = 0, k = 0; i + 1 < n; i++) if (split[i]) mids[k++] = Math.sqrt(grid[i] * grid[i + 1]);
            double[][] mr = respond(mids);
            double[] g2 = new double[n + flagged], r2 = new double[n + flagged], i2 = new double[n + flagged];
            for (int i = 0, k = 0, j = 0; i < n; i++) {
                g2[j] = grid[i]; r2[j] = resp[0][i]; i2[j] = resp[1][i]; j++;
                if (i + 1 < n && split[i]) { g2[j] = mids[k]; r2[j] = mr[0][k]; i2[j] = mr[1][k]; j++; k++; }
            }
            grid = g2;
            resp = new double[][] {r2, i2};
        }
        this.w = grid;
        int n = grid.length;
        double[] rr = resp[0], ri = resp[1];
        double[] ph = new double[n];
        for (int i = 0; i < n; i++) ph[i] = Math.atan2(ri[i], rr[i]);
        // unwrap the rational part
        for (int i = 1; i < n; i++) ph[i] = ph[i - 1] + principal(ph[i] - ph[i - 1]);
        // anchor: -90 deg per net integrator, -180 deg more when the remaining low-frequency gain is negative
        double stripped = ph[0] + integrators * Math.PI / 2;
        double anchor = -integrators * Math.PI / 2 + (Math.abs(principal(stripped)) > Math.PI / 2 ? -Math.PI : 0);
        double shift = 2 * Math.PI * Math.round((anchor - ph[0]) / (2 * Math.PI));
        for (int i = 0; i < n; i++) ph[i] += shift;
        this.phaseRational = ph;
        this.re = new double[n];
        this.im = new double[n];
        for (int i = 0; i < n; i++) {
            double c = Math.cos(w[i] * tau), s = -Math.sin(w[i] * tau);
            re[i] = rr[i] * c - ri[i] * s;
            im[i] = rr[i] * s + ri[i] * c;
        }
        this.exactGc = gc;
        this.exactPc = pc;
    }

    /** The loop gain L as a model on its own grid. Throws for an improper or zero loop gain. */
    public static ModelLoop of(TransferFunction loopGain) { return new ModelLoop(loopGain); }

    private boolean atOrigin(Complex r) {
        if (ts > 0) return r.subtract(Complex.ONE).abs() <= AXIS_TOLERANCE;
        return r.abs() <= AXIS_TOLERANCE;
    }

    /** Positive when unstable: Re p for continuous, |p| - 1 for sampled. */
    private double stabilityDistance(Complex p) { return ts > 0 ? p.abs() - 1 : p.getReal(); }

    /** {ω<sub>n</sub> in rad/s, ζ} of a root (sampled roots mapped through s = ln(z)/T). */
    private double[] naturalFrequency(Complex r) {
        Complex s = r;
        if (ts > 0) {
            if (r.abs() == 0) return new double[] {Double.NaN, 1};
            s = r.log().divide(ts);
        }
        double wn = s.abs();
        double zeta = wn == 0 ? 1 : -s.getReal() / wn;
        if (ts > 0) wn = Math.min(wn, Math.PI / ts);
        return new double[] {wn, Math.abs(zeta)};
    }

    private static double centre(List<double[]> f) {
        if (f.isEmpty()) return 1;
        double s = 0;
        for (double[] v : f) s += Math.log(v[0]);
        return Math.exp(s / f.size());
    }

    private static double[] sortedInBand(List<Double> pts, double lo, double hi) {
        double[] a = pts.stream().mapToDouble(Double::doubleValue).filter(v -> v >= lo && v <= hi).toArray();
        Arrays.sort(a);
        int k = 0;
        for (int i = 0; i < a.length; i++) if (k == 0 || a[i] > a[k - 1] * (1 + 1e-12)) a[k++] = a[i];
        a = Arrays.copyOf(a, k);
        if (a[0] > lo) { double[] b = new double[a.length + 1]; b[0] = lo; System.arraycopy(a, 0, b, 1, a.length); a = b; }
        if (a[a.length - 1] < hi * (1 - 1e-12)) { a = Arrays.copyOf(a, a.length + 1); a[a.length - 1] = hi; }
        return a;
    }

    private double[][] respond(double[] grid) {
        double[] r = new double[grid.length], i = new double[grid.length];
        double[] v = new double[2];
        for (int k = 0; k < grid.length; k++) {
            rationalAt(grid[k], v);
            r[k] = v[0];
            i[k] = v[1];
        }
        return new double[][] {r, i};
    }

    private void rationalAt(double omega, double[] out) { eval.rationalAt(omega, out); }

    static double principal(double a) {
        return a - 2 * Math.PI * Math.floor((a + Math.PI) / (2 * Math.PI));
    }

    private static double sq(double v) { return v * v; }

    @Override public int size() { return w.length; }

    @Override public double omegaRadPerS(int i) { return w[i]; }

    @Override public double re(int i) { return re[i]; }

    @Override public double im(int i) { return im[i]; }

    @Override public double phaseRad(int i) { return phaseRational[i] - w[i] * tau; }

    @Override public void valueAt(double omega, int i, double[] out) {
        double[] v = new double[2];
        rationalAt(omega, v);
        double[] r = {v[0]}, m = {v[1]};
        int j = Math.max(0, Math.min(i, w.length - 2));
        double t = (Math.log(omega) - Math.log(w[j])) / (Math.log(w[j + 1]) - Math.log(w[j]));
        double ref = phaseRational[j] + t * (phaseRational[j + 1] - phaseRational[j]);
        double a = Math.atan2(m[0], r[0]);
        a += 2 * Math.PI * Math.round((ref - a) / (2 * Math.PI));
        double c = Math.cos(omega * tau), s = -Math.sin(omega * tau);
        out[0] = r[0] * c - m[0] * s;
        out[1] = r[0] * s + m[0] * c;
        out[2] = a - omega * tau;
    }

    @Override public boolean isExact() { return true; }

    @Override public OptionalDouble sampleTimeS() { return ts > 0 ? OptionalDouble.of(ts) : OptionalDouble.empty(); }

    @Override public int netIntegrators() { return integrators; }

    @Override public OptionalInt openLoopUnstablePoles() { return OptionalInt.of(unstable); }

    @Override public int openLoopPolesOnAxis() { return onAxis; }

    @Override public double delayS() { return tau; }

    @Override public Optional<TransferFunction> model() { return Optional.of(loop); }

    @Override public Optional<double[]> exactGainCrossoversRadPerS() { return exactGc == null ? Optional.empty() : Optional.of(exactGc.clone()); }

    @Override public Optional<double[]> exactPhaseCrossoversRadPerS() { return exactPc == null ? Optional.empty() : Optional.of(exactPc.clone()); }

    /** True when |L| ≡ 1 (all-pass) or L is real on a whole interval, so crossovers are not isolated points. */
    boolean degenerateGain() { return ts == 0 && exactGc == null; }

    boolean degeneratePhase() { return ts == 0 && tau == 0 && exactPc == null; }

    @Override public String describe() {
        return "model, " + (ts > 0 ? "sampled at " + Units.formatHz(1 / ts) : "continuous") + (tau > 0 ? ", delay " + Units.g4(tau) + " s" : "")
                + ", analysed " + Units.formatHz(Units.radPerSToHz(w[0])) + " .. " + Units.formatHz(Units.radPerSToHz(w[w.length - 1]));
    }

    @Override public String toString() { return "ModelLoop[" + loop + "; " + describe() + "]"; }
}
