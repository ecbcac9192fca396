package org.loopledger.display;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Spec;
import org.loopledger.analysis.SpecReport;
import org.loopledger.notebook.Cell;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.Output;
import org.loopledger.notebook.RecordInfo;
import org.loopledger.notebook.RecordRenderer;
import org.loopledger.notebook.SpecSummary;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

class SpecReportRendererTest {
    /** L = 2/(s+1)^3 against PM >= 45 deg, GM >= 6 dB, Ms <= 1.5, bandwidth >= 0.2 Hz. */
    static SpecReport report() {
        return Spec.builder().minPhaseMarginDeg(45).minGainMarginDb(6).maxSensitivityPeak(1.5).minBandwidthHz(0.2).build()
                .check(MarginsRendererTest.CUBIC_LAG);
    }

    @Test
    void htmlTableAndJsonPayloadCarryEveryRow() {
        SpecReport r = report();
        MimeBundle b = Bundles.of(r);
        assertEquals(List.of(MimeBundle.TEXT_PLAIN, MimeBundle.TEXT_HTML, SpecSummary.MIME), List.copyOf(b.data().keySet()));
        assertEquals(SpecSummary.MIME, SpecReportJson.MIME, "one format, one MIME type");
        assertEquals(SpecReportText.of(r), b.plainText());
        Document d = Jsoup.parse(b.get(MimeBundle.TEXT_HTML).orElseThrow());
        var rows = d.select("tbody tr");
        assertEquals(r.rows().size(), rows.size());
        // By hand (see MarginsRendererTest): PM 67.60 deg at 0.1220 Hz passes 45 deg, GM 12.04 dB at 0.2757 Hz passes 6 dB.
        var pm = d.select("tbody tr:contains(phase margin) td").eachText();
        assertEquals(List.of("phase margin", ">= 45 deg", "67.6 deg", "0.122 Hz", "met"), pm);
        var gm = d.select("tbody tr:contains(gain margin) td").eachText();
        assertEquals(List.of("gain margin (increase)", ">= 6 dB", "12.04 dB", "0.2757 Hz", "met"), gm);
        // Ms of this loop (1.667, analysis' own figure) exceeds 1.5: the row fails and is marked so.
        assertEquals("not met", d.select("tbody tr:contains(sensitivity peak) td.fail").text());
        assertTrue(d.select("caption").text().contains("1 of 4 requirements not met"), d.select("caption").text());

        JsonObject j = JsonParser.parseString(b.get(SpecSummary.MIME).orElseThrow()).getAsJsonObject();
        assertEquals(4, j.getAsJsonArray("rows").size());
        JsonObject first = j.getAsJsonArray("rows").get(0).getAsJsonObject();
        assertEquals(r.rows().get(0).requirement(), first.get("requirement").getAsString());
        assertEquals(r.rows().get(0).pass(), first.get("pass").getAsBoolean());
        assertEquals(b, Bundles.of(report()), "deterministic");
    }

    @Test
    void theFormatReadsBackWhatItWrites() {
        // Definition (SpecReportJson's Javadoc): every row's strings and verdict, under the given title; untitled reports
        // get the default title. A missing field reads as empty, a missing pass as false.
        SpecReport r = report();
        SpecReportJson.Report back = SpecReportJson.read(SpecReportJson.write("K/(s+1)^3", r));
        assertEquals("K/(s+1)^3", back.title());
        assertEquals(r.rows().size(), back.rows().size());
        for (int i = 0; i < r.rows().size(); i++) {
            SpecReport.Row w = r.rows().get(i);
            assertEquals(new SpecReportJson.Row(w.requirement(), w.limit(), w.achieved(), SpecReportJson.at(w), w.pass()), back.rows().get(i));
        }
        assertEquals(SpecReportJson.DEFAULT_TITLE, SpecReportJson.read(SpecReportJson.write(r)).title());
        assertEquals("velocity loop", SpecReportJson.read(SpecReportJson.write(r.titled("velocity loop"))).title());
        assertEquals(new SpecReportJson.Row("x", "", "", "", false), SpecReportJson.read("{\"rows\": [{\"requirement\": \"x\"}]}").rows().get(0));
        assertThrows(RuntimeException.class, () -> SpecReportJson.read("[]"));
    }

    @Test
    void theRecordsClosingSummaryListsEveryCheck() {
        MimeBundle b = Bundles.of(report());
        Notebook nb = new Notebook(5, "{}", List.of(new Cell.Code("s", "spec.check(l)", 1,
                List.of(new Output.ExecuteResult(1, b.data(), Map.of())), "{}")));
        var checks = SpecSummary.collect(nb);
        assertEquals(1, checks.size());
        assertEquals(4, checks.get(0).rows().size());
        assertFalse(checks.get(0).passed());
        Document d = Jsoup.parse(RecordRenderer.render(nb, new RecordInfo("s.ipynb", "2026-01-01", "0", "17", List.of())));
        var summary = d.select("section.rec-summary table.rec-verdicts tr");
        assertEquals(1 + 4, summary.size(), "header plus one row per requirement");
        assertTrue(d.select("section.rec-summary").text().contains("1 not met"));
        assertEquals("not met", d.select("section.rec-summary tr:contains(sensitivity peak) td.rec-not-met").text());
    }
}
