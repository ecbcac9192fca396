package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;

import java.util.ArrayList;
import java.util.List;

/**
 * Continuous-to-discrete conversions of a {@link TransferFunction}.
 *
 * <ul>
 *   <li>{@link #zoh}: exact zero-order-hold equivalent. The control canonical realisation (A, B, C, D)
 *       is discretised with one matrix exponential of [[A, B], [0, 0]]·T (Franklin, Powell and
 *       Workman, Digital Control of Dynamic Systems, 3rd ed., §4.3.3); the denominator is
 *       ∏(z - e<sup>p<sub>i</sub>T</sup>) from the continuous poles, the numerator from the Markov
 *       parameters h<sub>0</sub> = D, h<sub>k</sub> = C A<sub>d</sub><sup>k-1</sup> B<sub>d</sub> as
 *       b<sub>k</sub> = Σ<sub>i&le;k</sub> a<sub>i</sub> h<sub>k-i</sub> (the first n+1 terms of D(z)·G(z)).</li>
 *   <li>{@link #tustin}: bilinear s = c·(z - 1)/(z + 1) with c = 2/T, or with prewarping at ω<sub>p</sub>,
 *       c = ω<sub>p</sub>/tan(ω<sub>p</sub>T/2), so that the discrete response equals the continuous one at ω<sub>p</sub>.</li>
 *   <li>{@link #matched}: matched pole-zero mapping z = e<sup>sT</sup> of every finite pole and zero;
 *       zeros at infinity map to z = -1 (the usual choice, same book §6.3.3, from memory); the gain
 *       is matched at DC, or at a stated frequency when there is a pole or zero at s = 0.</li>
 * </ul>
 *
 * <p>A pure delay is carried over unchanged as a delay term: exact in the frequency domain, and exact
 * as z<sup>-k</sup> when it is a whole number k of samples.
 */
public final class Discretization {
    private Discretization() {}

    /** Zero-order-hold equivalent at sample time {@code sampleTimeS}. */
    public static TransferFunction zoh(TransferFunction g, double sampleTimeS) {
        TimeBase tb = requireContinuous(g, sampleTimeS);
        g.requireProper("zero-order-hold discretisation");
        int n = g.denominator().degree();
        if (n == 0) return TransferFunction.gain(g.highFrequencyGain(), tb).withDelay(g.delayS());
        StateSpace ss = StateSpace.controllableCanonical(g);
        RealMatrix m = new Array2DRowRealMatrix(n + 1, n + 1);
        m.setSubMatrix(ss.a(), 0, 0);
        double[] b = ss.b();
        for (int i = 0; i < n; i++) m.setEntry(i, n, b[i]);
        RealMatrix phi = MatrixExponential.expm(m.scalarMultiply(sampleTimeS));
        RealMatrix ad = phi.getSubMatrix(0, n - 1, 0, n - 1);
        RealMatrix bd = phi.getSubMatrix(0, n - 1, n, n);
        double[] c = ss.c();
        List<Complex> zPoles = new ArrayList<>();
        for (Complex p : g.poles()) zPoles.add(p.multiply(sampleTimeS).exp());
        Polynomial den = Polynomial.ofRoots(conjugateSymmetric(zPoles));
        double[] a = den.coefficientsDescending();
        // Markov parameters h_0 = D, h_k = C A_d^{k-1} B_d, and N(z) = D(z)·G(z) truncated:
        // b_k = Σ_{i=0..k} a_i h_{k-i}. Linear in the data, so a numerator much smaller than the
        // denominator (fast sampling) keeps its own relative accuracy.
        double[] h = new double[n + 1];
        h[0] = ss.d();
        RealMatrix x = bd;
        for (int k = 1; k <= n; k++) {
            double s = 0;
            for (int i = 0; i < n; i++) s += c[i] * x.getEntry(i, 0);
            h[k] = s;
            if (k < n) x = ad.multiply(x);
        }
        double[] numD = new double[n + 1];
        for (int k = 0; k <= n; k++) {
            double s = 0;
            for (int i = 0; i <= k; i++) s += a[i] * h[k - i];
            numD[k] = s;
        }
        return TransferFunction.of(Polynomial.ofDescending(numD), den, tb).withDelay(g.delayS());
    }

    /** Tustin (bilinear) equivalent without prewarping: c = 2/T. */
    public static TransferFunction tustin(TransferFunction g, double sampleTimeS) {
        requireContinuous(g, sampleTimeS);
        return bilinear(g, 2.0 / sampleTimeS, sampleTimeS);
    }

    /** Tustin equivalent prewarped at {@code prewarpRadPerS} (0 &lt; ω<sub>p</sub> &lt; π/T). */
    public static TransferFunction tustin(TransferFunction g, double sampleTimeS, double prewarpRadPerS) {
        requireContinuous(g, sampleTimeS);
        if (!(prewarpRadPerS > 0) || prewarpRadPerS >= Math.PI / sampleTimeS) {
            throw new IllegalArgumentException("prewarp frequency must lie strictly between 0 and the Nyquist frequency "
                    + Units.formatHz(0.5 / sampleTimeS) + ", got " + Units.formatHz(Units.radPerSToHz(prewarpRadPerS)));
        }
        return bilinear(g, prewarpRadPerS / Math.tan(prewarpRadPerS * sampleTimeS / 2.0), sampleTimeS);
    }

    private static TransferFunction bilinear(TransferFunction g, double c, double ts) {
        g.requireProper("Tustin discretisation");
        int k = Math.max(g.numerator().degree(), g.denominator().degree());
        Polynomial num = substitute(g.numerator(), c, k);
        Polynomial den = substitute(g.denominator(), c, k);
        return TransferFunction.of(num, den, TimeBase.sampled(ts)).withDelay(g.delayS());
    }

