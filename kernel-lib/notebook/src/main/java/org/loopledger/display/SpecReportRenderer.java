package org.loopledger.display;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.loopledger.analysis.SpecReport;
import org.loopledger.lti.Units;

/**
 * A {@link SpecReport} as an HTML pass/fail table (requirement, limit, achieved, frequency, result)
 * with the analysis warnings below, as its own plain-text table, and as the JSON payload under
 * {@value #SPEC_REPORT_MIME} from which the tuning record's closing summary lists every spec check
 * (the format of {@code org.loopledger.notebook.SpecSummary}; display does not depend on notebook,
 * so the type is spelled here too and a test keeps the two equal).
 */
public final class SpecReportRenderer {
    /** MIME type of the spec-report payload; equal to {@code SpecSummary.MIME}. */
    public static final String SPEC_REPORT_MIME = "application/vnd.loopledger.spec-report+json";

    /** Title of an untitled check in the record's summary. */
    static final String TITLE = "Spec check";

    private static String title(SpecReport r) { return r.title().isEmpty() ? TITLE : TITLE + ", " + r.title(); }

    private SpecReportRenderer() {}

    public static MimeBundle render(SpecReport r) {
        return MimeBundle.builder(r.toString()).put(MimeBundle.TEXT_HTML, html(r)).put(SPEC_REPORT_MIME, json(r)).build();
    }

    private static String at(SpecReport.Row row) {
        return row.frequencyHz().isPresent() ? Units.formatHz(row.frequencyHz().getAsDouble()) : "";
    }

    public static String html(SpecReport r) {
        String verdict = r.passed() ? "all " + r.rows().size() + " requirements met" : r.failures().size() + " of " + r.rows().size() + " requirements not met";
        StringBuilder h = new StringBuilder(1024);
        h.append("<div class=\"loopledger-spec\">");
        h.append("<table class=\"loopledger-table\"><caption>").append(HtmlEscape.escape(title(r) + ": " + verdict)).append("</caption>");
        h.append("<thead><tr><th>Requirement</th><th>Limit</th><th>Achieved</th><th>At</th><th>Result</th></tr></thead><tbody>");
        for (SpecReport.Row row : r.rows()) {
            h.append("<tr><td>").append(HtmlEscape.escape(row.requirement())).append("</td><td>").append(HtmlEscape.escape(row.limit()))
                    .append("</td><td>").append(HtmlEscape.escape(row.achieved())).append("</td><td>").append(HtmlEscape.escape(at(row)))
                    .append("</td><td class=\"").append(row.pass() ? "pass\">met" : "fail\">not met").append("</td></tr>");
        }
        h.append("</tbody></table>");
        if (!r.warnings().isEmpty()) {
            h.append("<ul class=\"loopledger-warnings\">");
            for (String w : r.warnings()) h.append("<li>").append(HtmlEscape.escape(w)).append("</li>");
            h.append("</ul>");
        }
        return h.append("</div>").toString();
    }

    /** The payload SpecSummary reads: title and rows of requirement, limit, achieved, at, pass. */
    public static String json(SpecReport r) {
        JsonObject o = new JsonObject();
        o.addProperty("title", r.title().isEmpty() ? TITLE : r.title());
        JsonArray rows = new JsonArray();
        for (SpecReport.Row row : r.rows()) {
            JsonObject j = new JsonObject();
            j.addProperty("requirement", row.requirement());
            j.addProperty("limit", row.limit());
            j.addProperty("achieved", row.achieved());
            j.addProperty("at", at(row));
            j.addProperty("pass", row.pass());
            rows.add(j);
        }
        o.add("rows", rows);
        return o.toString();
    }
}
