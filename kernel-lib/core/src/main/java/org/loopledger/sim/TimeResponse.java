package org.loopledger.sim;

import org.loopledger.lti.Motion;
import org.loopledger.lti.Units;

import java.util.Arrays;
import java.util.Objects;

/**
 * A simulated response at the drive's sample instants t<sub>k</sub> = kT. Arrays (copied in and out), all the same length:
 * <ul>
 *   <li>{@code timeS}: t<sub>k</sub> in s;</li>
 *   <li>{@code reference}: position reference in rad (velocity command in rad/s for {@link Excitation#VELOCITY_STEP}; 0 for a disturbance);</li>
 *   <li>{@code positionRad}, {@code velocityRadPerS}: the plant's outputs sampled at t<sub>k</sub>;</li>
 *   <li>{@code current}: the clamped current command the controller computed at t<sub>k</sub> (plant-input units, e.g. A; it
 *       reaches the plant after the computation delay);</li>
 *   <li>{@code followingError}: reference - position (reference - velocity for a velocity step).</li>
 * </ul>
 * On a {@link Motion#LINEAR} axis ({@code motion}) positions are in m and velocities in m/s instead of rad and rad/s.
 */
public record TimeResponse(Excitation excitation, double amplitude, double sampleRateHz, double[] timeS, double[] reference,
                           double[] positionRad, double[] velocityRadPerS, double[] current, double[] followingError, Motion motion) {
    /** A rotary axis. */
    public TimeResponse(Excitation excitation, double amplitude, double sampleRateHz, double[] timeS, double[] reference,
                        double[] positionRad, double[] velocityRadPerS, double[] current, double[] followingError) {
        this(excitation, amplitude, sampleRateHz, timeS, reference, positionRad, velocityRadPerS, current, followingError, Motion.ROTARY);
    }

    public TimeResponse {
        Objects.requireNonNull(excitation, "excitation");
        Objects.requireNonNull(motion, "motion (Motion.ROTARY or Motion.LINEAR)");
        int n = timeS.length;
        for (double[] a : new double[][] {reference, positionRad, velocityRadPerS, current, followingError}) {
            if (a.length != n) throw new IllegalArgumentException("time response arrays differ in length: " + a.length + " vs " + n);
        }
        timeS = timeS.clone();
        reference = reference.clone();
        positionRad = positionRad.clone();
        velocityRadPerS = velocityRadPerS.clone();
        current = current.clone();
        followingError = followingError.clone();
    }

    @Override public double[] timeS() { return timeS.clone(); }

    @Override public double[] reference() { return reference.clone(); }

    @Override public double[] positionRad() { return positionRad.clone(); }

    @Override public double[] velocityRadPerS() { return velocityRadPerS.clone(); }

    @Override public double[] current() { return current.clone(); }

    @Override public double[] followingError() { return followingError.clone(); }

    public int size() { return timeS.length; }

    public double durationS() { return timeS[timeS.length - 1]; }

    /** Rise time, overshoot, settling time, following error (see {@link ResponseMetrics} for the definitions). */
    public ResponseMetrics metrics() { return ResponseMetrics.of(this); }

    @Override public boolean equals(Object o) {
        return o instanceof TimeResponse t && t.excitation == excitation && t.motion == motion && t.amplitude == amplitude && t.sampleRateHz == sampleRateHz
                && Arrays.equals(t.timeS, timeS) && Arrays.equals(t.reference, reference) && Arrays.equals(t.positionRad, positionRad)
                && Arrays.equals(t.velocityRadPerS, velocityRadPerS) && Arrays.equals(t.current, current) && Arrays.equals(t.followingError, followingError);
    }

    @Override public int hashCode() {
        return Objects.hash(excitation, amplitude, sampleRateHz, Arrays.hashCode(positionRad), Arrays.hashCode(velocityRadPerS), Arrays.hashCode(current));
    }

    @Override public String toString() {
        String unit = switch (excitation) {
            case POSITION_STEP -> motion.positionUnit();
            case POSITION_RAMP, VELOCITY_STEP -> motion.velocityUnit();
            case TORQUE_DISTURBANCE_STEP -> "(plant-input units)";
        };
        return excitation.label(motion) + " of " + Units.g4(amplitude) + " " + unit + ": " + timeS.length + " samples over " + Units.g4(durationS())
                + " s at " + Units.formatHz(sampleRateHz) + "; " + metrics();
    }
}
