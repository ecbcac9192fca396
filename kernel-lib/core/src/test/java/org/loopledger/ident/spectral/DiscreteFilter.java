package org.loopledger.ident.spectral;

import org.loopledger.lti.TransferFunction;

/** Test helper: a difference equation a0 y[k] + a1 y[k-1] + ... = b0 x[k] + b1 x[k-1] + ... (a0 = 1) and its exact response. */
record DiscreteFilter(double[] b, double[] a) {
    double[] apply(double[] x) {
        double[] y = new double[x.length];
        for (int k = 0; k < x.length; k++) {
            double s = 0;
            for (int i = 0; i < b.length; i++) if (k - i >= 0) s += b[i] * x[k - i];
            for (int i = 1; i < a.length; i++) if (k - i >= 0) s -= a[i] * y[k - i];
            y[k] = s;
        }
        return y;
    }

    /** As a transfer function in z (coefficients in z^-1 become descending powers of z after padding). */
    TransferFunction tf(double sampleTimeS) {
        int n = Math.max(b.length, a.length);
        double[] num = new double[n], den = new double[n];
        System.arraycopy(b, 0, num, 0, b.length);
        System.arraycopy(a, 0, den, 0, a.length);
        return TransferFunction.discrete(num, den, sampleTimeS);
    }
}
