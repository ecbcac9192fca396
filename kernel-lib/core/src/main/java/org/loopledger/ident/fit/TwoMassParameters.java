package org.loopledger.ident.fit;

import org.loopledger.lti.Motion;
import org.loopledger.lti.TransferFunction;

import java.util.Locale;

/**
 * Two-mass axis in modal form, current to motor velocity:
 * <pre>
 *   G(s) = K_t/(J·s + b) · (s²/ω_a² + 2ζ_as/ω_a + 1) / (s²/ω_r² + 2ζ_rs/ω_r + 1) · e^(-sτ)
 * </pre>
 * (to position: one more 1/s). For an undamped coupling the inertia ratio is
 * R = J<sub>l</sub>/J<sub>m</sub> = (ω<sub>r</sub>/ω<sub>a</sub>)² - 1, J<sub>m</sub> = J/(1 + R), and the
 * stiffness k = J<sub>l</sub>ω<sub>a</sub>² (common practice for the two-mass model). On a {@link Motion#LINEAR}
 * axis (a linear motor driving a compliantly coupled load) the same numbers are masses in kg, b in N·s/m,
 * k in N/m, and the ratio is the mass ratio.
 *
 * @param inertiaKgM2       J = J<sub>m</sub> + J<sub>l</sub>, the total inertia (motor plus load) seen at the motor, in kg·m²
 *                          (the total moving mass m<sub>1</sub> + m<sub>2</sub> in kg on a linear axis); it sets the
 *                          rigid-body slope K<sub>t</sub>/(J·s) below the antiresonance
 * @param viscousNmsPerRad  b, the total viscous friction, in N·m·s/rad (N·s/m on a linear axis); mechanical pole at b/J
 * @param resonanceHz       f<sub>r</sub> = ω<sub>r</sub>/2π, the resonance (peak) in Hz
 * @param resonanceDamping  ζ<sub>r</sub>, damping ratio of the resonance (dimensionless; 1/(2ζ<sub>r</sub>) is its Q)
 * @param antiresonanceHz   f<sub>a</sub> = ω<sub>a</sub>/2π, the antiresonance (dip) in Hz, below f<sub>r</sub>
 * @param antiresonanceDamping ζ<sub>a</sub>, damping ratio of the antiresonance (dimensionless)
 * @param delayS            τ, pure delay in s (0 when not fitted): the lags the model does not explain
 *                          (see {@link FitOptions#withDelay()})
 * @param motion            which units the numbers are in
 */
public record TwoMassParameters(double inertiaKgM2, double viscousNmsPerRad, double resonanceHz, double resonanceDamping,
                                double antiresonanceHz, double antiresonanceDamping, double delayS, Motion motion) {
    public TwoMassParameters {
        if (motion == null) throw new IllegalArgumentException("say whether the axis is Motion.ROTARY or Motion.LINEAR");
    }

    /** A rotary axis. */
    public TwoMassParameters(double inertiaKgM2, double viscousNmsPerRad, double resonanceHz, double resonanceDamping,
                             double antiresonanceHz, double antiresonanceDamping, double delayS) {
        this(inertiaKgM2, viscousNmsPerRad, resonanceHz, resonanceDamping, antiresonanceHz, antiresonanceDamping, delayS, Motion.ROTARY);
    }

    /** J = J<sub>m</sub> + J<sub>l</sub>, total inertia at the motor in kg·m² (total moving mass in kg on a linear axis). */
    @Override public double inertiaKgM2() { return inertiaKgM2; }

    /** b, total viscous friction in N·m·s/rad (N·s/m on a linear axis). */
    @Override public double viscousNmsPerRad() { return viscousNmsPerRad; }

    /** f<sub>r</sub>, the resonance (peak of the motor-side response) in Hz. */
    @Override public double resonanceHz() { return resonanceHz; }

    /** ζ<sub>r</sub>, damping ratio of the resonance (dimensionless). */
    @Override public double resonanceDamping() { return resonanceDamping; }

    /** f<sub>a</sub>, the antiresonance (dip of the motor-side response) in Hz. */
    @Override public double antiresonanceHz() { return antiresonanceHz; }

    /** ζ<sub>a</sub>, damping ratio of the antiresonance (dimensionless). */
    @Override public double antiresonanceDamping() { return antiresonanceDamping; }

    /** τ, the pure delay of the model in s (0 when no delay was fitted). */
    @Override public double delayS() { return delayS; }

    /**
     * R = J<sub>l</sub>/J<sub>m</sub> = (f<sub>r</sub>/f<sub>a</sub>)² - 1, load to motor inertia (or mass) ratio,
     * exact for an undamped coupling.
     */
    public double inertiaRatio() { return Math.pow(resonanceHz / antiresonanceHz, 2) - 1; }

    /** J<sub>m</sub> = J/(1 + R), motor-side inertia in kg·m² (mass in kg on a linear axis); undamped coupling assumed. */
    public double motorInertiaKgM2() { return inertiaKgM2 / (1 + inertiaRatio()); }

    /** J<sub>l</sub> = J - J<sub>m</sub>, load-side inertia in kg·m² (mass in kg on a linear axis); undamped coupling assumed. */
    public double loadInertiaKgM2() { return inertiaKgM2 - motorInertiaKgM2(); }

    /** k in N·m/rad, or N/m on a linear axis. */
    public double stiffnessNmPerRad() { return loadInertiaKgM2() * Math.pow(2 * Math.PI * antiresonanceHz, 2); }

    /** The same without delay. */
    public TwoMassParameters withoutDelay() {
        return new TwoMassParameters(inertiaKgM2, viscousNmsPerRad, resonanceHz, resonanceDamping, antiresonanceHz, antiresonanceDamping, 0, motion);
    }

    /** The continuous model from current (A) to velocity (rad/s or m/s) or, with {@code toPosition}, to position (rad or m). */
    public TransferFunction model(double torqueConstantNmPerA, boolean toPosition) {
        double wa = 2 * Math.PI * antiresonanceHz, wr = 2 * Math.PI * resonanceHz;
        double[] num = {torqueConstantNmPerA / (wa * wa), torqueConstantNmPerA * 2 * antiresonanceDamping / wa, torqueConstantNmPerA};
        double[] mode = {1 / (wr * wr), 2 * resonanceDamping / wr, 1};
        double[] den = {inertiaKgM2 * mode[0], inertiaKgM2 * mode[1] + viscousNmsPerRad * mode[0], inertiaKgM2 * mode[2] + viscousNmsPerRad * mode[1], viscousNmsPerRad * mode[2]};
        if (toPosition) den = new double[] {den[0], den[1], den[2], den[3], 0};
        return TransferFunction.continuous(num, den).withDelay(delayS);
    }

    @Override public String toString() {
        return String.format(Locale.ROOT, "two-mass: %s = %.5g %s, b = %.4g %s, resonance %.5g Hz (ζ %.4g), antiresonance %.5g Hz (ζ %.4g), "
                        + "%s ratio %.4g, delay %.4g µs", motion.inertiaSymbol(), inertiaKgM2, motion.inertiaUnit(), viscousNmsPerRad, motion.dampingUnit(),
                resonanceHz, resonanceDamping, antiresonanceHz, antiresonanceDamping, motion.inertiaName(), inertiaRatio(), delayS * 1e6);
    }
}
