/**
 * Loop analysis on models and measured data alike, through one interface
 * ({@link org.loopledger.analysis.LoopResponse}, implemented by {@link org.loopledger.analysis.ModelLoop} and
 * {@link org.loopledger.analysis.MeasuredLoop}): {@link org.loopledger.analysis.Margins} (every gain and phase
 * crossover, gain, phase, delay and modulus margins, peaks, bandwidth),
 * {@link org.loopledger.analysis.ClosedLoopStability} (poles or a Nyquist count),
 * {@link org.loopledger.analysis.GangOfFour} (S, T, PS, CS) and {@link org.loopledger.analysis.Spec} checked into a
 * {@link org.loopledger.analysis.SpecReport}. Figures that need care carry a
 * {@link org.loopledger.analysis.LoopWarning}.
 *
 * <p><b>Units.</b> Frequencies in rad/s inside records ({@code omegaRadPerS}) with Hz accessors where a user reads
 * them; phase and phase margin in degrees, gain margin in dB (and as a ratio), Ms and peak |T| as ratios, delay
 * margin in s. Phase margin is ∠L + 180° on the unwrapped branch anchored at -90° per net integrator.
 *
 * <p>Entry points: {@code Margins.of(loopGain)} for a {@code TransferFunction} or a measured {@code Frf};
 * on measured data state what the data cannot show with
 * {@code Margins.of(MeasuredLoop.of(frf).withIntegrators(n).withOpenLoopUnstablePoles(p))}.
 * The loop gains of a PIV cascade come from {@link org.loopledger.control.Cascade}.
 */
package org.loopledger.analysis;
