package org.loopledger.notebook;

import org.loopledger.display.SpecReportJson;

import java.util.ArrayList;
import java.util.List;

/**
 * The spec checks found in a notebook's outputs. A spec report announces itself with the MIME type
 * {@value #MIME}; the format is {@link SpecReportJson}'s.
 */
public final class SpecSummary {
    /** The MIME type that carries a spec report in an output bundle. */
    public static final String MIME = SpecReportJson.MIME;

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
            SpecReportJson.Report r = SpecReportJson.read(json);
            List<Row> rows = new ArrayList<>();
            for (SpecReportJson.Row row : r.rows()) rows.add(new Row(row.requirement(), row.limit(), row.achieved(), row.at(), row.pass()));
            return new Check(cell, r.title(), rows);
        } catch (RuntimeException e) {
            return new Check(cell, "unreadable spec report (" + e.getMessage() + ")", List.of(new Row("report readable", "yes", "no", "", false)));
        }
    }
}
