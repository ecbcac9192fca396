package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Margins;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.notebook.Cell;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.Output;
import org.loopledger.notebook.RecordInfo;
import org.loopledger.notebook.RecordRenderer;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class MarginsRendererTest {
    /** L = 2/(s+1)^3. */
    static final TransferFunction CUBIC_LAG = TransferFunction.continuous(new double[] {2}, new double[] {1, 3, 3, 1});
    /** L = 2(s+1)^2/s^3: conditionally stable (closed loop s^3 + 2s^2 + 4s + 2, Routh: 2·4 > 2). */
    static final TransferFunction CONDITIONAL = TransferFunction.continuous(new double[] {2, 4, 2}, new double[] {1, 0, 0, 0});

    /** The table whose caption starts with {@code caption}, as rows of cell texts (header row first). */
    static List<List<String>> table(Document d, String caption) {
        for (Element t : d.select("table")) {
            if (t.selectFirst("caption") != null && t.selectFirst("caption").text().startsWith(caption)) {
                List<List<String>> rows = new ArrayList<>();
                for (Element tr : t.select("tr")) rows.add(tr.select("th, td").eachText());
                return rows;
            }
        }
        throw new AssertionError("no table captioned " + caption);
    }

    static List<String> row(List<List<String>> table, String first) {
        return table.stream().filter(r -> r.get(0).equals(first)).findFirst().orElseThrow(() -> new AssertionError("no row " + first + " in " + table));
    }

    @Test
    void cubicLagShowsEveryFigureWithItsFrequency() {
        Margins m = Margins.of(CUBIC_LAG);
        MimeBundle b = Bundles.of(m);
        assertEquals(MarginsReportText.of(m), b.plainText());
        Document d = Jsoup.parse(b.get(MimeBundle.TEXT_HTML).orElseThrow());
        var summary = table(d, "Stability margins");
        assertEquals(List.of("Figure", "Value", "Unit", "At (Hz)"), summary.get(0));
        // Derivation by hand: phase -180 deg where 3·atan(w) = 180 deg, w = sqrt(3) rad/s = 0.2757 Hz; |L| = 2/(1+3)^(3/2) = 1/4,
        // so GM = 4 = 12.04 dB. |L| = 1 where (1+w^2)^(3/2) = 2, w = sqrt(2^(2/3) - 1) = 0.7664 rad/s = 0.1220 Hz, phase
        // -3·atan(0.7664) = -112.40 deg, PM = 67.60 deg, delay margin 1.1798 rad / 0.7664 rad/s = 1.539 s.
        assertEquals(List.of("Gain margin (increase)", "12.04 (x4)", "dB", "0.2757"), row(summary, "Gain margin (increase)"));
        assertEquals(List.of("Gain margin (decrease)", "no crossover", "dB", "–"), row(summary, "Gain margin (decrease)"));
        assertEquals(List.of("Phase margin", "67.6", "deg", "0.122"), row(summary, "Phase margin"));
        assertEquals(List.of("Delay margin", "1539", "ms", "0.122"), row(summary, "Delay margin"));
        var gc = table(d, "Gain crossovers");
        assertEquals(2, gc.size(), "one gain crossover");
        assertEquals(List.of("1", "0.122", "-112.4", "67.6", "1539"), gc.get(1).subList(0, 5));
        var pc = table(d, "Phase crossovers");
        assertEquals(2, pc.size(), "one phase crossover");
        assertEquals(List.of("1", "0.2757", "-180", "0.25", "12.04", "4", "increase (upper GM)"), pc.get(1).subList(0, 7));
        // Ms, Mt and bandwidth come straight from the value (analysis tests check the numbers against SciPy).
        assertEquals(Figures.num(m.sensitivityPeak().magnitude()) + " (" + Figures.fixed2(m.sensitivityPeak().magnitudeDb()) + " dB)", row(summary, "Ms = max |S|").get(1));
        assertEquals(Figures.num(m.bandwidth().frequencyHz().getAsDouble()), row(summary, "Bandwidth (-3 dB of T)").get(1));
        assertEquals(b, Bundles.of(Margins.of(CUBIC_LAG)), "deterministic");
    }

    @Test
    void conditionallyStableLoopShowsTheLowerGainMargin() {
        Document d = Jsoup.parse(MarginsRenderer.html(Margins.of(CONDITIONAL)));
        // Derivation by hand: phase = -270 + 2·atan(w) deg is -180 deg at w = 1 rad/s = 0.1592 Hz, where |L| = 2·2/1 = 4:
        // the gain may fall by a factor 1/4 (-12.04 dB) before the loop goes unstable. |L| = 1 at the real root of
        // w^3 - 2w^2 - 2 = 0, w = 2.3593 rad/s = 0.3755 Hz (numpy.roots), phase -135.94 deg, PM 44.06 deg.
        var summary = table(d, "Stability margins");
        assertEquals(List.of("Gain margin (decrease)", "-12.04 (x0.25)", "dB", "0.1592"), row(summary, "Gain margin (decrease)"));
        assertEquals(List.of("Phase margin", "44.06", "deg", "0.3755"), row(summary, "Phase margin"));
        var pc = table(d, "Phase crossovers");
        assertEquals("decrease (lower GM)", pc.get(1).get(6));
    }

    @Test
    void measuredLoopWarningsAreListedAndEscaped() {
        // A loop measured only below its crossover: the analysis warns that the crossover lies above the band.
        Frf f = Frf.ofModel(TransferFunction.continuous(new double[] {100}, new double[] {1, 0}), FrequencyGrid.logSpacedRadPerS(0.1, 1, 50));
        Margins m = Margins.of(f);
        Document d = Jsoup.parse(MarginsRenderer.html(m));
        assertFalse(m.warnings().isEmpty());
        assertEquals(m.warnings().stream().map(w -> w.message()).toList(), d.select("ul.loopledger-warnings li").eachText());
        assertEquals("none in band", row(table(d, "Stability margins"), "Phase margin").get(1));
        String html = MarginsRenderer.html(m);
        assertFalse(html.contains("|L| < 1") || html.matches("(?s).*<[^/a-z].*"), "every < in text is escaped");
    }

    @Test
    void tablesSurviveTheRecordSanitiser() {
        MimeBundle b = Bundles.of(Margins.of(CUBIC_LAG));
        Notebook nb = new Notebook(5, "{}", List.of(new Cell.Code("m", "Margins.of(l)", 1,
                List.of(new Output.ExecuteResult(1, b.data(), java.util.Map.of())), "{}")));
        String record = RecordRenderer.render(nb, new RecordInfo("m.ipynb", "2026-01-01", "0", "17", List.of()));
        Document d = Jsoup.parse(record);
        assertEquals(List.of("Gain margin (increase)", "12.04 (x4)", "dB", "0.2757"), row(table(d, "Stability margins"), "Gain margin (increase)"));
        assertEquals(2, table(d, "Phase crossovers").size());
    }
}
