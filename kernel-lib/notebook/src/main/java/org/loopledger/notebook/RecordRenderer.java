package org.loopledger.notebook;

import com.google.gson.GsonBuilder;
import com.google.gson.JsonParser;
import org.commonmark.node.BlockQuote;
import org.commonmark.node.Emphasis;
import org.commonmark.node.Heading;
import org.commonmark.node.Node;
import org.commonmark.node.Paragraph;
import org.commonmark.node.StrongEmphasis;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.safety.Safelist;
import org.loopledger.display.ImageData;
import org.loopledger.display.MarkdownHtml;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

/**
 * Renders an executed notebook into a self-contained, printable HTML tuning record: inline CSS, pictures
 * as {@code data:} URIs (SVG through {@code <img>}, where its scripts cannot run), no script, nothing
 * fetched, and a Content-Security-Policy that forbids any fetch should something slip through.
 *
 * <p>What the record says itself and what the notebook's outputs say are kept apart. Every class of the
 * record's own markup starts with {@value #OWN}; outputs keep only classes from a short allow-list that
 * never starts with it, and sit in a framed output area, so an output cannot dress itself up as the
 * record's verdicts. Markdown goes through {@link MarkdownHtml} (raw HTML escaped, safe links, images
 * embedded or shown as link text, math typeset), HTML outputs through jsoup's allow-list, everything else
 * is text.
 *
 * <p>The record's title is the level-1 heading that opens the notebook's first cell (shown once, in the
 * record's header), else the notebook's name. The caution at the top is the notebook's own where its
 * opening Markdown carries one (a block quote starting with a bold or italic "Caution"), else the
 * library's; the library's caution always closes the record, after the summary of spec checks.
 */
public final class RecordRenderer {
    /** The caution every record carries. */
    public static final String CAUTION = "Tuning moves real machinery. Try new gains first with reduced current and speed limits, "
            + "with guarding and an emergency stop in place, as the machine's risk assessment and the machinery-safety standards "
            + "that apply where it runs require (for example ISO 12100 and IEC 60204-1), under the responsibility of a competent, "
            + "authorised person. The figures in this record are engineering aids, not a certification of safety.";

    /** Prefix of every class in the record's own markup; no output may carry a class with it. */
    public static final String OWN = "rec-";

    /** No fetch of any kind; pictures only as data URIs; the inline style sheet. Navigation by a click is not affected. */
    static final String CONTENT_SECURITY_POLICY = "default-src 'none'; img-src data:; style-src 'unsafe-inline'; base-uri 'none'; form-action 'none'";

    private static final Safelist HTML_OUTPUTS = Safelist.basic()
            .addTags("table", "thead", "tbody", "tfoot", "tr", "th", "td", "caption", "colgroup", "col", "h1", "h2", "h3", "h4", "div", "span", "hr")
            .addAttributes("th", "colspan", "rowspan", "class").addAttributes("td", "colspan", "rowspan", "class")
            .addAttributes("table", "class").addAttributes("tr", "class").addAttributes("span", "class").addAttributes("div", "class")
            .addAttributes("ul", "class").addAttributes("caption", "class")
            .addTags("img").addAttributes("img", "src", "alt", "width", "height").addProtocols("img", "src", "data")
            .removeTags("a");
    /** Classes an HTML output may keep: the library's own output markup (display package), styled inside the output frame only. */
    private static final Pattern OUTPUT_CLASS = Pattern.compile("loopledger-[a-z0-9-]+|pass|fail");
    /** MIME types that are data for tools beside a shown representation (plot data for verify, spec reports for the summary). */
    private static final Pattern COMPANION = Pattern.compile("application/vnd\\.loopledger\\..*");
    private static final Pattern CAUTION_MARK = Pattern.compile("(?i)caution\\s*[.:!]?");

