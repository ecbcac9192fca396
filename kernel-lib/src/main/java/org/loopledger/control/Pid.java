package org.loopledger.control;

import org.loopledger.lti.Motion;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.Objects;
import java.util.Optional;

/**
 * A parallel PID with a first-order derivative filter, acting on the position error:
 * C(s) = K<sub>P</sub> + K<sub>I</sub>/s + K<sub>D</sub>s/(τs + 1)
 *      = [(K<sub>P</sub>τ + K<sub>D</sub>)s² + (K<sub>P</sub> + K<sub>I</sub>τ)s + K<sub>I</sub>] / [s(τs + 1)].
 *
 * <p><b>Units</b> (position error in rad, output in plant-input units, e.g. A): K<sub>P</sub> in A/rad,
 * K<sub>I</sub> in A/(rad·s), K<sub>D</sub> in A·s/rad, τ in s (τ = 0: ideal, unfiltered derivative).
 * K<sub>P</sub> must be positive; K<sub>I</sub> = 0 or K<sub>D</sub> = 0 leave that term out.
 *
 * <p><b>PIV form.</b> The numerator N(s) equals K<sub>v</sub>(s + ω<sub>i</sub>)(s + K<sub>p</sub>) exactly when
 * its roots are real; then C = C<sub>eq,PIV</sub>·1/(τs + 1) ({@link #toPiv}). Complex roots have no PIV
 * form and give an error that names them. See {@link Piv} for the reverse.
 */
public final class Pid {
    private final double kp;
    private final double ki;
    private final double kd;
    private final double tau;

    private Pid(double kp, double ki, double kd, double tau) {
        this.kp = Checks.positive(kp, "proportional gain KP", "plant-input units per rad (e.g. A/rad)");
        this.ki = Checks.nonNegative(ki, "integral gain KI", "plant-input units per rad·s (e.g. A/(rad·s))");
        this.kd = Checks.nonNegative(kd, "derivative gain KD", "plant-input units per rad/s (e.g. A·s/rad)");
        this.tau = Checks.nonNegative(tau, "derivative filter time constant", "s");
    }

    /** Gains as documented in the class, derivative filter corner 1/(2πτ) in Hz. */
    public static Pid of(double kp, double ki, double kd, double derivativeFilterCornerHz) {
        Checks.positive(derivativeFilterCornerHz, "derivative filter corner", "Hz (use Pid.ideal for no filter)");
        return new Pid(kp, ki, kd, 1.0 / Units.hzToRadPerS(derivativeFilterCornerHz));
    }

    /** Gains as documented in the class, derivative filter time constant τ in s (0 for none). */
    public static Pid withTimeConstant(double kp, double ki, double kd, double derivativeFilterTimeConstantS) {
        return new Pid(kp, ki, kd, derivativeFilterTimeConstantS);
    }

    /** No derivative filter (τ = 0); the transfer function is improper when K<sub>D</sub> &gt; 0. */
    public static Pid ideal(double kp, double ki, double kd) { return new Pid(kp, ki, kd, 0); }

    public double proportionalGain() { return kp; }

    public double integralGain() { return ki; }

    public double derivativeGain() { return kd; }

    /** τ in s (0 for an unfiltered derivative). */
    public double derivativeFilterTimeConstantS() { return tau; }

    public boolean hasDerivativeFilter() { return tau > 0; }

    /** The numerator N(s) coefficients {s², s, 1}. */
    private double[] numerator() { return new double[] {kp * tau + kd, kp + ki * tau, ki}; }

    /** C(s) as a transfer function. */
    public TransferFunction continuous() {
        return TransferFunction.continuous(numerator(), tau > 0 ? new double[] {tau, 1, 0} : new double[] {1, 0});
    }

    /**
     * The exact PIV form: the roots of N(s) = a s² + b s + c are -K<sub>p</sub> and -ω<sub>i</sub> (which is which:
     * {@code assignment}), K<sub>v</sub> = a, and a derivative filter becomes a first-order low-pass at 1/τ.
     *
     * @throws IllegalArgumentException when the roots are complex (named in the message), or when N is
     *         only first order (K<sub>D</sub> = 0 and τ = 0: no velocity gain)
     */
    public PidAsPiv toPiv(ZeroAssignment assignment) {
        Objects.requireNonNull(assignment, "assignment");
        double[] n = numerator();
        double a = n[0], b = n[1], c = n[2];
        if (a == 0) {
            throw new IllegalArgumentException("this PID (" + this + ") has no s² term (KD = 0 and no derivative filter), so its PIV "
                    + "form would need a zero velocity gain; give it a derivative gain or a derivative filter");
        }
        double disc = b * b - 4 * a * c;
        if (disc < 0) {
            double re = -b / (2 * a), im = Math.sqrt(-disc) / (2 * a);
            throw new IllegalArgumentException("this PID's numerator " + Units.g4(a) + " s^2 + " + Units.g4(b) + " s + " + Units.g4(c)
                    + " has complex roots " + Units.g4(re) + " ± j" + Units.g4(im) + " rad/s (natural frequency "
                    + Checks.hz(Math.sqrt(c / a)) + ", damping " + Units.g4(b / (2 * Math.sqrt(a * c))) + "); a PIV's zeros -Kp and -ωi "
                    + "are real, so no PIV equals it. Raise KP or lower KI·KD until KP² ≥ 4·KI·KD (with τ: (KP + KI·τ)² ≥ 4·KI·(KP·τ + KD))");
        }
        // Stable quadratic roots (Numerical Recipes, 3rd ed., §5.6): q = -(b + sqrt(disc))/2, roots q/a and c/q.
        double q = -0.5 * (b + Math.sqrt(disc));
        double fast = -q / a;             // magnitude of the root q/a (the larger one)
        double slow = c == 0 ? 0 : -c / q; // magnitude of c/q
        double lo = Math.min(fast, slow), hi = Math.max(fast, slow);
        double wi, kpPos;
        if (lo == 0) {
            wi = 0; // KI = 0: no integral action, the remaining zero is the position gain
            kpPos = hi;
        } else if (assignment == ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO) {
            wi = lo;
            kpPos = hi;
        } else {
            wi = hi;
            kpPos = lo;
        }
        Piv piv = Piv.of(kpPos, VelocityPi.ofRadPerS(a, wi));
        Optional<LowPass1> lp = tau > 0 ? Optional.of(LowPass1.ofRadPerS(1.0 / tau)) : Optional.empty();
        return new PidAsPiv(piv, lp);
    }

    @Override public boolean equals(Object o) {
        return o instanceof Pid p && p.kp == kp && p.ki == ki && p.kd == kd && p.tau == tau;
    }

    @Override public int hashCode() { return Objects.hash(kp, ki, kd, tau); }

    /** As {@link #describe(Motion)} for a rotary axis. */
    @Override public String toString() { return describe(Motion.ROTARY); }

    /** The gains per rad, rad·s and rad/s of position error on a rotary axis, per m, m·s and m/s on a linear one. */
    public String describe(Motion motion) {
        String x = motion.positionUnit();
        return "PID: KP = " + Units.g4(kp) + " per " + x + ", KI = " + Units.g4(ki) + " per " + x + "·s, KD = " + Units.g4(kd) + " per " + motion.velocityUnit() + ", "
                + (tau > 0 ? "derivative filter " + Checks.hz(1 / tau) + " (τ = " + Units.g4(tau) + " s)" : "no derivative filter");
    }
}
