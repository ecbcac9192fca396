package org.loopledger.analysis;

import org.loopledger.lti.Units;

/**
 * One phase crossover, phase of L = -180° + k·360° (L real and negative).
 *
 * @param omegaRadPerS       frequency in rad/s (0 for the DC point of a loop without integrators whose
 *                           gain is negative there; π/T for the Nyquist point of a sampled loop)
 * @param magnitude          |L| there
 * @param phaseDeg           phase of L, canonical unwrapped branch, degrees
 * @param gainMarginRatio    1/|L|: the gain factor that moves this crossing onto -1 (above 1: an increase,
 *                           below 1: a decrease)
 * @param distanceToMinusOne |1 + L| there
 */
public record PhaseCrossover(double omegaRadPerS, double magnitude, double phaseDeg, double gainMarginRatio, double distanceToMinusOne) {

    public double frequencyHz() { return omegaRadPerS / (2 * Math.PI); }

    /** Gain margin in dB, 20·log10(1/|L|): positive for an increase, negative for a decrease. */
    public double gainMarginDb() { return Units.ratioToDb(gainMarginRatio); }

    /** True when this crossing limits a gain increase (|L| &lt; 1). */
    public boolean limitsIncrease() { return gainMarginRatio > 1; }

    @Override public String toString() {
        return "phase crossover at " + Units.formatRadPerSAsHz(omegaRadPerS) + ": |L| = " + Units.g4(magnitude) + ", phase " + Units.formatDeg(phaseDeg)
                + ", gain margin " + Units.formatDb(gainMarginDb()) + " (x" + Units.g4(gainMarginRatio) + ")"
                + ", |1+L| = " + Units.g4(distanceToMinusOne);
    }
}
