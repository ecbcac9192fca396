package org.loopledger.control;

import org.loopledger.lti.TransferFunction;

/** Point-by-point complex arithmetic on split real/imaginary arrays (no Complex objects). */
final class ComplexArrays {
    private ComplexArrays() {}

    /** (re + j·im) ← (re + j·im)·G(jω) (or G(e<sup>jωT</sup>) for a sampled G). */
    static void multiplyBy(TransferFunction g, double[] omega, double[] re, double[] im) {
        int n = omega.length;
        double[] gr = new double[n], gi = new double[n];
        g.response(omega, gr, gi);
        multiply(re, im, gr, gi);
    }

    /** (re + j·im) ← (re + j·im)·(br + j·bi). */
    static void multiply(double[] re, double[] im, double[] br, double[] bi) {
        for (int i = 0; i < re.length; i++) {
            double r = re[i] * br[i] - im[i] * bi[i];
            im[i] = re[i] * bi[i] + im[i] * br[i];
            re[i] = r;
        }
    }

    static double[] ones(int n) {
        double[] a = new double[n];
        java.util.Arrays.fill(a, 1.0);
        return a;
    }
}
