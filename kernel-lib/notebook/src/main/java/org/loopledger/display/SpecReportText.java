package org.loopledger.display;

import org.loopledger.analysis.LoopWarning;
import org.loopledger.analysis.SpecReport;
import org.loopledger.lti.Units;

/**
 * The plain-text form of a {@link SpecReport}: the verdict line, a table of requirement, limit, achieved value,
 * frequency and result, and the analysis notes. Deterministic; the plain text of its display.
 */
public final class SpecReportText {
    private SpecReportText() {}

    public static String of(SpecReport r) {
        String[] head = {"requirement", "limit", "achieved", "at", "result"};
        int[] w = new int[head.length];
        for (int i = 0; i < head.length; i++) w[i] = head[i].length();
        String[][] cells = new String[r.rows().size()][];
        for (int k = 0; k < r.rows().size(); k++) {
            SpecReport.Row row = r.rows().get(k);
            cells[k] = new String[] {row.requirement(), row.limit(), row.achieved(),
                    row.frequencyHz().isPresent() ? Units.formatHz(row.frequencyHz().getAsDouble()) : "-", row.pass() ? "pass" : "FAIL"};
            for (int i = 0; i < w.length; i++) w[i] = Math.max(w[i], cells[k][i].length());
        }
        StringBuilder b = new StringBuilder(r.toString()).append('\n');
        line(b, head, w);
        StringBuilder rule = new StringBuilder();
        for (int i = 0; i < w.length; i++) rule.append("-".repeat(w[i])).append(i + 1 < w.length ? "  " : "");
        b.append(rule).append('\n');
        for (String[] c : cells) line(b, c, w);
        for (LoopWarning x : r.warnings()) b.append("note: ").append(x.message()).append('\n');
        return b.toString().stripTrailing();
    }

    private static void line(StringBuilder b, String[] c, int[] w) {
        for (int i = 0; i < c.length; i++) b.append(i + 1 < c.length ? Units.padRight(c[i], w[i] + 2) : c[i]);
        b.append('\n');
    }
}
