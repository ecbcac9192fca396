package org.loopledger.control;

import org.loopledger.lti.Discretization;
import org.loopledger.lti.TransferFunction;

/**
 * A filter in the current-command path of a drive: continuous H(s), and the discrete H(z) a drive runs
 * at its sample rate.
 *
 * <p><b>Discretisation.</b> Tustin (bilinear) prewarped at the filter's characteristic frequency
 * ω<sub>c</sub> ({@link #prewarpRadPerS()}: a low-pass corner, a notch centre, the geometric centre of a
 * lead/lag): s = c(z - 1)/(z + 1) with c = ω<sub>c</sub>/tan(ω<sub>c</sub>T/2) (via
 * {@link Discretization#tustin(TransferFunction, double, double)}), so H(z) equals H(s) exactly at ω<sub>c</sub>:
 * the notch stays centred, the low-pass corner keeps its gain. This is the "BLT with prewarping at the
 * design frequency" of R. Bristow-Johnson's Audio EQ Cookbook (W3C Working Group Note, 2021), whose
 * formulae are the test reference.
 *
 * <p>Every frequency that defines the filter must lie below the Nyquist frequency; otherwise the
 * discrete methods throw and name it.
 */
public sealed interface Filter permits LowPass1, LowPass2, Notch, LeadLag, Biquad {

    /** H(s), unity gain at DC unless the filter is a general biquad. */
    TransferFunction continuous();

    /** The Tustin prewarp frequency ω<sub>c</sub> in rad/s. */
    double prewarpRadPerS();

    /** Throws when a defining frequency is at or above the Nyquist frequency of {@code sampleRateHz}. */
    void requireBelowNyquist(double sampleRateHz);

    /** A one-line description with units, e.g. {@code notch 450 Hz, depth 20 dB, width 90 Hz}. */
    String describe();

    /** H(z) at {@code sampleRateHz}: Tustin prewarped at {@link #prewarpRadPerS()}, denominator monic. */
    default TransferFunction discrete(double sampleRateHz) {
        Checks.sampleRateHz(sampleRateHz);
        requireBelowNyquist(sampleRateHz);
        return Discretization.tustin(continuous(), 1.0 / sampleRateHz, prewarpRadPerS());
    }

    /** The drive's coefficients b0 b1 b2 a1 a2 (a0 = 1) at {@code sampleRateHz}. */
    default BiquadCoefficients coefficients(double sampleRateHz) { return BiquadCoefficients.of(discrete(sampleRateHz)); }
}
