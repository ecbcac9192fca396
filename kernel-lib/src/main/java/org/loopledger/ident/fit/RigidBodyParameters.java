package org.loopledger.ident.fit;

import org.loopledger.lti.TransferFunction;

import java.util.Locale;

/**
 * Rigid body with viscous friction: current → position K<sub>t</sub>/(J s² + b s)·e<sup>-sτ</sup>
 * (→ velocity K<sub>t</sub>/(J s + b)·e<sup>-sτ</sup>); mechanical pole at b/J.
 */
public record RigidBodyParameters(double inertiaKgM2, double viscousNmsPerRad, double delayS) {
    public double mechanicalPoleHz() { return viscousNmsPerRad / inertiaKgM2 / (2 * Math.PI); }

    public TransferFunction model(double torqueConstantNmPerA, boolean toPosition) {
        double[] den = toPosition ? new double[] {inertiaKgM2, viscousNmsPerRad, 0} : new double[] {inertiaKgM2, viscousNmsPerRad};
        return TransferFunction.continuous(new double[] {torqueConstantNmPerA}, den).withDelay(delayS);
    }

    @Override public String toString() {
        return String.format(Locale.ROOT, "rigid body: J = %.5g kg·m², b = %.4g N·m·s/rad (pole %.4g Hz), delay %.4g µs",
                inertiaKgM2, viscousNmsPerRad, mechanicalPoleHz(), delayS * 1e6);
    }
}
