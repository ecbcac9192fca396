package org.loopledger.control;

import org.loopledger.lti.Warning;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * What a PID to PIV conversion had to choose ({@link PidAsPiv#warnings()}): read it before typing the gains into a drive.
 *
 * @param kind    what the conversion found
 * @param message the other choice and what it would give, in words
 */
public record PidWarning(Kind kind, String message) implements Warning {
    public PidWarning {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(message, "message");
    }

    public enum Kind {
        /** The PID's two real zeros are interchangeable: the other assignment gives another K<sub>p</sub> and integral corner. */
        ZEROS_INTERCHANGEABLE,
        /** Neither zero lies within a factor of 2 of the expected K<sub>p</sub>: check the PID's units. */
        FAR_FROM_EXPECTED_POSITION_GAIN
    }

    /** No single frequency: the message names both zeros. */
    @Override public OptionalDouble frequencyHz() { return OptionalDouble.empty(); }

    /** The message alone. */
    @Override public String toString() { return message; }
}
