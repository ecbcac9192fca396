package org.loopledger.display;

/** Registers the renderers for the general-purpose libraries we ship: XChart and Tablesaw, and our own figures. */
final class BuiltinRenderers {
    private BuiltinRenderers() {}

    static void register(RendererRegistry r) {
        r.register(org.knowm.xchart.internal.chartpart.Chart.class, ChartRenderer::render);
        r.register(tech.tablesaw.api.Table.class, TableRenderer::render);
        r.register(org.loopledger.plot.Figure.class, FigureRenderer::render);
    }
}
