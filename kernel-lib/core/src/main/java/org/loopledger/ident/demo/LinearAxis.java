package org.loopledger.ident.demo;

import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.lti.Motion;


/**
 * Invented physical parameters of the second demo axis (SYNTHETIC, for demos and tests only): the Y axis
 * of a pick-and-place machine driven by an iron-core linear motor. The motor's carriage (mass m<sub>1</sub>,
 * viscous friction b to the frame) carries the placement head (m<sub>2</sub>) on a bracket of stiffness k
 * and damping c, a two-mass system with one structural resonance:
 *
 * <pre>
 *   m_1·ẍ_1 = K_f·i - b·ẋ_1 - c·(ẋ_1 - ẋ_2) - k·(x_1 - x_2)
 *   m_2·ẍ_2 = c·(ẋ_1 - ẋ_2) + k·(x_1 - x_2)
 * </pre>
 * Carriage velocity per current: v<sub>1</sub>/i = K<sub>f</sub>(m<sub>2</sub>s² + cs + k) /
 * (m<sub>1</sub>m<sub>2</sub>s³ + (m<sub>1</sub>c + m<sub>2</sub>c + m<sub>2</sub>b)s² + (m<sub>1</sub>k + m<sub>2</sub>k + bc)s + bk)
 * (the rotary derivation of {@link GantryAxis} with masses for inertias).
 *
 * @param forceConstantNPerA K<sub>f</sub>
 * @param carriageMassKg     m<sub>1</sub>, motor carriage
 * @param headMassKg         m<sub>2</sub>, placement head on its bracket
 * @param stiffnessNPerM     k, bracket
 * @param dampingNsPerM      c, bracket
 * @param viscousNsPerM      b, carriage to frame (guides, cables)
 */
public record LinearAxis(double forceConstantNPerA, double carriageMassKg, double headMassKg, double stiffnessNPerM, double dampingNsPerM,
                         double viscousNsPerM) {

    /** The demo's invented axis. */
    public static LinearAxis demo() { return new LinearAxis(38, 4.2, 1.3, 1.27e6, 45, 12); }

    /**
     * The exact modal form K<sub>f</sub>/(m s + b')·(s²/ω<sub>a</sub>² + 2ζ<sub>a</sub>s/ω<sub>a</sub> + 1)/(s²/ω<sub>r</sub>² + 2ζ<sub>r</sub>s/ω<sub>r</sub> + 1)
     * of current to carriage velocity: zeros from m<sub>2</sub>s² + cs + k, poles from the cubic's roots,
     * m = m<sub>1</sub>ω<sub>r</sub>²/ω<sub>a</sub>², b' = m·p (derivation by hand, as {@link GantryAxis#modalTruth}).
     */
    public Truth truth(double delayS) {
        double[] t = TwoMassMechanics.modal(carriageMassKg, headMassKg, stiffnessNPerM, dampingNsPerM, viscousNsPerM);
        return new Truth(forceConstantNPerA, t[0], t[1], t[2], t[3], t[4], t[5], delayS);
    }

    /** True modal parameters of current → logged carriage velocity (SI; frequencies in Hz). */
    public record Truth(double forceConstantNPerA, double massKg, double viscousNsPerM, double resonanceHz, double resonanceDamping,
                        double antiresonanceHz, double antiresonanceDamping, double delayS) {
        /** The same numbers as the two-mass fit's parameters on a {@link Motion#LINEAR} axis (kg, N·s/m, Hz, s), e.g. for a fit table's truth. */
        public TwoMassParameters twoMass() {
            return new TwoMassParameters(massKg, viscousNsPerM, resonanceHz, resonanceDamping, antiresonanceHz, antiresonanceDamping, delayS, Motion.LINEAR);
        }
    }
}
