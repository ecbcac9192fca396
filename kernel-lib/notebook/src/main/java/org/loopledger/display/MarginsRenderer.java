package org.loopledger.display;

import org.loopledger.analysis.Bandwidth;
import org.loopledger.analysis.GainCrossover;
import org.loopledger.analysis.Margins;
import org.loopledger.analysis.Peak;
import org.loopledger.analysis.PhaseCrossover;

import java.util.Optional;

/**
 * {@link Margins} as HTML: a summary table (gain margins up and down, phase margin, delay margin, Ms,
 * peak |T|, bandwidth, each with its frequency), a table of every gain crossover and of every phase
 * crossover, and the warnings as a list; the plain text is {@link MarginsReportText}.
 * Units in the column headers (Hz, deg, dB, ms); all text escaped; deterministic.
 */
public final class MarginsRenderer {
    private MarginsRenderer() {}

    public static MimeBundle render(Margins m) {
        return MimeBundle.builder(MarginsReportText.of(m)).put(MimeBundle.TEXT_HTML, html(m)).build();
    }

    public static String html(Margins m) {
        String none = m.measured() ? "none in band" : "no crossover";
        StringBuilder h = new StringBuilder(2048);
        h.append("<div class=\"loopledger-margins\">");

        HtmlTable summary = HtmlTable.of("Stability margins", "Figure", "Value", "Unit", "At (Hz)");
        gainMarginRow(summary, "Gain margin (increase)", m.upperGainMargin(), none);
        gainMarginRow(summary, "Gain margin (decrease)", m.lowerGainMargin(), none);
        Optional<GainCrossover> pm = m.phaseMarginCrossover();
        summary.row("Phase margin", pm.map(g -> Figures.fixed2(g.phaseMarginDeg())).orElse(none), "deg", pm.map(g -> Figures.hz(g.omegaRadPerS())).orElse(Figures.NONE));
        if (m.delayMarginS().isPresent()) {
            GainCrossover worst = m.gainCrossovers().stream().min((a, b) -> Double.compare(a.delayMarginS(), b.delayMarginS())).orElseThrow();
            summary.row("Delay margin", Figures.ms(m.delayMarginS().getAsDouble()), "ms", Figures.hz(worst.omegaRadPerS()));
            if (m.delayMarginSamples().isPresent()) {
                summary.row("Delay margin", Figures.num(m.delayMarginSamples().getAsDouble()), "samples", Figures.hz(worst.omegaRadPerS()));
            }
        } else {
            summary.row("Delay margin", none, "ms", Figures.NONE);
        }
        peakRow(summary, "Ms = max |S|", m.sensitivityPeak());
        summary.row("Modulus margin 1/Ms", Figures.num(m.modulusMargin()), "", Figures.hz(m.sensitivityPeak().omegaRadPerS()));
        peakRow(summary, "Mt = max |T|", m.complementaryPeak());
        Bandwidth bw = m.bandwidth();
        summary.row("Bandwidth (-3 dB of T)", bw.frequencyHz().isPresent() ? Figures.num(bw.frequencyHz().getAsDouble()) : "none in band", "Hz", Figures.NONE);
        summary.row("Open-loop unstable poles", m.openLoopUnstablePoles().isPresent() ? String.valueOf(m.openLoopUnstablePoles().getAsInt()) : "not stated", "", Figures.NONE);
        summary.row("Net integrators", String.valueOf(m.netIntegrators()), "", Figures.NONE);
        summary.appendTo(h);

        HtmlTable gc = HtmlTable.of("Gain crossovers (|L| = 1)", "#", "Frequency (Hz)", "Phase of L (deg)", "Phase margin (deg)",
                "Delay margin (ms)", "Delay margin (samples)", "|1+L|");
        int i = 1;
        for (GainCrossover g : m.gainCrossovers()) {
            gc.rowWithClass(g.phaseMarginDeg() <= 0 ? "fail" : "", String.valueOf(i++), Figures.hz(g.omegaRadPerS()), Figures.fixed2(g.phaseDeg()),
                    Figures.fixed2(g.phaseMarginDeg()), Figures.ms(g.delayMarginS()), Figures.opt(g.delayMarginSamples()), Figures.num(g.distanceToMinusOne()));
        }
        if (gc.isEmpty()) gc.row(Figures.NONE, none, Figures.NONE, Figures.NONE, Figures.NONE, Figures.NONE, Figures.NONE);
        gc.appendTo(h);

        HtmlTable pc = HtmlTable.of("Phase crossovers (phase of L = -180 deg + k·360 deg)", "#", "Frequency (Hz)", "Phase of L (deg)", "|L|",
                "Gain margin (dB)", "Gain factor", "Limits", "|1+L|");
        PhaseCrossover up = m.upperGainMargin().orElse(null), down = m.lowerGainMargin().orElse(null);
        i = 1;
        for (PhaseCrossover p : m.phaseCrossovers()) {
            String limits = (p.limitsIncrease() ? "increase" : "decrease") + (p.equals(up) ? " (upper GM)" : p.equals(down) ? " (lower GM)" : "");
            pc.row(String.valueOf(i++), Figures.hz(p.omegaRadPerS()), Figures.fixed2(p.phaseDeg()), Figures.num(p.magnitude()),
                    Figures.fixed2(p.gainMarginDb()), Figures.num(p.gainMarginRatio()), limits, Figures.num(p.distanceToMinusOne()));
        }
        if (pc.isEmpty()) pc.row(Figures.NONE, none, Figures.NONE, Figures.NONE, Figures.NONE, Figures.NONE, Figures.NONE, Figures.NONE);
        pc.appendTo(h);

        if (!m.warnings().isEmpty()) {
            h.append("<ul class=\"loopledger-warnings\">");
            for (var w : m.warnings()) h.append("<li>").append(HtmlEscape.escape(w.message())).append("</li>");
            h.append("</ul>");
        }
        h.append("</div>");
        return h.toString();
    }

    private static void gainMarginRow(HtmlTable t, String label, Optional<PhaseCrossover> p, String none) {
        if (p.isEmpty()) {
            t.row(label, none, "dB", Figures.NONE);
        } else {
            PhaseCrossover c = p.get();
            t.row(label, Figures.fixed2(c.gainMarginDb()) + " (x" + Figures.num(c.gainMarginRatio()) + ")", "dB", Figures.hz(c.omegaRadPerS()));
        }
    }

    private static void peakRow(HtmlTable t, String label, Peak p) {
        t.row(label, Figures.num(p.magnitude()) + " (" + Figures.fixed2(p.magnitudeDb()) + " dB)" + (p.atBandEdge() ? ", at band edge" : ""), "",
                Figures.hz(p.omegaRadPerS()));
    }
}
