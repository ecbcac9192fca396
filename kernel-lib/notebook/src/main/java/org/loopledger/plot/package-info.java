/**
 * Figures drawn with XChart in Loopledger's style: {@link org.loopledger.plot.BodePlot},
 * {@link org.loopledger.plot.NicholsPlot}, {@link org.loopledger.plot.NyquistPlot},
 * {@link org.loopledger.plot.GangOfFourPlot}, {@link org.loopledger.plot.CoherencePlot} and
 * {@link org.loopledger.plot.TimePlot}, each giving a {@link org.loopledger.plot.Figure} (panels on a grid) that a
 * notebook shows when a cell ends with it (SVG and PNG, plus the plotted data that {@code verify} compares).
 *
 * <p><b>Units.</b> Frequency axes in Hz (log), phase in degrees, magnitude in dB, time in s; the inputs stay in the
 * library's units ({@link org.loopledger.frf.Frf} and {@link org.loopledger.lti.TransferFunction} in rad/s).
 * Plots are deterministic (no random ids, no timestamps). {@link org.loopledger.plot.Palette} and
 * {@link org.loopledger.plot.ChartStyle} hold the look.
 */
package org.loopledger.plot;
