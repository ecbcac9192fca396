package org.loopledger.ident.fit;

import org.loopledger.lti.Motion;
import org.loopledger.lti.TransferFunction;

import java.util.Locale;

/**
 * Rigid body with viscous friction: current → position K<sub>t</sub>/(J s² + b s)·e<sup>-sτ</sup>
 * (→ velocity K<sub>t</sub>/(J s + b)·e<sup>-sτ</sup>); mechanical pole at b/J. On a {@link Motion#LINEAR}
 * axis the same numbers are the mass m in kg, b in N·s/m and the force constant K<sub>f</sub> in N/A.
 *
 * @param inertiaKgM2      J in kg·m² (rotary) or the mass in kg (linear)
 * @param viscousNmsPerRad b in N·m·s/rad (rotary) or N·s/m (linear)
 * @param delayS           τ
 * @param motion           which units the numbers are in
 */
public record RigidBodyParameters(double inertiaKgM2, double viscousNmsPerRad, double delayS, Motion motion) {
    public RigidBodyParameters {
        if (motion == null) throw new IllegalArgumentException("say whether the axis is Motion.ROTARY or Motion.LINEAR");
    }

    /** A rotary axis. */
    public RigidBodyParameters(double inertiaKgM2, double viscousNmsPerRad, double delayS) {
        this(inertiaKgM2, viscousNmsPerRad, delayS, Motion.ROTARY);
    }

    public double mechanicalPoleHz() { return viscousNmsPerRad / inertiaKgM2 / (2 * Math.PI); }

    public TransferFunction model(double torqueConstantNmPerA, boolean toPosition) {
        double[] den = toPosition ? new double[] {inertiaKgM2, viscousNmsPerRad, 0} : new double[] {inertiaKgM2, viscousNmsPerRad};
        return TransferFunction.continuous(new double[] {torqueConstantNmPerA}, den).withDelay(delayS);
    }

    @Override public String toString() {
        return String.format(Locale.ROOT, "rigid body: %s = %.5g %s, b = %.4g %s (pole %.4g Hz), delay %.4g µs",
                motion.inertiaSymbol(), inertiaKgM2, motion.inertiaUnit(), viscousNmsPerRad, motion.dampingUnit(), mechanicalPoleHz(), delayS * 1e6);
    }
}
