package org.loopledger.tune;

import org.loopledger.frf.Frf;

import java.util.Objects;

/**
 * One load case for the tuner: a label for the record and the plant from current (or torque) command
 * to velocity in rad/s, as measured.
 */
public record PlantCase(String label, Frf plantToVelocity) {
    public PlantCase {
        Objects.requireNonNull(plantToVelocity, "plant FRF");
        if (label == null || label.isBlank()) throw new IllegalArgumentException("give each load case a label (e.g. \"heavy head\")");
        if (plantToVelocity.size() < 8) throw new IllegalArgumentException("load case '" + label + "' has only " + plantToVelocity.size()
                + " FRF points; a tuner needs the response over the band around the crossover (at least 8 points, typically hundreds)");
    }

    public static PlantCase of(String label, Frf plantToVelocity) { return new PlantCase(label, plantToVelocity); }
}
