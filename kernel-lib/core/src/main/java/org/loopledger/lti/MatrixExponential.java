package org.loopledger.lti;

import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * Matrix exponential by scaling and squaring with a diagonal Padé approximant of degree 6.
 *
 * <p>Source: C. Moler and C. Van Loan, "Nineteen Dubious Ways to Compute the Exponential of a Matrix,
 * Twenty-Five Years Later", SIAM Review 45(1), 2003, method 3 (and Golub &amp; Van Loan, Matrix
 * Computations, 3rd ed., Algorithm 11.3.1). The matrix is scaled by 2<sup>-s</sup> until its infinity
 * norm is at most 1/2; the truncation bound for q = 6 is then about 3.4e-16 relative.
 */
public final class MatrixExponential {
    private static final int Q = 6;

    private MatrixExponential() {}

    /** e<sup>A</sup> for a square matrix A (not modified). */
    public static RealMatrix expm(RealMatrix a) {
        if (!a.isSquare()) throw new IllegalArgumentException("matrix exponential needs a square matrix, got " + a.getRowDimension() + "x" + a.getColumnDimension());
        int n = a.getRowDimension();
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (!Double.isFinite(a.getEntry(i, j))) throw new IllegalArgumentException("matrix entry (" + i + "," + j + ") is not finite");
            }
        }
        double norm = a.getNorm(); // maximum absolute column sum; any consistent norm serves
        int s = Math.max(0, Math.getExponent(norm) + 2);
        RealMatrix as = a.scalarMultiply(Math.scalb(1.0, -s));
        RealMatrix x = as;
        double c = 0.5;
        RealMatrix id = MatrixUtils.createRealIdentityMatrix(n);
        RealMatrix e = id.add(as.scalarMultiply(c));
        RealMatrix d = id.subtract(as.scalarMultiply(c));
        boolean positive = true;
        for (int k = 2; k <= Q; k++) {
            c = c * (Q - k + 1) / (k * (2.0 * Q - k + 1));
            x = as.multiply(x);
            RealMatrix cx = x.scalarMultiply(c);
            e = e.add(cx);
            d = positive ? d.add(cx) : d.subtract(cx);
            positive = !positive;
        }
        RealMatrix r = new LUDecomposition(d).getSolver().solve(e);
        for (int k = 0; k < s; k++) r = r.multiply(r);
        return r;
    }
}