    /** Σ a<sub>i</sub> c<sup>i</sup> (z - 1)<sup>i</sup> (z + 1)<sup>k-i</sup> for p(s) = Σ a<sub>i</sub> s<sup>i</sup>. */
    private static Polynomial substitute(Polynomial p, double c, int k) {
        Polynomial zm1 = Polynomial.ofDescending(1, -1);
        Polynomial zp1 = Polynomial.ofDescending(1, 1);
        Polynomial r = Polynomial.zero();
        for (int i = 0; i <= p.degree(); i++) {
            double a = p.coefficientOfPower(i);
            if (a == 0) continue;
            r = r.plus(zm1.pow(i).times(zp1.pow(k - i)).times(a * Math.pow(c, i)));
        }
        return r;
    }

    /** Matched pole-zero equivalent, gain matched at DC (s = 0 ↔ z = 1). */
    public static TransferFunction matched(TransferFunction g, double sampleTimeS) {
        requireContinuous(g, sampleTimeS);
        if (g.denominator().evaluate(0) == 0 || g.numerator().evaluate(0) == 0) {
            throw new IllegalArgumentException("matched pole-zero: " + g + " has a pole or zero at s = 0, so its DC gain cannot be matched; "
                    + "state a frequency with matched(g, T, matchRadPerS)");
        }
        return matchedAt(g, sampleTimeS, 0.0);
    }

    /** Matched pole-zero equivalent with |G| matched at {@code matchRadPerS} (0 &lt;= ω &lt; π/T). */
    public static TransferFunction matched(TransferFunction g, double sampleTimeS, double matchRadPerS) {
        requireContinuous(g, sampleTimeS);
        if (!(matchRadPerS >= 0) || matchRadPerS >= Math.PI / sampleTimeS) {
            throw new IllegalArgumentException("gain-matching frequency must lie in [0, Nyquist), got " + matchRadPerS + " rad/s");
        }
        return matchedAt(g, sampleTimeS, matchRadPerS);
    }

    private static TransferFunction matchedAt(TransferFunction g, double ts, double w) {
        g.requireProper("matched pole-zero discretisation");
        if (g.numerator().isZero()) return TransferFunction.gain(0, TimeBase.sampled(ts));
        List<Complex> zp = new ArrayList<>();
        for (Complex p : g.poles()) zp.add(p.multiply(ts).exp());
        List<Complex> zz = new ArrayList<>();
        for (Complex z : g.zeros()) zz.add(z.multiply(ts).exp());
        for (int i = 0; i < g.relativeDegree(); i++) zz.add(new Complex(-1, 0));
        TimeBase tb = TimeBase.sampled(ts);
        double[] nv = new double[2], dv = new double[2];
        g.numerator().evaluate(0, w, nv);
        g.denominator().evaluate(0, w, dv);
        if ((nv[0] == 0 && nv[1] == 0) || (dv[0] == 0 && dv[1] == 0)) {
            throw new IllegalArgumentException("matched pole-zero: the gain cannot be matched at " + Units.g4(w) + " rad/s, where "
                    + g + " has a " + (dv[0] == 0 && dv[1] == 0 ? "pole" : "zero") + "; choose another frequency");
        }
        TransferFunction unit = TransferFunction.of(Polynomial.ofRoots(conjugateSymmetric(zz)), Polynomial.ofRoots(conjugateSymmetric(zp)), tb);
        double target = g.withoutDelay().response(w).abs();
        double got = unit.response(w).abs();
        if (!(got > 0) || !Double.isFinite(got) || !Double.isFinite(target)) {
            throw new IllegalArgumentException("matched pole-zero: the gain cannot be matched at " + w + " rad/s (pole or zero there); choose another frequency");
        }
        // The sign: the discrete response must point the same way as the continuous one at the matching frequency.
        Complex a = g.withoutDelay().response(w);
        Complex b = unit.response(w);
        double sign = a.getReal() * b.getReal() + a.getImaginary() * b.getImaginary() >= 0 ? 1 : -1;
        return unit.times(sign * target / got).withDelay(g.delayS());
    }

    /** Makes a root set exactly conjugate-symmetric (pairs matched by nearest conjugate) so coefficients are real. */
    static Complex[] conjugateSymmetric(List<Complex> roots) {
        List<Complex> left = new ArrayList<>(roots);
        List<Complex> out = new ArrayList<>();
        while (!left.isEmpty()) {
            Complex r = left.remove(0);
            double scale = Math.max(1e-300, r.abs());
            if (Math.abs(r.getImaginary()) <= 1e-12 * scale) {
                out.add(new Complex(r.getReal(), 0));
                continue;
            }
            int best = -1;
            double bestD = Double.POSITIVE_INFINITY;
            for (int j = 0; j < left.size(); j++) {
                double d = left.get(j).subtract(r.conjugate()).abs();
                if (d < bestD) { bestD = d; best = j; }
            }
            if (best < 0) throw new IllegalArgumentException("complex root " + r + " has no conjugate partner");
            Complex s = left.remove(best);
            double re = 0.5 * (r.getReal() + s.getReal());
            double im = 0.5 * (Math.abs(r.getImaginary()) + Math.abs(s.getImaginary()));
            out.add(new Complex(re, im));
            out.add(new Complex(re, -im));
        }
        return out.toArray(Complex[]::new);
    }

    private static TimeBase requireContinuous(TransferFunction g, double sampleTimeS) {
        if (g.isDiscrete()) throw new IllegalArgumentException("system is already sampled (" + g.timeBase() + "); discretise a continuous system");
        return TimeBase.sampled(sampleTimeS);
    }
}
