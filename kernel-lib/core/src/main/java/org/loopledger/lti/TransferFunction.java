package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A single-input single-output rational transfer function with an optional pure delay:
 * G = e<sup>-τ·s</sup> · N / D in continuous time, or the same with z = e<sup>sT</sup> on a sampled
 * time base (the delay then still acts as e<sup>-jωτ</sup> in the frequency domain, so fractions of a
 * sample are exact).
 *
 * <p>Numerator and denominator are {@link Polynomial}s in descending powers; on construction the
 * denominator is made monic. Immutable.
 *
 * <p>Frequency responses are evaluated at s = jω, or at z = e<sup>jωT</sup> for sampled systems,
 * where ω must not exceed the Nyquist frequency π/T.
 */
public final class TransferFunction {
    private final Polynomial num;
    private final Polynomial den;
    private final TimeBase timeBase;
    private final double delayS;

    private TransferFunction(Polynomial num, Polynomial den, TimeBase timeBase, double delayS) {
        Objects.requireNonNull(num, "numerator");
        Objects.requireNonNull(den, "denominator");
        Objects.requireNonNull(timeBase, "time base");
        if (den.isZero()) throw new IllegalArgumentException("denominator is the zero polynomial; a transfer function needs a non-zero denominator");
        if (!(delayS >= 0) || Double.isInfinite(delayS)) {
            throw new IllegalArgumentException("delay must be a finite non-negative number of seconds, got " + delayS);
        }
        double lead = den.leading();
        this.num = lead == 1.0 ? num : num.dividedBy(lead);
        this.den = lead == 1.0 ? den : den.dividedBy(lead);
        this.timeBase = timeBase;
        this.delayS = delayS;
    }

    /** G(s) = num(s)/den(s), coefficients in descending powers of s. */
    public static TransferFunction continuous(double[] numDescending, double[] denDescending) {
        return new TransferFunction(Polynomial.ofDescending(numDescending), Polynomial.ofDescending(denDescending), TimeBase.continuous(), 0);
    }

    /** G(z) = num(z)/den(z), coefficients in descending powers of z, sample time in seconds. */
    public static TransferFunction discrete(double[] numDescending, double[] denDescending, double sampleTimeS) {
        return new TransferFunction(Polynomial.ofDescending(numDescending), Polynomial.ofDescending(denDescending), TimeBase.sampled(sampleTimeS), 0);
    }

    public static TransferFunction of(Polynomial num, Polynomial den, TimeBase timeBase) {
        return new TransferFunction(num, den, timeBase, 0);
    }

    /** A constant gain on the given time base. */
    public static TransferFunction gain(double k, TimeBase timeBase) {
        return new TransferFunction(Polynomial.constant(k), Polynomial.one(), timeBase, 0);
    }

    /** A constant continuous gain. */
    public static TransferFunction gain(double k) { return gain(k, TimeBase.continuous()); }

    /** The Laplace variable s. */
    public static TransferFunction s() { return continuous(new double[] {1, 0}, new double[] {1}); }

    /** The shift variable z on a sampled time base. */
    public static TransferFunction z(double sampleTimeS) { return discrete(new double[] {1, 0}, new double[] {1}, sampleTimeS); }

    /** From zeros, poles (conjugate pairs for complex ones) and the gain k in k·∏(x - z<sub>i</sub>)/∏(x - p<sub>i</sub>). */
    public static TransferFunction zpk(List<Complex> zeros, List<Complex> poles, double k, TimeBase timeBase) {
        return new TransferFunction(Polynomial.ofRoots(zeros.toArray(Complex[]::new)).times(k),
                Polynomial.ofRoots(poles.toArray(Complex[]::new)), timeBase, 0);
    }

    /** The pure delay e<sup>-τs</sup> alone, on a continuous time base. */
    public static TransferFunction delay(double delayS) {
        return new TransferFunction(Polynomial.one(), Polynomial.one(), TimeBase.continuous(), delayS);
    }

    public Polynomial numerator() { return num; }

    /** The denominator, monic. */
    public Polynomial denominator() { return den; }

    public TimeBase timeBase() { return timeBase; }

    public boolean isDiscrete() { return timeBase.isDiscrete(); }