    private static final String CSS = """
            :root { --ink:#222830; --muted:#5b6470; --rule:#d9dde2; --accent:#1f6e78; --bad:#a83a32; --good:#3d6b2a; }
            * { box-sizing: border-box; }
            body { font: 10.5pt/1.45 "DejaVu Sans", "Liberation Sans", Arial, sans-serif; color: var(--ink); max-width: 190mm; margin: 12mm auto; padding: 0 6mm; }
            header.rec-header { border-bottom: 2px solid var(--accent); margin-bottom: 1em; }
            header.rec-header h1 { font-size: 17pt; margin: 0 0 .3em 0; }
            table.rec-facts { border-collapse: collapse; font-size: 9pt; margin-bottom: .8em; }
            table.rec-facts th { text-align: left; color: var(--muted); font-weight: normal; padding: 1px 12px 1px 0; vertical-align: top; }
            table.rec-facts td { padding: 1px 0; word-break: break-all; }
            .rec-caution { border-left: 4px solid var(--bad); background: #faf1ef; padding: .5em .8em; margin: 1em 0; font-size: 9.5pt; }
            .rec-caution p { margin: .2em 0; }
            .rec-cell { margin: .6em 0; page-break-inside: avoid; break-inside: avoid; }
            .rec-label { color: var(--muted); font-size: 8pt; font-family: "DejaVu Sans Mono", monospace; }
            pre { font: 8.5pt/1.35 "DejaVu Sans Mono", "Liberation Mono", monospace; white-space: pre-wrap; word-break: break-word; margin: .2em 0; }
            pre.rec-source { background: #f4f6f8; border: 1px solid var(--rule); padding: .4em .6em; }
            pre.rec-stderr { color: var(--bad); }
            pre.rec-error { color: var(--bad); border-left: 3px solid var(--bad); padding-left: .5em; }
            .rec-md table, .rec-output table { border-collapse: collapse; font-size: 9pt; margin: .3em 0; }
            .rec-md th, .rec-md td, .rec-output th, .rec-output td { border: 1px solid var(--rule); padding: 2px 6px; text-align: left; }
            .rec-md img:not(.ll-math) { max-width: 100%; height: auto; }
            .ll-math { display: inline; }
            .ll-math-display { display: block; text-align: center; margin: .4em 0; }
            /* Outputs: framed, headings kept small, verdict colours without the record's badges. */
            .rec-output { border-left: 3px solid var(--rule); padding-left: .6em; margin-top: .2em; }
            .rec-output img:not(.ll-math) { max-width: 100%; height: auto; display: block; margin: .3em 0; }
            .rec-output h1, .rec-output h2, .rec-output h3, .rec-output h4 { font-size: 10pt; margin: .3em 0; }
            .rec-output td.pass { color: var(--good); } .rec-output td.fail { color: var(--bad); }
            .rec-output caption { text-align: left; font-style: italic; }
            .rec-note { color: var(--muted); font-style: italic; font-size: 9pt; margin: .2em 0; }
            /* The record's own verdicts: a band and badges that no output can borrow. */
            section.rec-summary { border-top: 4px double var(--accent); margin-top: 1.5em; page-break-before: auto; }
            section.rec-summary h2 { background: var(--accent); color: #fff; padding: .2em .5em; font-size: 13pt; }
            table.rec-verdicts { border-collapse: collapse; font-size: 9pt; margin: .3em 0; }
            table.rec-verdicts th, table.rec-verdicts td { border: 1px solid var(--rule); padding: 2px 6px; text-align: left; }
            td.rec-met, td.rec-not-met { color: #fff; font-weight: bold; text-align: center; }
            td.rec-met { background: var(--good); } td.rec-not-met { background: var(--bad); }
            @page { size: A4; margin: 14mm; }
            @media print { body { margin: 0; max-width: none; } .rec-cell { page-break-inside: avoid; } section.rec-summary { page-break-before: always; }
              td.rec-met, td.rec-not-met, section.rec-summary h2 { -webkit-print-color-adjust: exact; print-color-adjust: exact; } }
            """;

    private RecordRenderer() {}

    /** The whole record as one HTML document; relative image paths in Markdown are shown as link text. */
    public static String render(Notebook nb, RecordInfo info) {
        return render(nb, info, null);
    }

