package org.loopledger.display;

/**
 * Registers the renderers for the general-purpose libraries we ship (XChart, Tablesaw), our own
 * figures, and the library's domain values (transfer functions, FRFs, margins, spec reports), which are rendered
 * from here so that the domain packages never depend on display.
 */
final class BuiltinRenderers {
    private BuiltinRenderers() {}

    static void register(RendererRegistry r) {
        r.register(org.knowm.xchart.internal.chartpart.Chart.class, ChartRenderer::render);
        r.register(tech.tablesaw.api.Table.class, TableRenderer::render);
        r.register(org.loopledger.plot.Figure.class, FigureRenderer::render);
        r.register(org.loopledger.lti.TransferFunction.class, TransferFunctionRenderer::render);
        r.register(org.loopledger.frf.Frf.class, FrfRenderer::render);
        r.register(org.loopledger.analysis.Margins.class, MarginsRenderer::render);
        r.register(org.loopledger.analysis.SpecReport.class, SpecReportRenderer::render);
    }
}