    /** Sample time in seconds; throws for a continuous system. */
    public double sampleTimeS() {
        if (timeBase instanceof TimeBase.Sampled sm) return sm.sampleTimeS();
        throw new IllegalStateException("a continuous transfer function has no sample time");
    }

    /** Pure delay τ in seconds (0 if none). */
    public double delayS() { return delayS; }

    public boolean hasDelay() { return delayS > 0; }

    /** Same rational part, delay replaced by {@code delayS}. */
    public TransferFunction withDelay(double delayS) { return new TransferFunction(num, den, timeBase, delayS); }

    /** The rational part alone (delay dropped). */
    public TransferFunction withoutDelay() { return withDelay(0); }

    /** Relative degree deg(D) - deg(N) (negative for an improper system). */
    public int relativeDegree() { return num.isZero() ? Integer.MAX_VALUE : den.degree() - num.degree(); }

    public boolean isProper() { return relativeDegree() >= 0; }

    public boolean isStrictlyProper() { return relativeDegree() > 0; }

    /** Throws with a clear message when the system is not proper. */
    public TransferFunction requireProper(String why) {
        if (!isProper()) {
            throw new IllegalArgumentException(why + " needs a proper transfer function, but " + this + " has a numerator of degree "
                    + num.degree() + " above its denominator's " + den.degree() + "; add roll-off poles (a derivative filter, for instance)");
        }
        return this;
    }

    public List<Complex> poles() { return den.roots(); }

    public List<Complex> zeros() { return num.isZero() ? List.of() : num.roots(); }

    /**
     * Steady-state gain: G(0) in continuous time, G(1) in discrete time. Roots at s = 0 (z = 1) are
     * counted in numerator and denominator and cancelled; with more poles than zeros there the gain is
     * infinite, signed like the residue lim G·s<sup>m</sup> (so 1/(s(s - 2)) gives -∞); with more zeros it is 0.
     *
     * <p>A root counts as being at s = 0 (z = 1) when the polynomial's value there is below 1e-12 of the
     * sum of its coefficients' magnitudes, i.e. at the rounding-noise level of coefficient form (DESIGN:
     * an integrator computed as -1e-15, or a ZOH pole at z = 1 ± 1e-16, is an integrator).
     */
    public double dcGain() {
        if (num.isZero()) return 0.0;
        double x = isDiscrete() ? 1.0 : 0.0;
        double[] n = num.coefficientsDescending(), d = den.coefficientsDescending();
        int mn = 0, md = 0;
        while (n.length > 1 && atDc(n, x)) { n = deflate(n, x); mn++; }
        while (d.length > 1 && atDc(d, x)) { d = deflate(d, x); md++; }
        double ratio = horner(n, x) / horner(d, x);
        if (mn > md) return 0.0;
        if (mn == md) return ratio;
        return Math.copySign(Double.POSITIVE_INFINITY, ratio);
    }

    private static double horner(double[] c, double x) {
        double r = 0;
        for (double v : c) r = r * x + v;
        return r;
    }

    private static boolean atDc(double[] c, double x) {
        double scale = 0;
        for (double v : c) scale += Math.abs(v);
        return Math.abs(horner(c, x)) <= 1e-12 * scale;
    }

    /** c(x)/(x - x0) by synthetic division, remainder (rounding noise) dropped. */
    private static double[] deflate(double[] c, double x0) {
        double[] q = new double[c.length - 1];
        double acc = 0;
        for (int i = 0; i < q.length; i++) {
            acc = acc * x0 + c[i];
            q[i] = acc;
        }
        return q;
    }

    /** G(jω) (or G(e<sup>jωT</sup>)), ω in rad/s. */
    public Complex response(double omegaRadPerS) {
        double[] re = new double[1], im = new double[1];
        response(new double[] {omegaRadPerS}, re, im);
        return new Complex(re[0], im[0]);
    }

