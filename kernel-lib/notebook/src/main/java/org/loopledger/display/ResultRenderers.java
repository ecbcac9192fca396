package org.loopledger.display;

import org.loopledger.lti.Units;
import org.loopledger.analysis.Margins;
import org.loopledger.control.CoefficientTable;
import org.loopledger.ident.fit.BandQuality;
import org.loopledger.ident.fit.FitResult;
import org.loopledger.ident.fit.FitWarning;
import org.loopledger.ident.fit.RigidBodyFit;
import org.loopledger.ident.fit.TwoMassFit;
import org.loopledger.ident.fit.ParameterEstimate;
import org.loopledger.sim.Excitation;
import org.loopledger.sim.ResponseMetrics;
import org.loopledger.tune.LoadCaseFigures;
import org.loopledger.tune.Resonance;
import org.loopledger.tune.ResonanceWarning;
import org.loopledger.tune.TargetCheck;
import org.loopledger.tune.TuningResult;

import java.util.Locale;
import java.util.OptionalDouble;

/**
 * Tables for the result values of control, ident, sim and tune: drive filter coefficients, fitted
 * parameters with their intervals, step-response figures and tuning results. HTML with the units in
 * the column headers, every cell escaped; the plain text is each value's own {@code toString()}.
 */
public final class ResultRenderers {
    private ResultRenderers() {}

    /** Discrete filter coefficients, 15 significant digits (what a drive parameter needs), with the caution: see {@link FilterTable}. */
    public static MimeBundle coefficients(CoefficientTable t) {
        return FilterTable.of(t).toMimeBundle();
    }

    /** Fitted parameters (value, unit, standard error, 95 % interval), the fit quality per band, and the usability verdict with its warnings. */
    public static MimeBundle fit(FitResult r) {
        return html(r.toString(), fitHtml(r));
    }

    /** A two-mass fit: the estimate in words, then the fit's tables. */
    public static MimeBundle twoMassFit(TwoMassFit f) {
        return html(f.toString(), "<p>" + HtmlEscape.escape(f.estimate().toString()) + "</p>" + fitHtml(f.fit()));
    }

    /** A rigid-body fit: the estimate in words, then the fit's tables. */
    public static MimeBundle rigidBodyFit(RigidBodyFit f) {
        return html(f.toString(), "<p>" + HtmlEscape.escape(f.estimate().toString()) + "</p>" + fitHtml(f.fit()));
    }

    private static String fitHtml(FitResult r) {
        StringBuilder h = new StringBuilder("<div class=\"loopledger-fit\">");
        if (r.isUsable()) {
            h.append("<p><strong>Usable</strong>: no warning from the checks (fit quality, band, physical range, conditioning, "
                    + "determination, correlation, sub-band consistency)</p>");
        } else {
            h.append("<p><strong>Fit NOT usable</strong>: ").append(r.warnings().size()).append(r.warnings().size() == 1 ? " warning" : " warnings")
                    .append("</p>");
            HtmlTable w = HtmlTable.of("Why the fit cannot be used as it stands", "Check", "Parameter", "Frequency (Hz)", "Finding");
            for (FitWarning x : r.warnings()) {
                w.row(x.kind().name(), x.parameter().orElse(""), x.frequencyHz().isPresent() ? Figures.num(x.frequencyHz().getAsDouble()) : "", x.message());
            }
            w.appendTo(h);
        }
        HtmlTable p = HtmlTable.of(String.format(Locale.ROOT, "Fitted model: %d points, %d iterations, reduced chi-square %s", r.points(), r.iterations(),
                Figures.num(r.reducedChiSquare())), "Parameter", "Value", "Unit", "Standard error", "95 % low", "95 % high");
        for (ParameterEstimate e : r.parameters()) {
            p.row(e.name(), Figures.num(e.value()), e.unit(), Figures.num(e.standardError()), Figures.num(e.low95()), Figures.num(e.high95()));
        }
        p.appendTo(h);
        if (!r.quality().isEmpty()) {
            HtmlTable q = HtmlTable.of("Fit quality by band", "Band", "From (Hz)", "To (Hz)", "Points", "RMS magnitude error (dB)",
                    "RMS phase error (deg)", "Normalised error (%)", "Reduced chi-square");
            for (BandQuality b : r.quality()) {
                q.row(b.label(), Figures.num(b.fLowHz()), Figures.num(b.fHighHz()), String.valueOf(b.points()), Figures.num(b.rmsMagnitudeErrorDb()),
                        Figures.num(b.rmsPhaseErrorDeg()), Figures.num(b.normalisedErrorPercent()), Figures.num(b.reducedChiSquare()));
            }
            q.appendTo(h);
        }
        return h.append("</div>").toString();
    }

