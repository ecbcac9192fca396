package org.loopledger.display;

import org.loopledger.analysis.GainCrossover;
import org.loopledger.analysis.LoopWarning;
import org.loopledger.analysis.Margins;
import org.loopledger.analysis.PhaseCrossover;
import org.loopledger.lti.Units;

/**
 * The plain-text report of a {@link Margins}: every margin with its frequency, the peaks, the bandwidth, the open
 * loop, every gain and phase crossover in a table, and the warnings. Deterministic (no times, no identities); the
 * plain-text form of its display, useful in a terminal client.
 */
public final class MarginsReportText {
    private MarginsReportText() {}

    private static String none(Margins m) { return m.measured() ? "none in band" : "no crossover"; }

    public static String of(Margins m) {
        StringBuilder b = new StringBuilder();
        b.append("Margins (").append(m.source()).append(")\n");
        b.append("  gain margin (increase): ").append(m.upperGainMargin().map(p -> Units.formatDb(p.gainMarginDb()) + " (x" + Units.g4(p.gainMarginRatio()) + ") at " + Units.formatRadPerSAsHz(p.omegaRadPerS())).orElse(none(m))).append('\n');
        b.append("  gain margin (decrease): ").append(m.lowerGainMargin().map(p -> Units.formatDb(p.gainMarginDb()) + " (x" + Units.g4(p.gainMarginRatio()) + ") at " + Units.formatRadPerSAsHz(p.omegaRadPerS())).orElse(none(m))).append('\n');
        b.append("  phase margin:           ").append(m.phaseMarginCrossover().map(g -> Units.formatDeg(g.phaseMarginDeg()) + " at " + Units.formatRadPerSAsHz(g.omegaRadPerS())).orElse(none(m))).append('\n');
        b.append("  delay margin:           ").append(m.phaseMarginCrossover().isPresent() ? Units.formatSeconds(m.delayMarginS().getAsDouble())
                + (m.delayMarginSamples().isPresent() ? " (" + Units.g4(m.delayMarginSamples().getAsDouble()) + " samples)" : "") : none(m)).append('\n');
        b.append("  Ms = max|S|:            ").append(m.sensitivityPeak()).append(", modulus margin 1/Ms = ").append(Units.g4(m.modulusMargin())).append('\n');
        b.append("  Mt = max|T|:            ").append(m.complementaryPeak()).append('\n');
        b.append("  bandwidth (-3 dB of T): ").append(m.bandwidth()).append('\n');
        b.append("  open loop:              ").append(m.openLoopUnstablePoles().isPresent() ? m.openLoopUnstablePoles().getAsInt() + " unstable pole(s)" : "unstable poles not stated")
                .append(", ").append(m.openLoopPolesOnAxis()).append(" on the stability boundary, net integrators ").append(m.netIntegrators()).append('\n');
        b.append("  gain crossovers (|L| = 1):");
        if (m.gainCrossovers().isEmpty()) b.append(' ').append(none(m)).append('\n');
        else {
            b.append('\n').append("    ").append(Units.padRight("frequency", 14)).append(Units.padRight("phase", 14)).append(Units.padRight("PM", 14))
                    .append(Units.padRight("delay margin", 16)).append("|1+L|\n");
            for (GainCrossover g : m.gainCrossovers()) {
                b.append("    ").append(Units.padRight(Units.formatRadPerSAsHz(g.omegaRadPerS()), 14)).append(Units.padRight(Units.formatDeg(g.phaseDeg()), 14))
                        .append(Units.padRight(Units.formatDeg(g.phaseMarginDeg()), 14)).append(Units.padRight(Units.formatSeconds(g.delayMarginS()), 16))
                        .append(Units.g4(g.distanceToMinusOne())).append('\n');
            }
        }
        b.append("  phase crossovers (phase = -180 deg + k 360 deg):");
        if (m.phaseCrossovers().isEmpty()) b.append(' ').append(none(m)).append('\n');
        else {
            b.append('\n').append("    ").append(Units.padRight("frequency", 14)).append(Units.padRight("phase", 14)).append(Units.padRight("|L|", 12))
                    .append(Units.padRight("GM", 24)).append("|1+L|\n");
            for (PhaseCrossover p : m.phaseCrossovers()) {
                b.append("    ").append(Units.padRight(Units.formatRadPerSAsHz(p.omegaRadPerS()), 14)).append(Units.padRight(Units.formatDeg(p.phaseDeg()), 14))
                        .append(Units.padRight(Units.g4(p.magnitude()), 12)).append(Units.padRight(Units.formatDb(p.gainMarginDb()) + " (x" + Units.g4(p.gainMarginRatio()) + ")", 24))
                        .append(Units.g4(p.distanceToMinusOne())).append('\n');
            }
        }
        for (LoopWarning w : m.warnings()) b.append("  note: ").append(w.message()).append('\n');
        return b.toString().stripTrailing();
    }
}
