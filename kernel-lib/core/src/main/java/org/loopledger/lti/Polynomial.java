package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * A polynomial with real coefficients, stored in <em>descending</em> powers:
 * p(x) = c<sub>0</sub> x<sup>n</sup> + c<sub>1</sub> x<sup>n-1</sup> + ... + c<sub>n</sub>.
 *
 * <p>Immutable: arrays are copied in and out. Leading zeros are trimmed on construction; the zero
 * polynomial is {@code [0]} with degree 0. Coefficients must be finite.
 *
 * <p>Roots come from the eigenvalues of the companion matrix (as in numpy.roots), after a diagonal
 * balancing (Parlett and Reinsch, Numer. Math. 13, 1969) and one Newton polishing step per root
 * that is kept only when it lowers the residual.
 */
public final class Polynomial {
    private static final Polynomial ZERO = new Polynomial(new double[] {0.0});
    private static final Polynomial ONE = new Polynomial(new double[] {1.0});

    private final double[] c;

    private Polynomial(double[] trimmed) { this.c = trimmed; }

    /** From coefficients in descending powers (copied). Leading zeros are dropped. */
    public static Polynomial ofDescending(double... coefficients) {
        if (coefficients == null || coefficients.length == 0) {
            throw new IllegalArgumentException("a polynomial needs at least one coefficient (use 0 for the zero polynomial)");
        }
        for (int i = 0; i < coefficients.length; i++) {
            if (!Double.isFinite(coefficients[i])) {
                throw new IllegalArgumentException("polynomial coefficient " + i + " is " + coefficients[i]
                        + "; every coefficient must be a finite number");
            }
        }
        int first = 0;
        while (first < coefficients.length - 1 && coefficients[first] == 0.0) first++;
        return new Polynomial(Arrays.copyOfRange(coefficients, first, coefficients.length));
    }

    public static Polynomial constant(double value) { return ofDescending(value); }

    public static Polynomial zero() { return ZERO; }

    public static Polynomial one() { return ONE; }

    /**
     * The monic polynomial with the given roots. Complex roots must come in conjugate pairs (to a
     * relative 1e-9), so that the coefficients are real.
     */
    public static Polynomial ofRoots(Complex... roots) {
        double[] re = {1.0};
        double[] im = {0.0};
        for (Complex r : roots) {
            if (!Double.isFinite(r.getReal()) || !Double.isFinite(r.getImaginary())) {
                throw new IllegalArgumentException("root " + r + " is not finite");
            }
            double[] nre = new double[re.length + 1];
            double[] nim = new double[re.length + 1];
            for (int i = 0; i < re.length; i++) {
                nre[i] += re[i];
                nim[i] += im[i];
                nre[i + 1] -= re[i] * r.getReal() - im[i] * r.getImaginary();
                nim[i + 1] -= re[i] * r.getImaginary() + im[i] * r.getReal();
            }
            re = nre;
            im = nim;
        }
        double scale = 0;
        for (double v : re) scale = Math.max(scale, Math.abs(v));
        for (double v : im) {
            if (Math.abs(v) > 1e-9 * Math.max(1.0, scale)) {
                throw new IllegalArgumentException("roots do not come in conjugate pairs, so the polynomial would have complex coefficients: "
                        + Arrays.toString(roots));
            }
        }
        return ofDescending(re);
    }

    /** Degree (0 for constants, including the zero polynomial). */
    public int degree() { return c.length - 1; }

    public boolean isZero() { return c.length == 1 && c[0] == 0.0; }

    /** Coefficients in descending powers (a copy). */
    public double[] coefficientsDescending() { return c.clone(); }

    /** The internal coefficient array, for allocation-free evaluation inside this package. Never modify or leak it. */
    double[] coefficientsShared() { return c; }

    /** p(x)/k, coefficient by coefficient (so a tiny k does not overflow through 1/k). */
    public Polynomial dividedBy(double k) {
        if (!Double.isFinite(k) || k == 0) throw new IllegalArgumentException("divisor must be finite and non-zero, got " + k);
        double[] r = c.clone();
        for (int i = 0; i < r.length; i++) r[i] /= k;
        return ofDescending(r);
    }

    /** Coefficient of x<sup>power</sup> (0 if above the degree). */
    public double coefficientOfPower(int power) {
        int idx = c.length - 1 - power;
        return idx < 0 || idx >= c.length ? 0.0 : c[idx];
    }

    public double leading() { return c[0]; }

    /** p(x) for real x (Horner). */
    public double evaluate(double x) {
        double r = 0;
        for (double v : c) r = r * x + v;
        return r;
    }

    /** p(z) for complex z (Horner). */
    public Complex evaluate(Complex z) {
        double[] out = new double[2];
        evaluate(z.getReal(), z.getImaginary(), out);
        return new Complex(out[0], out[1]);
    }

    /** p(x + jy) written into {@code out[0]} (real) and {@code out[1]} (imaginary); no allocation. */
    public void evaluate(double x, double y, double[] out) {
        double re = 0, im = 0;
        for (double v : c) {
            double nre = re * x - im * y + v;
            im = re * y + im * x;
            re = nre;
        }
        out[0] = re;
        out[1] = im;
    }

