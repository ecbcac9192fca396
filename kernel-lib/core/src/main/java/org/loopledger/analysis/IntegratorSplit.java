package org.loopledger.analysis;

import org.loopledger.lti.Polynomial;

/**
 * p(x) = (x - a)<sup>count</sup>·rest(x), with a = 0 for continuous (s) and a = 1 for sampled (z) polynomials:
 * the integrator (or differentiator) factors split off by repeated synthetic division while the remainder is
 * round-off, |p(a)| &le; {@value #TOLERANCE}·Σ|c<sub>i</sub>|.
 *
 * <p>Why: a double root at z = 1 comes out of an eigenvalue solver split by about √ε ≈ 1e-8, one copy
 * outside the unit circle, and Horner evaluation of the expanded polynomial near z = 1 cancels
 * catastrophically at low frequency. Splitting the factors off keeps the integrator count exact and lets
 * (e<sup>jωT</sup> - 1)<sup>k</sup> be evaluated in closed form (2 sin(ωT/2))<sup>k</sup> e<sup>jk(π/2 + ωT/2)</sup>.
 */
record IntegratorSplit(int count, Polynomial rest) {
    static final double TOLERANCE = 1e-10;

    static IntegratorSplit of(Polynomial p, boolean sampled) {
        double a = sampled ? 1 : 0;
        int k = 0;
        Polynomial q = p;
        while (q.degree() > 0) {
            double[] c = q.coefficientsDescending();
            double norm = 0;
            for (double v : c) norm += Math.abs(v);
            double[] b = new double[c.length - 1];
            double acc = 0;
            for (int i = 0; i < c.length - 1; i++) {
                acc = c[i] + a * acc;
                b[i] = acc;
            }
            double rem = c[c.length - 1] + a * acc;
            if (Math.abs(rem) > TOLERANCE * norm) break;
            q = Polynomial.ofDescending(b);
            k++;
        }
        return new IntegratorSplit(k, q);
    }
}
