package org.loopledger.notebook;

import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

class RecordAndVerifyTest {

    private static RecordInfo info() {
        return new RecordInfo("demo.ipynb", "2026-12-01", "0.1.0", "17.0.15",
                List.of(new RecordInfo.DatasetDigest("datasets/x.csv", 12, "ab".repeat(32))));
    }

    @Test
    void recordIsSelfContainedAndStatesItsProvenance() {
        String html = RecordRenderer.render(NotebookFormatTest.sample(), info());
        assertTrue(html.contains("<title>Axis X tuning</title>"));
        assertTrue(html.contains("SHA-256 " + "ab".repeat(32)));
        assertTrue(html.contains("ISO 12100"));
        assertTrue(html.contains("data:image/svg+xml;base64,"));
        assertFalse(html.contains("<script"), "no script at all");
        assertFalse(html.matches("(?s).*(src|href)=\"https?:.*"), "nothing fetched");
        assertTrue(html.contains("Synthetic demo &lt;b&gt;data&lt;/b&gt;."), "raw HTML in Markdown is escaped");
    }

    @Test
    void hostileOutputsRenderAsText() {
        // Common practice (OWASP XSS prevention): a record must never execute what a notebook output contains.
        Notebook nb = new Notebook(5, "{}", List.of(new Cell.Code("x", "x", 1, List.of(
                new Output.Stream("stdout", "<script>alert(1)</script>"),
                new Output.DisplayData(Map.of("text/html", "<table><tr><td>ok</td></tr></table><img src=x onerror=alert(1)><script>alert(2)</script>"), Map.of()),
                new Output.ExecuteResult(1, Map.of("text/plain", "<img src=x onerror=alert(3)>"), Map.of())), "{}")));
        String html = RecordRenderer.render(nb, info());
        assertFalse(html.contains("<script>alert"));
        assertFalse(html.matches("(?s).*<[^>]*onerror.*"), "no element carries an event handler");
        assertTrue(html.contains("&lt;img src=x onerror=alert(3)&gt;"), "plain text stays visible as text");
        assertTrue(html.contains("&lt;script&gt;alert(1)&lt;/script&gt;"));
        assertTrue(html.contains("<td>ok</td>"), "allowed table markup survives");
    }

    @Test
    void outputsCannotWearTheRecordsClassesAndTitleAndCautionAppearOnce() {
        // The record's own markup is rec-*; an output keeps only the library's output classes (RecordTrustInBrowserTest
        // checks the same in Chromium, computed styles included).
        Notebook nb = new Notebook(5, "{}", List.of(
                new Cell.Markdown("m", "# Axis Z\n\nIntro.\n\n> *Caution:* own words of this notebook.\n> Second line.\n\nMore.\n", "{}"),
                new Cell.Code("x", "x", 1, List.of(new Output.DisplayData(Map.of("text/html",
                        "<table class=\"rec-verdicts summary loopledger-table\" id=\"v\" style=\"color:red\"><tr><td class=\"rec-met pass\">met</td></tr></table>"), Map.of())), "{}")));
        org.jsoup.nodes.Document d = org.jsoup.Jsoup.parse(RecordRenderer.render(nb, info()));
        assertEquals(List.of("Axis Z"), d.select("h1").eachText(), "the notebook's heading is the record's title, once");
        assertEquals(List.of("loopledger-table", "pass"), d.select(".rec-output [class]").eachAttr("class"));
        assertTrue(d.select(".rec-output [id], .rec-output [style]").isEmpty());
        assertTrue(d.select(".rec-caution").first().text().startsWith("Caution: own words of this notebook. Second line."), d.select(".rec-caution").first().text());
        String text = d.body().text();
        assertEquals(text.indexOf("own words"), text.lastIndexOf("own words"), "the notebook's caution once");
        assertTrue(text.indexOf("Intro.") < text.indexOf("More."), text);
        assertTrue(d.select(".rec-caution").last().text().contains("ISO 12100"), "the library's caution closes the record");
    }

    @Test
    void htmlOutputsKeepEmbeddedPicturesOnly() {
        String png = "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg==";
        String out = RecordRenderer.sanitisedHtml("<p>a<img src=\"data:image/png;base64," + png + "\" alt=\"dot\" onerror=\"x()\">"
                + "<img src=\"http://192.0.2.1/beacon.png\"><img src=\"data:image/png;base64,PHN2Zz4=\"><img src=\"data:text/html,<script>x</script>\"></p>");
        org.jsoup.nodes.Document d = org.jsoup.Jsoup.parseBodyFragment(out);
        assertEquals(List.of("data:image/png;base64," + png), d.select("img").eachAttr("src"), out);
        assertFalse(out.contains("onerror") || out.contains("192.0.2.1") || out.contains("script"), out);
        assertEquals(3, out.split("image not shown", -1).length - 1, out);
    }

    @Test
    void specReportsAreSummarised() {
        String spec = "{\"title\":\"velocity loop\",\"rows\":[{\"requirement\":\"phase margin\",\"limit\":\">= 45 deg\",\"achieved\":\"52.1 deg\",\"at\":\"81 Hz\",\"pass\":true},"
                + "{\"requirement\":\"Ms\",\"limit\":\"<= 1.6\",\"achieved\":\"1.71\",\"at\":\"140 Hz\",\"pass\":false}]}";
        Notebook nb = new Notebook(5, "{}", List.of(new Cell.Code("x", "check()", 1,
                List.of(new Output.DisplayData(Map.of(SpecSummary.MIME, spec, "text/plain", "spec"), Map.of())), "{}")));
        var checks = SpecSummary.collect(nb);
        assertEquals(1, checks.size());
        assertFalse(checks.get(0).passed());
        String html = RecordRenderer.render(nb, info());
        assertTrue(html.contains("1 not met"));
        assertTrue(html.contains("52.1 deg"));
    }

    @Test
    void verifyToleratesRoundOffAndNamesTheCellThatChanged() {
        Notebook a = NotebookFormatTest.sample();
        OutputComparison cmp = OutputComparison.withTolerance(1e-6, 0);
        assertTrue(cmp.compare(a, a).allReproduced());
        assertNull(cmp.text("t", "gain 1.0000001 dB", "gain 1.0000002 dB"));
        // a SHA-256 is digits and letters: its long digit runs overflow a double but must still compare equal
        String sha = "SHA-256 d81ee0a709d7f87d2f23a8100292215d3af9f20249a8781919aa69e7ddf08d09" + "9".repeat(400);
        assertNull(cmp.text("t", sha, sha));
        assertNotNull(cmp.text("t", "gain 1.2 dB", "gain 1.3 dB"));
        assertNotNull(cmp.text("t", "gain 1.2 dB", "gain 1.2 Hz"));

        Cell.Code c1 = (Cell.Code) a.cells().get(1);
        Cell.Code changed = c1.withResults(1, List.of(new Output.Stream("stdout", "gain 1.3 dB\nline two\n"), c1.outputs().get(1)));
        Notebook b = a.withCells(List.of(a.cells().get(0), changed, a.cells().get(2), a.cells().get(3)));
        var report = cmp.compare(a, b);
        assertFalse(report.allReproduced());
        assertEquals(2, report.differing().get(0).cellNumber());
        assertTrue(report.toString().contains("1.2345 became 1.3"), report.toString());
    }
}
