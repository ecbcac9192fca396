package org.loopledger.analysis;

import org.loopledger.lti.Units;
import org.loopledger.lti.Warning;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Why a figure of a loop analysis ({@link Margins}, {@link ClosedLoopStability}, {@link SpecReport}) needs care: a
 * structured warning with its kind, the frequency it concerns (Hz, when it has one) and the message in words.
 *
 * @param kind        what the analysis found
 * @param frequencyHz where, when the finding has a place (a band edge, the frequency of a peak)
 * @param message     what it means and what to do, in words
 */
public record LoopWarning(Kind kind, OptionalDouble frequencyHz, String message) implements Warning {
    public LoopWarning {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(frequencyHz, "frequencyHz");
        Objects.requireNonNull(message, "message");
    }

    public enum Kind {
        /** Phase crossovers where |L| &lt; 1e-12 were left out: no gain change reaches them, their phase is rounding. */
        NEGLIGIBLE_CROSSOVERS_LEFT_OUT,
        /** |L| = 1 at every frequency (all-pass loop): gain crossovers are not isolated points. */
        GAIN_NOT_ISOLATED,
        /** L is real over whole frequency intervals: phase crossovers are not isolated points. */
        PHASE_NOT_ISOLATED,
        /** A continuous delay adds phase crossovers without end; the list stops at the given frequency. */
        CROSSOVERS_TRUNCATED,
        /** Open-loop poles on the stability boundary besides integrators: |L| is infinite there. */
        POLES_ON_BOUNDARY,
        /** The open loop is unstable: margins alone do not decide closed-loop stability. */
        OPEN_LOOP_UNSTABLE,
        /** |L| &gt; 1 at the top of the measured band: a gain crossover lies above it. */
        CROSSOVER_ABOVE_BAND,
        /** |L| &lt; 1 at the bottom of the measured band: a gain crossover may lie below it. */
        CROSSOVER_BELOW_BAND,
        /** No gain crossover in the measured band. */
        NO_GAIN_CROSSOVER_IN_BAND,
        /** No phase crossover in the measured band: the gain margin may be set above it. */
        NO_PHASE_CROSSOVER_IN_BAND,
        /** Crossings closer than 5 % in frequency: likely measurement noise near |L| = 1 or -180 deg. */
        CLUSTERED_CROSSINGS,
        /** The peak of |S| sits at a band edge: the true Ms may lie outside the band. */
        PEAK_AT_BAND_EDGE,
        /** Net integrators estimated from the low-frequency slope, not stated. */
        INTEGRATORS_ESTIMATED,
        /** Closed-loop poles on the stability boundary: marginally stable at best. */
        MARGINALLY_STABLE,
        /** The Nyquist count and the closed-loop pole count disagree. */
        COUNTS_DISAGREE,
        /** A delay makes the closed-loop poles infinitely many: stability decided by the Nyquist criterion on a grid. */
        DECIDED_ON_GRID,
        /** The Nyquist curve at an end of the grid is far from its limit: the count assumes nothing happens beyond. */
        NYQUIST_END_UNCERTAIN,
        /** The winding number is not an integer, or L passes -1 closer than the grid resolves. */
        NYQUIST_GRID_TOO_COARSE,
        /** Z = P + N is negative: the stated open-loop unstable poles cannot be right, or the band misses part of the curve. */
        IMPOSSIBLE_COUNT
    }

    static LoopWarning of(Kind kind, String message) { return new LoopWarning(kind, OptionalDouble.empty(), message); }

    static LoopWarning atRadPerS(Kind kind, double omegaRadPerS, String message) {
        return new LoopWarning(kind, OptionalDouble.of(Units.radPerSToHz(omegaRadPerS)), message);
    }

    /** The same warning with {@code context} before its message ("velocity loop: ..."), for combined reports. */
    public LoopWarning in(String context) { return new LoopWarning(kind, frequencyHz, context + ": " + message); }

    /** The message alone (the form reports print). */
    @Override public String toString() { return message; }
}
