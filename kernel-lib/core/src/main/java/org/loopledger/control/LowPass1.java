package org.loopledger.control;

import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

/** First-order low-pass H(s) = ω<sub>c</sub>/(s + ω<sub>c</sub>), unity DC gain, -3 dB at ω<sub>c</sub>; prewarped at ω<sub>c</sub>. */
public record LowPass1(double cornerRadPerS) implements Filter {
    public LowPass1 {
        Checks.positive(cornerRadPerS, "low-pass corner", "rad/s");
    }

    public static LowPass1 ofHz(double cornerHz) {
        return new LowPass1(Units.hzToRadPerS(Checks.positive(cornerHz, "low-pass corner", "Hz")));
    }

    public static LowPass1 ofRadPerS(double cornerRadPerS) { return new LowPass1(cornerRadPerS); }

    public double cornerHz() { return Units.radPerSToHz(cornerRadPerS); }

    @Override public TransferFunction continuous() {
        return TransferFunction.continuous(new double[] {cornerRadPerS}, new double[] {1, cornerRadPerS});
    }

    @Override public double prewarpRadPerS() { return cornerRadPerS; }

    @Override public void requireBelowNyquist(double sampleRateHz) { Checks.belowNyquist(cornerRadPerS, sampleRateHz, "first-order low-pass corner"); }

    @Override public String describe() { return "1st-order low-pass " + Units.formatRadPerSAsHz(cornerRadPerS); }

    @Override public String toString() { return describe(); }
}
