package org.loopledger.tune;

import org.loopledger.frf.Frf;
import org.loopledger.lti.Motion;

import java.util.Objects;

/**
 * One load case for the tuner: a label for the record and the plant from current (or torque or force)
 * command to velocity, as measured: in rad/s on a {@link Motion#ROTARY} axis, in m/s on a
 * {@link Motion#LINEAR} one (the motion decides the units the tuning result is shown in).
 */
public record PlantCase(String label, Frf plantToVelocity, Motion motion) {
    public PlantCase {
        Objects.requireNonNull(plantToVelocity, "plant FRF");
        if (label == null || label.isBlank()) throw new IllegalArgumentException("give each load case a label (e.g. \"heavy head\")");
        if (motion == null) throw new IllegalArgumentException("load case '" + label + "': say whether the axis is Motion.ROTARY or Motion.LINEAR");
        if (plantToVelocity.size() < 8) throw new IllegalArgumentException("load case '" + label + "' has only " + plantToVelocity.size()
                + " FRF points; a tuner needs the response over the band around the crossover (at least 8 points, typically hundreds)");
    }

    /** A rotary axis (velocity in rad/s). */
    public PlantCase(String label, Frf plantToVelocity) { this(label, plantToVelocity, Motion.ROTARY); }

    /** A rotary axis (velocity in rad/s). */
    public static PlantCase of(String label, Frf plantToVelocity) { return new PlantCase(label, plantToVelocity); }

    /** A rotary or linear axis (velocity in rad/s or m/s). */
    public static PlantCase of(String label, Frf plantToVelocity, Motion motion) { return new PlantCase(label, plantToVelocity, motion); }

    /** A linear axis: the plant to velocity in m/s. */
    public static PlantCase linear(String label, Frf plantToVelocityMPerS) { return new PlantCase(label, plantToVelocityMPerS, Motion.LINEAR); }
}