    /**
     * The whole record as one HTML document.
     *
     * @param notebookFolder the folder of the notebook file, whose image files Markdown may refer to by
     *                       relative path (they are embedded); null where no file may be read
     */
    public static String render(Notebook nb, RecordInfo info, Path notebookFolder) {
        Opening opening = Opening.of(nb, notebookFolder);
        String title = opening.title.orElse(info.notebookName());
        StringBuilder h = new StringBuilder(64 * 1024);
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        h.append("<meta http-equiv=\"Content-Security-Policy\" content=\"").append(esc(CONTENT_SECURITY_POLICY)).append("\">\n");
        h.append("<meta name=\"generator\" content=\"Loopledger ").append(esc(info.libraryVersion())).append("\">\n");
        h.append("<title>").append(esc(title)).append("</title>\n<style>\n").append(CSS).append("</style>\n</head>\n<body>\n");
        header(h, title, info);
        if (opening.cautionHtml.isPresent()) {
            h.append("<div class=\"rec-caution\">").append(opening.cautionHtml.get()).append("</div>\n");
        } else {
            standardCaution(h);
        }
        MarkdownHtml outputsMarkdown = MarkdownHtml.forRecord(new RecordImages(Map.of(), notebookFolder));
        int n = 0;
        for (Cell c : nb.cells()) {
            n++;
            Node parsed = opening.parsed.get(n - 1);
            if (parsed != null) {
                if (parsed.getFirstChild() != null) {
                    h.append("<div class=\"rec-cell rec-md\">").append(opening.markdown.get(n - 1).render(parsed)).append("</div>\n");
                }
            } else {
                cell(h, c, n, notebookFolder, outputsMarkdown);
            }
        }
        summary(h, SpecSummary.collect(nb));
        standardCaution(h);
        h.append("</body>\n</html>\n");
        return h.toString();
    }

    private static void standardCaution(StringBuilder h) {
        h.append("<div class=\"rec-caution\"><strong>Caution.</strong> ").append(esc(CAUTION)).append("</div>\n");
    }

    /**
     * The notebook's opening, the Markdown cells before its first other cell, parsed once so that the title
     * heading and the caution can be lifted out of them into the record's header and caution box.
     */
    private static final class Opening {
        final Map<Integer, Node> parsed = new LinkedHashMap<>();
        final Map<Integer, MarkdownHtml> markdown = new LinkedHashMap<>();
        Optional<String> title = Optional.empty();
        Optional<String> cautionHtml = Optional.empty();

        static Opening of(Notebook nb, Path folder) {
            Opening o = new Opening();
            for (int i = 0; i < nb.cells().size() && nb.cells().get(i) instanceof Cell.Markdown md; i++) {
                MarkdownHtml m = MarkdownHtml.forRecord(new RecordImages(md.attachments(), folder));
                o.parsed.put(i, m.parse(md.source()));
                o.markdown.put(i, m);
            }
            Node first = o.parsed.get(0);
            if (first != null && first.getFirstChild() instanceof Heading hd && hd.getLevel() == 1) {
                String t = MarkdownHtml.plainText(hd);
                if (!t.isEmpty()) {
                    o.title = Optional.of(t);
                    hd.unlink();
                }
            }
            for (var e : o.parsed.entrySet()) {
                for (Node block = e.getValue().getFirstChild(); block != null; block = block.getNext()) {
                    if (block instanceof BlockQuote q && isCaution(q)) {
                        StringBuilder b = new StringBuilder();
                        MarkdownHtml m = o.markdown.get(e.getKey());
                        for (Node child = q.getFirstChild(); child != null; child = child.getNext()) b.append(m.render(child));
                        o.cautionHtml = Optional.of(b.toString());
                        q.unlink();
                        return o;
                    }
                }
            }
            return o;
        }

        /** A block quote whose first paragraph starts with bold or italic "Caution" (with or without a stop or colon). */
        private static boolean isCaution(BlockQuote q) {
            if (!(q.getFirstChild() instanceof Paragraph p)) return false;
            Node lead = p.getFirstChild();
            return (lead instanceof StrongEmphasis || lead instanceof Emphasis) && CAUTION_MARK.matcher(MarkdownHtml.plainText(lead)).matches();
        }
    }

