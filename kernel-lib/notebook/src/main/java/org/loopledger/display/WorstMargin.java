package org.loopledger.display;

import java.util.OptionalDouble;

/**
 * The worst value of one stability figure over the rows of a {@link MarginsTable}: where it occurs, the
 * spec's limit if one was given, and the verdict in words. A verdict says "meets" only when the limit was
 * checked on every row; a miss says by how much ("missed by 3.2 deg").
 *
 * @param figure      "phase margin", "gain margin" or "Ms"
 * @param value       the worst value (NaN when no row has the figure)
 * @param unit        "deg", "dB" or "" (Ms is a ratio)
 * @param loadCase    load case of the worst row ("" when none)
 * @param loop        loop of the worst row ("" when none)
 * @param frequencyHz where the worst value occurs, in Hz (NaN when none)
 * @param limit       the spec's limit in the same unit, if given
 * @param verdict     the verdict or a note in words, never "met" unless checked
 * @param missed      true when the limit was checked and the worst value misses it
 */
public record WorstMargin(String figure, double value, String unit, String loadCase, String loop, double frequencyHz, OptionalDouble limit,
                          String verdict, boolean missed) {
    /** The worst value with its unit, "none in band" when no row has one. */
    public String valueText() {
        if (Double.isNaN(value)) return "none in band";
        return switch (unit) {
            case "deg" -> org.loopledger.lti.Units.formatDeg(value);
            case "dB" -> org.loopledger.lti.Units.formatDb(value);
            default -> Figures.num(value);
        };
    }

    /** "heavy head / plant input at 212.3 Hz", or "" when there is no worst row. */
    public String where() {
        if (loadCase.isEmpty() && loop.isEmpty()) return "";
        String at = Double.isNaN(frequencyHz) ? "" : " at " + org.loopledger.lti.Units.formatHz(frequencyHz);
        return (loadCase.isEmpty() ? loop : loop.isEmpty() ? loadCase : loadCase + " / " + loop) + at;
    }

    /** One line for the plain-text form. */
    @Override public String toString() {
        String w = where();
        return "worst " + figure + ": " + valueText() + (w.isEmpty() ? "" : " (" + w + ")") + (verdict.isEmpty() ? "" : "; " + verdict);
    }
}
