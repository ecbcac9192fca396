package org.loopledger.display;

import tech.tablesaw.api.Table;
import tech.tablesaw.columns.Column;

/**
 * Tablesaw tables as an escaped HTML table (first {@value #MAX_ROWS} rows, the shape stated) and as
 * Tablesaw's own fixed-width text for terminals.
 */
public final class TableRenderer {
    static final int MAX_ROWS = 200;

    private TableRenderer() {}

    public static MimeBundle render(Table t) {
        int rows = Math.min(t.rowCount(), MAX_ROWS);
        StringBuilder h = new StringBuilder(256 + rows * t.columnCount() * 16);
        h.append("<table class=\"loopledger-table\">");
        if (t.name() != null && !t.name().isEmpty()) h.append("<caption>").append(HtmlEscape.escape(t.name())).append("</caption>");
        h.append("<thead><tr>");
        for (Column<?> c : t.columns()) h.append("<th>").append(HtmlEscape.escape(c.name())).append("</th>");
        h.append("</tr></thead><tbody>");
        for (int r = 0; r < rows; r++) {
            h.append("<tr>");
            for (Column<?> c : t.columns()) h.append("<td>").append(HtmlEscape.escape(c.getString(r))).append("</td>");
            h.append("</tr>");
        }
        h.append("</tbody></table>");
        if (rows < t.rowCount()) {
            h.append("<p>").append(rows).append(" of ").append(t.rowCount()).append(" rows shown, ").append(t.columnCount()).append(" columns</p>");
        }
        String text = rows < t.rowCount() ? t.first(rows).printAll() + "\n... " + t.rowCount() + " rows in all" : t.printAll();
        return MimeBundle.builder(text).put(MimeBundle.TEXT_HTML, h.toString()).build();
    }
}
