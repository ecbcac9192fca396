package org.loopledger.ident.demo;

import org.loopledger.ident.fit.TwoMassParameters;


/**
 * Invented physical parameters of the synthetic laser-marking gantry's X axis (SYNTHETIC, for demos
 * and tests only): a servo motor (inertia J<sub>m</sub>, viscous friction b) drives a ball screw through a
 * compliant coupling (torsional stiffness k, damping c); the screw, carriage and head form the load
 * inertia J<sub>l</sub> = J<sub>screw</sub> + m·(lead/2π)² seen at the motor.
 *
 * <pre>
 *   J_m·θ̈_m = K_t·i - b·θ̇_m - c·(θ̇_m - θ̇_l) - k·(θ_m - θ_l)
 *   J_l·θ̈_l = c·(θ̇_m - θ̇_l) + k·(θ_m - θ_l)
 * </pre>
 * Motor velocity per current: ω<sub>m</sub>/i = K<sub>t</sub>(J<sub>l</sub>s² + cs + k) /
 * (J<sub>m</sub>J<sub>l</sub>s³ + (J<sub>m</sub>c + J<sub>l</sub>c + J<sub>l</sub>b)s² + (J<sub>m</sub>k + J<sub>l</sub>k + bc)s + bk)
 * (derivation by hand from the two equations above).
 *
 * @param torqueConstantNmPerA K<sub>t</sub>
 * @param motorInertiaKgM2     J<sub>m</sub> (rotor and coupling hub)
 * @param screwInertiaKgM2     ball screw inertia
 * @param leadM                screw lead, m per revolution
 * @param movingMassKg         carriage plus head
 * @param stiffnessNmPerRad    k, coupling and screw in series, torsional
 * @param dampingNmsPerRad     c, coupling damping
 * @param viscousNmsPerRad     b, motor-side viscous friction
 */
public record GantryAxis(double torqueConstantNmPerA, double motorInertiaKgM2, double screwInertiaKgM2, double leadM,
                         double movingMassKg, double stiffnessNmPerRad, double dampingNmsPerRad, double viscousNmsPerRad) {

    /** Load inertia at the motor, J<sub>screw</sub> + m·(lead/2π)². */
    public double loadInertiaKgM2() {
        double r = leadM / (2 * Math.PI);
        return screwInertiaKgM2 + movingMassKg * r * r;
    }

    /**
     * The exact parameters of the fitted modal form K<sub>t</sub>/(J s + b)·(s²/ω<sub>a</sub>² + 2ζ<sub>a</sub>s/ω<sub>a</sub> + 1)
     * /(s²/ω<sub>r</sub>² + 2ζ<sub>r</sub>s/ω<sub>r</sub> + 1) of this axis (with the given delay): zeros from
     * J<sub>l</sub>s² + cs + k, poles from the cubic's roots, J = J<sub>m</sub>ω<sub>r</sub>²/ω<sub>a</sub>², b = J·p
     * (derivation by hand; equal to J<sub>m</sub> + J<sub>l</sub> and b when b → 0).
     */
    public TwoMassParameters modalTruth(double delayS) {
        double[] t = TwoMassMechanics.modal(motorInertiaKgM2, loadInertiaKgM2(), stiffnessNmPerRad, dampingNmsPerRad, viscousNmsPerRad);
        return new TwoMassParameters(t[0], t[1], t[2], t[3], t[4], t[5], delayS);
    }
}
