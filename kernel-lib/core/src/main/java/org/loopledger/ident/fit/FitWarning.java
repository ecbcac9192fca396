package org.loopledger.ident.fit;

import org.loopledger.lti.Units;
import org.loopledger.lti.Warning;

import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Why a fit cannot be used as it stands: a structured warning on a {@link FitResult}, which its display shows.
 *
 * @param kind        what the check found
 * @param parameter   the parameter concerned (for {@link Kind#CORRELATED} the first of the pair), if any
 * @param frequencyHz where in frequency, if the finding has a place (a resonance outside the band, a band that fits badly)
 * @param message     what it means and what to do, in words
 */
public record FitWarning(Kind kind, Optional<String> parameter, OptionalDouble frequencyHz, String message) implements Warning {
    public FitWarning {
        if (kind == null || message == null || parameter == null || frequencyHz == null) throw new IllegalArgumentException("a fit warning needs a kind and a message");
    }

    public enum Kind {
        /** A modal frequency (resonance, antiresonance) outside the band the data cover: the data cannot have seen it. */
        OUTSIDE_BAND,
        /** A value no axis can have: damping ζ ≥ 1 of a "resonance", an antiresonance above its resonance, a negative delay. */
        OUTSIDE_PHYSICAL_RANGE,
        /** The Jacobian at the optimum is (near) singular: the covariance and so every interval mean nothing (zero or enormous widths). */
        ILL_CONDITIONED,
        /** The 95 % interval of a parameter is so wide that the data do not determine it. */
        NOT_DETERMINED,
        /** Two parameters with |ρ| &gt; 0.99: the data fix a combination, not each one. */
        CORRELATED,
        /** Refitted on sub-bands, a parameter moves far beyond its intervals: the data cannot pin it down, and its interval understates the uncertainty. */
        BAND_DEPENDENT,
        /** The model misses the data by far more than a usable fit does. */
        POOR_FIT
    }

    static FitWarning of(Kind kind, String parameter, double frequencyHz, String message) {
        return new FitWarning(kind, Optional.ofNullable(parameter), Double.isNaN(frequencyHz) ? OptionalDouble.empty() : OptionalDouble.of(frequencyHz), message);
    }

    @Override public String toString() {
        return kind + parameter.map(p -> " (" + p + ")").orElse("") + (frequencyHz.isPresent() ? " at " + Units.formatHz(frequencyHz.getAsDouble()) : "")
                + ": " + message;
    }
}
