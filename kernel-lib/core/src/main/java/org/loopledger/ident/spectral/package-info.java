/**
 * Nonparametric frequency-response estimation from sampled signals: Welch H1/H2 with coherence
 * ({@link org.loopledger.ident.spectral.FrfEstimate}, {@link org.loopledger.ident.spectral.WelchOptions},
 * {@link org.loopledger.ident.spectral.CrossSpectra}, {@link org.loopledger.ident.spectral.WindowType},
 * {@link org.loopledger.ident.spectral.Detrend}), synchronous averaging over whole periods of a periodic excitation
 * ({@link org.loopledger.ident.spectral.PeriodicAverage}, {@link org.loopledger.ident.spectral.PeriodDetection},
 * {@link org.loopledger.ident.spectral.LineFloor}), closed-loop plant extraction
 * ({@link org.loopledger.ident.spectral.ClosedLoopEstimate}) and log-frequency decimation for plotting and tuning
 * ({@link org.loopledger.ident.spectral.LogDecimation}).
 *
 * <p><b>Units.</b> Sample rates in Hz; results are {@link org.loopledger.frf.Frf}s on rad/s grids, in output units per
 * input unit. Cross-spectra follow SciPy's convention conj(X)·Y. For whole drive logs in one call see
 * {@link org.loopledger.ident.estimate.FrfFromLogs}.
 */
package org.loopledger.ident.spectral;
