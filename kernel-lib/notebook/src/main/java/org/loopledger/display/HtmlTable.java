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

    @Override public String toString() {
        StringBuilder h = new StringBuilder();
        appendTo(h);
        return h.toString();
    }
}
