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
 */
public record Antiresonance(double frequencyHz, double depthDb, double halfPowerWidthHz, double dampingEstimate) {
    @Override public String toString() {
        return "antiresonance at " + Units.formatHz(frequencyHz) + ": " + Units.g4(depthDb) + " dB below the rigid-body trend, half-power width "
                + Units.formatHz(halfPowerWidthHz) + ", damping ≈ " + Units.g4(dampingEstimate);
    }
}
