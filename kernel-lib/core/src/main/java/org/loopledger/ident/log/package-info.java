/**
 * Reading drive logs and exported frequency responses: {@link org.loopledger.ident.log.DriveLogReader}
 * (delimited text or Level 5 {@code .mat}) gives a checked {@link org.loopledger.ident.log.DriveLog} in SI units;
 * {@link org.loopledger.ident.log.FrfFileReader} reads an analyser's or drive's FRF export straight into an
 * {@link org.loopledger.frf.Frf}.
 *
 * <p><b>Units.</b> Column headers follow {@link org.loopledger.ident.log.LogColumns} ({@code quantity_unit}, e.g.
 * {@code time_s}, {@code current_measured_A}, {@code velocity_rad_s}); common non-SI tokens are converted on
 * reading, anything else is mapped with a {@link org.loopledger.ident.log.ColumnMap} and
 * {@link org.loopledger.ident.log.LogUnit}s. The checks ({@link org.loopledger.ident.log.LogChecks}) report
 * problems as {@link org.loopledger.ident.log.LogIssue}s naming the column and row. Every file read is recorded
 * with its SHA-256 by {@link org.loopledger.provenance.Provenance}.
 */
package org.loopledger.ident.log;
