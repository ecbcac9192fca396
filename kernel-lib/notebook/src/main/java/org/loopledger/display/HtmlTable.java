package org.loopledger.display;

import java.util.ArrayList;
import java.util.List;

/**
 * A small builder for the escaped HTML tables the domain renderers emit: a caption, a header row
 * whose labels carry the units, body rows. Every cell is text and is escaped; the markup uses only
 * tags and attributes that the tuning record's sanitiser keeps (table, caption, thead, tbody, tr,
 * th, td, class).
 */
final class HtmlTable {
    private final String caption;
    private final List<String> header;
    private final List<List<String>> rows = new ArrayList<>();
    private final List<String> rowClasses = new ArrayList<>();

    private HtmlTable(String caption, List<String> header) {
        this.caption = caption;
        this.header = List.copyOf(header);
    }

    static HtmlTable of(String caption, String... header) { return new HtmlTable(caption, List.of(header)); }

    HtmlTable row(String... cells) { return rowWithClass("", cells); }

    /** A row whose {@code <tr>} carries {@code cssClass} (empty for none). */
    HtmlTable rowWithClass(String cssClass, String... cells) {
        if (cells.length != header.size()) {
            throw new IllegalArgumentException("row has " + cells.length + " cells but the table has " + header.size() + " columns");
        }
        rows.add(List.of(cells));
        rowClasses.add(cssClass);
        return this;
    }

    boolean isEmpty() { return rows.isEmpty(); }

    void appendTo(StringBuilder h) {
        h.append("<table class=\"loopledger-table\">");
        if (caption != null && !caption.isEmpty()) h.append("<caption>").append(HtmlEscape.escape(caption)).append("</caption>");
        h.append("<thead><tr>");
        for (String c : header) h.append("<th>").append(HtmlEscape.escape(c)).append("</th>");
        h.append("</tr></thead><tbody>");
        for (int i = 0; i < rows.size(); i++) {
            String cls = rowClasses.get(i);
            h.append(cls.isEmpty() ? "<tr>" : "<tr class=\"" + HtmlEscape.escape(cls) + "\">");
            for (String c : rows.get(i)) h.append("<td>").append(HtmlEscape.escape(c)).append("</td>");
            h.append("</tr>");
        }
        h.append("</tbody></table>");
    }

    /**
     * The same table as fixed-width plain text for terminal clients: the caption, then the header and the
     * rows with columns padded to their widest cell (two spaces apart, trailing blanks trimmed). Deterministic:
     * nothing but the cells.
     */
    String toText() {
        int n = header.size();
        int[] width = new int[n];
        for (int c = 0; c < n; c++) width[c] = header.get(c).length();
        for (List<String> r : rows) for (int c = 0; c < n; c++) width[c] = Math.max(width[c], r.get(c).length());
        StringBuilder t = new StringBuilder();
        if (caption != null && !caption.isEmpty()) t.append(caption).append('\n');
        textLine(t, header, width);
        for (List<String> r : rows) textLine(t, r, width);
        return t.toString();
    }

    private static void textLine(StringBuilder t, List<String> cells, int[] width) {
        StringBuilder line = new StringBuilder("  ");
        for (int c = 0; c < cells.size(); c++) {
            line.append(c == cells.size() - 1 ? cells.get(c) : org.loopledger.lti.Units.padRight(cells.get(c), width[c] + 2));
        }
        t.append(line.toString().stripTrailing()).append('\n');
    }

    @Override public String toString() {
        StringBuilder h = new StringBuilder();
        appendTo(h);
        return h.toString();
    }
}