    /**
     * G on a grid of frequencies, written into {@code re} and {@code im} (modified, at least as long as the
     * grid); {@code omegaRadPerS} not modified. Allocation-free: Horner's rule on the coefficient arrays
     * and Smith's complex division (no {@code Complex} objects, no boxing), so it suits hot loops over big
     * grids. For sampled systems every ω must lie in [-π/T, π/T]. Throws when ω hits a pole on the
     * imaginary axis (unit circle), where G is infinite, rather than writing NaN.
     */
    public void response(double[] omegaRadPerS, double[] re, double[] im) {
        GridArguments.requireOutputs(omegaRadPerS, re, im);
        double ts = GridArguments.sampleTimeS(timeBase);
        final double[] nc = num.coefficientsShared(), dc = den.coefficientsShared();
        for (int i = 0; i < omegaRadPerS.length; i++) {
            double w = omegaRadPerS[i];
            GridArguments.requireFrequency(w, i, ts);
            double x, y;
            if (ts > 0) {
                x = Math.cos(w * ts);
                y = Math.sin(w * ts);
            } else {
                x = 0;
                y = w;
            }
            double nr = 0, ni = 0;
            for (double v : nc) {
                double t = nr * x - ni * y + v;
                ni = nr * y + ni * x;
                nr = t;
            }
            double dr = 0, di = 0;
            for (double v : dc) {
                double t = dr * x - di * y + v;
                di = dr * y + di * x;
                dr = t;
            }
            double gr, gi;
            if (Math.abs(dr) >= Math.abs(di)) {           // Smith's division: no overflow in |d|²
                if (dr == 0) {
                    throw new IllegalArgumentException("frequency " + Units.g4(w) + " rad/s (index " + i + ") is a pole of " + this
                            + " on the " + (ts > 0 ? "unit circle" : "imaginary axis") + ", where the response is infinite; leave that frequency out of the grid");
                }
                double r = di / dr, q = dr + di * r;
                gr = (nr + ni * r) / q;
                gi = (ni - nr * r) / q;
            } else {
                double r = dr / di, q = dr * r + di;
                gr = (nr * r + ni) / q;
                gi = (ni * r - nr) / q;
            }
            if (delayS > 0) {
                double c = Math.cos(w * delayS), s = -Math.sin(w * delayS);
                double t = gr * c - gi * s;
                gi = gr * s + gi * c;
                gr = t;
            }
            re[i] = gr;
            im[i] = gi;
        }
    }

    /** Series connection this·other (delays add). */
    public TransferFunction times(TransferFunction other) {
        timeBase.requireSame(other.timeBase, "series connection");
        return new TransferFunction(num.times(other.num), den.times(other.den), timeBase, delayS + other.delayS);
    }

    public TransferFunction times(double k) { return new TransferFunction(num.times(k), den, timeBase, delayS); }

    /** Parallel connection this + other; both must have the same delay (a sum of different delays is not rational). */
    public TransferFunction plus(TransferFunction other) {
        timeBase.requireSame(other.timeBase, "parallel connection");
        if (delayS != other.delayS) {
            throw new IllegalArgumentException("parallel connection of systems with different delays (" + delayS + " s and " + other.delayS
                    + " s) has no rational form; evaluate both on a frequency grid and add the responses instead");
        }
        return new TransferFunction(num.times(other.den).plus(other.num.times(den)), den.times(other.den), timeBase, delayS);
    }

    public TransferFunction minus(TransferFunction other) { return plus(other.negate()); }

    /**
     * This + k. For a delayed system (N/D)e<sup>-τs</sup> + k has no rational form, so it throws like
     * {@link #plus(TransferFunction)} (k = 0 excepted).
     */
    public TransferFunction plus(double k) { return k == 0 ? this : plus(gain(k, timeBase)); }

    public TransferFunction negate() { return times(-1.0); }

    /** 1/G. Throws for a zero system or one with a delay (its inverse would be a prediction). */
    public TransferFunction inverse() {
        if (num.isZero()) throw new IllegalArgumentException("the zero transfer function has no inverse");
        if (delayS > 0) throw new IllegalArgumentException("the inverse of a delay is a prediction, which no causal system can do; drop the delay first");
        return new TransferFunction(den, num, timeBase, 0);
    }

    /** Closed loop with unity negative feedback: G/(1 + G). */
    public TransferFunction feedback() { return feedback(gain(1.0, timeBase)); }

