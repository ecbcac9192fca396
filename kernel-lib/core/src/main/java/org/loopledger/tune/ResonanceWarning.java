package org.loopledger.tune;

import org.loopledger.lti.Warning;

import java.util.OptionalDouble;

/**
 * Why a found resonance's figures cannot be trusted as printed.
 *
 * @param kind        what is wrong
 * @param frequencyHz where (the peak; always present)
 * @param message     what it means and what to do, in words
 */
public record ResonanceWarning(Kind kind, OptionalDouble frequencyHz, String message) implements Warning {
    public enum Kind {
        /**
         * The half-power width is narrower than the frequency spacing at the peak, or fewer than three points lie
         * above the half-power level: the grid does not resolve the peak, so its height, width and damping are
         * only what the grid happened to sample.
         */
        DAMPING_NOT_RESOLVED
    }

    @Override public String toString() { return kind + ": " + message; }
}
