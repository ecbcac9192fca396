package org.loopledger.analysis;

import org.loopledger.lti.Units;

/**
 * The peak of a closed-loop magnitude (|S| or |T|) and where it occurs.
 *
 * @param magnitude    peak value (ratio)
 * @param omegaRadPerS frequency of the peak in rad/s
 * @param atBandEdge   true when the peak sits at an end of the analysed band (the true peak may lie outside)
 */
public record Peak(double magnitude, double omegaRadPerS, boolean atBandEdge) {

    public double magnitudeDb() { return Units.ratioToDb(magnitude); }

    public double frequencyHz() { return omegaRadPerS / (2 * Math.PI); }

    @Override public String toString() {
        return Units.g4(magnitude) + " (" + Units.formatDb(magnitudeDb()) + ") at " + Units.formatRadPerSAsHz(omegaRadPerS) + (atBandEdge ? " (band edge)" : "");
    }
}
