package org.loopledger.display;

import java.util.List;

/**
 * A unit-bearing table followed by its notes (verdicts, log warnings, coherence remarks): the plain text and the
 * HTML of the display values that end in such a list ({@link FitTable}, {@link FrfTable}, {@link SignalLevels},
 * {@link ExcitationCheck}), written once.
 */
final class TableWithNotes {
    private TableWithNotes() {}

    /** The table's fixed-width text, then one note a line. */
    static String text(HtmlTable table, List<String> notes) {
        StringBuilder t = new StringBuilder(table.toText());
        for (String s : notes) t.append(s).append('\n');
        return t.toString().stripTrailing();
    }

    /** The text above as {@code text/plain}, and the table with the notes as a list inside {@code <div class="cssClass">}. */
    static MimeBundle bundle(String cssClass, HtmlTable table, List<String> notes) {
        StringBuilder h = new StringBuilder("<div class=\"").append(HtmlEscape.escape(cssClass)).append("\">");
        table.appendTo(h);
        h.append("<ul>");
        for (String s : notes) h.append("<li>").append(HtmlEscape.escape(s)).append("</li>");
        h.append("</ul></div>");
        return MimeBundle.builder(text(table, notes)).put(MimeBundle.TEXT_HTML, h.toString()).build();
    }
}