    /** Time-response figures of one simulated excitation. */
    public static MimeBundle response(ResponseMetrics m) {
        Excitation x = m.excitation();
        String unit = x.errorUnit(m.motion());
        boolean step = x == Excitation.POSITION_STEP || x == Excitation.VELOCITY_STEP;
        boolean disturbance = x == Excitation.TORQUE_DISTURBANCE_STEP;
        HtmlTable t = HtmlTable.of("Response to a " + x.label(m.motion()), "Figure", "Value", "Unit");
        if (step) {
            t.row("Rise time (10-90 %)", ms(m.riseTimeS()), "ms");
            t.row("Overshoot", Figures.opt(m.overshootPct()), "%");
        }
        if (x != Excitation.POSITION_RAMP) {
            t.row(disturbance ? "Recovery time (2 % of peak)" : "Settling time (2 % band)",
                    m.settlingTimeS().isPresent() ? ms(m.settlingTimeS()) : "not settled within " + Figures.num(m.recordLengthS()) + " s", "ms");
        }
        t.row(disturbance ? "Peak deviation" : "Peak following error", Figures.num(m.peakFollowingError()), unit);
        if (x == Excitation.POSITION_RAMP) t.row("Final following error", Figures.num(m.finalFollowingError()), unit);
        t.row("Peak current", Figures.num(m.peakCurrent()), "plant-input units (e.g. A)");
        return html(m.toString(), t.toString());
    }

    private static String ms(OptionalDouble s) { return s.isPresent() ? Figures.ms(s.getAsDouble()) : Figures.NONE; }

    /** A tuning result: verdict and binding constraint, the gains, the figures per load case, the search trace. */
    public static MimeBundle tuning(TuningResult r) {
        StringBuilder h = new StringBuilder("<div class=\"loopledger-tuning\">");
        h.append("<p><strong>").append(r.specMet() ? "Spec met" : "Spec NOT met").append("</strong>; binding constraint: ")
                .append(HtmlEscape.escape(r.bindingConstraint())).append("</p>");
        if (!r.targets().isEmpty()) {
            HtmlTable t = HtmlTable.of("Targets stated in the spec (worst load case, independent re-analysis)", "Target", "Asked (Hz)", "Achieved (Hz)",
                    "Load case", "Result");
            for (TargetCheck c : r.targets()) {
                t.row(c.kind().label(), Figures.num(c.askedHz()), Double.isNaN(c.achievedHz()) ? "none in band" : Figures.num(c.achievedHz()),
                        c.loadCase(), c.met() ? "met" : "MISSED: " + c.describe());
            }
            t.appendTo(h);
        }
        DriveGains gains = DriveGains.of(r.piv(), r.motion());
        gains.table().appendTo(h);
        if (r.filters().isEmpty()) h.append("<p>Filters on the current command: none</p>");
        else tuningFilters(r).table().appendTo(h);
        HtmlTable c = HtmlTable.of("Achieved figures per load case (independent re-analysis)", "Load case", "Velocity crossover (Hz)",
                "Velocity PM (deg)", "Velocity GM (dB)", "Velocity Ms", "Plant-input Ms", "Plant-input PM (deg)", "Position crossover (Hz)", "Position PM (deg)");
        for (LoadCaseFigures f : r.cases()) {
            c.row(f.label(), Figures.num(f.velocityCrossoverHz()), pm(f.velocityLoop()), gm(f.velocityLoop()), Figures.num(f.velocityLoop().sensitivityPeak().magnitude()),
                    Figures.num(f.plantInput().sensitivityPeak().magnitude()), pm(f.plantInput()), Figures.num(f.positionCrossoverHz()), pm(f.positionLoop()));
        }
        c.appendTo(h);
        if (!r.trace().isEmpty()) {
            h.append("<ol class=\"loopledger-trace\">");
            for (String s : r.trace()) h.append("<li>").append(HtmlEscape.escape(s)).append("</li>");
            h.append("</ol>");
        }
        h.append("<p>").append(r.evaluations()).append(" loop evaluations</p>");
        h.append("<p><strong>Caution.</strong> ").append(HtmlEscape.escape(DriveCaution.TEXT)).append("</p>");
        return html(tuningText(r), h.append("</div>").toString());
    }

