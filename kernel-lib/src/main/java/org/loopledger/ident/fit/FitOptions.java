package org.loopledger.ident.fit;

import java.util.Locale;

/**
 * What to fit and how.
 *
 * @param torqueConstantNmPerA K<sub>t</sub>, known from the motor data sheet: an FRF fixes only K<sub>t</sub>/J,
 *                             so J and b are reported for the given K<sub>t</sub>
 * @param toPosition           the FRF is current → position (rad) rather than → velocity (rad/s)
 * @param sampleTimeS          &gt; 0: fit the zero-order-hold sampled-data form at this sample time (what a
 *                             drive measures between held current and sampled velocity); 0: continuous model
 * @param fitDelay             also fit a pure delay τ ≥ 0 (otherwise τ = 0)
 * @param fLowHz               lowest frequency used
 * @param fHighHz              highest frequency used
 */
public record FitOptions(double torqueConstantNmPerA, boolean toPosition, double sampleTimeS, boolean fitDelay, double fLowHz, double fHighHz) {
    public FitOptions {
        if (!(torqueConstantNmPerA > 0) || Double.isInfinite(torqueConstantNmPerA)) {
            throw new IllegalArgumentException("torque constant must be finite and positive, got " + torqueConstantNmPerA + " N·m/A");
        }
        if (!(sampleTimeS >= 0) || Double.isInfinite(sampleTimeS)) throw new IllegalArgumentException("sample time must be 0 (continuous) or positive, got " + sampleTimeS + " s");
        if (!(fLowHz >= 0) || !(fHighHz > fLowHz)) throw new IllegalArgumentException("fit band " + fLowHz + " .. " + fHighHz + " Hz must have 0 <= low < high");
    }

    /** Current → velocity, continuous model, no delay, the whole FRF. */
    public static FitOptions velocity(double torqueConstantNmPerA) {
        return new FitOptions(torqueConstantNmPerA, false, 0, false, 0, Double.POSITIVE_INFINITY);
    }

    /** Current → position, continuous model, no delay, the whole FRF. */
    public static FitOptions position(double torqueConstantNmPerA) {
        return new FitOptions(torqueConstantNmPerA, true, 0, false, 0, Double.POSITIVE_INFINITY);
    }

    public FitOptions sampledAt(double sampleTimeS) { return new FitOptions(torqueConstantNmPerA, toPosition, sampleTimeS, fitDelay, fLowHz, fHighHz); }

    public FitOptions withDelay() { return new FitOptions(torqueConstantNmPerA, toPosition, sampleTimeS, true, fLowHz, fHighHz); }

    public FitOptions bandHz(double lowHz, double highHz) { return new FitOptions(torqueConstantNmPerA, toPosition, sampleTimeS, fitDelay, lowHz, highHz); }

    @Override public String toString() {
        return String.format(Locale.ROOT, "fit current → %s, Kt = %.4g N·m/A, %s, %s, band %.4g .. %.4g Hz", toPosition ? "position" : "velocity",
                torqueConstantNmPerA, sampleTimeS > 0 ? String.format(Locale.ROOT, "sampled-data (ZOH, T = %.4g µs)", sampleTimeS * 1e6) : "continuous",
                fitDelay ? "delay fitted" : "no delay", fLowHz, fHighHz);
    }
}
