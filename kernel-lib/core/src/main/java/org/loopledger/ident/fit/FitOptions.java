package org.loopledger.ident.fit;

import org.loopledger.lti.Motion;

import java.util.Locale;

/**
 * What to fit and how.
 *
 * @param torqueConstantNmPerA the motor constant, known from the motor data sheet: K<sub>t</sub> in N·m/A for a
 *                             {@link Motion#ROTARY} axis, the force constant K<sub>f</sub> in N/A for a
 *                             {@link Motion#LINEAR} one (see {@link #motorConstantPerA()}). An FRF fixes only
 *                             K<sub>t</sub>/J, so J and b are reported for the given constant
 * @param toPosition           the FRF is current → position (rad or m) rather than → velocity (rad/s or m/s)
 * @param sampleTimeS          &gt; 0: fit the zero-order-hold sampled-data form at this sample time (what a
 *                             drive measures between held current and sampled velocity); 0: continuous model
 * @param fitDelay             also fit a pure delay τ ≥ 0 (otherwise τ = 0)
 * @param fLowHz               lowest frequency used
 * @param fHighHz              highest frequency used
 * @param motion               rotary (inertia in kg·m², friction in N·m·s/rad) or linear (mass in kg, N·s/m)
 */
public record FitOptions(double torqueConstantNmPerA, boolean toPosition, double sampleTimeS, boolean fitDelay, double fLowHz, double fHighHz,
                         Motion motion) {
    public FitOptions {
        if (motion == null) throw new IllegalArgumentException("say whether the axis is Motion.ROTARY or Motion.LINEAR");
        if (!(torqueConstantNmPerA > 0) || Double.isInfinite(torqueConstantNmPerA)) {
            throw new IllegalArgumentException(motion.motorConstantName() + " must be finite and positive, got " + torqueConstantNmPerA + " " + motion.motorConstantUnit());
        }
        if (!(sampleTimeS >= 0) || Double.isInfinite(sampleTimeS)) throw new IllegalArgumentException("sample time must be 0 (continuous) or positive, got " + sampleTimeS + " s");
        if (!(fLowHz >= 0) || !(fHighHz > fLowHz)) throw new IllegalArgumentException("fit band " + fLowHz + " .. " + fHighHz + " Hz must have 0 <= low < high");
    }

    /** A rotary axis. */
    public FitOptions(double torqueConstantNmPerA, boolean toPosition, double sampleTimeS, boolean fitDelay, double fLowHz, double fHighHz) {
        this(torqueConstantNmPerA, toPosition, sampleTimeS, fitDelay, fLowHz, fHighHz, Motion.ROTARY);
    }

    /** Rotary axis, current → velocity, continuous model, no delay, the whole FRF. */
    public static FitOptions velocity(double torqueConstantNmPerA) {
        return velocity(Motion.ROTARY, torqueConstantNmPerA);
    }

    /** Rotary axis, current → position, continuous model, no delay, the whole FRF. */
    public static FitOptions position(double torqueConstantNmPerA) {
        return position(Motion.ROTARY, torqueConstantNmPerA);
    }

    /**
     * Current → velocity, continuous model, no delay, the whole FRF, for a rotary or linear axis;
     * {@code motorConstantPerA} in N·m/A (rotary) or N/A (linear).
     */
    public static FitOptions velocity(Motion motion, double motorConstantPerA) {
        return new FitOptions(motorConstantPerA, false, 0, false, 0, Double.POSITIVE_INFINITY, motion);
    }

    /** As {@link #velocity(Motion, double)}, to position (rad or m). */
    public static FitOptions position(Motion motion, double motorConstantPerA) {
        return new FitOptions(motorConstantPerA, true, 0, false, 0, Double.POSITIVE_INFINITY, motion);
    }

    /** The motor constant: N·m/A on a rotary axis, N/A on a linear one ({@link Motion#motorConstantUnit()}). */
    public double motorConstantPerA() { return torqueConstantNmPerA; }

    /**
     * Sample time in s of the sampled-data form the data are compared with: &gt; 0 (see {@link #sampledAt}) makes
     * the fit compare the data with the model's zero-order-hold equivalent at z = e<sup>jωT</sup>; 0 compares with
     * the continuous model at s = jω. Either way the fitted parameters and {@link FitResult#model()} are those of the
     * continuous physical model.
     */
    @Override public double sampleTimeS() { return sampleTimeS; }

    /** Lowest frequency of the FRF used by the fit, in Hz (0: from the first point). */
    @Override public double fLowHz() { return fLowHz; }

    /** Highest frequency of the FRF used by the fit, in Hz ({@code +∞}: to the last point). */
    @Override public double fHighHz() { return fHighHz; }

    /**
     * The same options, fitting the zero-order-hold sampled-data form at {@code sampleTimeS} (1/fs of the drive
     * that measured the FRF): use it for an FRF measured between the drive's held current command and its sampled
     * velocity, so that the hold's phase lag (about half a sample) and its magnitude droop are explained by the
     * hold rather than absorbed into the fitted delay. The model returned stays continuous (the physical
     * parameters); only the comparison with the data is sampled. 0 restores the continuous comparison. The fit band
     * must then end at or below the Nyquist frequency 1/(2·sampleTimeS).
     *
     * @param sampleTimeS sample time in s (e.g. 1/16000), or 0
     * @return a new value; this one is unchanged
     */
    public FitOptions sampledAt(double sampleTimeS) { return new FitOptions(torqueConstantNmPerA, toPosition, sampleTimeS, fitDelay, fLowHz, fHighHz, motion); }

    /**
     * The same options, also fitting a pure delay τ, the model carrying e<sup>-sτ</sup>. The delay absorbs every lag
     * the model does not explain: computation delay, current-loop lag near the band and, in a continuous fit
     * ({@code sampleTimeS = 0}) of drive data, the hold's half sample. The estimate is reported as fitted (a negative
     * value shows a model mismatch); the model uses max(0, τ).
     *
     * @return a new value; this one is unchanged
     */
    public FitOptions withDelay() { return new FitOptions(torqueConstantNmPerA, toPosition, sampleTimeS, true, fLowHz, fHighHz, motion); }

    /**
     * The same options restricted to the FRF points from {@code lowHz} to {@code highHz} (inclusive), e.g. to leave
     * out a low band dominated by friction or a high band of poor coherence.
     *
     * @param lowHz  lowest frequency used, Hz, at least 0
     * @param highHz highest frequency used, Hz, above {@code lowHz}
     * @return a new value; this one is unchanged
     */
    public FitOptions bandHz(double lowHz, double highHz) { return new FitOptions(torqueConstantNmPerA, toPosition, sampleTimeS, fitDelay, lowHz, highHz, motion); }

    @Override public String toString() {
        String constant = motion == Motion.ROTARY ? "Kt" : "Kf";
        return String.format(Locale.ROOT, "fit current → %s, %s = %.4g %s, %s, %s, band %.4g .. %.4g Hz", toPosition ? "position" : "velocity",
                constant, torqueConstantNmPerA, motion.motorConstantUnit(),
                sampleTimeS > 0 ? String.format(Locale.ROOT, "sampled-data (ZOH, T = %.4g µs)", sampleTimeS * 1e6) : "continuous",
                fitDelay ? "delay fitted" : "no delay", fLowHz, fHighHz)
                + (motion == Motion.LINEAR ? ", linear axis" : "");
    }
}
