package org.loopledger.lti;

/**
 * Parlett–Reinsch diagonal balancing by powers of two (B. N. Parlett and C. Reinsch, "Balancing a
 * matrix for calculation of eigenvalues and eigenvectors", Numer. Math. 13, 1969; the same loop as
 * LAPACK's xGEBAL without the permutation step). A similarity transform D<sup>-1</sup> M D with D
 * diagonal: eigenvalues are unchanged, and because the factors are powers of two no rounding is added.
 */
final class Balancing {
    private static final double RADIX = 2.0;

    private Balancing() {}

    /**
     * Balances {@code a} in place and returns the diagonal d of D (a becomes D<sup>-1</sup> a D).
     * Indices whose off-diagonal row or column is all zero keep d = 1.
     */
    static double[] balanceInPlace(double[][] a) {
        int n = a.length;
        double[] d = new double[n];
        java.util.Arrays.fill(d, 1.0);
        boolean done = false;
        for (int iter = 0; !done && iter < 100; iter++) {
            done = true;
            for (int i = 0; i < n; i++) {
                double r = 0, col = 0;
                for (int j = 0; j < n; j++) {
                    if (j != i) {
                        col += Math.abs(a[j][i]);
                        r += Math.abs(a[i][j]);
                    }
                }
                if (col == 0 || r == 0) continue;
                double g = r / RADIX, f = 1.0, s = col + r;
                while (col < g) { f *= RADIX; col *= RADIX * RADIX; }
                g = r * RADIX;
                while (col > g) { f /= RADIX; col /= RADIX * RADIX; }
                if ((col + r) / f < 0.95 * s) {
                    done = false;
                    g = 1.0 / f;
                    for (int j = 0; j < n; j++) a[i][j] *= g;
                    for (int j = 0; j < n; j++) a[j][i] *= f;
                    d[i] *= f;
                }
            }
        }
        return d;
    }
}