    private static void header(StringBuilder h, String title, RecordInfo info) {
        h.append("<header class=\"rec-header\">\n<h1>").append(esc(title)).append("</h1>\n<table class=\"rec-facts\">\n");
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

    private static void cell(StringBuilder h, Cell c, int n, Path folder, MarkdownHtml outputsMarkdown) {
        if (c instanceof Cell.Markdown md) {
            MarkdownHtml m = MarkdownHtml.forRecord(new RecordImages(md.attachments(), folder));
            h.append("<div class=\"rec-cell rec-md\">").append(m.render(md.source())).append("</div>\n");
        } else if (c instanceof Cell.Code code) {
            h.append("<div class=\"rec-cell rec-code\">\n<div class=\"rec-label\">cell ").append(n);
            if (code.executionCount() != null) h.append(" · run ").append(code.executionCount());
            h.append("</div>\n<pre class=\"rec-source\">").append(esc(code.source())).append("</pre>\n");
            if (!code.outputs().isEmpty()) {
                h.append("<div class=\"rec-output\">\n");
                for (Output o : code.outputs()) output(h, o, outputsMarkdown);
                h.append("</div>\n");
            }
            h.append("</div>\n");
        } else {
            h.append("<div class=\"rec-cell rec-raw\"><pre>").append(esc(c.source())).append("</pre></div>\n");
        }
    }

    private static void output(StringBuilder h, Output o, MarkdownHtml markdown) {
        if (o instanceof Output.Stream s) {
            h.append("<pre class=\"rec-").append(s.name()).append("\">").append(esc(s.text())).append("</pre>\n");
        } else if (o instanceof Output.Error e) {
            h.append("<pre class=\"rec-error\">").append(esc(e.ename() + ": " + e.evalue()));
            for (String line : e.traceback()) h.append('\n').append(esc(stripAnsi(line)));
            h.append("</pre>\n");
        } else if (o instanceof Output.DisplayData d) {
            bundle(h, d.data(), markdown);
        } else if (o instanceof Output.ExecuteResult r) {
            bundle(h, r.data(), markdown);
        }
    }

    /** The representations the record can show, richest first. */
    private static final List<String> SHOWN = List.of("image/svg+xml", "image/png", "image/jpeg", "image/gif",
            "text/markdown", "text/html", "text/latex", "application/json", "text/plain");

    /** Shows the richest representation the record can show safely, and says so where a type cannot be shown. */
    private static void bundle(StringBuilder h, Map<String, String> data, MarkdownHtml markdown) {
        String chosen = SHOWN.stream().filter(data::containsKey).findFirst().orElse(null);
        if (chosen != null) show(h, chosen, data.get(chosen), markdown);
        if (chosen == null || chosen.equals("text/plain")) {
            Set<String> unshown = new TreeSet<>();
            for (String mime : data.keySet()) if (!mime.equals("text/plain") && !COMPANION.matcher(mime).matches()) unshown.add(mime);
            if (!unshown.isEmpty()) {
                h.append("<p class=\"rec-note\">").append(chosen == null ? "Output" : "The richer form of this output")
                        .append(" of type ").append(esc(String.join(", ", unshown))).append(" is not shown in this record.</p>\n");
            } else if (chosen == null) {
                h.append("<p class=\"rec-note\">").append(data.isEmpty() ? "An output without data" : "An output with only tool data ("
                        + esc(String.join(", ", new TreeSet<>(data.keySet()))) + ")").append(" is not shown in this record.</p>\n");
            }
        }
    }

    private static void show(StringBuilder h, String mime, String value, MarkdownHtml markdown) {
        switch (mime) {
            case "image/svg+xml", "image/png", "image/jpeg", "image/gif" -> {
                Optional<String> uri = ImageData.fromBundle(mime, value);
                if (uri.isPresent()) {
                    h.append("<img alt=\"plot\" src=\"").append(uri.get()).append("\">\n");
                } else {
                    h.append("<p class=\"rec-note\">An output of type ").append(esc(mime)).append(" is not a valid image of that type and is not shown in this record.</p>\n");
                }
            }
            case "text/markdown" -> h.append("<div class=\"rec-md-output\">").append(markdown.render(value)).append("</div>\n");
            case "text/html" -> h.append(sanitisedHtml(value)).append('\n');
            case "text/latex" -> h.append("<div class=\"rec-latex\">").append(latex(value, markdown)).append("</div>\n");
            case "application/json" -> h.append("<pre>").append(esc(prettyJson(value))).append("</pre>\n");
            default -> h.append("<pre>").append(esc(value)).append("</pre>\n");
        }
    }

    /**
     * An HTML output through the allow-list, keeping only the output classes that never match the record's own, and
     * pictures only as embedded data URIs.
     */
    static String sanitisedHtml(String html) {
        Document d = Jsoup.parseBodyFragment(Jsoup.clean(html, HTML_OUTPUTS));
        d.outputSettings().prettyPrint(false);
        for (Element e : d.body().select("[class]")) {
            String kept = e.classNames().stream().filter(c -> OUTPUT_CLASS.matcher(c).matches()).collect(Collectors.joining(" "));
            if (kept.isEmpty()) e.removeAttr("class"); else e.attr("class", kept);
        }
        d.body().select("[id], [style]").forEach(e -> e.removeAttr("id").removeAttr("style"));
        for (Element img : d.body().select("img")) {
            // Only embeddable pictures whose bytes match their type; anything else would be a broken image or a fetch.
            Optional<String> uri = ImageData.fromDataUri(img.attr("src"));
            if (uri.isPresent()) img.attr("src", uri.get()); else img.replaceWith(new org.jsoup.nodes.TextNode("[image not shown: not an embedded picture]"));
        }
        return d.body().html();
    }

    /** A text/latex output: one formula in $$, \[ \], $ or an environment typeset whole; anything else as Markdown with math. */
    private static String latex(String value, MarkdownHtml markdown) {
        String t = value.strip();
        if (t.length() > 4 && t.startsWith("$$") && t.endsWith("$$") && !t.substring(2, t.length() - 2).contains("$")) {
            return MarkdownHtml.formulaHtml(t.substring(2, t.length() - 2), true, t);
        }
        if (t.length() > 4 && t.startsWith("\\[") && t.endsWith("\\]")) return MarkdownHtml.formulaHtml(t.substring(2, t.length() - 2), true, t);
        if (t.length() > 2 && t.startsWith("$") && t.endsWith("$") && !t.substring(1, t.length() - 1).contains("$")) {
            return MarkdownHtml.formulaHtml(t.substring(1, t.length() - 1), false, t);
        }
        if (t.startsWith("\\begin{")) return MarkdownHtml.formulaHtml(t, true, t);
        return markdown.render(value);
    }

    private static String prettyJson(String json) {
        try {
            return new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().create().toJson(JsonParser.parseString(json));
        } catch (RuntimeException e) {
            return json;
        }
    }

    private static void summary(StringBuilder h, List<SpecSummary.Check> checks) {
        h.append("<section class=\"rec-summary\">\n<h2>Spec checks in this record</h2>\n");
        if (checks.isEmpty()) {
            h.append("<p>This notebook checks no spec.</p>\n");
        } else {
            long failed = checks.stream().filter(c -> !c.passed()).count();
            h.append("<p>").append(checks.size()).append(" spec check(s), ").append(failed == 0 ? "all met." : failed + " not met.").append("</p>\n");
            for (SpecSummary.Check c : checks) {
                h.append("<h3>").append(esc(c.title().isEmpty() ? "Spec check" : c.title())).append(" <small>(cell ").append(c.cellNumber())
                        .append(")</small></h3>\n<table class=\"rec-verdicts\">\n<tr><th>Requirement</th><th>Limit</th><th>Achieved</th><th>At</th><th>Result</th></tr>\n");
                for (SpecSummary.Row r : c.rows()) {
                    h.append("<tr><td>").append(esc(r.requirement())).append("</td><td>").append(esc(r.limit())).append("</td><td>")
                            .append(esc(r.achieved())).append("</td><td>").append(esc(r.at())).append("</td><td class=\"")
                            .append(r.pass() ? "rec-met\">met" : "rec-not-met\">not met").append("</td></tr>\n");
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
