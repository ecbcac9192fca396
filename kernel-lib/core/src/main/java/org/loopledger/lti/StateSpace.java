package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * A SISO state-space realisation x' = A x + B u, y = C x + D u (or the sampled equivalent).
 * Immutable: matrices are copied in and out.
 *
 * <p>{@link #controllableCanonical} realises a proper transfer function N/D (D monic of degree n) with
 * A's first row -a<sub>1</sub> … -a<sub>n</sub>, ones on the sub-diagonal, B = e<sub>1</sub>,
 * C<sub>i</sub> = b<sub>i</sub> - a<sub>i</sub> b<sub>0</sub>, D = b<sub>0</sub>
 * (Franklin, Powell and Emami-Naeini, Feedback Control of Dynamic Systems, "control canonical form").
 * Its entries are the raw coefficients, which for a servo loop of order 8 span twenty decades; use it
 * for low orders or for display.
 *
 * <p>{@link #seriesSections} realises the same transfer function as a series connection of first- and
 * second-order sections built from its poles and zeros, and {@link #balanced} equilibrates any
 * realisation by a diagonal similarity. Together they are the well-conditioned realisation that
 * matrix methods (the zero-order-hold matrix exponential, the frequency response
 * C(λI - A)<sup>-1</sup>B + D) need (DESIGN: "use a balanced state space where a matrix method is needed").
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

    /**
     * A series connection u → H<sub>1</sub> → H<sub>2</sub> → … → k·y of first- and second-order
     * sections with the poles and zeros of {@code g} (its delay is not part of the realisation): complex
     * poles (zeros) pair with their conjugates, real ones pair by size, each zero factor goes with the
     * pole section nearest in natural frequency, and every section is realised in control canonical form
     * with its own small coefficients. The result is block lower triangular; it is not yet balanced
     * (call {@link #balanced()}).
     */
    public static StateSpace seriesSections(TransferFunction g) {
        g.requireProper("a state-space realisation");
        int n = g.denominator().degree();
        if (n == 0) throw new IllegalArgumentException("a static gain has no states; nothing to realise");
        double k = g.numerator().leading();
        List<double[]> dens = factors(Discretization.conjugateSymmetric(g.poles()));
        List<double[]> nums = g.numerator().isZero() ? List.of() : factors(Discretization.conjugateSymmetric(g.zeros()));
        if (g.numerator().isZero()) k = 0;
        // Assign numerator factors (quadratics first) to pole sections of enough degree, nearest in natural frequency.
        double[][] sectionNum = new double[dens.size()][];
        List<double[]> order = new ArrayList<>(nums);
        order.sort(Comparator.comparingInt((double[] f) -> -f.length));
        for (double[] f : order) {
            int best = -1;
            double bestD = Double.POSITIVE_INFINITY;
            for (int i = 0; i < dens.size(); i++) {
                if (sectionNum[i] != null || dens.get(i).length < f.length) continue;
                double dist = Math.abs(logNaturalFrequency(dens.get(i)) - logNaturalFrequency(f));
                if (dist < bestD) { bestD = dist; best = i; }
            }
            if (best < 0) throw new IllegalStateException("no pole section left for zero factor of degree " + (f.length - 1) + " in " + g);
            sectionNum[best] = f;
        }
        double[][] am = new double[n][n];
        double[] bm = new double[n];
        double[] row = new double[n];   // input of the current section = row·x + dIn·u
        double dIn = 1.0;
        int off = 0;
        for (int s = 0; s < dens.size(); s++) {
            double[] den = dens.get(s);
            int m = den.length - 1;
            double[] num = new double[m + 1];
            double[] f = sectionNum[s] == null ? new double[] {1.0} : sectionNum[s];
            System.arraycopy(f, 0, num, m + 1 - f.length, f.length);
            // Section states x_s' = A_s x_s + e_1 u_s with u_s = row·x + dIn·u.
            for (int j = 0; j < m; j++) am[off][off + j] = -den[j + 1];
            for (int i = 1; i < m; i++) am[off + i][off + i - 1] = 1.0;
            for (int j = 0; j < off; j++) am[off][j] += row[j];
            bm[off] = dIn;
            // Output y_s = C_s x_s + D_s u_s becomes the next section's input.
            double ds = num[0];
            double[] next = new double[n];
            for (int j = 0; j < off; j++) next[j] = ds * row[j];
            for (int i = 0; i < m; i++) next[off + i] = num[i + 1] - den[i + 1] * num[0];
            row = next;
            dIn = ds * dIn;
            off += m;
        }
        double[] cm = new double[n];
        for (int j = 0; j < n; j++) cm[j] = k * row[j];
        return of(am, bm, cm, k * dIn, g.timeBase());
    }

    /** Monic real factors of a conjugate-symmetric root set: quadratics for conjugate pairs and for pairs of real roots (by size), one linear factor if odd. */
    private static List<double[]> factors(Complex[] roots) {
        List<double[]> out = new ArrayList<>();
        List<Double> reals = new ArrayList<>();
        for (int i = 0; i < roots.length; i++) {
            Complex r = roots[i];
            if (r.getImaginary() == 0) { reals.add(r.getReal()); continue; }
            out.add(new double[] {1, -2 * r.getReal(), r.getReal() * r.getReal() + r.getImaginary() * r.getImaginary()});
            i++; // conjugateSymmetric puts the partner right after
        }
        reals.sort(Comparator.comparingDouble(Math::abs));
        for (int i = 0; i + 1 < reals.size(); i += 2) {
            double p = reals.get(i), q = reals.get(i + 1);
            out.add(new double[] {1, -(p + q), p * q});
        }
        if (reals.size() % 2 == 1) out.add(new double[] {1, -reals.get(reals.size() - 1)});
        out.sort(Comparator.comparingDouble(StateSpace::logNaturalFrequency));
        return out;
    }

    /** log of the natural frequency |c<sub>last</sub>|<sup>1/degree</sup> of a monic factor; roots at 0 count as very slow. */
    private static double logNaturalFrequency(double[] f) {
        int m = f.length - 1;
        if (m == 0) return 0;
        double c = Math.abs(f[m]);
        if (c == 0) c = m == 2 ? Math.abs(f[1]) * 1e-6 : 0;
        return c == 0 ? -745 : Math.log(c) / m;
    }

    /**
     * The same system with its states rescaled by powers of two (a diagonal similarity, exact in
     * binary) so that the rows and columns of the system matrix [[A, B], [C, D]] have comparable norms
     * (Parlett–Reinsch balancing applied to the whole system matrix; scaling the input and output
     * index together leaves the SISO transfer function unchanged).
     */
    public StateSpace balanced() {
        int n = order();
        double[][] m = new double[n + 1][n + 1];
        double[][] av = a.getData();
        for (int i = 0; i < n; i++) {
            System.arraycopy(av[i], 0, m[i], 0, n);
            m[i][n] = b.getEntry(i, 0);
            m[n][i] = c.getEntry(0, i);
        }
        m[n][n] = d;
        Balancing.balanceInPlace(m);
        double[][] an = new double[n][n];
        double[] bn = new double[n], cn = new double[n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(m[i], 0, an[i], 0, n);
            bn[i] = m[i][n];
            cn[i] = m[n][i];
        }
        // m = S^-1 M S with S = diag(s_1..s_n, u): A' = s^-1 A s, B' = s^-1 B u, C' = u^-1 C s, so C'(λ - A')^-1 B' = C(λ - A)^-1 B.
        return of(an, bn, cn, m[n][n], timeBase);
    }

    /**
     * The frequency response C(λI - A)<sup>-1</sup>B + D at λ = jω (continuous) or λ = e<sup>jωT</sup>
     * (sampled), ω in rad/s, with no polynomial in between: one complex LU factorisation with partial
     * pivoting per frequency on split real/imaginary arrays. Accurate where coefficient forms are not
     * (poles clustered near z = 1 at fast sampling), provided the realisation is well scaled (use
     * {@link #balanced()}). Throws at a pole on the imaginary axis (unit circle).
     */
    public void response(double[] omegaRadPerS, double[] re, double[] im) {
        GridArguments.requireOutputs(omegaRadPerS, re, im);
        double ts = GridArguments.sampleTimeS(timeBase);
        Resolvent r = new Resolvent(this);
        double[] out = new double[2];
        for (int i = 0; i < omegaRadPerS.length; i++) {
            double w = omegaRadPerS[i];
            GridArguments.requireFrequency(w, i, ts);
            boolean ok = ts > 0 ? r.evaluate(Math.cos(w * ts), Math.sin(w * ts), out) : r.evaluate(0, w, out);
            if (!ok) {
                throw new IllegalArgumentException("frequency " + Units.g4(w) + " rad/s (index " + i + ") is a pole of " + this
                        + " on the " + (ts > 0 ? "unit circle" : "imaginary axis") + ", where the response is infinite; leave that frequency out of the grid");
            }
            re[i] = out[0];
            im[i] = out[1];
        }
    }

    /** The frequency response at one ω in rad/s; see {@link #response(double[], double[], double[])}. */
    public Complex response(double omegaRadPerS) {
        double[] re = new double[1], im = new double[1];
        response(new double[] {omegaRadPerS}, re, im);
        return new Complex(re[0], im[0]);
    }

    /** C(λI - A)<sup>-1</sup>B + D at a complex λ, with work arrays allocated once. */
    static final class Resolvent {
        private final int n;
        private final double[] a, b, c;
        private final double d;
        private final double[] mr, mi, xr, xi;

        Resolvent(StateSpace ss) {
            n = ss.order();
            a = new double[n * n];
            double[][] av = ss.a.getData();
            for (int i = 0; i < n; i++) System.arraycopy(av[i], 0, a, i * n, n);
            b = ss.b();
            c = ss.c();
            d = ss.d;
            mr = new double[n * n];
            mi = new double[n * n];
            xr = new double[n];
            xi = new double[n];
        }

        /** Writes G(λ) into out[0], out[1]; false when λI - A is exactly singular (λ is a pole). */
        boolean evaluate(double lr, double li, double[] out) {
            for (int k = 0; k < n * n; k++) { mr[k] = -a[k]; mi[k] = 0; }
            for (int i = 0; i < n; i++) { mr[i * n + i] += lr; mi[i * n + i] = li; xr[i] = b[i]; xi[i] = 0; }
            for (int col = 0; col < n; col++) {
                int p = col;
                double best = Math.abs(mr[col * n + col]) + Math.abs(mi[col * n + col]);
                for (int r = col + 1; r < n; r++) {
                    double v = Math.abs(mr[r * n + col]) + Math.abs(mi[r * n + col]);
                    if (v > best) { best = v; p = r; }
                }
                if (best == 0) return false;
                if (p != col) {
                    for (int j = col; j < n; j++) {
                        double t = mr[p * n + j]; mr[p * n + j] = mr[col * n + j]; mr[col * n + j] = t;
                        t = mi[p * n + j]; mi[p * n + j] = mi[col * n + j]; mi[col * n + j] = t;
                    }
                    double t = xr[p]; xr[p] = xr[col]; xr[col] = t;
                    t = xi[p]; xi[p] = xi[col]; xi[col] = t;
                }
                double pr = mr[col * n + col], pi = mi[col * n + col];
                double den = pr * pr + pi * pi;          // pivot is the largest entry of its column: no overflow concern at these scales
                double ir = pr / den, ii = -pi / den;     // 1/pivot
                for (int r = col + 1; r < n; r++) {
                    double er = mr[r * n + col], ei = mi[r * n + col];
                    if (er == 0 && ei == 0) continue;
                    double fr = er * ir - ei * ii, fi = er * ii + ei * ir;
                    for (int j = col + 1; j < n; j++) {
                        double ur = mr[col * n + j], ui = mi[col * n + j];
                        mr[r * n + j] -= fr * ur - fi * ui;
                        mi[r * n + j] -= fr * ui + fi * ur;
                    }
                    xr[r] -= fr * xr[col] - fi * xi[col];
                    xi[r] -= fr * xi[col] + fi * xr[col];
                }
            }
            double yr = d, yi = 0;
            for (int i = n - 1; i >= 0; i--) {
                double sr = xr[i], si = xi[i];
                for (int j = i + 1; j < n; j++) {
                    double ur = mr[i * n + j], ui = mi[i * n + j];
                    sr -= ur * xr[j] - ui * xi[j];
                    si -= ur * xi[j] + ui * xr[j];
                }
                double pr = mr[i * n + i], pi = mi[i * n + i];
                double den = pr * pr + pi * pi;
                xr[i] = (sr * pr + si * pi) / den;
                xi[i] = (si * pr - sr * pi) / den;
                yr += c[i] * xr[i];
                yi += c[i] * xi[i];
            }
            out[0] = yr;
            out[1] = yi;
            return Double.isFinite(yr) && Double.isFinite(yi);
        }
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
