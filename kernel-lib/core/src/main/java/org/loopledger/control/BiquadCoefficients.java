package org.loopledger.control;

import org.loopledger.lti.TransferFunction;

import java.util.Locale;

/**
 * Coefficients of one discrete section as a drive takes them, normalised so that a0 = 1:
 * H(z) = (b0 + b1 z<sup>-1</sup> + b2 z<sup>-2</sup>) / (1 + a1 z<sup>-1</sup> + a2 z<sup>-2</sup>)
 * (the sign convention of scipy.signal and of the Audio EQ Cookbook). A first-order section has
 * b2 = a2 = 0.
 */
public record BiquadCoefficients(double b0, double b1, double b2, double a1, double a2) {
    public BiquadCoefficients {
        double[] all = {b0, b1, b2, a1, a2};
        for (double v : all) {
            if (!Double.isFinite(v)) throw new IllegalArgumentException("biquad coefficient is not finite: " + v);
        }
    }

    /** From a sampled transfer function of order at most 2 (denominator made monic). */
    public static BiquadCoefficients of(TransferFunction discrete) {
        if (!discrete.isDiscrete()) throw new IllegalArgumentException("coefficients need a sampled transfer function, got " + discrete);
        if (discrete.hasDelay()) throw new IllegalArgumentException("a biquad section has no delay term; got " + discrete);
        int n = discrete.denominator().degree();
        if (n > 2 || discrete.numerator().degree() > n) {
            throw new IllegalArgumentException("a biquad section has order at most 2 and is proper; got " + discrete + "; split it into sections");
        }
        double lead = discrete.denominator().leading();
        double[] b = new double[3], a = new double[3];
        for (int k = 0; k <= n; k++) {
            b[k] = discrete.numerator().coefficientOfPower(n - k) / lead;
            a[k] = discrete.denominator().coefficientOfPower(n - k) / lead;
        }
        return new BiquadCoefficients(b[0], b[1], b[2], a[1], a[2]);
    }

    /** The section as H(z) in descending powers of z (a second-order polynomial pair) at sample time T. */
    public TransferFunction transferFunction(double sampleTimeS) {
        return TransferFunction.discrete(new double[] {b0, b1, b2}, new double[] {1, a1, a2}, sampleTimeS);
    }

    /** As {b0, b1, b2, a1, a2}. */
    public double[] toArray() { return new double[] {b0, b1, b2, a1, a2}; }

    @Override public String toString() {
        return String.format(Locale.ROOT, "b0 = %.15g, b1 = %.15g, b2 = %.15g, a1 = %.15g, a2 = %.15g (a0 = 1)", b0, b1, b2, a1, a2);
    }
}
