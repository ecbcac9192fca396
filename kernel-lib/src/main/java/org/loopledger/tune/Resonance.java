package org.loopledger.tune;

import org.loopledger.lti.Units;

/**
 * A lightly damped resonance found in a measured plant response.
 *
 * @param frequencyHz     frequency of the peak
 * @param prominenceDb    height of the peak above the rigid-body trend (|P|·ω<sup>n</sup> flattened, n net integrators), dB
 * @param halfPowerWidthHz width of the peak 3 dB below its top
 * @param dampingEstimate ζ ≈ width / (2·f) from the half-power bandwidth (common practice)
 */
public record Resonance(double frequencyHz, double prominenceDb, double halfPowerWidthHz, double dampingEstimate) {
    @Override public String toString() {
        return "resonance at " + Units.formatHz(frequencyHz) + ": " + Units.g4(prominenceDb) + " dB above the rigid-body trend, half-power width "
                + Units.formatHz(halfPowerWidthHz) + ", damping ≈ " + Units.g4(dampingEstimate);
    }
}
