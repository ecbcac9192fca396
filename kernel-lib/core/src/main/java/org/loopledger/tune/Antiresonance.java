package org.loopledger.tune;

import org.loopledger.lti.Units;

/**
 * A lightly damped antiresonance (a dip, the zero pair of a two-mass axis seen from the motor) found in a
 * measured plant response.
 *
 * @param frequencyHz      frequency of the dip
 * @param depthDb          depth of the dip below the rigid-body trend (|P|·ω<sup>n</sup> flattened), dB, positive
 * @param halfPowerWidthHz width of the dip 3 dB above its bottom
 * @param dampingEstimate  ζ ≈ width / (2·f) (half-power bandwidth, common practice)
 * @param warnings         why the figures cannot be trusted as printed (empty when the dip is resolved)
 */
public record Antiresonance(double frequencyHz, double depthDb, double halfPowerWidthHz, double dampingEstimate, java.util.List<ResonanceWarning> warnings) {
    public Antiresonance {
        warnings = java.util.List.copyOf(warnings);
    }

    /** An antiresonance without warnings. */
    public Antiresonance(double frequencyHz, double depthDb, double halfPowerWidthHz, double dampingEstimate) {
        this(frequencyHz, depthDb, halfPowerWidthHz, dampingEstimate, java.util.List.of());
    }

    /** Whether the frequency grid resolves the dip, so that the width and damping mean what they say. */
    public boolean dampingResolved() {
        return warnings.stream().noneMatch(w -> w.kind() == ResonanceWarning.Kind.DAMPING_NOT_RESOLVED);
    }

    @Override public String toString() {
        StringBuilder sb = new StringBuilder("antiresonance at " + Units.formatHz(frequencyHz) + ": " + Units.g4(depthDb)
                + " dB below the rigid-body trend, half-power width " + Units.formatHz(halfPowerWidthHz) + ", damping ≈ " + Units.g4(dampingEstimate));
        for (ResonanceWarning w : warnings) sb.append("\n  warning: ").append(w.message());
        return sb.toString();
    }
}
