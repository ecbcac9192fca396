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

    /**
     * Zero-order-hold equivalent at sample time {@code sampleTimeS}, in coefficient form.
     *
     * <p>Route: the balanced series-section realisation ({@link StateSpace#seriesSections},
     * {@link StateSpace#balanced}) is discretised by {@link #zohStateSpace}; the denominator is
     * ∏(z - e<sup>p<sub>i</sub>T</sup>) from the continuous poles; the numerator N(z) = D(z)·G<sub>d</sub>(z)
     * is evaluated from the state-space formula at 2(n + 1) points on the unit circle (between the
     * poles) and its coefficients recovered by an inverse DFT, a unitary, well-conditioned step.
     *
     * <p>Limitation, inherent to coefficient form: for high orders at fast sampling (poles and
     * zeros clustered near z = 1) the coefficients themselves, even when correctly rounded, cannot
     * give the response near z = 1 to full accuracy; the relative error of the response is about
     * 1e-16·(Σ|b<sub>i</sub>|/|N(z)| + Σ|a<sub>i</sub>|/|D(z)|), e.g. 1e-4 at 1 Hz for an
     * eighth-order servo loop at 16 kHz. Where that matters, evaluate {@link #zohStateSpace} instead.
     */
    public static TransferFunction zoh(TransferFunction g, double sampleTimeS) {
        TimeBase tb = requireContinuous(g, sampleTimeS);
        g.requireProper("zero-order-hold discretisation");
        int n = g.denominator().degree();
        if (n == 0) return TransferFunction.gain(g.highFrequencyGain(), tb).withDelay(g.delayS());
        if (g.numerator().isZero()) return TransferFunction.gain(0, tb).withDelay(g.delayS());
        StateSpace sd = zohOfRational(g.withoutDelay(), sampleTimeS);
        List<Complex> zPoles = new ArrayList<>();
        for (Complex p : g.poles()) zPoles.add(p.multiply(sampleTimeS).exp());
        Complex[] zp = conjugateSymmetric(zPoles);
        Polynomial den = Polynomial.ofRoots(zp);
        // Sample points e^{jθ_k}, θ_k = (2πk + φ)/M, with the rotation φ that keeps them farthest from the poles.
        int m = 2 * (n + 1);
        double phi = 0, bestGap = -1;
        for (int t = 1; t <= 7; t++) {
            double cand = Math.PI * t / 4.0;
            double gap = Double.POSITIVE_INFINITY;
            for (int k = 0; k < m; k++) {
                double th = (2 * Math.PI * k + cand) / m;
                for (Complex p : zp) gap = Math.min(gap, Math.hypot(Math.cos(th) - p.getReal(), Math.sin(th) - p.getImaginary()));
            }
            if (gap > bestGap) { bestGap = gap; phi = cand; }
        }
        StateSpace.Resolvent r = new StateSpace.Resolvent(sd);
        double[] nr = new double[m], ni = new double[m], g1 = new double[2], d1 = new double[2];
        for (int k = 0; k < m; k++) {
            double th = (2 * Math.PI * k + phi) / m, x = Math.cos(th), y = Math.sin(th);
            if (!r.evaluate(x, y, g1)) throw new IllegalStateException("zoh: sample point hit a pole of " + g);
            den.evaluate(x, y, d1);
            nr[k] = g1[0] * d1[0] - g1[1] * d1[1];
            ni[k] = g1[0] * d1[1] + g1[1] * d1[0];
        }
        double[] numD = new double[n + 1];            // descending: numD[n - j] = c_j
        for (int j = 0; j <= n; j++) {
            double s = 0;
            for (int k = 0; k < m; k++) {
                double th = -j * (2 * Math.PI * k + phi) / m;
                s += nr[k] * Math.cos(th) - ni[k] * Math.sin(th);
            }
            numD[n - j] = s / m;
        }
        numD[0] = sd.d();                              // exactly: N(z) = D·den(z) + C adj(zI - A_d) B_d, and adj has degree n - 1
        return TransferFunction.of(Polynomial.ofDescending(numD), den, tb).withDelay(g.delayS());
    }

    /**
     * Zero-order-hold equivalent as a sampled state-space model (A<sub>d</sub>, B<sub>d</sub>, C, D),
     * with no polynomial anywhere: the continuous system is realised as balanced series sections
     * ({@link StateSpace#seriesSections}, {@link StateSpace#balanced}) and [A<sub>d</sub>, B<sub>d</sub>]
     * taken from one matrix exponential of [[A, B], [0, 0]]·T (Franklin, Powell and Workman, Digital
     * Control of Dynamic Systems, 3rd ed., §4.3.3). Its {@link StateSpace#response(double[], double[], double[])}
     * is the accurate frequency response of the ZOH equivalent at any order and sample rate (DESIGN:
     * high-order products are evaluated without expanding them). A system with a pure delay is refused,
     * since a state-space model carries none: discretise {@code g.withoutDelay()} and multiply the
     * response by e<sup>-jωτ</sup>.
     */
    public static StateSpace zohStateSpace(TransferFunction g, double sampleTimeS) {
        requireContinuous(g, sampleTimeS);
        g.requireProper("zero-order-hold discretisation");
        if (g.hasDelay()) {
            throw new IllegalArgumentException("zohStateSpace: " + g + " has a pure delay of " + Units.g4(g.delayS())
                    + " s, which a state-space model cannot carry; discretise g.withoutDelay() and multiply its response by e^(-jωτ)");
        }
        if (g.denominator().degree() == 0) {
            throw new IllegalArgumentException("zohStateSpace: " + g + " is a static gain and has no states; its ZOH equivalent is the same gain");
        }
        return zohOfRational(g, sampleTimeS);
    }

    private static StateSpace zohOfRational(TransferFunction g, double sampleTimeS) {
        StateSpace ss = StateSpace.seriesSections(g).balanced();
        int n = ss.order();
        RealMatrix m = new Array2DRowRealMatrix(n + 1, n + 1);
        m.setSubMatrix(ss.a(), 0, 0);
        double[] b = ss.b();
        for (int i = 0; i < n; i++) m.setEntry(i, n, b[i]);
        RealMatrix phi = MatrixExponential.expm(m.scalarMultiply(sampleTimeS));
        return StateSpace.of(phi.getSubMatrix(0, n - 1, 0, n - 1).getData(), phi.getColumnMatrix(n).getSubMatrix(0, n - 1, 0, 0).getColumn(0),
                ss.c(), ss.d(), TimeBase.sampled(sampleTimeS));
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
