package org.loopledger.analysis;

import org.apache.commons.math3.complex.Complex;
import org.loopledger.lti.Polynomial;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Crossovers of a delay-free continuous rational loop L = N/D as roots of polynomials in x = ω².
 *
 * <p>With p(jω) = A<sub>p</sub>(ω²) + jω·B<sub>p</sub>(ω²) (even and odd parts of p):
 * <ul>
 *   <li>gain crossovers: |N(jω)|² - |D(jω)|² = A<sub>N</sub>² + x B<sub>N</sub>² - A<sub>D</sub>² - x B<sub>D</sub>² = 0;</li>
 *   <li>phase crossovers: Im(N(jω)·conj D(jω)) = ω (B<sub>N</sub>A<sub>D</sub> - A<sub>N</sub>B<sub>D</sub>) = 0 with
 *       Re(N·conj D) = A<sub>N</sub>A<sub>D</sub> + x B<sub>N</sub>B<sub>D</sub> &lt; 0.</li>
 * </ul>
 * Only positive real roots x count. The frequency is first scaled (s = σ·ŝ, σ the geometric centre of
 * the loop's pole and zero magnitudes) so that the coefficients stay well conditioned; callers polish
 * each root against L itself.
 */
final class OmegaSquared {
    private OmegaSquared() {}

    /** Relative imaginary part below which a computed root counts as real (double roots come out ~1e-8 apart). */
    private static final double REAL_ROOT_TOLERANCE = 1e-6;

    /** A(x) and B(x) as descending coefficient arrays for p(σ·ŝ) with ŝ = jω̂. */
    private static Polynomial[] evenOdd(Polynomial p, double sigma) {
        double[] c = p.coefficientsDescending();
        int n = c.length - 1;
        double[] asc = new double[n + 1];
        for (int k = 0; k <= n; k++) asc[k] = c[n - k] * Math.pow(sigma, k);
        int na = n / 2 + 1, nb = (n + 1) / 2 + (n == 0 ? 1 : 0);
        double[] aAsc = new double[Math.max(1, na)];
        double[] bAsc = new double[Math.max(1, nb)];
        for (int k = 0; k <= n; k++) {
            int m = k / 2;
            double sign = (m % 2 == 0) ? 1 : -1;
            if (k % 2 == 0) aAsc[m] += sign * asc[k];
            else bAsc[m] += sign * asc[k];
        }
        return new Polynomial[] {descending(aAsc), descending(bAsc)};
    }

    private static Polynomial descending(double[] asc) {
        double[] d = new double[asc.length];
        for (int i = 0; i < asc.length; i++) d[i] = asc[asc.length - 1 - i];
        return Polynomial.ofDescending(d);
    }

    /** Scaled gain-crossover polynomial G(x̂) (x = σ² x̂). */
    static Polynomial gainPolynomial(Polynomial num, Polynomial den, double sigma) {
        Polynomial[] n = evenOdd(num, sigma), d = evenOdd(den, sigma);
        Polynomial x = Polynomial.ofDescending(1, 0);
        return n[0].times(n[0]).plus(x.times(n[1]).times(n[1])).minus(d[0].times(d[0])).minus(x.times(d[1]).times(d[1]));
    }

    /** Scaled phase-crossover polynomial P(x̂) and the real-part polynomial R(x̂), as {P, R}. */
    static Polynomial[] phasePolynomials(Polynomial num, Polynomial den, double sigma) {
        Polynomial[] n = evenOdd(num, sigma), d = evenOdd(den, sigma);
        Polynomial x = Polynomial.ofDescending(1, 0);
        Polynomial im = n[1].times(d[0]).minus(n[0].times(d[1]));
        Polynomial re = n[0].times(d[0]).plus(x.times(n[1]).times(d[1]));
        return new Polynomial[] {im, re};
    }

    /** Gain crossover frequencies (rad/s), ascending; empty when none; null when |L| ≡ 1 (no isolated crossovers). */
    static double[] gainCrossovers(Polynomial num, Polynomial den, double sigma) {
        Polynomial[] d = evenOdd(den, sigma);
        Polynomial dd = d[0].times(d[0]).plus(Polynomial.ofDescending(1, 0).times(d[1]).times(d[1]));
        Polynomial g = normalised(gainPolynomial(num, den, sigma), maxAbs(dd));
        if (g == null) return null;
        return toOmega(positiveRealRoots(g), sigma);
    }

    /** Phase crossover frequencies (rad/s, ω &gt; 0), ascending; null when L is real on a whole interval. */
    static double[] phaseCrossovers(Polynomial num, Polynomial den, double sigma) {
        Polynomial[] pr = phasePolynomials(num, den, sigma);
        Polynomial p = normalised(pr[0], maxAbs(pr[1]));
        if (p == null) return null;
        List<Double> keep = new ArrayList<>();
        for (double x : positiveRealRoots(p)) {
            if (pr[1].evaluate(x) < 0) keep.add(x);
        }
        return toOmega(keep.stream().mapToDouble(Double::doubleValue).toArray(), sigma);
    }

    /** p scaled to a largest coefficient of 1, or null when p is round-off next to {@code reference} (identically zero). */
    private static Polynomial normalised(Polynomial p, double reference) {
        double m = maxAbs(p);
        if (m == 0 || m <= 1e-12 * reference) return null;
        return p.times(1.0 / m);
    }

    private static double maxAbs(Polynomial p) {
        double m = 0;
        for (double v : p.coefficientsDescending()) m = Math.max(m, Math.abs(v));
        return m;
    }

    private static double[] positiveRealRoots(Polynomial p) {
        if (p.degree() == 0) return new double[0];
        List<Double> out = new ArrayList<>();
        for (Complex r : p.roots()) {
            double re = r.getReal();
            if (re > 0 && Math.abs(r.getImaginary()) <= REAL_ROOT_TOLERANCE * Math.abs(re)) out.add(newton(p, re));
        }
        double[] a = out.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        // a double root (tangency) may come out as two nearly equal roots: keep one
        List<Double> d = new ArrayList<>();
        for (double v : a) if (d.isEmpty() || Math.abs(v - d.get(d.size() - 1)) > 1e-7 * v) d.add(v);
        return d.stream().mapToDouble(Double::doubleValue).toArray();
    }

    private static double newton(Polynomial p, double x) {
        Polynomial dp = p.derivative();
        for (int k = 0; k < 3; k++) {
            double f = p.evaluate(x), df = dp.evaluate(x);
            if (df == 0) break;
            double nx = x - f / df;
            if (!(nx > 0) || Math.abs(p.evaluate(nx)) >= Math.abs(f)) break;
            x = nx;
        }
        return x;
    }

    private static double[] toOmega(double[] xHat, double sigma) {
        double[] w = new double[xHat.length];
        for (int i = 0; i < w.length; i++) w[i] = sigma * Math.sqrt(xHat[i]);
        Arrays.sort(w);
        return w;
    }
}
