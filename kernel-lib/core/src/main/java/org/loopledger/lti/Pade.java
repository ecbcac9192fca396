package org.loopledger.lti;

/**
 * Diagonal Padé approximants of a pure delay e<sup>-τs</sup>, <b>for time simulation only</b>.
 *
 * <p>Frequency-domain work (margins, Bode plots, FRF arithmetic) must keep the delay exact as
 * e<sup>-jωτ</sup> ({@link TransferFunction#withDelay}); a Padé approximant is all-pass in magnitude
 * but its phase departs from -ωτ above about ω ≈ order/τ, and it adds right-half-plane zeros.
 *
 * <p>The [n/n] approximant is N(s)/N(-s) with N(s) = Σ<sub>k=0..n</sub> c<sub>k</sub> (-τs)<sup>k</sup>,
 * c<sub>k</sub> = (2n-k)! n! / ((2n)! k! (n-k)!) (the classic closed form, e.g. Golub and Van Loan,
 * Matrix Computations, 3rd ed., §11.3, from memory). Orders above 10 are refused: the coefficients
 * then span more than 20 decades and lose accuracy in coefficient form.
 */
public final class Pade {
    /** Highest order accepted. */
    public static final int MAX_ORDER = 10;

    private Pade() {}

    /**
     * The [n/n] Padé approximant of e<sup>-τs</sup> as a continuous transfer function (monic denominator).
     *
     * @param delayS τ in seconds, finite and non-negative (0 gives the unit gain)
     * @param order  n, from 1 to {@link #MAX_ORDER}
     */
    public static TransferFunction approximant(double delayS, int order) {
        if (!(delayS >= 0) || Double.isInfinite(delayS)) {
            throw new IllegalArgumentException("delay must be a finite non-negative number of seconds, got " + delayS);
        }
        if (order < 1 || order > MAX_ORDER) {
            throw new IllegalArgumentException("Padé order must be 1.." + MAX_ORDER + ", got " + order
                    + "; orders 2 to 6 are usual for simulating a delay");
        }
        if (delayS == 0) return TransferFunction.gain(1.0);
        double[] num = new double[order + 1], den = new double[order + 1];
        double c = 1, tk = 1;
        for (int k = 0; k <= order; k++) {
            // descending powers: s^k sits at index order - k
            den[order - k] = c * tk;
            num[order - k] = (k % 2 == 0 ? 1 : -1) * c * tk;
            c = c * (order - k) / ((2.0 * order - k) * (k + 1));
            tk *= delayS;
        }
        return TransferFunction.continuous(num, den);
    }

    /**
     * {@code g} with its delay replaced by the [n/n] approximant (for time simulation only); {@code g}
     * itself when it has no delay. Continuous systems only: a sampled delay of whole samples is z<sup>-k</sup>.
     */
    public static TransferFunction replacingDelay(TransferFunction g, int order) {
        if (g.isDiscrete()) {
            throw new IllegalArgumentException("Padé approximation is for continuous delays; on a sampled system write a delay of k samples as z^-k");
        }
        if (!g.hasDelay()) return g;
        return g.withoutDelay().times(approximant(g.delayS(), order));
    }
}
