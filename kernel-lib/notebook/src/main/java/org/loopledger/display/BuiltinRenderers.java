package org.loopledger.display;

/**
 * Registers the renderers for the general-purpose libraries we ship (XChart, Tablesaw), our own
 * figures, and the library's domain values (transfer functions, FRFs, margins, spec reports, filter coefficients, fits, response figures, tuning results), which are rendered
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
        r.register(org.loopledger.control.CoefficientTable.class, ResultRenderers::coefficients);
        r.register(org.loopledger.ident.fit.FitResult.class, ResultRenderers::fit);
        r.register(org.loopledger.ident.fit.TwoMassFit.class, ResultRenderers::twoMassFit);
        r.register(org.loopledger.ident.fit.RigidBodyFit.class, ResultRenderers::rigidBodyFit);
        r.register(org.loopledger.sim.ResponseMetrics.class, ResultRenderers::response);
        r.register(org.loopledger.tune.TuningResult.class, ResultRenderers::tuning);
        r.register(org.loopledger.tune.Resonance.class, ResultRenderers::resonance);
        r.register(org.loopledger.tune.NotchProposal.class, ResultRenderers::notchProposal);
        r.register(org.loopledger.control.Piv.class, p -> DriveGains.of(p).toMimeBundle());
        r.register(org.loopledger.control.VelocityPi.class, v -> DriveGains.of(v).toMimeBundle());
        r.register(org.loopledger.control.Pid.class, p -> DriveGains.of(p).toMimeBundle());
        r.register(org.loopledger.control.FilterChain.class, f -> FilterTable.of(f).toMimeBundle());
        r.register(org.loopledger.control.DriveTiming.class, DriveTimingRenderer::render);
        r.register(org.loopledger.analysis.GangOfFour.class, GangOfFourRenderer::render);
        r.register(org.loopledger.sim.TimeResponse.class, TimeResponseRenderer::render);
        r.register(org.loopledger.ident.estimate.LoadCases.class, LoadCaseTable::render);
        r.register(org.loopledger.ident.estimate.LoadCaseEstimate.class, LoadCaseTable::render);
        r.register(org.loopledger.ident.log.DriveLog.class, DriveLogSummary::render);
    }
}
