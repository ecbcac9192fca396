package org.loopledger.tune;

import org.loopledger.lti.Units;

/**
 * The figures a tuner screens a candidate loop gain with: lowest gain crossover, worst phase margin
 * over all gain crossovers, worst upper and lower gain margins over all phase crossovers, the peak of
 * |S| on the grid, and whether the closed loop is stable by the crossing count.
 *
 * @param crossoverRadPerS lowest gain crossover (NaN when |L| never crosses 1 in the band)
 * @param phaseMarginDeg   smallest phase margin over the gain crossovers (+inf when none)
 * @param gainMarginDb     smallest upper gain margin in dB (+inf when no phase crossover has |L| &lt; 1)
 * @param lowerGainMarginDb the gain reduction in dB (negative) that destabilises a conditionally stable loop (-inf when none)
 * @param sensitivityPeak  max |1/(1+L)| on the grid (Ms)
 * @param stable           closed loop stable by the Nyquist crossing count (open-loop poles assumed stable or on the axis)
 */
public record LoopFigures(double crossoverRadPerS, double phaseMarginDeg, double gainMarginDb, double lowerGainMarginDb,
                          double sensitivityPeak, boolean stable) {

    public double crossoverHz() { return Units.radPerSToHz(crossoverRadPerS); }

    @Override public String toString() {
        return "crossover " + Units.formatHz(crossoverHz()) + ", PM " + Units.g4(phaseMarginDeg) + " deg, GM " + Units.g4(gainMarginDb)
                + " dB, Ms " + Units.g4(sensitivityPeak) + (stable ? "" : ", UNSTABLE");
    }
}
