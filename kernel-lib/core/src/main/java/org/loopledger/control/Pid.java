package org.loopledger.control;

import org.loopledger.lti.Motion;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
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
     * {@code assignment}), K<sub>v</sub> = a, and a derivative filter becomes a first-order low-pass at 1/τ. The zeros
     * are interchangeable, so the result warns with the other assignment; when the drive's K<sub>p</sub> is roughly
     * known, {@link #toPivNearestPositionGain} picks the right one.
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
                    + Units.formatRadPerSAsHz(Math.sqrt(c / a)) + ", damping " + Units.g4(b / (2 * Math.sqrt(a * c))) + "); a PIV's zeros -Kp and -ωi "
                    + "are real, so no PIV equals it. Raise KP or lower KI·KD until KP² ≥ 4·KI·KD (with τ: (KP + KI·τ)² ≥ 4·KI·(KP·τ + KD))");
        }
        double[] z = zeros(a, b, c);
        double lo = z[0], hi = z[1];
        if (lo == 0) return build(a, hi, 0, List.of()); // KI = 0: no integral action, the remaining zero is the position gain
        boolean cornerLow = assignment == ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO;
        double kpPos = cornerLow ? hi : lo, wi = cornerLow ? lo : hi;
        return build(a, kpPos, wi, swapWarning(a, kpPos, wi, "the stated assignment " + assignment));
    }

    /**
     * The PIV form whose position gain K<sub>p</sub> is the zero nearest {@code expectedPositionGainPerS} (nearest in
     * ratio, |ln(zero/expected)|), for instance the drive's current K<sub>p</sub>. The two zeros of N(s) are
     * interchangeable in the single-loop transfer function, so a plain {@link #toPiv(ZeroAssignment)} with a fixed
     * rule would swap K<sub>p</sub> and ω<sub>i</sub> whenever the drive's corner lies on the other side of its
     * position gain. The result warns with the other assignment, and when neither zero lies within a factor of 2 of
     * the expectation.
     */
    public PidAsPiv toPivNearestPositionGain(double expectedPositionGainPerS) {
        Checks.positive(expectedPositionGainPerS, "expected position gain Kp", "1/s");
        double[] n = numerator();
        double a = n[0], b = n[1], c = n[2];
        if (a == 0 || b * b - 4 * a * c < 0) return toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO); // same errors, same words
        double[] z = zeros(a, b, c);
        double lo = z[0], hi = z[1];
        if (lo == 0) return build(a, hi, 0, List.of());
        double e = expectedPositionGainPerS;
        boolean loIsKp = Math.abs(Math.log(lo / e)) <= Math.abs(Math.log(hi / e));
        double kpPos = loIsKp ? lo : hi, wi = loIsKp ? hi : lo;
        List<PidWarning> w = new ArrayList<>(swapWarning(a, kpPos, wi, "the zero nearest the expected Kp = " + Units.g4(e) + " 1/s"));
        if (Math.abs(Math.log(kpPos / e)) > Math.log(2)) {
            w.add(new PidWarning(PidWarning.Kind.FAR_FROM_EXPECTED_POSITION_GAIN, "neither zero (" + Units.g4(lo) + " and " + Units.g4(hi) + " rad/s) lies within a factor of 2 of the expected Kp = "
                    + Units.g4(e) + " 1/s: check the PID's units (per rad, per s) before using this PIV"));
        }
        return build(a, kpPos, wi, w);
    }

    /**
     * Magnitudes of the two real roots of a s² + b s + c, ascending (0 first when c = 0). Stable quadratic roots
     * (Numerical Recipes, 3rd ed., §5.6): q = -(b + sqrt(disc))/2, roots q/a and c/q.
     */
    private static double[] zeros(double a, double b, double c) {
        double q = -0.5 * (b + Math.sqrt(Math.max(0, b * b - 4 * a * c)));
        double fast = -q / a;
        double slow = c == 0 ? 0 : -c / q;
        return new double[] {Math.min(fast, slow), Math.max(fast, slow)};
    }

    private PidAsPiv build(double kv, double kpPos, double wi, List<PidWarning> warnings) {
        Piv piv = Piv.of(kpPos, VelocityPi.ofRadPerS(kv, wi));
        Optional<LowPass1> lp = tau > 0 ? Optional.of(LowPass1.ofRadPerS(1.0 / tau)) : Optional.empty();
        return new PidAsPiv(piv, lp, warnings);
    }

    /** The other assignment, spelled out, unless the zeros coincide (then both assignments are the same PIV). */
    private static List<PidWarning> swapWarning(double kv, double kpPos, double wi, String rule) {
        if (Math.abs(kpPos - wi) <= 1e-12 * Math.max(kpPos, wi)) return List.of();
        return List.of(new PidWarning(PidWarning.Kind.ZEROS_INTERCHANGEABLE, "the PID's zeros " + Units.g4(Math.min(kpPos, wi)) + " and " + Units.g4(Math.max(kpPos, wi))
                + " rad/s are interchangeable; " + rule + " gives Kp = " + Units.g4(kpPos) + " 1/s, integral corner "
                + Units.formatRadPerSAsHz(wi) + "; the other gives Kp = " + Units.g4(wi) + " 1/s, integral corner " + Units.formatRadPerSAsHz(kpPos)
                + " (same single-loop transfer function, different reference response): pick the one that matches the drive"));
    }

    /**
     * Whether every gain and the filter time constant agree with {@code other} within {@code relativeTolerance}
     * (relative to the larger of each pair, so two zeros are close).
     * For round trips PID → PIV → PID, where {@link #equals} fails on rounding (1e-16).
     */
    public boolean isCloseTo(Pid other, double relativeTolerance) {
        Objects.requireNonNull(other, "other");
        if (!(relativeTolerance >= 0)) throw new IllegalArgumentException("relative tolerance must be non-negative, got " + relativeTolerance);
        return close(kp, other.kp, relativeTolerance) && close(ki, other.ki, relativeTolerance) && close(kd, other.kd, relativeTolerance)
                && close(tau, other.tau, relativeTolerance);
    }

    static boolean close(double x, double y, double rel) {
        return Math.abs(x - y) <= rel * Math.max(Math.abs(x), Math.abs(y));
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
                + (tau > 0 ? "derivative filter " + Units.formatRadPerSAsHz(1 / tau) + " (τ = " + Units.g4(tau) + " s)" : "no derivative filter");
    }
}
