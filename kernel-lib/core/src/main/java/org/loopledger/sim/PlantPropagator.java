package org.loopledger.sim;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.loopledger.lti.MatrixExponential;
import org.loopledger.lti.StateSpace;
import org.loopledger.lti.TransferFunction;

/**
 * Exact propagation of the continuous axis over an interval with constant inputs (the zero-order-hold
 * solution: x(t + h) = Φ(h)x(t) + Γ(h)·[u; d], Φ = e<sup>Ah</sup>, Γ = ∫<sub>0</sub><sup>h</sup>e<sup>Aσ</sup>dσ·B, from one
 * matrix exponential of [[A, B], [0, 0]]·h; G. F. Franklin, J. D. Powell, M. Workman, Digital Control of Dynamic
 * Systems, 3rd ed., §4.3.3). States: the plant's control-canonical states, the position (integral of velocity),
 * and the current-loop lag state when there is one. Inputs: u (current command) and d (disturbance added at the
 * plant input after the current loop).
 */
final class PlantPropagator {
    final int n;          // number of states
    final double[] cVel;  // velocity = cVel · x
    final double[] cPos;  // position = cPos · x
    private final double[][] a;
    private final double[][] b; // n x 2

    PlantPropagator(TransferFunction plant, double currentLoopRadPerS) {
        StateSpace ss = StateSpace.controllableCanonical(plant);
        int np = ss.order();
        boolean lag = !Double.isInfinite(currentLoopRadPerS);
        n = np + 1 + (lag ? 1 : 0);
        a = new double[n][n];
        b = new double[n][2];
        double[][] ap = ss.a();
        double[] bp = ss.b(), cp = ss.c();
        for (int i = 0; i < np; i++) System.arraycopy(ap[i], 0, a[i], 0, np);
        for (int j = 0; j < np; j++) a[np][j] = cp[j]; // position' = velocity
        for (int i = 0; i < np; i++) {
            if (lag) a[i][np + 1] = bp[i]; else b[i][0] = bp[i];
            b[i][1] = bp[i];
        }
        if (lag) {
            a[np + 1][np + 1] = -currentLoopRadPerS;
            b[np + 1][0] = currentLoopRadPerS;
        }
        double[] cv = new double[n], cx = new double[n];
        System.arraycopy(cp, 0, cv, 0, np);
        cx[np] = 1;
        // Diagonal similarity x = S·x_b (Parlett–Reinsch balancing by powers of two, as LAPACK's gebal without
        // permutation): the companion form of a lightly damped resonance is badly scaled (entries from 1 to ω⁴),
        // and scaling-and-squaring loses accuracy on such non-normal matrices; balancing restores about two digits.
        double[] sc = balance(a);
        for (int i = 0; i < n; i++) {
            b[i][0] /= sc[i];
            b[i][1] /= sc[i];
            cv[i] *= sc[i];
            cx[i] *= sc[i];
        }
        cVel = cv;
        cPos = cx;
    }

    /** Balances {@code m} in place (m ← S⁻¹mS, S diagonal powers of two) and returns the diagonal of S. */
    private static double[] balance(double[][] m) {
        int n = m.length;
        double[] s = new double[n];
        java.util.Arrays.fill(s, 1.0);
        boolean done = false;
        for (int iter = 0; !done && iter < 200; iter++) {
            done = true;
            for (int i = 0; i < n; i++) {
                double c = 0, r = 0;
                for (int j = 0; j < n; j++) {
                    if (j == i) continue;
                    c += Math.abs(m[j][i]);
                    r += Math.abs(m[i][j]);
                }
                if (c == 0 || r == 0) continue;
                double g = r / 2, f = 1, sum = c + r;
                while (c < g) { f *= 2; c *= 4; }
                g = r * 2;
                while (c > g) { f /= 2; c /= 4; }
                if ((c + r) / f < 0.95 * sum) {
                    done = false;
                    // column i scaled by f, row i by 1/f: S_ii *= f
                    for (int j = 0; j < n; j++) m[i][j] /= f;
                    for (int j = 0; j < n; j++) m[j][i] *= f;
                    s[i] *= f;
                }
            }
        }
        return s;
    }

    /** Φ(h) and Γ(h) (n x 2) for an interval of {@code h} seconds. */
    Step step(double h) {
        RealMatrix m = new Array2DRowRealMatrix(n + 2, n + 2);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) m.setEntry(i, j, a[i][j] * h);
            m.setEntry(i, n, b[i][0] * h);
            m.setEntry(i, n + 1, b[i][1] * h);
        }
        RealMatrix e = MatrixExponential.expm(m);
        double[][] phi = new double[n][n], gam = new double[n][2];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) phi[i][j] = e.getEntry(i, j);
            gam[i][0] = e.getEntry(i, n);
            gam[i][1] = e.getEntry(i, n + 1);
        }
        return new Step(phi, gam);
    }

    /** One interval's transition; {@link #apply} works in place on primitive arrays. */
    static final class Step {
        private final double[][] phi;
        private final double[][] gam;

        Step(double[][] phi, double[][] gam) {
            this.phi = phi;
            this.gam = gam;
        }

        /** x ← Φx + Γ[u; d], using {@code scratch} (length n). */
        void apply(double[] x, double u, double d, double[] scratch) {
            int n = x.length;
            for (int i = 0; i < n; i++) {
                double s = gam[i][0] * u + gam[i][1] * d;
                double[] row = phi[i];
                for (int j = 0; j < n; j++) s += row[j] * x[j];
                scratch[i] = s;
            }
            System.arraycopy(scratch, 0, x, 0, n);
        }
    }

    double velocity(double[] x) { return dot(cVel, x); }

    double position(double[] x) { return dot(cPos, x); }

    private static double dot(double[] c, double[] x) {
        double s = 0;
        for (int i = 0; i < x.length; i++) s += c[i] * x[i];
        return s;
    }
}
