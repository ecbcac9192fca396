package org.loopledger.display;

import org.loopledger.ident.log.DriveLog;
import org.loopledger.ident.log.LogIssue;
import org.loopledger.provenance.Provenance;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A drive log as it was read, so the reader can check the import at a glance: the file's name, its size and SHA-256 (as
 * recorded for the tuning record), rows, sample rate and duration; every SI column and where it came from (the
 * file's column and unit, or the stated rate for a log without a time column); the file's metadata lines; the log
 * checks' warnings ("none" when there are none). HTML and a plain-text form with the same content; deterministic.
 * Shown when a cell ends with a {@link DriveLog}.
 */
public final class DriveLogSummary {
    private DriveLogSummary() {}

    /**
     * The file name without its folder: the folder depends on where the notebook was run from (the runner's
     * {@code verify} compares outputs run from elsewhere), and the tuning record lists the dataset's path.
     */
    static String fileName(String source) {
        int slash = Math.max(source.lastIndexOf('/'), source.lastIndexOf('\\'));
        return slash >= 0 && slash < source.length() - 1 ? source.substring(slash + 1) : source;
    }

    public static MimeBundle render(DriveLog log) {
        String caption = "Log " + fileName(log.source()) + ": " + log.rows() + " rows at " + Figures.num(log.sampleRateHz()) + " Hz ("
                + Figures.num(log.durationS()) + " s)";
        Optional<Provenance.Dataset> d = log.dataset();
        String digest = d.map(x -> "SHA-256 " + x.sha256() + " (" + x.bytes() + " bytes)").orElse("SHA-256 not recorded (the log was not read from a file)");
        HtmlTable columns = HtmlTable.of(caption, "Column (SI)", "Read from");
        Map<String, String> sources = log.columnSources();
        if (sources.isEmpty()) {
            for (String c : log.columnNames()) columns.row(c, "the file's column " + c);
        } else {
            sources.forEach(columns::row);
        }
        List<String> metadata = new ArrayList<>();
        log.metadata().forEach((k, v) -> metadata.add(v.isEmpty() ? k : k + ": " + v));
        List<String> warnings = log.warnings().stream().map(LogIssue::toString).toList();
        String checks = warnings.isEmpty() ? "Log checks: no warning" : "Log checks: " + warnings.size() + (warnings.size() == 1 ? " warning" : " warnings");

        StringBuilder text = new StringBuilder(columns.toText()).append("  ").append(digest).append('\n');
        if (!metadata.isEmpty()) {
            text.append("File metadata:\n");
            for (String m : metadata) text.append("  # ").append(m).append('\n');
        }
        text.append(checks);
        for (String w : warnings) text.append("\n  ").append(w);

        StringBuilder html = new StringBuilder("<div class=\"loopledger-log\">");
        columns.appendTo(html);
        html.append("<p>").append(HtmlEscape.escape(digest)).append("</p>");
        if (!metadata.isEmpty()) {
            html.append("<p>File metadata:</p><ul>");
            for (String m : metadata) html.append("<li>").append(HtmlEscape.escape(m)).append("</li>");
            html.append("</ul>");
        }
        html.append("<p>").append(HtmlEscape.escape(checks)).append("</p>");
        if (!warnings.isEmpty()) {
            html.append("<ul class=\"loopledger-warnings\">");
            for (String w : warnings) html.append("<li>").append(HtmlEscape.escape(w)).append("</li>");
            html.append("</ul>");
        }
        html.append("</div>");
        return MimeBundle.builder(text.toString()).put(MimeBundle.TEXT_HTML, html.toString()).build();
    }
}
