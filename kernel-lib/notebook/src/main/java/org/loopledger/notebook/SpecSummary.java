package org.loopledger.notebook;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;

import java.util.ArrayList;
import java.util.List;

/**
 * The spec checks found in a notebook's outputs. A spec report announces itself with the MIME type
 * {@value #MIME}: a JSON object {@code {"title": ..., "rows": [{"requirement", "limit", "achieved",
 * "at", "pass"}]}}, all strings except {@code pass}.
 */
public final class SpecSummary {
    /** The MIME type that carries a spec report in an output bundle. */
    public static final String MIME = "application/vnd.loopledger.spec-report+json";

    /** One requirement with its outcome. */
    public record Row(String requirement, String limit, String achieved, String at, boolean pass) {}

    /** One spec check: the cell it came from, its title and its rows. */
    public record Check(int cellNumber, String title, List<Row> rows) {
        public Check { rows = List.copyOf(rows); }

        public boolean passed() { return rows.stream().allMatch(Row::pass); }
    }

    private SpecSummary() {}

    /** Every spec report in the notebook's outputs, in cell order (cells numbered from 1). */
    public static List<Check> collect(Notebook nb) {
        List<Check> out = new ArrayList<>();
        int n = 0;
        for (Cell c : nb.cells()) {
            n++;
            if (!(c instanceof Cell.Code code)) continue;
            for (Output o : code.outputs()) {
                String json = null;
                if (o instanceof Output.DisplayData d) json = d.data().get(MIME);
                if (o instanceof Output.ExecuteResult r) json = r.data().get(MIME);
                if (json != null) out.add(parse(n, json));
            }
        }
        return out;
    }

    private static Check parse(int cell, String json) {
        try {
            JsonObject o = JsonParser.parseString(json).getAsJsonObject();
            List<Row> rows = new ArrayList<>();
            for (JsonElement e : o.getAsJsonArray("rows")) {
                JsonObject r = e.getAsJsonObject();
                rows.add(new Row(str(r, "requirement"), str(r, "limit"), str(r, "achieved"), str(r, "at"), r.has("pass") && r.get("pass").getAsBoolean()));
            }
            return new Check(cell, str(o, "title"), rows);
        } catch (RuntimeException e) {
            return new Check(cell, "unreadable spec report (" + e.getMessage() + ")", List.of(new Row("report readable", "yes", "no", "", false)));
        }
    }

    private static String str(JsonObject o, String k) { return o.has(k) && !o.get(k).isJsonNull() ? o.get(k).getAsString() : ""; }
}
