package org.loopledger.control;

import org.loopledger.lti.Motion;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.Objects;

/**
 * A PIV position controller: a proportional position loop (gain K<sub>p</sub> in 1/s, turning a
 * position error in rad into a velocity command in rad/s) around a PI velocity loop
 * ({@link VelocityPi}).
 *
 * <p><b>Two views of the same controller.</b>
 * <ul>
 *   <li>Cascade: u = C<sub>v</sub>(s)·(K<sub>p</sub>(r - x) - v), with C<sub>v</sub> = K<sub>v</sub>(s + ω<sub>i</sub>)/s
 *       and v = s·x. Broken at the plant input the loop gain is
 *       L<sub>u</sub> = C<sub>v</sub>·(1 + K<sub>p</sub>/s)·P<sub>v</sub>, with P<sub>v</sub> the plant from input to velocity.</li>
 *   <li>Equivalent single loop on the position error ({@link #equivalentSingleLoop()}):
 *       C<sub>eq</sub>(s) = K<sub>v</sub>(s + ω<sub>i</sub>)(s + K<sub>p</sub>)/s, a gain, an integrator and two real zeros
 *       at -ω<sub>i</sub> and -K<sub>p</sub>, with L<sub>u</sub> = C<sub>eq</sub>·P<sub>x</sub>, P<sub>x</sub> = P<sub>v</sub>/s.</li>
 * </ul>
 * The two loop gains are equal by algebra: C<sub>v</sub>(1 + K<sub>p</sub>/s)P<sub>v</sub> = C<sub>v</sub>(s + K<sub>p</sub>)·P<sub>v</sub>/s.
 * (They differ in how the reference enters, not in stability or robustness at the plant input.)
 *
 * <p><b>As a PID.</b> Expanding C<sub>eq</sub> gives an ideal parallel PID on the position error with
 * K<sub>P</sub> = K<sub>v</sub>(ω<sub>i</sub> + K<sub>p</sub>), K<sub>I</sub> = K<sub>v</sub>ω<sub>i</sub>K<sub>p</sub>,
 * K<sub>D</sub> = K<sub>v</sub> ({@link #toPid()}); with a derivative filter τ see {@link #toPid(double)}.
 *
 * <p>Immutable.
 */
public final class Piv {
    private final double kp;
    private final VelocityPi velocity;

    private Piv(double kp, VelocityPi velocity) {
        this.kp = Checks.positive(kp, "position gain Kp", "1/s (rad/s of velocity command per rad of position error)");
        this.velocity = Objects.requireNonNull(velocity, "velocity controller");
    }

    /**
     * @param positionGainPerS       K<sub>p</sub> in 1/s
     * @param velocityGainPerRadPerS K<sub>v</sub> in plant-input units per rad/s (e.g. A/(rad/s))
     * @param integralCornerHz       velocity-integral corner ω<sub>i</sub>/2π in Hz (0 for none)
     */
    public static Piv of(double positionGainPerS, double velocityGainPerRadPerS, double integralCornerHz) {
        return new Piv(positionGainPerS, VelocityPi.of(velocityGainPerRadPerS, integralCornerHz));
    }

    public static Piv of(double positionGainPerS, VelocityPi velocity) { return new Piv(positionGainPerS, velocity); }

    /** K<sub>p</sub> in 1/s. */
    public double positionGainPerS() { return kp; }

    public VelocityPi velocity() { return velocity; }

    public Piv withPositionGain(double positionGainPerS) { return new Piv(positionGainPerS, velocity); }

    public Piv withVelocity(VelocityPi v) { return new Piv(kp, v); }

    /** The position controller alone, K<sub>p</sub> (rad/s per rad). */
    public TransferFunction positionController() { return TransferFunction.gain(kp); }

    /**
     * C<sub>eq</sub>(s) = K<sub>v</sub>(s + ω<sub>i</sub>)(s + K<sub>p</sub>)/s, acting on the position error
     * (improper on its own; proper once multiplied by a plant to position).
     */
    public TransferFunction equivalentSingleLoop() {
        double kv = velocity.velocityGain(), wi = velocity.integralCornerRadPerS();
        return TransferFunction.continuous(new double[] {kv, kv * (wi + kp), kv * wi * kp}, new double[] {1, 0});
    }

    /** The ideal parallel PID (no derivative filter) whose transfer function equals {@link #equivalentSingleLoop()}. */
    public Pid toPid() {
        double kv = velocity.velocityGain(), wi = velocity.integralCornerRadPerS();
        return Pid.ideal(kv * (wi + kp), kv * wi * kp, kv);
    }