    /** The filters of a tuning, with coefficients at the drive's sample rate when the timing is sampled. */
    private static FilterTable tuningFilters(TuningResult r) {
        return r.timing().isSampled() ? FilterTable.of(r.filters(), r.timing()) : FilterTable.of(r.filters());
    }

    /**
     * The tuning in plain text: its report ({@link TuningReportText}: verdict, gains, filters, figures per load case),
     * the gains in drive units, the filter coefficients, the search trace and the caution. No wall-clock time: it
     * reproduces.
     */
    static String tuningText(TuningResult r) {
        StringBuilder t = new StringBuilder(TuningReportText.of(r)).append('\n');
        t.append(DriveGains.of(r.piv(), r.motion()).table().toText());
        if (r.filters().isEmpty()) t.append("Filters on the current command: none\n");
        else t.append(tuningFilters(r).table().toText());
        if (!r.trace().isEmpty()) {
            t.append("search trace:\n");
            for (String s : r.trace()) t.append("  ").append(s).append('\n');
        }
        return t.append("Caution: ").append(DriveCaution.TEXT).toString();
    }

    /**
     * A notch proposal: its full report ({@link NotchProposalText}: resonances, the notch, the tuning without it, the
     * same gains with it on every load case, the re-tuning and whether the notch pays) with the drive caution, as text
     * and as preformatted HTML (never wrapped mid-number).
     */
    public static MimeBundle notchProposal(org.loopledger.tune.NotchProposal p) {
        String text = NotchProposalText.of(p) + "\nCaution: " + DriveCaution.TEXT;
        String html = "<div class=\"loopledger-notch-proposal\"><p><strong>" + HtmlEscape.escape(p.pays() ? "The notch pays." : "The notch does not pay here.")
                + "</strong></p><pre>" + HtmlEscape.escape(text) + "</pre></div>";
        return html(text, html);
    }

    /** A found resonance: frequency, prominence, half-power width, damping estimate, and any warning about its resolution. */
    public static MimeBundle resonance(Resonance r) {
        StringBuilder h = new StringBuilder("<div class=\"loopledger-resonance\">");
        HtmlTable t = HtmlTable.of("Resonance" + (r.dampingResolved() ? "" : " (damping NOT resolved)"), "Frequency (Hz)", "Above rigid-body trend (dB)",
                "Half-power width (Hz)", "Damping estimate");
        t.row(Figures.num(r.frequencyHz()), Figures.num(r.prominenceDb()), Figures.num(r.halfPowerWidthHz()),
                r.dampingResolved() ? Figures.num(r.dampingEstimate()) : Figures.num(r.dampingEstimate()) + " (not resolved)");
        t.appendTo(h);
        if (!r.warnings().isEmpty()) {
            h.append("<ul class=\"loopledger-warnings\">");
            for (ResonanceWarning w : r.warnings()) {
                h.append("<li><strong>").append(HtmlEscape.escape(w.kind().name())).append("</strong>: ").append(HtmlEscape.escape(w.message())).append("</li>");
            }
            h.append("</ul>");
        }
        return html(r.toString(), h.append("</div>").toString());
    }

    private static String pm(Margins m) { return m.phaseMarginDeg().isPresent() ? Figures.fixed2(m.phaseMarginDeg().getAsDouble()) : "none in band"; }

    private static String gm(Margins m) { return m.gainMarginDb().isPresent() ? Figures.fixed2(m.gainMarginDb().getAsDouble()) : "none in band"; }

    private static MimeBundle html(String text, String html) {
        return MimeBundle.builder(text).put(MimeBundle.TEXT_HTML, html).build();
    }
}
