package org.loopledger.tune;

import org.loopledger.lti.Units;

import java.util.List;

/**
 * A lightly damped resonance found in a measured plant response.
 *
 * @param frequencyHz     frequency of the peak
 * @param prominenceDb    height of the peak above the rigid-body trend (|P|·ω<sup>n</sup> flattened, n net integrators), dB
 * @param halfPowerWidthHz width of the peak 3 dB below its top
 * @param dampingEstimate ζ ≈ width / (2·f) from the half-power bandwidth (common practice)
 * @param warnings        why the figures cannot be trusted as printed (empty when the peak is resolved)
 */
public record Resonance(double frequencyHz, double prominenceDb, double halfPowerWidthHz, double dampingEstimate, List<ResonanceWarning> warnings) {
    public Resonance {
        warnings = List.copyOf(warnings);
    }

    /** Frequency of the peak in Hz. */
    @Override public double frequencyHz() { return frequencyHz; }

    /** Height of the peak above the rigid-body trend in dB (|P|·ω<sup>n</sup> flattened, n net integrators). */
    @Override public double prominenceDb() { return prominenceDb; }

    /** Width of the peak 3 dB below its top, in Hz; see {@link #dampingResolved()} before trusting it. */
    @Override public double halfPowerWidthHz() { return halfPowerWidthHz; }

    /** ζ ≈ width / (2·f) from the half-power bandwidth (common practice); see {@link #dampingResolved()}. */
    @Override public double dampingEstimate() { return dampingEstimate; }

    /** A resonance without warnings. */
    public Resonance(double frequencyHz, double prominenceDb, double halfPowerWidthHz, double dampingEstimate) {
        this(frequencyHz, prominenceDb, halfPowerWidthHz, dampingEstimate, List.of());
    }

    /** Whether the frequency grid resolves the peak, so that the width and damping mean what they say. */
    public boolean dampingResolved() {
        return warnings.stream().noneMatch(w -> w.kind() == ResonanceWarning.Kind.DAMPING_NOT_RESOLVED);
    }

    @Override public String toString() {
        StringBuilder sb = new StringBuilder("resonance at " + Units.formatHz(frequencyHz) + ": " + Units.g4(prominenceDb)
                + " dB above the rigid-body trend, half-power width " + Units.formatHz(halfPowerWidthHz) + ", damping ≈ " + Units.g4(dampingEstimate));
        for (ResonanceWarning w : warnings) sb.append("\n  warning: ").append(w.message());
        return sb.toString();
    }
}