    /** Closed loop with negative feedback through H: G/(1 + G·H). Delays are not allowed inside a loop (not rational). */
    public TransferFunction feedback(TransferFunction h) {
        timeBase.requireSame(h.timeBase, "feedback connection");
        if (delayS > 0 || h.delayS > 0) {
            throw new IllegalArgumentException("a delay inside a feedback loop has no rational closed-loop form; "
                    + "analyse it on a frequency grid (analysis.GangOfFour) or approximate the delay (Pade) first");
        }
        Polynomial n = num.times(h.den);
        Polynomial d = den.times(h.den).plus(num.times(h.num));
        if (d.isZero()) throw new IllegalArgumentException("1 + G·H is identically zero: the loop is algebraically ill-posed");
        return new TransferFunction(n, d, timeBase, 0);
    }

    /**
     * Cancels pole-zero pairs closer than {@code relativeTolerance}·max(1, |p|) and returns the reduced
     * system with the same high-frequency gain factor. Returns this when nothing cancels.
     */
    public TransferFunction minimal(double relativeTolerance) {
        if (!(relativeTolerance >= 0) || Double.isInfinite(relativeTolerance)) {
            throw new IllegalArgumentException("cancellation tolerance must be a finite non-negative number, got " + relativeTolerance);
        }
        if (num.isZero()) return new TransferFunction(Polynomial.zero(), Polynomial.one(), timeBase, delayS);
        List<Complex> z = new ArrayList<>(zeros());
        List<Complex> p = new ArrayList<>(poles());
        boolean any = false;
        for (int i = 0; i < p.size(); i++) {
            Complex pi = p.get(i);
            if (pi.getImaginary() < 0) continue;            // handled together with its partner above the axis
            int zi = nearest(z, pi);
            if (zi < 0 || z.get(zi).subtract(pi).abs() > relativeTolerance * Math.max(1.0, pi.abs())) continue;
            if (pi.getImaginary() == 0) {
                z.remove(zi);
                p.remove(i);
                i = -1;
                any = true;
                continue;
            }
            // A complex pole cancels only together with its conjugate, so the remainder stays real.
            List<Complex> z2 = new ArrayList<>(z);
            Complex zc = z2.remove(zi);
            int zj = nearest(z2, zc.getImaginary() == 0 ? pi.conjugate() : zc.conjugate());
            if (zj < 0 || z2.get(zj).subtract(pi.conjugate()).abs() > relativeTolerance * Math.max(1.0, pi.abs())) continue;
            z2.remove(zj);
            List<Complex> p2 = new ArrayList<>(p);
            p2.remove(i);
            p2.remove(nearest(p2, pi.conjugate()));
            z = z2;
            p = p2;
            i = -1;
            any = true;
        }
        if (!any) return this;
        double k = num.leading();
        return new TransferFunction(Polynomial.ofRoots(Discretization.conjugateSymmetric(z)).times(k),
                Polynomial.ofRoots(Discretization.conjugateSymmetric(p)), timeBase, delayS);
    }

    private static int nearest(List<Complex> list, Complex x) {
        int best = -1;
        double bestD = Double.POSITIVE_INFINITY;
        for (int j = 0; j < list.size(); j++) {
            double d = list.get(j).subtract(x).abs();
            if (d < bestD) { bestD = d; best = j; }
        }
        return best;
    }

    /** Static gain at high frequency for a proper system (lim G as s → ∞), 0 if strictly proper. */
    public double highFrequencyGain() {
        requireProper("the high-frequency gain");
        return num.degree() == den.degree() ? num.leading() / den.leading() : 0.0;
    }

    @Override public boolean equals(Object o) {
        return o instanceof TransferFunction t && num.equals(t.num) && den.equals(t.den) && timeBase.equals(t.timeBase) && delayS == t.delayS;
    }

    @Override public int hashCode() { return Objects.hash(num, den, timeBase, delayS); }

    /** e.g. {@code (s + 1) / (s^2 + 3 s + 2)}, with the delay and the sample time when present. */
    @Override public String toString() {
        String v = isDiscrete() ? "z" : "s";
        StringBuilder sb = new StringBuilder();
        sb.append('(').append(num.toString(v)).append(")");
        if (!(den.degree() == 0 && den.leading() == 1.0)) sb.append(" / (").append(den.toString(v)).append(')');
        if (delayS > 0) sb.append(" · e^(-").append(Units.g4(delayS)).append(" s)");
        if (timeBase instanceof TimeBase.Sampled sm) sb.append("   [T = ").append(Units.g4(sm.sampleTimeS())).append(" s]");
        return sb.toString();
    }
}
