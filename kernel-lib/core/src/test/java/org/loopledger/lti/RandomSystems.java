package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Seeded random continuous systems for cross-checks against SciPy: orders 1..6, real and complex
 * poles, stable and unstable ones, zeros from none up to the order (biproper), gain of either sign.
 *
 * <p>Roots are kept apart (no two closer than 10 % of the larger magnitude, and no zero within 10 %
 * of a pole) so that root matching by nearest neighbour is unambiguous and the root problem is
 * well conditioned: numpy.roots and our companion solver then both sit near machine precision and a
 * 1e-9 comparison is meaningful.
 */
final class RandomSystems {
    /** One generated case: the roots it was built from and its coefficients (descending powers). */
    record Case(int index, List<Complex> poles, List<Complex> zeros, double gain, double[] num, double[] den) {
        boolean stable() { return poles.stream().allMatch(p -> p.getReal() < 0); }

        boolean biproper() { return zeros.size() == poles.size(); }

        boolean hasComplexPoles() { return poles.stream().anyMatch(p -> p.getImaginary() != 0); }

        TransferFunction continuous() { return TransferFunction.continuous(num, den); }

        @Override public String toString() {
            return "case " + index + " (order " + poles.size() + ", " + zeros.size() + " zeros, "
                    + (stable() ? "stable" : "unstable") + (hasComplexPoles() ? ", complex poles" : "") + ")";
        }
    }

    private RandomSystems() {}

    /** {@code count} systems from a fixed seed; case i has order 1 + (i mod 6). */
    static List<Case> draw(long seed, int count) {
        SplittableRandom rnd = new SplittableRandom(seed);
        List<Case> out = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            int order = 1 + i % 6;
            boolean unstable = i % 3 == 2;           // every third system has a right-half-plane pole
            int nZeros = i % 4 == 3 ? order : rnd.nextInt(order); // every fourth is biproper
            List<Complex> poles;
            List<Complex> zeros;
            do {
                poles = roots(rnd, order, unstable, 0.3, 30);
                zeros = roots(rnd, nZeros, rnd.nextBoolean(), 0.5, 50);
            } while (!separated(poles, zeros));
            double gain = Math.exp(rnd.nextDouble(Math.log(0.1), Math.log(10))) * (rnd.nextBoolean() ? 1 : -1);
            double[] num = Polynomial.ofRoots(zeros.toArray(Complex[]::new)).times(gain).coefficientsDescending();
            double[] den = Polynomial.ofRoots(poles.toArray(Complex[]::new)).times(rnd.nextDouble(0.5, 3)).coefficientsDescending();
            out.add(new Case(i, List.copyOf(poles), List.copyOf(zeros), gain, num, den));
        }
        return out;
    }

    /** n roots: complex pairs with probability 1/2 while room is left, magnitudes log-uniform in [lo, hi]. */
    private static List<Complex> roots(SplittableRandom rnd, int n, boolean oneInRightHalfPlane, double lo, double hi) {
        List<Complex> r = new ArrayList<>();
        boolean rhpDone = !oneInRightHalfPlane;
        while (r.size() < n) {
            double mag = Math.exp(rnd.nextDouble(Math.log(lo), Math.log(hi)));
            double sign = rhpDone ? -1 : 1;
            rhpDone = true;
            if (n - r.size() >= 2 && rnd.nextBoolean()) {
                double zeta = rnd.nextDouble(0.1, 0.9);
                double re = sign * zeta * mag, im = mag * Math.sqrt(1 - zeta * zeta);
                r.add(new Complex(re, im));
                r.add(new Complex(re, -im));
            } else {
                r.add(new Complex(sign * mag, 0));
            }
        }
        return r;
    }

    private static boolean separated(List<Complex> poles, List<Complex> zeros) {
        List<Complex> all = new ArrayList<>(poles);
        all.addAll(zeros);
        for (int i = 0; i < all.size(); i++) {
            for (int j = i + 1; j < all.size(); j++) {
                Complex a = all.get(i), b = all.get(j);
                if (a.equals(b.conjugate()) && a.getImaginary() != 0) continue; // the two members of one pair
                if (a.subtract(b).abs() < 0.1 * Math.max(a.abs(), b.abs())) return false;
            }
        }
        return true;
    }
}
