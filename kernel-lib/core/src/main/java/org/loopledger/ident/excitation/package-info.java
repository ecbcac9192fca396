/**
 * Excitation signals for identification, each an {@link org.loopledger.ident.excitation.ExcitationSignal} that
 * knows its sample rate and period (so estimation can average whole periods leakage-free):
 * {@link org.loopledger.ident.excitation.Multisine} (log-spaced lines, Schroeder phases),
 * {@link org.loopledger.ident.excitation.Prbs} (ITU-T O.150 polynomials, {@link org.loopledger.ident.excitation.PrbsPolynomial})
 * and {@link org.loopledger.ident.excitation.Chirp}.
 *
 * <p><b>Units.</b> Frequencies and sample rates in Hz, periods in samples; amplitudes and RMS values are in the
 * unit of the injected quantity (e.g. A of current command). An excitation injected into a drive moves the axis:
 * start with a small amplitude.
 */
package org.loopledger.ident.excitation;
