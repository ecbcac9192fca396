package org.loopledger.control;

import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.Objects;
import java.util.Optional;

/**
 * Loop gains of a PIV cascade at every break point, on the plant's frequency grid:
 * <pre>
 *   velocity loop (inner, broken at the velocity feedback, position loop open)   L<sub>v</sub> = C<sub>v</sub>·F·D·P<sub>v</sub>
 *   velocity closed loop                                                          T<sub>v</sub> = L<sub>v</sub>/(1 + L<sub>v</sub>)
 *   position loop (outer, broken at the position feedback, inner loop closed)     L<sub>p</sub> = K<sub>p</sub>·T<sub>v</sub>/(jω)
 *   position closed loop                                                          T<sub>p</sub> = L<sub>p</sub>/(1 + L<sub>p</sub>)
 *   plant input (broken at the current/torque command, both loops closed)         L<sub>u</sub> = L<sub>v</sub>·(1 + K<sub>p</sub>/(jω))
 * </pre>
 * with P<sub>v</sub> the plant from current (or torque) command to velocity, C<sub>v</sub> the velocity PI, F the
 * filters on the current command, D the drive effects ({@link DriveTiming}). Position is the integral of velocity
 * (x = v/(jω)); velocity is taken as measured directly (a velocity estimator belongs in the plant data).
 * L<sub>u</sub> equals the PIV's equivalent single loop C<sub>eq</sub>·F·D·P<sub>v</sub>/(jω) (see {@link Piv}), and
 * 1 + L<sub>u</sub> = (1 + L<sub>v</sub>)(1 + L<sub>p</sub>) (algebra), so the loop at the plant input, where torque
 * disturbances enter, is stable exactly when both nested loops are.
 *
 * <p>Always available as {@link Frf}s on the plant's grid (delays exact); as transfer functions through
 * {@link #transferFunctions()} only for a model plant, a continuous timing and no delay. Immutable.
 */
public final class CascadeLoops {
    private final Piv piv;
    private final VelocityLoop inner;
    private final Frf positionLoop;
    private final Frf positionClosedLoop;
    private final Frf plantInput;
    private final TransferFunction plantModel; // null for measured data

    private CascadeLoops(Frf plant, TransferFunction plantModel, Piv piv, FilterChain filters, DriveTiming timing) {
        this.piv = Objects.requireNonNull(piv, "piv");
        this.plantModel = plantModel;
        this.inner = VelocityLoop.of(plant, piv.velocity(), filters, timing);
        double[] w = plant.omegaRadPerS();
        int n = w.length;
        double kp = piv.positionGainPerS();
        Frf tv = inner.closedLoop(), lv = inner.loopGain();
        double[] lpr = new double[n], lpi = new double[n], tpr = new double[n], tpi = new double[n], lur = new double[n], lui = new double[n];
        for (int i = 0; i < n; i++) {
            double k = kp / w[i];
            // Kp/(jω)·T_v = -j·(Kp/ω)·T_v
            lpr[i] = k * tv.imagAt(i);
            lpi[i] = -k * tv.realAt(i);
            VelocityLoop.complementary(lpr[i], lpi[i], tpr, tpi, i);
            // L_v·(1 - j·Kp/ω)
            double a = lv.realAt(i), b = lv.imagAt(i);
            lur[i] = a + k * b;
            lui[i] = b - k * a;
        }
        this.positionLoop = VelocityLoop.withCoherence(Frf.ofParts(w, lpr, lpi), plant);
        this.positionClosedLoop = VelocityLoop.withCoherence(Frf.ofParts(w, tpr, tpi), plant);
        this.plantInput = VelocityLoop.withCoherence(Frf.ofParts(w, lur, lui), plant);
    }

    /** From a measured plant, current (or torque) command to velocity in rad/s. */
    public static CascadeLoops of(Frf plantToVelocity, Piv piv, FilterChain filters, DriveTiming timing) {
        return new CascadeLoops(plantToVelocity, null, piv, filters, timing);
    }

    /** From a continuous plant model, current (or torque) command to velocity, evaluated on {@code omegaRadPerS}. */
    public static CascadeLoops of(TransferFunction plantToVelocity, Piv piv, FilterChain filters, DriveTiming timing, double[] omegaRadPerS) {
        return new CascadeLoops(modelOnGrid(plantToVelocity, omegaRadPerS), plantToVelocity, piv, filters, timing);
    }

    static Frf modelOnGrid(TransferFunction plant, double[] omegaRadPerS) {
        if (plant.isDiscrete()) {
            throw new IllegalArgumentException("the plant model must be continuous (current to velocity in s); got a sampled one " + plant
                    + ". The drive's sampling is described by DriveTiming");
        }
        return Frf.ofModel(plant, omegaRadPerS);
    }

    public Piv piv() { return piv; }

    public Frf plant() { return inner.plant(); }

    public FilterChain filters() { return inner.filters(); }

    public DriveTiming timing() { return inner.timing(); }

    /** The inner loop on its own. */
    public VelocityLoop inner() { return inner; }

    /** L<sub>u</sub>, broken at the plant input (current or torque command). */
    public Frf plantInput() { return plantInput; }

    /** L<sub>v</sub>, the velocity loop broken at the velocity feedback (position loop open). */
    public Frf velocityLoop() { return inner.loopGain(); }

    /** T<sub>v</sub>, velocity command to velocity. */
    public Frf velocityClosedLoop() { return inner.closedLoop(); }

    /** L<sub>p</sub> = K<sub>p</sub>T<sub>v</sub>/(jω), the position loop broken at the position feedback (inner loop closed). */
    public Frf positionLoop() { return positionLoop; }

    /** T<sub>p</sub>, position reference to position. */
    public Frf positionClosedLoop() { return positionClosedLoop; }

    /** All five as one record. */
    public LoopGains all() {
        return new LoopGains(plantInput, velocityLoop(), positionLoop, velocityClosedLoop(), positionClosedLoop);
    }

    /**
     * The same five as exact transfer functions, present for a model plant without delay and a continuous
     * timing (a delay or a sampled controller has no continuous rational form; see
     * {@link CascadeTransferFunctions#sampled} for the exact sampled-data loop).
     */
    public Optional<CascadeTransferFunctions> transferFunctions() {
        if (plantModel == null || plantModel.hasDelay() || inner.timing().isSampled()) return Optional.empty();
        return Optional.of(CascadeTransferFunctions.continuous(plantModel, piv, inner.filters(), inner.timing()));
    }

    @Override public String toString() {
        return "PIV cascade: " + piv + "; " + inner.filters() + "; " + inner.timing() + "; plant " + inner.plant();
    }
}
