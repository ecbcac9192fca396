package org.loopledger.tune;

import org.loopledger.analysis.Margins;
import org.loopledger.lti.Units;

/**
 * The achieved figures of a tuning on one load case, from an independent re-analysis of each loop
 * with {@link Margins}: the velocity loop (inner), the loop broken at the plant input (where torque
 * disturbances enter; its Ms is the robustness figure usually quoted) and the position loop (outer).
 */
public record LoadCaseFigures(String label, Margins velocityLoop, Margins plantInput, Margins positionLoop) {

    /** Lowest velocity-loop gain crossover in Hz (NaN when none in band). */
    public double velocityCrossoverHz() { return firstCrossoverHz(velocityLoop); }

    /** Lowest position-loop gain crossover in Hz (NaN when none in band). */
    public double positionCrossoverHz() { return firstCrossoverHz(positionLoop); }

    private static double firstCrossoverHz(Margins m) {
        return m.gainCrossovers().isEmpty() ? Double.NaN : Units.radPerSToHz(m.gainCrossovers().get(0).omegaRadPerS());
    }

    static String pm(Margins m) {
        return m.phaseMarginDeg().isPresent() ? Units.g4(m.phaseMarginDeg().getAsDouble()) + " deg" : "none in band";
    }

    static String gm(Margins m) {
        return m.gainMarginDb().isPresent() ? Units.g4(m.gainMarginDb().getAsDouble()) + " dB" : "none in band";
    }

    @Override public String toString() {
        return String.format(java.util.Locale.ROOT, "%-18s velocity: crossover %s, PM %s, GM %s, Ms %s | plant input: Ms %s, PM %s, GM %s | position: crossover %s, PM %s",
                label, Units.formatHz(velocityCrossoverHz()), pm(velocityLoop), gm(velocityLoop), Units.g4(velocityLoop.sensitivityPeak().magnitude()),
                Units.g4(plantInput.sensitivityPeak().magnitude()), pm(plantInput), gm(plantInput),
                Units.formatHz(positionCrossoverHz()), pm(positionLoop));
    }
}
