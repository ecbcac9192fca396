package org.loopledger.analysis;

import org.loopledger.lti.Units;
import org.loopledger.lti.Polynomial;
import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;

/**
 * Frequency response of a {@link TransferFunction} with its integrator factors (s, or z - 1) split off
 * ({@link IntegratorSplit}) and evaluated in closed form, the rest by Horner: accurate at low frequency
 * even for high-order sampled systems, where Horner on the expanded polynomial cancels near z = 1.
 * Primitive arrays, no allocation per point. Includes the pure delay e<sup>-jωτ</sup>.
 */
final class FactoredResponse {
    private final Polynomial numRest;
    private final Polynomial denRest;
    private final double[] numC;  // numRest coefficients, descending
    private final double[] denC;
    private final int power;      // net power of 1/(x - a)
    private final double ts;      // 0: continuous
    private final double tau;
    private final int numAtA;
    private final int denAtA;

    FactoredResponse(TransferFunction g) {
        this.ts = g.timeBase() instanceof TimeBase.Sampled sm ? sm.sampleTimeS() : 0;
        this.tau = g.delayS();
        IntegratorSplit n = IntegratorSplit.of(g.numerator(), ts > 0);
        IntegratorSplit d = IntegratorSplit.of(g.denominator(), ts > 0);
        this.numRest = n.rest();
        this.denRest = d.rest();
        this.numC = numRest.coefficientsDescending();
        this.denC = denRest.coefficientsDescending();
        this.numAtA = n.count();
        this.denAtA = d.count();
        this.power = d.count() - n.count();
    }

    Polynomial numeratorRest() { return numRest; }

    Polynomial denominatorRest() { return denRest; }

    /** Factors s (or z - 1) split off the numerator. */
    int numeratorFactors() { return numAtA; }

    /** Factors s (or z - 1) split off the denominator. */
    int denominatorFactors() { return denAtA; }

    /** G at ω (rad/s, at most π/T when sampled), without the delay, into out[0..1] (modified). */
    void rationalAt(double omega, double[] out) {
        double x, y;
        if (ts > 0) {
            if (omega > Math.PI / ts * (1 + 1e-12)) {
                throw new IllegalArgumentException("frequency " + Units.formatRadPerSAsHz(omega) + " lies above the Nyquist frequency " + Units.formatRadPerSAsHz(Math.PI / ts)
                        + " of this sampled system; restrict the grid to [0, π/T]");
            }
            x = Math.cos(omega * ts);
            y = Math.sin(omega * ts);
        } else {
            x = 0;
            y = omega;
        }
        double nr = 0, ni = 0, dr = 0, di = 0;
        for (double c : numC) { double t = nr * x - ni * y + c; ni = nr * y + ni * x; nr = t; }
        for (double c : denC) { double t = dr * x - di * y + c; di = dr * y + di * x; dr = t; }
        double dd = dr * dr + di * di;
        double gr = (nr * dr + ni * di) / dd;
        double gi = (ni * dr - nr * di) / dd;
        if (power != 0) {
            // x - a = jω, or e^{jωT} - 1 = 2 sin(ωT/2) e^{j(π/2 + ωT/2)}
            double mag = ts > 0 ? 2 * Math.sin(omega * ts / 2) : omega;
            double ang = ts > 0 ? Math.PI / 2 + omega * ts / 2 : Math.PI / 2;
            double m = Math.pow(mag, -power), a = -power * ang;
            double c = m * Math.cos(a), s = m * Math.sin(a);
            double t = gr * c - gi * s;
            gi = gr * s + gi * c;
            gr = t;
        }
        out[0] = gr;
        out[1] = gi;
    }

    /** G (with delay) on a grid into re, im (modified). */
    void response(double[] omega, double[] re, double[] im) {
        double[] v = new double[2];
        for (int k = 0; k < omega.length; k++) {
            rationalAt(omega[k], v);
            if (tau > 0) {
                double c = Math.cos(omega[k] * tau), s = -Math.sin(omega[k] * tau);
                double t = v[0] * c - v[1] * s;
                v[1] = v[0] * s + v[1] * c;
                v[0] = t;
            }
            re[k] = v[0];
            im[k] = v[1];
        }
    }
}
