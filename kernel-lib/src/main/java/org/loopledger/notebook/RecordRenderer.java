package org.loopledger.notebook;

import org.commonmark.parser.Parser;
import org.commonmark.renderer.html.HtmlRenderer;
import org.jsoup.Jsoup;
import org.jsoup.safety.Safelist;

import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.List;
import java.util.Map;

/**
 * Renders an executed notebook into a self-contained, printable HTML tuning record: inline CSS, plots
 * as inline images (SVG as a data URI, where its scripts cannot run, or PNG), no script, nothing
 * fetched. Every output is escaped or sanitised: Markdown goes through commonmark with raw HTML
 * escaped, HTML outputs through jsoup's allow-list, everything else is text.
 */
public final class RecordRenderer {
    /** The caution every record carries. */
    public static final String CAUTION = "Tuning moves real machinery. Try new gains first with reduced current and speed limits, "
            + "with guarding and an emergency stop in place, as the machine's risk assessment and the machinery-safety standards "
            + "that apply where it runs require (for example ISO 12100 and IEC 60204-1), under the responsibility of a competent, "
            + "authorised person. The figures in this record are engineering aids, not a certification of safety.";

    private static final Parser MARKDOWN = Parser.builder().build();
    private static final HtmlRenderer MARKDOWN_HTML = HtmlRenderer.builder().escapeHtml(true).sanitizeUrls(true).build();
    private static final Safelist HTML_OUTPUTS = Safelist.basic()
            .addTags("table", "thead", "tbody", "tfoot", "tr", "th", "td", "caption", "colgroup", "col", "h1", "h2", "h3", "h4", "div", "span", "hr")
            .addAttributes("th", "colspan", "rowspan", "class").addAttributes("td", "colspan", "rowspan", "class")
            .addAttributes("table", "class").addAttributes("tr", "class").addAttributes("span", "class").addAttributes("div", "class")
            .removeTags("a");

    private static final String CSS = """
            :root { --ink:#222830; --muted:#5b6470; --rule:#d9dde2; --accent:#1f6e78; --bad:#a83a32; --good:#3d6b2a; }
            * { box-sizing: border-box; }
            body { font: 10.5pt/1.45 "DejaVu Sans", "Liberation Sans", Arial, sans-serif; color: var(--ink); max-width: 190mm; margin: 12mm auto; padding: 0 6mm; }
            header.record { border-bottom: 2px solid var(--accent); margin-bottom: 1em; }
            header.record h1 { font-size: 17pt; margin: 0 0 .3em 0; }
            table.facts { border-collapse: collapse; font-size: 9pt; margin-bottom: .8em; }
            table.facts th { text-align: left; color: var(--muted); font-weight: normal; padding: 1px 12px 1px 0; vertical-align: top; }
            table.facts td { padding: 1px 0; word-break: break-all; }
            .caution { border-left: 4px solid var(--bad); background: #faf1ef; padding: .5em .8em; margin: 1em 0; font-size: 9.5pt; }
            .cell { margin: .6em 0; page-break-inside: avoid; break-inside: avoid; }
            .cell .label { color: var(--muted); font-size: 8pt; font-family: "DejaVu Sans Mono", monospace; }
            pre { font: 8.5pt/1.35 "DejaVu Sans Mono", "Liberation Mono", monospace; white-space: pre-wrap; word-break: break-word; margin: .2em 0; }
            pre.source { background: #f4f6f8; border: 1px solid var(--rule); padding: .4em .6em; }
            pre.stderr { color: var(--bad); }
            pre.error { color: var(--bad); border-left: 3px solid var(--bad); padding-left: .5em; }
            .output img { max-width: 100%; height: auto; display: block; margin: .3em 0; }
            .output table, table.summary { border-collapse: collapse; font-size: 9pt; margin: .3em 0; }
            .output th, .output td, table.summary th, table.summary td { border: 1px solid var(--rule); padding: 2px 6px; text-align: left; }
            td.pass { color: var(--good); font-weight: bold; } td.fail { color: var(--bad); font-weight: bold; }
            section.summary { border-top: 2px solid var(--accent); margin-top: 1.5em; page-break-before: auto; }
            @page { size: A4; margin: 14mm; }
            @media print { body { margin: 0; max-width: none; } .cell { page-break-inside: avoid; } section.summary { page-break-before: always; } }
            """;

    private RecordRenderer() {}

    /** The whole record as one HTML document. */
    public static String render(Notebook nb, RecordInfo info) {
        String title = nb.title(info.notebookName());
        StringBuilder h = new StringBuilder(64 * 1024);
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        h.append("<meta name=\"generator\" content=\"Loopledger ").append(esc(info.libraryVersion())).append("\">\n");
        h.append("<title>").append(esc(title)).append("</title>\n<style>\n").append(CSS).append("</style>\n</head>\n<body>\n");
        header(h, title, info);
        h.append("<div class=\"caution\"><strong>Caution.</strong> ").append(esc(CAUTION)).append("</div>\n");
        int n = 0;
        for (Cell c : nb.cells()) {
            n++;
            cell(h, c, n);
        }
        summary(h, SpecSummary.collect(nb));
        h.append("<div class=\"caution\"><strong>Caution.</strong> ").append(esc(CAUTION)).append("</div>\n");
        h.append("</body>\n</html>\n");
        return h.toString();
    }

