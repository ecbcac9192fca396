package org.loopledger.control;

import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

/**
 * Second-order low-pass H(s) = ω<sub>n</sub>²/(s² + 2ζω<sub>n</sub>s + ω<sub>n</sub>²), unity DC gain; Q = 1/(2ζ)
 * (ζ = 1/√2 is the Butterworth response, -3 dB at ω<sub>n</sub>). Prewarped at ω<sub>n</sub>; the discrete form
 * equals the Audio EQ Cookbook's LPF with the same ω<sub>n</sub> and Q.
 */
public record LowPass2(double naturalRadPerS, double damping) implements Filter {
    public LowPass2 {
        Checks.positive(naturalRadPerS, "low-pass natural frequency", "rad/s");
        Checks.positive(damping, "low-pass damping ratio", "(dimensionless; 0.707 for Butterworth)");
    }

    /** Natural frequency in Hz, damping ratio ζ. */
    public static LowPass2 ofHz(double naturalHz, double damping) {
        return new LowPass2(Units.hzToRadPerS(Checks.positive(naturalHz, "low-pass natural frequency", "Hz")), damping);
    }

    /** Natural frequency in Hz, quality factor Q = 1/(2ζ). */
    public static LowPass2 ofHzAndQ(double naturalHz, double q) {
        return ofHz(naturalHz, 0.5 / Checks.positive(q, "low-pass quality factor Q", "(dimensionless; 0.707 for Butterworth)"));
    }

    public double naturalHz() { return Units.radPerSToHz(naturalRadPerS); }

    public double q() { return 0.5 / damping; }

    @Override public TransferFunction continuous() {
        double w = naturalRadPerS;
        return TransferFunction.continuous(new double[] {w * w}, new double[] {1, 2 * damping * w, w * w});
    }

    @Override public double prewarpRadPerS() { return naturalRadPerS; }

    @Override public void requireBelowNyquist(double sampleRateHz) { Checks.belowNyquist(naturalRadPerS, sampleRateHz, "second-order low-pass frequency"); }

    @Override public String describe() { return "2nd-order low-pass " + Units.formatRadPerSAsHz(naturalRadPerS) + ", damping " + Units.g4(damping); }

    @Override public String toString() { return describe(); }
}
