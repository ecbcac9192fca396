/**
 * Frequency-response data: {@link org.loopledger.frf.Frf} (complex values on a strictly increasing grid in rad/s,
 * optional coherence 0..1 and per-point uncertainty, and whether it was measured or computed from a model),
 * {@link org.loopledger.frf.FrequencyGrid} (log-spaced grids; each method name says the unit it returns),
 * {@link org.loopledger.frf.Phase} (unwrapping) and {@link org.loopledger.frf.FrfDifference}.
 *
 * <p><b>Units.</b> Grids and values are in rad/s internally; methods that take or return Hz say so in their
 * names ({@code restrictedToHz}, {@code ofPartsHz}, {@code logSpacedHz}). Interpolation between grid points is
 * linear in log ω on log-magnitude and unwrapped phase.
 *
 * <p>Entry points: {@code Frf.ofModel(model, grid)} to evaluate a model, the readers in
 * {@link org.loopledger.ident.log} and the estimators in {@link org.loopledger.ident.spectral} for data.
 */
package org.loopledger.frf;