    /**
     * The parallel PID with derivative filter time constant τ whose transfer function equals this
     * PIV's C<sub>eq</sub>·1/(τs + 1), that is this PIV followed by a first-order low-pass at 1/τ.
     * Matching N(s) = (K<sub>P</sub>τ + K<sub>D</sub>)s² + (K<sub>P</sub> + K<sub>I</sub>τ)s + K<sub>I</sub> with
     * K<sub>v</sub>(s + ω<sub>i</sub>)(s + K<sub>p</sub>) gives K<sub>I</sub> = K<sub>v</sub>ω<sub>i</sub>K<sub>p</sub>,
     * K<sub>P</sub> = K<sub>v</sub>(ω<sub>i</sub> + K<sub>p</sub>) - K<sub>I</sub>τ, K<sub>D</sub> = K<sub>v</sub> - K<sub>P</sub>τ
     * (derivation by hand). Positive gains need K<sub>D</sub> = K<sub>v</sub>(1 - ω<sub>i</sub>τ)(1 - K<sub>p</sub>τ) &ge; 0 and
     * ω<sub>i</sub>K<sub>p</sub>τ &lt; ω<sub>i</sub> + K<sub>p</sub>; a corner 1/τ at or above max(ω<sub>i</sub>, K<sub>p</sub>) always qualifies.
     */
    public Pid toPid(double derivativeFilterTimeConstantS) {
        double tau = Checks.nonNegative(derivativeFilterTimeConstantS, "derivative filter time constant", "s");
        if (tau == 0) return toPid();
        double kv = velocity.velocityGain(), wi = velocity.integralCornerRadPerS();
        double ki = kv * wi * kp;
        double kP = kv * (wi + kp) - ki * tau;
        double kd = kv - kP * tau;
        double slowest = Math.max(wi, kp);
        if (kd < -1e-12 * kv || !(kP > 0)) {
            throw new IllegalArgumentException("a derivative filter with corner " + Units.formatRadPerSAsHz(1 / tau) + " (τ = " + Units.g4(tau)
                    + " s) sits between this PIV's zeros, so the PID would need KP = " + Units.g4(kP) + " and KD = " + Units.g4(kd)
                    + " (one negative). Choose a corner of at least " + Units.formatRadPerSAsHz(slowest));
        }
        return Pid.withTimeConstant(kP, ki, Math.max(0, kd), tau);
    }

    @Override public boolean equals(Object o) { return o instanceof Piv p && p.kp == kp && p.velocity.equals(velocity); }

    /**
     * Whether K<sub>p</sub>, K<sub>v</sub> and ω<sub>i</sub> agree with {@code other} within {@code relativeTolerance}
     * (relative to the larger of each pair). For round trips PIV → PID → PIV, where {@link #equals} fails on rounding.
     */
    public boolean isCloseTo(Piv other, double relativeTolerance) {
        Objects.requireNonNull(other, "other");
        if (!(relativeTolerance >= 0)) throw new IllegalArgumentException("relative tolerance must be non-negative, got " + relativeTolerance);
        return Pid.close(kp, other.kp, relativeTolerance) && Pid.close(velocity.velocityGain(), other.velocity.velocityGain(), relativeTolerance)
                && Pid.close(velocity.integralCornerRadPerS(), other.velocity.integralCornerRadPerS(), relativeTolerance);
    }

    @Override public int hashCode() { return Objects.hash(kp, velocity); }

    /** As {@link #describe(Motion)} for a rotary axis. */
    @Override public String toString() { return describe(Motion.ROTARY); }

    /**
     * The gains in the axis' own units: K<sub>v</sub> per rad/s on a rotary axis; per m/s on a linear one,
     * where K<sub>v</sub> per mm/s and K<sub>p</sub> in (m/min)/mm follow in brackets (common practice).
     */
    public String describe(Motion motion) {
        Objects.requireNonNull(motion, "motion");
        double kv = velocity.velocityGain();
        String integral = ", integral corner " + (velocity.hasIntegral() ? Units.formatRadPerSAsHz(velocity.integralCornerRadPerS()) : "none");
        if (motion == Motion.ROTARY) return "PIV: Kp = " + Units.g4(kp) + " 1/s, Kv = " + Units.g4(kv) + " " + motion.velocityGainUnit() + integral;
        return "PIV: Kp = " + Units.g4(kp) + " 1/s (" + Units.g4(Motion.metresPerMinutePerMm(kp)) + " (m/min)/mm), Kv = " + Units.g4(kv) + " "
                + motion.velocityGainUnit() + " (" + Units.g4(Motion.perMmPerS(kv)) + " per mm/s)" + integral;
    }
}
