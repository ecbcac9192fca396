/**
 * Physical models fitted to a measured {@link org.loopledger.frf.Frf}: {@link org.loopledger.ident.fit.ModelFit}
 * (weighted Levenberg-Marquardt on the log of the complex ratio) gives a
 * {@link org.loopledger.ident.fit.RigidBodyFit} or {@link org.loopledger.ident.fit.TwoMassFit}: the parameters as a
 * value ({@link org.loopledger.ident.fit.RigidBodyParameters}, {@link org.loopledger.ident.fit.TwoMassParameters})
 * and a {@link org.loopledger.ident.fit.FitResult} with 95 % intervals, quality per band and
 * {@link org.loopledger.ident.fit.FitWarning}s (a fit with any warning is not usable as it stands).
 *
 * <p><b>Units.</b> Set by {@link org.loopledger.ident.fit.FitOptions}: the motor constant in N·m/A (rotary) or N/A
 * (linear), the band in Hz, the sample time in s; parameters come back in SI for the axis' kind of motion
 * (kg·m² and N·m·s/rad, or kg and N·s/m), frequencies in Hz, delays in s.
 */
package org.loopledger.ident.fit;