    private static void header(StringBuilder h, String title, RecordInfo info) {
        h.append("<header class=\"record\">\n<h1>").append(esc(title)).append("</h1>\n<table class=\"facts\">\n");
        fact(h, "Notebook", info.notebookName());
        fact(h, "Run date", info.runDate());
        fact(h, "Library", "Loopledger " + info.libraryVersion());
        fact(h, "Java", info.javaVersion());
        if (info.datasets().isEmpty()) {
            fact(h, "Datasets", "none read");
        } else {
            for (RecordInfo.DatasetDigest d : info.datasets()) {
                fact(h, "Dataset", d.path() + " (" + d.bytes() + " bytes), SHA-256 " + d.sha256());
            }
        }
        h.append("</table>\n</header>\n");
    }

    private static void fact(StringBuilder h, String k, String v) {
        h.append("<tr><th>").append(esc(k)).append("</th><td>").append(esc(v)).append("</td></tr>\n");
    }

    private static void cell(StringBuilder h, Cell c, int n) {
        if (c instanceof Cell.Markdown md) {
            h.append("<div class=\"cell markdown\">").append(MARKDOWN_HTML.render(MARKDOWN.parse(md.source()))).append("</div>\n");
        } else if (c instanceof Cell.Code code) {
            h.append("<div class=\"cell code\">\n<div class=\"label\">cell ").append(n);
            if (code.executionCount() != null) h.append(" · run ").append(code.executionCount());
            h.append("</div>\n<pre class=\"source\">").append(esc(code.source())).append("</pre>\n<div class=\"output\">\n");
            for (Output o : code.outputs()) output(h, o);
            h.append("</div>\n</div>\n");
        } else {
            h.append("<div class=\"cell raw\"><pre>").append(esc(c.source())).append("</pre></div>\n");
        }
    }

    private static void output(StringBuilder h, Output o) {
        if (o instanceof Output.Stream s) {
            h.append("<pre class=\"").append(s.name()).append("\">").append(esc(s.text())).append("</pre>\n");
        } else if (o instanceof Output.Error e) {
            h.append("<pre class=\"error\">").append(esc(e.ename() + ": " + e.evalue()));
            for (String line : e.traceback()) h.append('\n').append(esc(stripAnsi(line)));
            h.append("</pre>\n");
        } else if (o instanceof Output.DisplayData d) {
            bundle(h, d.data());
        } else if (o instanceof Output.ExecuteResult r) {
            bundle(h, r.data());
        }
    }

    /** Picks the richest representation that a record can show safely. */
    private static void bundle(StringBuilder h, Map<String, String> data) {
        if (data.containsKey("image/svg+xml")) {
            String b64 = Base64.getEncoder().encodeToString(data.get("image/svg+xml").getBytes(StandardCharsets.UTF_8));
            h.append("<img alt=\"plot\" src=\"data:image/svg+xml;base64,").append(b64).append("\">\n");
        } else if (data.containsKey("image/png")) {
            String b64 = data.get("image/png").replaceAll("\\s", "");
            if (!b64.matches("[A-Za-z0-9+/=]*")) {
                h.append("<pre>[image/png output is not valid base64; not shown]</pre>\n");
                return;
            }
            h.append("<img alt=\"plot\" src=\"data:image/png;base64,").append(b64).append("\">\n");
        } else if (data.containsKey("text/html")) {
            h.append(Jsoup.clean(data.get("text/html"), HTML_OUTPUTS)).append('\n');
        } else if (data.containsKey("text/markdown")) {
            h.append(MARKDOWN_HTML.render(MARKDOWN.parse(data.get("text/markdown"))));
        } else if (data.containsKey("text/plain")) {
            h.append("<pre>").append(esc(data.get("text/plain"))).append("</pre>\n");
        }
    }

    private static void summary(StringBuilder h, List<SpecSummary.Check> checks) {
        h.append("<section class=\"summary\">\n<h2>Spec checks in this record</h2>\n");
        if (checks.isEmpty()) {
            h.append("<p>This notebook checks no spec.</p>\n");
        } else {
            long failed = checks.stream().filter(c -> !c.passed()).count();
            h.append("<p>").append(checks.size()).append(" spec check(s), ").append(failed == 0 ? "all met." : failed + " not met.").append("</p>\n");
            for (SpecSummary.Check c : checks) {
                h.append("<h3>").append(esc(c.title().isEmpty() ? "Spec check" : c.title())).append(" <small>(cell ").append(c.cellNumber())
                        .append(")</small></h3>\n<table class=\"summary\">\n<tr><th>Requirement</th><th>Limit</th><th>Achieved</th><th>At</th><th>Result</th></tr>\n");
                for (SpecSummary.Row r : c.rows()) {
                    h.append("<tr><td>").append(esc(r.requirement())).append("</td><td>").append(esc(r.limit())).append("</td><td>")
                            .append(esc(r.achieved())).append("</td><td>").append(esc(r.at())).append("</td><td class=\"")
                            .append(r.pass() ? "pass\">met" : "fail\">not met").append("</td></tr>\n");
                }
                h.append("</table>\n");
            }
        }
        h.append("</section>\n");
    }

    static String stripAnsi(String s) { return s.replaceAll("\u001B\\[[;\\d]*[A-Za-z]", ""); }

    /** HTML escaping of text content and attribute values (null as empty). */
    static String esc(String s) {
        return s == null ? "" : org.loopledger.display.HtmlEscape.escape(s);
    }
}
