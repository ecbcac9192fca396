package org.loopledger.control;

import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

/**
 * Lead or lag H(s) = (1 + s/ω<sub>z</sub>)/(1 + s/ω<sub>p</sub>), unity DC gain, high-frequency gain
 * ω<sub>p</sub>/ω<sub>z</sub>. A lead has ω<sub>p</sub> &gt; ω<sub>z</sub>; a lag ω<sub>p</sub> &lt; ω<sub>z</sub>. The extreme
 * phase, asin((α - 1)/(α + 1)) with α = ω<sub>p</sub>/ω<sub>z</sub>, occurs at the geometric centre
 * √(ω<sub>z</sub>ω<sub>p</sub>) (G. F. Franklin, J. D. Powell, A. Emami-Naeini, Feedback Control of Dynamic
 * Systems, lead compensation design, from memory); the discrete form is prewarped there.
 */
public record LeadLag(double zeroRadPerS, double poleRadPerS) implements Filter {
    public LeadLag {
        Checks.positive(zeroRadPerS, "lead/lag zero corner", "rad/s");
        Checks.positive(poleRadPerS, "lead/lag pole corner", "rad/s");
        if (zeroRadPerS == poleRadPerS) {
            throw new IllegalArgumentException("lead/lag with equal zero and pole corners (" + Units.formatRadPerSAsHz(zeroRadPerS)
                    + ") does nothing; leave it out or separate the corners");
        }
    }

    public static LeadLag ofCornersHz(double zeroHz, double poleHz) {
        Checks.positive(zeroHz, "lead/lag zero corner", "Hz");
        Checks.positive(poleHz, "lead/lag pole corner", "Hz");
        return new LeadLag(Units.hzToRadPerS(zeroHz), Units.hzToRadPerS(poleHz));
    }

    /**
     * The lead (phase &gt; 0) or lag (phase &lt; 0) with extreme phase {@code phaseDeg} (strictly between -90
     * and 90 deg, not 0) at {@code centreHz}: ω<sub>z</sub> = ω<sub>c</sub>√((1 - sin φ)/(1 + sin φ)),
     * ω<sub>p</sub> = ω<sub>c</sub>√((1 + sin φ)/(1 - sin φ)).
     */
    public static LeadLag ofCentreHz(double centreHz, double phaseDeg) {
        double wc = Units.hzToRadPerS(Checks.positive(centreHz, "lead/lag centre", "Hz"));
        if (!(Math.abs(phaseDeg) < 90) || phaseDeg == 0) {
            throw new IllegalArgumentException("lead/lag phase must lie strictly between -90 and 90 deg and not be 0, got " + phaseDeg + " deg");
        }
        double s = Math.sin(Units.degToRad(phaseDeg));
        double r = Math.sqrt((1 + s) / (1 - s));
        return new LeadLag(wc / r, wc * r);
    }

    public boolean isLead() { return poleRadPerS > zeroRadPerS; }

    /** √(ω<sub>z</sub>ω<sub>p</sub>) in rad/s. */
    public double centreRadPerS() { return Math.sqrt(zeroRadPerS * poleRadPerS); }

    /** Extreme phase asin((α - 1)/(α + 1)) in degrees (negative for a lag). */
    public double extremePhaseDeg() {
        double a = poleRadPerS / zeroRadPerS;
        return Units.radToDeg(Math.asin((a - 1) / (a + 1)));
    }

    @Override public TransferFunction continuous() {
        return TransferFunction.continuous(new double[] {1 / zeroRadPerS, 1}, new double[] {1 / poleRadPerS, 1});
    }

    @Override public double prewarpRadPerS() { return centreRadPerS(); }

    @Override public void requireBelowNyquist(double sampleRateHz) {
        Checks.belowNyquist(zeroRadPerS, sampleRateHz, (isLead() ? "lead" : "lag") + " zero corner");
        Checks.belowNyquist(poleRadPerS, sampleRateHz, (isLead() ? "lead" : "lag") + " pole corner");
    }

    @Override public String describe() {
        return (isLead() ? "lead " : "lag ") + Units.g4(extremePhaseDeg()) + " deg at " + Units.formatRadPerSAsHz(centreRadPerS()) + " (zero "
                + Units.formatRadPerSAsHz(zeroRadPerS) + ", pole " + Units.formatRadPerSAsHz(poleRadPerS) + ")";
    }

    @Override public String toString() { return describe(); }
}
