package org.loopledger.control;

import org.loopledger.frf.Frf;

import java.util.Objects;

/** The loop gains and closed loops of a cascade at its break points (see {@link CascadeLoops} for the definitions). */
public record LoopGains(Frf plantInput, Frf velocityLoop, Frf positionLoop, Frf velocityClosedLoop, Frf positionClosedLoop) {
    public LoopGains {
        Objects.requireNonNull(plantInput, "plantInput");
        Objects.requireNonNull(velocityLoop, "velocityLoop");
        Objects.requireNonNull(positionLoop, "positionLoop");
        Objects.requireNonNull(velocityClosedLoop, "velocityClosedLoop");
        Objects.requireNonNull(positionClosedLoop, "positionClosedLoop");
    }
}
