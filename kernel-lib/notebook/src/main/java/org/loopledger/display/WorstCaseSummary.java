package org.loopledger.display;

import org.loopledger.analysis.GainCrossover;
import org.loopledger.analysis.SpecReport;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The conclusion of a {@link MarginsTable} in a few lines: the worst phase margin, gain margin and Ms over every
 * loop and load case with where they occur and the verdict against the spec (as the table's own worst-case block),
 * the range of each loop's first gain crossover over the load cases (lowest and highest, with their load cases), and,
 * when spec reports are given, how many pass and which fail.
 *
 * <pre>{@code
 * WorstCaseSummary.of(margins).withSpecChecks(reports)
 * }</pre>
 *
 * Nothing is recomputed: the figures are the table's. Immutable.
 */
public final class WorstCaseSummary implements Displayable {
    /** A loop's first gain crossover over the load cases: lowest and highest, with where. */
    public record CrossoverRange(String loop, double lowestHz, String lowestCase, double highestHz, String highestCase, int loadCases) {
        /** "182.9 Hz (heavy head) to 236.8 Hz (empty carriage)"; one value when every load case crosses at the same frequency. */
        public String text() {
            if (loadCases == 0) return "no gain crossover";
            String low = Units.formatHz(lowestHz), high = Units.formatHz(highestHz);
            if (low.equals(high)) return low + (loadCases == 1 ? " (" + lowestCase + ")" : " (every load case)");
            return low + " (" + lowestCase + ") to " + high + " (" + highestCase + ")";
        }
    }

    private final MarginsTable margins;
    private final List<SpecReport> reports; // empty: none given

    private WorstCaseSummary(MarginsTable margins, List<SpecReport> reports) {
        this.margins = Objects.requireNonNull(margins, "margins table");
        this.reports = List.copyOf(reports);
    }

    /** The worst figures and crossover ranges of {@code margins}. */
    public static WorstCaseSummary of(MarginsTable margins) { return new WorstCaseSummary(margins, List.of()); }

    /** With the outcome of these spec checks (each one line in the record's summary too). */
    public WorstCaseSummary withSpecChecks(List<SpecReport> reports) {
        Objects.requireNonNull(reports, "spec reports");
        if (reports.isEmpty()) throw new IllegalArgumentException("no spec reports given; leave out withSpecChecks when there are none");
        return new WorstCaseSummary(margins, reports);
    }

    /** Worst phase margin, gain margin and Ms, as the margins table finds them. */
    public List<WorstMargin> worst() {
        return List.of(margins.worstPhaseMargin(), margins.worstGainMargin(), margins.worstSensitivityPeak());
    }

    /** Per loop (in the table's order), the range of its first gain crossover over the load cases. */
    public List<CrossoverRange> crossovers() {
        Map<String, List<MarginsTable.Row>> byLoop = new LinkedHashMap<>();
        for (MarginsTable.Row r : margins.rows()) byLoop.computeIfAbsent(r.loop(), k -> new ArrayList<>()).add(r);
        List<CrossoverRange> out = new ArrayList<>();
        byLoop.forEach((loop, rows) -> {
            double lo = Double.NaN, hi = Double.NaN;
            String loCase = "", hiCase = "";
            int n = 0;
            for (MarginsTable.Row r : rows) {
                List<GainCrossover> g = r.margins().gainCrossovers();
                if (g.isEmpty()) continue;
                double f = g.stream().mapToDouble(GainCrossover::frequencyHz).min().getAsDouble();
                if (n == 0 || f < lo) { lo = f; loCase = r.loadCase(); }
                if (n == 0 || f > hi) { hi = f; hiCase = r.loadCase(); }
                n++;
            }
            out.add(new CrossoverRange(loop, lo, loCase, hi, hiCase, n));
        });
        return List.copyOf(out);
    }

    /** "9 of 9 spec checks pass", or how many fail and which; empty when no reports were given. */
    public String specChecks() {
        if (reports.isEmpty()) return "";
        List<String> failed = reports.stream().filter(r -> !r.passed()).map(r -> r.title().isEmpty() ? "(untitled)" : r.title()).toList();
        String head = (reports.size() - failed.size()) + " of " + reports.size() + " spec checks pass";
        return failed.isEmpty() ? head : head + "; FAIL: " + String.join("; ", failed);
    }

    private HtmlTable table() {
        HtmlTable t = HtmlTable.of("Worst case over every loop and load case" + (margins.spec().isPresent() ? ", against the spec" : " (no spec given: nothing checked)"),
                "Figure", "Value", "Where", "Verdict");
        for (WorstMargin w : worst()) t.rowWithClass(w.missed() ? "fail" : "", "worst " + w.figure(), w.valueText(), w.where(), w.verdict());
        for (CrossoverRange c : crossovers()) t.row("first gain crossover, " + c.loop(), c.text(), "", "");
        if (!reports.isEmpty()) {
            boolean fail = reports.stream().anyMatch(r -> !r.passed());
            t.rowWithClass(fail ? "fail" : "", "spec checks", specChecks(), "", fail ? "NOT all pass" : "all pass");
        }
        return t;
    }

    /** One line per figure: the worst values with their verdicts, the crossover ranges, the spec checks. */
    @Override public String toString() {
        StringBuilder t = new StringBuilder();
        for (WorstMargin w : worst()) t.append(w).append('\n');
        for (CrossoverRange c : crossovers()) t.append(c.loop()).append(", first gain crossover: ").append(c.text()).append('\n');
        if (!reports.isEmpty()) t.append(specChecks()).append('\n');
        return t.toString().stripTrailing();
    }

    @Override public MimeBundle toMimeBundle() {
        return MimeBundle.builder(toString()).put(MimeBundle.TEXT_HTML, "<div class=\"loopledger-margins-table\">" + table() + "</div>").build();
    }
}
