package org.loopledger.control;

import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.Objects;

/**
 * The velocity controller of a cascade: a PI on the velocity error,
 * C<sub>v</sub>(s) = K<sub>v</sub>·(1 + ω<sub>i</sub>/s) = K<sub>v</sub>·(s + ω<sub>i</sub>)/s.
 *
 * <p><b>Units.</b> K<sub>v</sub> is in plant-input units per rad/s of velocity error: A/(rad/s)
 * (= A·s/rad) for a current-commanded drive, N·m·s/rad when the plant input is a torque; on a linear
 * axis per m/s instead ({@link org.loopledger.lti.Motion}; the numbers are the same, the names differ). The
 * velocity-integral corner ω<sub>i</sub> is the frequency where the integral and proportional
 * parts are equal; rad/s inside, Hz in {@link #of}. ω<sub>i</sub> = 0 means no integral action.
 *
 * <p><b>Discrete form</b> (what the drive runs at sample time T): the integral is accumulated by
 * backward Euler, I[k] = I[k-1] + ω<sub>i</sub>T·e[k], u[k] = K<sub>v</sub>(e[k] + I[k]), so
 * C<sub>v</sub>(z) = K<sub>v</sub>·((1 + ω<sub>i</sub>T)z - 1)/(z - 1). The {@code sim} package runs
 * exactly this recursion, and {@link Cascade} evaluates exactly this C<sub>v</sub>(z) when the
 * drive is sampled, so frequency and time domain see the same controller.
 *
 * <p>Immutable.
 */
public final class VelocityPi {
    private final double kv;
    private final double omegaI;

    private VelocityPi(double kv, double omegaI) {
        this.kv = Checks.positive(kv, "velocity gain Kv", "plant-input units per rad/s (e.g. A/(rad/s))");
        this.omegaI = Checks.nonNegative(omegaI, "velocity-integral corner", "rad/s");
    }

    /** K<sub>v</sub> in plant-input units per rad/s (e.g. A/(rad/s)), integral corner in Hz (0 for none). */
    public static VelocityPi of(double velocityGainPerRadPerS, double integralCornerHz) {
        Checks.nonNegative(integralCornerHz, "velocity-integral corner", "Hz");
        return new VelocityPi(velocityGainPerRadPerS, Units.hzToRadPerS(integralCornerHz));
    }

    /** K<sub>v</sub> in plant-input units per rad/s, integral corner in rad/s (0 for none). */
    public static VelocityPi ofRadPerS(double velocityGainPerRadPerS, double integralCornerRadPerS) {
        return new VelocityPi(velocityGainPerRadPerS, integralCornerRadPerS);
    }

    /** A proportional-only velocity controller (ω<sub>i</sub> = 0). */
    public static VelocityPi proportional(double velocityGainPerRadPerS) { return new VelocityPi(velocityGainPerRadPerS, 0); }

    /** K<sub>v</sub> in plant-input units per rad/s. */
    public double velocityGain() { return kv; }

    /** ω<sub>i</sub> in rad/s (0 when there is no integral action). */
    public double integralCornerRadPerS() { return omegaI; }

    public double integralCornerHz() { return Units.radPerSToHz(omegaI); }

    public boolean hasIntegral() { return omegaI > 0; }

    /** Same integral corner, another gain. */
    public VelocityPi withVelocityGain(double velocityGainPerRadPerS) { return new VelocityPi(velocityGainPerRadPerS, omegaI); }

    /** C<sub>v</sub>(s) = K<sub>v</sub>(s + ω<sub>i</sub>)/s, or K<sub>v</sub> without integral. */
    public TransferFunction continuous() {
        if (omegaI == 0) return TransferFunction.gain(kv);
        return TransferFunction.continuous(new double[] {kv, kv * omegaI}, new double[] {1, 0});
    }

    /** C<sub>v</sub>(z) = K<sub>v</sub>((1 + ω<sub>i</sub>T)z - 1)/(z - 1) (backward-Euler integral), at sample time T. */
    public TransferFunction discrete(double sampleTimeS) {
        TimeBase tb = TimeBase.sampled(sampleTimeS);
        if (omegaI == 0) return TransferFunction.gain(kv, tb);
        return TransferFunction.discrete(new double[] {kv * (1 + omegaI * sampleTimeS), -kv}, new double[] {1, -1}, sampleTimeS);
    }

    @Override public boolean equals(Object o) { return o instanceof VelocityPi v && v.kv == kv && v.omegaI == omegaI; }

    @Override public int hashCode() { return Objects.hash(kv, omegaI); }

    /** As {@link #describe(org.loopledger.lti.Motion)} for a rotary axis. */
    @Override public String toString() { return describe(org.loopledger.lti.Motion.ROTARY); }

    /** K<sub>v</sub> per rad/s (rotary) or per m/s (linear), and the integral corner. */
    public String describe(org.loopledger.lti.Motion motion) {
        return "velocity PI: Kv = " + Units.g4(kv) + " " + motion.velocityGainUnit() + ", integral corner " + (omegaI == 0 ? "none" : Units.formatRadPerSAsHz(omegaI));
    }
}
