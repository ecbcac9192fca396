/**
 * Load cases from drive logs in one call: {@link org.loopledger.ident.estimate.FrfFromLogs} reads each log
 * (checks, SI units, SHA-256), picks the input, output and excitation columns, averages over whole excitation
 * periods and returns {@link org.loopledger.ident.estimate.LoadCases}, one
 * {@link org.loopledger.ident.estimate.LoadCaseEstimate} per log, ready for the tuner
 * ({@code LoadCases.plantCases()}).
 *
 * <p>Entry point: {@code FrfFromLogs.currentToVelocity()} (current in A to velocity in rad/s or m/s).
 */
package org.loopledger.ident.estimate;
