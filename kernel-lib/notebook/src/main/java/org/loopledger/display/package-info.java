/**
 * How values become notebook outputs: a {@link org.loopledger.display.MimeBundle} per value, found by the
 * {@link org.loopledger.display.RendererRegistry} (a {@link org.loopledger.display.Displayable} renders itself; other
 * types through a {@link org.loopledger.display.Renderer}, built in or registered by a
 * {@link org.loopledger.display.RendererProvider}). Ending a cell with a domain value (margins, fits, tuning results,
 * spec reports, figures) shows its table or picture; {@link org.loopledger.display.ResultRenderers} lists the result
 * tables.
 *
 * <p>Tables that combine several results: {@link org.loopledger.display.MarginsTable} (margins of several loops on
 * several load cases), {@link org.loopledger.display.ResponseTable}, {@link org.loopledger.display.FitTable},
 * {@link org.loopledger.display.LoadCaseTable}, {@link org.loopledger.display.FilterTable},
 * {@link org.loopledger.display.DriveGains} (gains in a drive's units, with the caution). The helpers imported in
 * every kernel session ({@code display(...)}, {@code markdown(...)}, {@code html(...)}) are in
 * {@link org.loopledger.display.Displays}.
 *
 * <p><b>Units.</b> At this edge frequencies are shown in Hz, phase in degrees, magnitude in dB, each column or
 * label carrying its unit. Plain-text forms are deterministic so that {@code verify} can compare them.
 */
package org.loopledger.display;
