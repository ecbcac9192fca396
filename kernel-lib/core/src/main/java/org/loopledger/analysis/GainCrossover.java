package org.loopledger.analysis;

import org.loopledger.lti.Units;
import java.util.OptionalDouble;

/**
 * One gain crossover, |L(jω)| = 1.
 *
 * @param omegaRadPerS       crossover frequency in rad/s
 * @param phaseDeg           phase of L there, canonical unwrapped branch, degrees
 * @param phaseMarginDeg     phase margin = phase + 180°, degrees, on the canonical branch: negative when the phase is
 *                           below -180°, and above 180° where the loop phase leads (between an antiresonance and its
 *                           resonance, say): then it is the lag that would bring this crossing onto -1
 * @param distanceToMinusOne |1 + L(jω)| at the crossover
 * @param delayMarginS       extra delay that brings this crossover onto -1: PM (rad, reduced modulo 2π) / ω, 0 when PM &le; 0
 * @param delayMarginSamples the same in samples of a sampled loop; empty for continuous loops
 */
public record GainCrossover(double omegaRadPerS, double phaseDeg, double phaseMarginDeg, double distanceToMinusOne,
                            double delayMarginS, OptionalDouble delayMarginSamples) {

    public double frequencyHz() { return omegaRadPerS / (2 * Math.PI); }

    @Override public String toString() {
        return "gain crossover at " + Units.formatRadPerSAsHz(omegaRadPerS) + ": phase " + Units.formatDeg(phaseDeg) + ", phase margin " + Units.formatDeg(phaseMarginDeg)
                + ", delay margin " + Units.formatSeconds(delayMarginS)
                + (delayMarginSamples.isPresent() ? " (" + Units.g4(delayMarginSamples.getAsDouble()) + " samples)" : "")
                + ", |1+L| = " + Units.g4(distanceToMinusOne);
    }
}
