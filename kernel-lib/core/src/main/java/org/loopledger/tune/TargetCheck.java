package org.loopledger.tune;

import org.loopledger.lti.Units;

import java.util.Locale;

/**
 * A bandwidth target the user stated in the {@link TuningSpec}, checked on the independent re-analysis
 * of the chosen loops (never on the tuner's screen): what was asked, what the worst load case achieved,
 * and whether that meets it.
 *
 * @param kind       which target and how it is compared
 * @param askedHz    the frequency the user asked for
 * @param achievedHz the worst case over the load cases (lowest crossover), NaN when a loop has no gain crossover in the band
 * @param loadCase   the load case that gives {@code achievedHz}
 */
public record TargetCheck(Kind kind, double askedHz, double achievedHz, String loadCase) {
    /**
     * Relative tolerance of a comparison: the screen interpolates linearly between grid points and the
     * re-analysis refines, so an exact hit on the screen lands within a fraction of a per cent.
     */
    public static final double TOLERANCE = 0.01;

    /** The targets a {@link TuningSpec} can state. */
    public enum Kind {
        /** Position-loop gain crossover (K<sub>p</sub> ≈ ω) at least the asked bandwidth. */
        POSITION_BANDWIDTH("position bandwidth"),
        /** Velocity-loop crossover at the asked frequency (within the tolerance, both ways). */
        VELOCITY_CROSSOVER("velocity crossover"),
        /** Velocity-loop crossover at most the asked ceiling. */
        VELOCITY_CROSSOVER_CEILING("velocity crossover ceiling");

        private final String label;

        Kind(String label) { this.label = label; }

        public String label() { return label; }
    }

    /** Whether the achieved figure meets the target (a missing crossover never does). */
    public boolean met() {
        if (Double.isNaN(achievedHz)) return false;
        return switch (kind) {
            case POSITION_BANDWIDTH -> achievedHz >= askedHz * (1 - TOLERANCE);
            case VELOCITY_CROSSOVER -> Math.abs(achievedHz / askedHz - 1) <= TOLERANCE;
            case VELOCITY_CROSSOVER_CEILING -> achievedHz <= askedHz * (1 + TOLERANCE);
        };
    }

    /** The achieved figure against the asked one, and by how much it misses: "position bandwidth 3.002 Hz of the 20 Hz asked (85 % short)". */
    public String describe() {
        String where = loadCase == null || loadCase.isEmpty() ? "" : ", worst case " + loadCase;
        if (Double.isNaN(achievedHz)) {
            return kind.label() + ": no crossover in the measured band (" + Units.formatHz(askedHz) + " asked" + where + ")";
        }
        String achieved = Units.formatHz(achievedHz), asked = Units.formatHz(askedHz);
        if (met()) {
            return kind == Kind.VELOCITY_CROSSOVER_CEILING ? "velocity crossover " + achieved + " (ceiling " + asked + where + ")"
                    : kind.label() + " " + achieved + " (" + asked + " asked" + where + ")";
        }
        double pct = 100 * Math.abs(achievedHz / askedHz - 1);
        String by = String.format(Locale.ROOT, "%.3g %%", pct);
        return switch (kind) {
            case POSITION_BANDWIDTH -> kind.label() + " " + achieved + " of the " + asked + " asked (" + by + " short" + where + ")";
            case VELOCITY_CROSSOVER -> kind.label() + " " + achieved + " where " + asked + " was asked (" + by + (achievedHz < askedHz ? " low" : " high") + where + ")";
            case VELOCITY_CROSSOVER_CEILING -> "velocity crossover " + achieved + " above the " + asked + " ceiling (" + by + " over" + where + ")";
        };
    }

    @Override public String toString() { return (met() ? "met: " : "MISSED: ") + describe(); }
}
