package org.loopledger.analysis;

import org.loopledger.lti.Units;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Polynomial;
import org.loopledger.lti.TransferFunction;

import java.util.Optional;

/**
 * The Gang of Four of a plant P and controller C in unity negative feedback: sensitivity S = 1/(1+PC),
 * complementary sensitivity T = PC/(1+PC), load (plant) sensitivity PS = P/(1+PC) and noise (control)
 * sensitivity CS = C/(1+PC) (Åström and Murray, Feedback Systems, 2nd ed., §12.1).
 *
 * <p>Always available as {@link Frf}s on a grid (for sampled systems, up to the Nyquist frequency); for
 * delay-free models also as exact {@link TransferFunction}s, with the common denominator
 * D<sub>P</sub>D<sub>C</sub> + N<sub>P</sub>N<sub>C</sub>.
 */
public final class GangOfFour {
    private final Frf s;
    private final Frf t;
    private final Frf ps;
    private final Frf cs;
    private final TransferFunction[] exact; // null when not available

    private GangOfFour(double[] w, double[] pr, double[] pi, double[] cr, double[] ci, TransferFunction[] exact, boolean computed) {
        int n = w.length;
        double[] sr = new double[n], si = new double[n], tr = new double[n], ti = new double[n];
        double[] psr = new double[n], psi = new double[n], csr = new double[n], csi = new double[n];
        for (int i = 0; i < n; i++) {
            double lr = pr[i] * cr[i] - pi[i] * ci[i], li = pr[i] * ci[i] + pi[i] * cr[i];
            double dr = 1 + lr, di = li, dd = dr * dr + di * di;
            if (dd == 0) {
                throw new IllegalArgumentException("1 + PC = 0 at " + Units.formatRadPerSAsHz(w[i]) + ": the loop is exactly on -1 there and S is infinite");
            }
            // S = 1/(1+L)
            sr[i] = dr / dd;
            si[i] = -di / dd;
            tr[i] = lr * sr[i] - li * si[i];
            ti[i] = lr * si[i] + li * sr[i];
            psr[i] = pr[i] * sr[i] - pi[i] * si[i];
            psi[i] = pr[i] * si[i] + pi[i] * sr[i];
            csr[i] = cr[i] * sr[i] - ci[i] * si[i];
            csi[i] = cr[i] * si[i] + ci[i] * sr[i];
        }
        Frf s0 = Frf.ofParts(w, sr, si), t0 = Frf.ofParts(w, tr, ti), ps0 = Frf.ofParts(w, psr, psi), cs0 = Frf.ofParts(w, csr, csi);
        this.s = computed ? s0.asComputedFromModel() : s0;
        this.t = computed ? t0.asComputedFromModel() : t0;
        this.ps = computed ? ps0.asComputedFromModel() : ps0;
        this.cs = computed ? cs0.asComputedFromModel() : cs0;
        this.exact = exact;
    }

    /** From models, on the dense grid that the analysis uses for the loop P·C. */
    public static GangOfFour of(TransferFunction plant, TransferFunction controller) {
        ModelLoop l = ModelLoop.of(plant.times(controller));
        double[] w = new double[l.size()];
        for (int i = 0; i < w.length; i++) w[i] = l.omegaRadPerS(i);
        return of(plant, controller, w);
    }

    /** From models on a given grid (rad/s; for sampled models every ω at or below π/T). */
    public static GangOfFour of(TransferFunction plant, TransferFunction controller, double[] omegaRadPerS) {
        plant.timeBase().requireSame(controller.timeBase(), "Gang of Four");
        int n = omegaRadPerS.length;
        double[] pr = new double[n], pi = new double[n], cr = new double[n], ci = new double[n];
        // integrator factors in closed form: accurate near DC even for high-order sampled models
        new FactoredResponse(plant).response(omegaRadPerS, pr, pi);
        new FactoredResponse(controller).response(omegaRadPerS, cr, ci);
        return new GangOfFour(omegaRadPerS, pr, pi, cr, ci, exactForms(plant, controller), true);
    }

    /** From a measured plant and a measured controller on the same grid. */
    public static GangOfFour of(Frf plant, Frf controller) {
        if (!plant.sameGridAs(controller)) {
            throw new IllegalArgumentException("plant and controller FRFs are on different grids (" + plant + ", " + controller
                    + "); resample one onto the other's grid with resampledTo(...) first");
        }
        return new GangOfFour(plant.omegaRadPerS(), plant.real(), plant.imag(), controller.real(), controller.imag(), null,
                plant.isComputedFromModel() && controller.isComputedFromModel());
    }

    /** From a measured plant and a model controller, evaluated on the plant's grid. */
    public static GangOfFour of(Frf plant, TransferFunction controller) {
        double[] w = plant.omegaRadPerS();
        double[] cr = new double[w.length], ci = new double[w.length];
        new FactoredResponse(controller).response(w, cr, ci);
        return new GangOfFour(w, plant.real(), plant.imag(), cr, ci, null, plant.isComputedFromModel());
    }

    private static TransferFunction[] exactForms(TransferFunction p, TransferFunction c) {
        if (p.hasDelay() || c.hasDelay()) return null;
        Polynomial np = p.numerator(), dp = p.denominator(), nc = c.numerator(), dc = c.denominator();
        Polynomial den = dp.times(dc).plus(np.times(nc));
        if (den.isZero()) throw new IllegalArgumentException("1 + PC is identically zero: the loop is algebraically ill-posed");
        var tb = p.timeBase();
        return new TransferFunction[] {
            TransferFunction.of(dp.times(dc), den, tb),
            TransferFunction.of(np.times(nc), den, tb),
            TransferFunction.of(np.times(dc), den, tb),
            TransferFunction.of(nc.times(dp), den, tb)};
    }

    /** S = 1/(1+PC) on the grid. */
    public Frf sensitivity() { return s; }

    /** T = PC/(1+PC) on the grid. */
    public Frf complementarySensitivity() { return t; }

    /** PS = P/(1+PC): from a load disturbance at the plant input to the output. */
    public Frf loadSensitivity() { return ps; }

    /** CS = C/(1+PC): from measurement noise (or the reference) to the control signal. */
    public Frf noiseSensitivity() { return cs; }

    /** S as a transfer function (delay-free models only). */
    public Optional<TransferFunction> sensitivityModel() { return exact == null ? Optional.empty() : Optional.of(exact[0]); }

    public Optional<TransferFunction> complementarySensitivityModel() { return exact == null ? Optional.empty() : Optional.of(exact[1]); }

    public Optional<TransferFunction> loadSensitivityModel() { return exact == null ? Optional.empty() : Optional.of(exact[2]); }

    public Optional<TransferFunction> noiseSensitivityModel() { return exact == null ? Optional.empty() : Optional.of(exact[3]); }

    /** One line: the grid (the peaks of each function: {@code display.GangOfFourText}). */
    @Override public String toString() {
        return "Gang of Four on " + s.size() + " points, " + Units.formatRadPerSAsHz(s.minOmegaRadPerS()) + " .. " + Units.formatRadPerSAsHz(s.maxOmegaRadPerS())
                + (exact != null ? " (exact transfer functions available)" : "");
    }
}
