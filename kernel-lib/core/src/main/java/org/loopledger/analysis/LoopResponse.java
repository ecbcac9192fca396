package org.loopledger.analysis;

import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * A loop gain L(jω) as the analysis sees it: values on a grid (one code path for models and data)
 * plus refinement hooks. Margins, sensitivity peaks, bandwidth and the Nyquist count read only this
 * interface.
 *
 * <ul>
 *   <li>{@link ModelLoop}: a {@link TransferFunction} (continuous or sampled, with or without delay)
 *       on a dense adaptive grid; {@link #valueAt} is exact, so crossings are refined by Brent, and
 *       delay-free continuous models also give their crossovers exactly
 *       ({@link #exactGainCrossoversRadPerS()}).</li>
 *   <li>{@link MeasuredLoop}: an {@link Frf} (or raw arrays, the fast path); {@link #valueAt}
 *       interpolates in log-frequency on log-magnitude and unwrapped phase, only inside the measured
 *       band. Nothing is extrapolated.</li>
 * </ul>
 *
 * <p>Frequencies in rad/s, phase in rad. The phase returned by {@link #phaseRad(int)} is on the
 * canonical unwrapped branch: continuous along the grid and anchored at low frequency at
 * -90° per net integrator (and -180° more when the remaining low-frequency gain is negative).
 */
public interface LoopResponse {

    /** A model loop gain on its own dense grid. */
    static ModelLoop of(TransferFunction loopGain) { return ModelLoop.of(loopGain); }

    /** A measured continuous-time loop gain. */
    static MeasuredLoop of(Frf loopGain) { return MeasuredLoop.of(loopGain); }

    /** Number of grid points (at least 2). */
    int size();

    /** Grid frequency i in rad/s (strictly increasing in i). */
    double omegaRadPerS(int i);

    /** Re L at grid point i. */
    double re(int i);

    /** Im L at grid point i. */
    double im(int i);

    /** Phase of L at grid point i in rad, canonical unwrapped branch. */
    double phaseRad(int i);

    /**
     * L at {@code omegaRadPerS}, which must lie in [ω<sub>i</sub>, ω<sub>i+1</sub>] (i is the bracket
     * index, 0 &le; i &lt; size() - 1): writes re, im and the phase on the canonical branch into
     * {@code out[0..2]} (modified). Exact for models, interpolated for data.
     */
    void valueAt(double omegaRadPerS, int i, double[] out);

    /** True when {@link #valueAt} is exact (a model), false when it interpolates data. */
    boolean isExact();

    /** True for measured data (answers only inside the band, never extrapolated). */
    default boolean isMeasured() { return !isExact(); }

    /** Sample time in s for a sampled loop (grid then ends at or below π/T), empty for continuous. */
    OptionalDouble sampleTimeS();

    /** Net number of integrators (poles minus zeros at s = 0, or z = 1); stated or estimated for data. */
    int netIntegrators();

    /** Open-loop poles strictly in the right half plane (outside the unit circle); for data only when stated. */
    OptionalInt openLoopUnstablePoles();

    /** Open-loop poles on the imaginary axis (unit circle) within the tolerance; for data, the net integrators. */
    int openLoopPolesOnAxis();

    /** Pure delay in s (models), 0 for rational models and for data. */
    default double delayS() { return 0; }

    /** The model, when this is one. */
    default Optional<TransferFunction> model() { return Optional.empty(); }

    /** Gain crossovers found exactly (roots of a polynomial in ω²), when the model allows; else empty. */
    default Optional<double[]> exactGainCrossoversRadPerS() { return Optional.empty(); }

    /** Phase crossovers found exactly, when the model allows (continuous, delay-free); else empty. */
    default Optional<double[]> exactPhaseCrossoversRadPerS() { return Optional.empty(); }

    /** One line naming the source: model or data, time base, band. */
    String describe();

    /**
     * Phase of L in rad at any frequency inside the analysed band, on the canonical branch (the bracket is
     * found first, so a single-frequency evaluation still lands on the right branch). Throws outside the
     * band: nothing is extrapolated.
     */
    default double phaseRadAt(double omegaRadPerS) {
        if (!(omegaRadPerS >= lowRadPerS() * (1 - 1e-12) && omegaRadPerS <= highRadPerS() * (1 + 1e-12))) {
            throw new IllegalArgumentException("frequency " + org.loopledger.lti.Units.formatHz(omegaRadPerS / (2 * Math.PI))
                    + " lies outside the analysed band " + org.loopledger.lti.Units.formatHz(lowRadPerS() / (2 * Math.PI)) + " .. "
                    + org.loopledger.lti.Units.formatHz(highRadPerS() / (2 * Math.PI)) + "; no extrapolation");
        }
        double w = Math.min(highRadPerS(), Math.max(lowRadPerS(), omegaRadPerS));
        double[] v = new double[3];
        valueAt(w, LoopScan.bracketOf(this, w), v);
        return v[2];
    }

    /** Lowest analysed frequency, rad/s. */
    default double lowRadPerS() { return omegaRadPerS(0); }

    /** Highest analysed frequency, rad/s. */
    default double highRadPerS() { return omegaRadPerS(size() - 1); }
}
