package org.loopledger.ident.demo;

import org.apache.commons.math3.complex.Complex;
import org.loopledger.lti.Polynomial;

import java.util.List;

/**
 * The two-mass mechanics both demo axes share, in either kind of motion (kg and N/m, or kg·m² and N·m/rad):
 * a driven mass m<sub>1</sub> coupled to a load m<sub>2</sub> by stiffness k and damping c, viscous friction b on
 * the driven side, force or torque constant K per ampere. States: position 1, velocity 1, position 2, velocity 2.
 */
final class TwoMassMechanics {
    private TwoMassMechanics() {}

    /**
     * The zero-order-hold transition over one sample time {@code t}: exp of the augmented 5×5 matrix
     * [A·t, B·t; 0, 0], whose top rows are [Φ | Γ] (Van Loan's construction, as in {@link GantrySimulator#expm}).
     */
    static double[][] zohTransition(double m1, double m2, double k, double c, double b, double gainPerA, double t) {
        double[][] a = {
                {0, 1, 0, 0},
                {-k / m1, -(b + c) / m1, k / m1, c / m1},
                {0, 0, 0, 1},
                {k / m2, c / m2, -k / m2, -c / m2}};
        double[] bIn = {0, gainPerA / m1, 0, 0};
        double[][] m = new double[5][5];
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) m[i][j] = a[i][j] * t;
            m[i][4] = bIn[i] * t;
        }
        return GantrySimulator.expm(m);
    }

    /**
     * The exact modal form of current to driven-side velocity, K/(M s + b')·(s²/ω<sub>a</sub>² + 2ζ<sub>a</sub>s/ω<sub>a</sub> + 1)
     * /(s²/ω<sub>r</sub>² + 2ζ<sub>r</sub>s/ω<sub>r</sub> + 1): zeros from m<sub>2</sub>s² + cs + k, poles from the cubic's roots,
     * M = m<sub>1</sub>ω<sub>r</sub>²/ω<sub>a</sub>², b' = M·p (derivation by hand).
     *
     * @return {M, b', resonance Hz, ζ<sub>r</sub>, antiresonance Hz, ζ<sub>a</sub>}
     */
    static double[] modal(double m1, double m2, double k, double c, double b) {
        double wa = Math.sqrt(k / m2), za = c / (2 * Math.sqrt(k * m2));
        List<Complex> roots = Polynomial.ofDescending(m1 * m2, m1 * c + m2 * c + m2 * b, m1 * k + m2 * k + b * c, b * k).roots();
        double p = Double.NaN, wr = Double.NaN, zr = Double.NaN;
        for (Complex r : roots) {
            if (Math.abs(r.getImaginary()) < 1e-9 * r.abs()) p = -r.getReal();
            else if (r.getImaginary() > 0) {
                wr = r.abs();
                zr = -r.getReal() / wr;
            }
        }
        double mass = m1 * wr * wr / (wa * wa);
        return new double[] {mass, mass * p, wr / (2 * Math.PI), zr, wa / (2 * Math.PI), za};
    }
}
