package org.loopledger.analysis;

import org.loopledger.lti.Units;
import java.util.OptionalDouble;

/**
 * Closed-loop -3 dB bandwidth: the first frequency where |T| falls below its low-frequency value
 * divided by √2.
 *
 * @param omegaRadPerS        the bandwidth in rad/s, empty when not reached in the analysed band
 * @param referenceMagnitude  the low-frequency |T| used (1 for loops with integrators)
 * @param note                why it is empty, or how the reference was taken (never null, may be empty)
 */
public record Bandwidth(OptionalDouble omegaRadPerS, double referenceMagnitude, String note) {

    public OptionalDouble frequencyHz() {
        return omegaRadPerS.isPresent() ? OptionalDouble.of(omegaRadPerS.getAsDouble() / (2 * Math.PI)) : OptionalDouble.empty();
    }

    public boolean isPresent() { return omegaRadPerS.isPresent(); }

    @Override public String toString() {
        String s = omegaRadPerS.isPresent() ? Units.formatRadPerSAsHz(omegaRadPerS.getAsDouble()) : "none in band";
        return s + (note.isEmpty() ? "" : " (" + note + ")");
    }
}
