package org.loopledger.display;

import org.loopledger.ident.estimate.LoadCaseEstimate;
import org.loopledger.ident.estimate.LoadCases;
import org.loopledger.ident.log.LogIssue;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

/**
 * The summary of load cases estimated from logs: one row per case (label, log file, the start of its SHA-256,
 * lines and band, excitation period, periods averaged, lowest coherence and where, log warnings), units in the
 * headers; then every log warning with its column and row. HTML and a fixed-width plain-text form with the same
 * cells (deterministic: nothing from the clock).
 */
public final class LoadCaseTable {
    /** Hex digits of the SHA-256 shown (the record's header lists the whole digest). */
    static final int SHA_DIGITS = 12;
    private static final String[] HEADER = {"Load case", "Log", "SHA-256", "Lines", "From (Hz)", "To (Hz)", "Period (samples)",
            "Periods averaged", "Min coherence", "At (Hz)", "Log warnings"};

    private LoadCaseTable() {}

    /** One load case, as a table of one row. */
    public static MimeBundle render(LoadCaseEstimate c) { return render(new LoadCases(List.of(c))); }

    public static MimeBundle render(LoadCases cases) {
        String caption = "Load cases from logs: " + describe(cases.cases().get(0));
        List<String[]> rows = new ArrayList<>();
        for (LoadCaseEstimate c : cases.cases()) rows.add(row(c));
        HtmlTable h = HtmlTable.of(caption, HEADER);
        for (String[] r : rows) h.row(r);
        StringBuilder html = new StringBuilder("<div class=\"loopledger-load-cases\">");
        h.appendTo(html);
        List<String> warnings = warnings(cases);
        if (!warnings.isEmpty()) {
            html.append("<ul class=\"loopledger-warnings\">");
            for (String w : warnings) html.append("<li>").append(HtmlEscape.escape(w)).append("</li>");
            html.append("</ul>");
        }
        html.append("</div>");
        StringBuilder text = new StringBuilder(caption).append('\n');
        text.append(textTable(rows));
        for (String w : warnings) text.append('\n').append("  ").append(w);
        return MimeBundle.builder(text.toString()).put(MimeBundle.TEXT_HTML, html.toString()).build();
    }

    private static String describe(LoadCaseEstimate c) {
        return c.outputColumn() + " / " + c.inputColumn() + ", synchronous average on the lines excited by " + c.excitationColumn();
    }

    private static String[] row(LoadCaseEstimate c) {
        OptionalDouble coh = c.minCoherence(), at = c.minCoherenceHz();
        return new String[] {c.label(), c.file().getFileName().toString(), c.sha256().substring(0, SHA_DIGITS) + "…", String.valueOf(c.frf().size()),
                Figures.num(c.bandLowHz()), Figures.num(c.bandHighHz()), c.periodSamples() + (c.periodDetected() ? " (detected)" : ""),
                String.valueOf(c.averagedPeriods()), coh.isPresent() ? String.format(java.util.Locale.ROOT, "%.3f", coh.getAsDouble()) : "– (one period)",
                Figures.opt(at), c.warnings().isEmpty() ? "none" : String.valueOf(c.warnings().size())};
    }

    private static List<String> warnings(LoadCases cases) {
        List<String> w = new ArrayList<>();
        for (LoadCaseEstimate c : cases.cases()) for (LogIssue i : c.warnings()) w.add(c.label() + ": " + i);
        return w;
    }

    private static String textTable(List<String[]> rows) {
        int[] width = new int[HEADER.length];
        for (int j = 0; j < HEADER.length; j++) {
            width[j] = HEADER[j].length();
            for (String[] r : rows) width[j] = Math.max(width[j], r[j].length());
        }
        StringBuilder sb = new StringBuilder();
        line(sb, HEADER, width);
        int total = 0;
        for (int w : width) total += w + 3;
        sb.append("-".repeat(Math.max(0, total - 3))).append('\n');
        for (int i = 0; i < rows.size(); i++) {
            line(sb, rows.get(i), width);
        }
        sb.setLength(sb.length() - 1);
        return sb.toString();
    }

    private static void line(StringBuilder sb, String[] cells, int[] width) {
        for (int j = 0; j < cells.length; j++) {
            if (j > 0) sb.append(" | ");
            sb.append(j == 0 ? Units.padRight(cells[j], width[j]) : " ".repeat(width[j] - cells[j].length()) + cells[j]);
        }
        sb.append('\n');
    }
}
