/**
 * Controllers, filters and the digital drive: {@link org.loopledger.control.Piv} (position gain K<sub>p</sub> in 1/s
 * around a {@link org.loopledger.control.VelocityPi}), {@link org.loopledger.control.Pid} and its exact PIV form
 * {@link org.loopledger.control.PidAsPiv}; filters on the current command ({@link org.loopledger.control.Notch},
 * {@link org.loopledger.control.LowPass1}, {@link org.loopledger.control.LowPass2},
 * {@link org.loopledger.control.LeadLag}, {@link org.loopledger.control.Biquad}) chained in a
 * {@link org.loopledger.control.FilterChain}, with the discrete coefficients a drive takes
 * ({@link org.loopledger.control.BiquadCoefficients}, {@link org.loopledger.control.CoefficientTable});
 * {@link org.loopledger.control.DriveTiming} (sample rate, computation delay, hold, current loop); and
 * {@link org.loopledger.control.Cascade}, which gives the loop gains at every break point of a PIV cascade
 * around a measured or model plant.
 *
 * <p><b>Units.</b> Frequencies are given in Hz or rad/s as the factory name says ({@code Notch.ofHz},
 * {@code VelocityPi.ofRadPerS}); K<sub>v</sub> is in plant-input units (A for a current-commanded drive) per
 * rad/s (per m/s on a linear axis); the notebook side's {@code display.DriveGains} shows the gains in a drive's units.
 * Gains typed into a drive move real metal: try them with reduced current and speed limits first.
 */
package org.loopledger.control;
