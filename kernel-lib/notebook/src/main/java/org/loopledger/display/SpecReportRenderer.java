package org.loopledger.display;

import org.loopledger.analysis.SpecReport;

/**
 * A {@link SpecReport} as an HTML pass/fail table (requirement, limit, achieved, frequency, result)
 * with the analysis warnings below, as a plain-text table ({@link SpecReportText}), and as the spec-report payload
 * ({@link SpecReportJson}) from which the record's closing summary lists every spec check.
 */
public final class SpecReportRenderer {
    /** Title of an untitled check. */
    static final String TITLE = SpecReportJson.DEFAULT_TITLE;

    private static String title(SpecReport r) { return r.title().isEmpty() ? TITLE : TITLE + ", " + r.title(); }

    private SpecReportRenderer() {}

    public static MimeBundle render(SpecReport r) {
        return MimeBundle.builder(SpecReportText.of(r)).put(MimeBundle.TEXT_HTML, html(r)).put(SpecReportJson.MIME, SpecReportJson.write(r)).build();
    }

    public static String html(SpecReport r) {
        String verdict = r.passed() ? "all " + r.rows().size() + " requirements met" : r.failures().size() + " of " + r.rows().size() + " requirements not met";
        StringBuilder h = new StringBuilder(1024);
        h.append("<div class=\"loopledger-spec\">");
        h.append("<table class=\"loopledger-table\"><caption>").append(HtmlEscape.escape(title(r) + ": " + verdict)).append("</caption>");
        h.append("<thead><tr><th>Requirement</th><th>Limit</th><th>Achieved</th><th>At</th><th>Result</th></tr></thead><tbody>");
        for (SpecReport.Row row : r.rows()) {
            h.append("<tr><td>").append(HtmlEscape.escape(row.requirement())).append("</td><td>").append(HtmlEscape.escape(row.limit()))
                    .append("</td><td>").append(HtmlEscape.escape(row.achieved())).append("</td><td>").append(HtmlEscape.escape(SpecReportJson.at(row)))
                    .append("</td><td class=\"").append(row.pass() ? "pass\">met" : "fail\">not met").append("</td></tr>");
        }
        h.append("</tbody></table>");
        if (!r.warnings().isEmpty()) {
            h.append("<ul class=\"loopledger-warnings\">");
            for (var w : r.warnings()) h.append("<li>").append(HtmlEscape.escape(w.message())).append("</li>");
            h.append("</ul>");
        }
        return h.append("</div>").toString();
    }
}
