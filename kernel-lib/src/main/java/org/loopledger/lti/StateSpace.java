package org.loopledger.lti;

import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * A SISO state-space realisation x' = A x + B u, y = C x + D u (or the sampled equivalent).
 * Immutable: matrices are copied in and out.
 *
 * <p>{@link #controllableCanonical} realises a proper transfer function N/D (D monic of degree n) with
 * A's first row -a<sub>1</sub> … -a<sub>n</sub>, ones on the sub-diagonal, B = e<sub>1</sub>,
 * C<sub>i</sub> = b<sub>i</sub> - a<sub>i</sub> b<sub>0</sub>, D = b<sub>0</sub>
 * (Franklin, Powell and Emami-Naeini, Feedback Control of Dynamic Systems, "control canonical form").
 */
public final class StateSpace {
    private final RealMatrix a;
    private final RealMatrix b;
    private final RealMatrix c;
    private final double d;
    private final TimeBase timeBase;

    private StateSpace(RealMatrix a, RealMatrix b, RealMatrix c, double d, TimeBase timeBase) {
        this.a = a.copy();
        this.b = b.copy();
        this.c = c.copy();
        this.d = d;
        this.timeBase = timeBase;
    }

    /** From A (n×n), B and C (n entries each), D and the time base; all copied, all entries finite. */
    public static StateSpace of(double[][] a, double[] b, double[] c, double d, TimeBase timeBase) {
        java.util.Objects.requireNonNull(timeBase, "time base");
        int n = a.length;
        if (n == 0) throw new IllegalArgumentException("a state-space model needs at least one state; a static gain is a TransferFunction.gain");
        for (int i = 0; i < n; i++) {
            if (a[i].length != n) throw new IllegalArgumentException("A must be square: it has " + n + " rows but row " + i + " has " + a[i].length + " entries");
        }
        if (b.length != n || c.length != n) throw new IllegalArgumentException("A is " + n + "x" + n + " but B has " + b.length + " and C " + c.length + " entries");
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) requireFinite(a[i][j], "A(" + i + "," + j + ")");
            requireFinite(b[i], "B(" + i + ")");
            requireFinite(c[i], "C(" + i + ")");
        }
        requireFinite(d, "D");
        return new StateSpace(MatrixUtils.createRealMatrix(a), MatrixUtils.createColumnRealMatrix(b), MatrixUtils.createRowRealMatrix(c), d, timeBase);
    }

    private static void requireFinite(double v, String what) {
        if (!Double.isFinite(v)) throw new IllegalArgumentException("state-space entry " + what + " is " + v + "; every entry must be a finite number");
    }

    /** Control canonical realisation of a proper transfer function (its delay is not part of the realisation). */
    public static StateSpace controllableCanonical(TransferFunction g) {
        g.requireProper("a state-space realisation");
        double[] den = g.denominator().coefficientsDescending();
        int n = den.length - 1;
        if (n == 0) throw new IllegalArgumentException("a static gain has no states; nothing to realise");
        double[] num = new double[n + 1];
        double[] gn = g.numerator().coefficientsDescending();
        System.arraycopy(gn, 0, num, n + 1 - gn.length, gn.length);
        double[][] am = new double[n][n];
        for (int j = 0; j < n; j++) am[0][j] = -den[j + 1];
        for (int i = 1; i < n; i++) am[i][i - 1] = 1.0;
        double[] bm = new double[n];
        bm[0] = 1.0;
        double[] cm = new double[n];
        for (int i = 0; i < n; i++) cm[i] = num[i + 1] - den[i + 1] * num[0];
        return of(am, bm, cm, num[0], g.timeBase());
    }

    public int order() { return a.getRowDimension(); }

    public double[][] a() { return a.getData(); }

    public double[] b() { return b.getColumn(0); }

    public double[] c() { return c.getRow(0); }

    public double d() { return d; }

    public TimeBase timeBase() { return timeBase; }

    RealMatrix aMatrix() { return a.copy(); }

    RealMatrix bMatrix() { return b.copy(); }

    RealMatrix cMatrix() { return c.copy(); }

    @Override public String toString() {
        return "StateSpace[order " + order() + ", " + timeBase + "]";
    }
}
