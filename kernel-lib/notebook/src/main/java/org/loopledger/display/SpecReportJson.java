package org.loopledger.display;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import org.loopledger.analysis.SpecReport;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The spec-report format, defined here only: the JSON payload under {@value #MIME} in an output bundle, from which
 * a record's closing summary lists every spec check. An object
 * {@code {"title": ..., "rows": [{"requirement", "limit", "achieved", "at", "pass"}]}}, all strings except
 * {@code pass} (a boolean); {@code at} is the frequency of the achieved figure in Hz as text, or empty.
 * Every renderer that emits a spec report writes it with {@link #write}; the notebook side reads it with {@link #read}.
 */
public final class SpecReportJson {
    /** The MIME type that carries a spec report in an output bundle. */
    public static final String MIME = "application/vnd.loopledger.spec-report+json";

    /** Title of an untitled report. */
    public static final String DEFAULT_TITLE = "Spec check";

    /** One requirement with its outcome, as written. */
    public record Row(String requirement, String limit, String achieved, String at, boolean pass) {}

    /** A report as read back. */
    public record Report(String title, List<Row> rows) {
        public Report { rows = List.copyOf(rows); }
    }

    private SpecReportJson() {}

    /** The report under its own title ({@value #DEFAULT_TITLE} when it has none). */
    public static String write(SpecReport r) { return write(r.title().isEmpty() ? DEFAULT_TITLE : r.title(), r); }

    /** The report under {@code title}. */
    public static String write(String title, SpecReport r) {
        Objects.requireNonNull(title, "title");
        JsonObject o = new JsonObject();
        o.addProperty("title", title);
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

    /** The frequency of a row's achieved figure as the format writes it (empty when the row has none). */
    public static String at(SpecReport.Row row) {
        return row.frequencyHz().isPresent() ? Units.formatHz(row.frequencyHz().getAsDouble()) : "";
    }

    /**
     * Reads a payload; missing strings read as empty, a missing {@code pass} as false.
     *
     * @throws RuntimeException (Gson's) when the text is not such an object
     */
    public static Report read(String json) {
        JsonObject o = JsonParser.parseString(json).getAsJsonObject();
        List<Row> rows = new ArrayList<>();
        for (JsonElement e : o.getAsJsonArray("rows")) {
            JsonObject r = e.getAsJsonObject();
            rows.add(new Row(str(r, "requirement"), str(r, "limit"), str(r, "achieved"), str(r, "at"), r.has("pass") && r.get("pass").getAsBoolean()));
        }
        return new Report(str(o, "title"), rows);
    }

    private static String str(JsonObject o, String k) { return o.has(k) && !o.get(k).isJsonNull() ? o.get(k).getAsString() : ""; }
}
