package org.loopledger.control;

import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

/**
 * A general continuous biquad H(s) = (n<sub>2</sub>s² + n<sub>1</sub>s + n<sub>0</sub>)/(d<sub>2</sub>s² + d<sub>1</sub>s + d<sub>0</sub>),
 * proper, discretised by Tustin prewarped at a stated frequency (where the discrete response equals the
 * continuous one exactly).
 */
public record Biquad(double n2, double n1, double n0, double d2, double d1, double d0, double prewarpRadPerS) implements Filter {
    public Biquad {
        for (double v : new double[] {n2, n1, n0, d2, d1, d0}) {
            if (!Double.isFinite(v)) throw new IllegalArgumentException("biquad coefficient is not finite: " + v);
        }
        if (d2 == 0 && d1 == 0 && d0 == 0) throw new IllegalArgumentException("biquad denominator is zero; give d2, d1 or d0");
        int dd = d2 != 0 ? 2 : d1 != 0 ? 1 : 0;
        int nd = n2 != 0 ? 2 : n1 != 0 ? 1 : 0;
        if (nd > dd) {
            throw new IllegalArgumentException("biquad numerator of degree " + nd + " above its denominator's " + dd
                    + " is improper and cannot run in a drive; add denominator terms");
        }
        Checks.positive(prewarpRadPerS, "biquad prewarp frequency", "rad/s");
    }

    /** From numerator and denominator in descending powers of s (at most 3 coefficients each), prewarp in Hz. */
    public static Biquad ofContinuous(double[] numDescending, double[] denDescending, double prewarpHz) {
        if (numDescending.length > 3 || denDescending.length > 3 || numDescending.length == 0 || denDescending.length == 0) {
            throw new IllegalArgumentException("a biquad has 1 to 3 coefficients in numerator and denominator, got "
                    + numDescending.length + " and " + denDescending.length);
        }
        double[] n = pad(numDescending), d = pad(denDescending);
        return new Biquad(n[0], n[1], n[2], d[0], d[1], d[2], Units.hzToRadPerS(Checks.positive(prewarpHz, "biquad prewarp frequency", "Hz")));
    }

    private static double[] pad(double[] c) {
        double[] r = new double[3];
        System.arraycopy(c, 0, r, 3 - c.length, c.length);
        return r;
    }

    @Override public TransferFunction continuous() {
        return TransferFunction.continuous(new double[] {n2, n1, n0}, new double[] {d2, d1, d0});
    }

    @Override public void requireBelowNyquist(double sampleRateHz) { Checks.belowNyquist(prewarpRadPerS, sampleRateHz, "biquad prewarp frequency"); }

    @Override public String describe() { return "biquad " + continuous() + ", prewarped at " + Units.formatRadPerSAsHz(prewarpRadPerS); }

    @Override public String toString() { return describe(); }
}