    public Polynomial plus(Polynomial o) {
        int n = Math.max(c.length, o.c.length);
        double[] r = new double[n];
        for (int i = 0; i < c.length; i++) r[n - c.length + i] += c[i];
        for (int i = 0; i < o.c.length; i++) r[n - o.c.length + i] += o.c[i];
        return ofDescending(r);
    }

    public Polynomial minus(Polynomial o) { return plus(o.times(-1.0)); }

    public Polynomial times(Polynomial o) {
        double[] r = new double[c.length + o.c.length - 1];
        for (int i = 0; i < c.length; i++) {
            for (int j = 0; j < o.c.length; j++) r[i + j] += c[i] * o.c[j];
        }
        return ofDescending(r);
    }

    public Polynomial times(double k) {
        if (!Double.isFinite(k)) throw new IllegalArgumentException("scale factor must be finite, got " + k);
        double[] r = c.clone();
        for (int i = 0; i < r.length; i++) r[i] *= k;
        return ofDescending(r);
    }

    /** p(x)<sup>n</sup>, n &ge; 0. */
    public Polynomial pow(int n) {
        if (n < 0) throw new IllegalArgumentException("power must be non-negative, got " + n);
        Polynomial r = ONE;
        for (int i = 0; i < n; i++) r = r.times(this);
        return r;
    }

    public Polynomial derivative() {
        if (c.length == 1) return ZERO;
        double[] r = new double[c.length - 1];
        for (int i = 0; i < r.length; i++) r[i] = c[i] * (c.length - 1 - i);
        return ofDescending(r);
    }

    /** Number of roots exactly at zero (trailing zero coefficients). */
    public int rootsAtZero() {
        if (isZero()) return 0;
        int k = 0;
        while (c[c.length - 1 - k] == 0.0) k++;
        return k;
    }

    /**
     * All roots, as many as the degree, sorted by real part then imaginary part. Roots exactly at
     * zero (trailing zero coefficients) are returned as exact zeros.
     */
    public List<Complex> roots() {
        if (isZero()) throw new IllegalArgumentException("the zero polynomial has no finite set of roots");
        List<Complex> out = new ArrayList<>();
        int zeros = rootsAtZero();
        for (int i = 0; i < zeros; i++) out.add(Complex.ZERO);
        int n = c.length - 1 - zeros;
        if (n >= 1) {
            double[] a = Arrays.copyOf(c, n + 1);
            if (n == 1) {
                out.add(new Complex(-a[1] / a[0], 0));
            } else {
                double[][] m = new double[n][n];
                for (int j = 0; j < n; j++) m[0][j] = -a[j + 1] / a[0];
                for (int i = 1; i < n; i++) m[i][i - 1] = 1.0;
                Balancing.balanceInPlace(m);
                EigenDecomposition ed = new EigenDecomposition(new Array2DRowRealMatrix(m, false));
                double[] re = ed.getRealEigenvalues();
                double[] im = ed.getImagEigenvalues();
                Polynomial p = ofDescending(a);
                Polynomial dp = p.derivative();
                for (int i = 0; i < n; i++) out.add(polish(p, dp, new Complex(re[i], im[i])));
            }
        }
        out.sort(Comparator.comparingDouble(Complex::getReal).thenComparingDouble(Complex::getImaginary));
        return out;
    }

    private static Complex polish(Polynomial p, Polynomial dp, Complex z) {
        Complex f = p.evaluate(z);
        Complex d = dp.evaluate(z);
        if (d.abs() == 0 || !Double.isFinite(d.abs())) return z;
        Complex z1 = z.subtract(f.divide(d));
        if (!Double.isFinite(z1.getReal()) || !Double.isFinite(z1.getImaginary())) return z;
        if (z.getImaginary() == 0) z1 = new Complex(z1.getReal(), 0);
        return p.evaluate(z1).abs() < f.abs() ? z1 : z;
    }

    @Override public boolean equals(Object o) { return o instanceof Polynomial p && Arrays.equals(c, p.c); }

    @Override public int hashCode() { return Arrays.hashCode(c); }

    /** Human-readable form in the variable {@code x}, e.g. {@code 2 s^2 + 3 s + 1}. */
    public String toString(String variable) {
        StringBuilder sb = new StringBuilder();
        int n = c.length - 1;
        for (int i = 0; i <= n; i++) {
            double v = c[i];
            if (v == 0 && n > 0) continue;
            int pw = n - i;
            String mag = Units.g4(Math.abs(v));
            if (sb.length() == 0) {
                if (v < 0) sb.append('-');
            } else {
                sb.append(v < 0 ? " - " : " + ");
            }
            boolean one = Math.abs(v) == 1.0 && pw > 0;
            if (!one) sb.append(mag);
            if (pw > 0) {
                if (!one) sb.append(' ');
                sb.append(variable);
                if (pw > 1) sb.append('^').append(pw);
            }
        }
        return sb.length() == 0 ? "0" : sb.toString();
    }

    @Override public String toString() { return toString("x"); }
}
