package org.loopledger.display;

import org.loopledger.ident.log.DriveLog;
import org.loopledger.ident.log.LogIssue;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The levels of every signal in a checked drive log, before anything is estimated from it: rows, sample rate and
 * duration in the caption, then one row per column (SI units, named by the log's {@code quantity_unit} header
 * convention) with its minimum, maximum, peak |x| and RMS, and below the table the log checks' warnings, or that
 * there were none. The figures a user reads to see that a small-signal test stayed small (current well under the
 * drive's limit). Where the log came from (file, digest, column origins, metadata) is the log's own display.
 *
 * <pre>{@code
 * SignalLevels.of(DriveLogReader.read(path, LogCheckOptions.defaults().withSampleRateHz(16000)))
 * }</pre>
 */
public final class SignalLevels implements Displayable {
    private final DriveLog log;

    private SignalLevels(DriveLog log) { this.log = log; }

    public static SignalLevels of(DriveLog log) { return new SignalLevels(Objects.requireNonNull(log, "log")); }

    HtmlTable table() {
        String source = log.source();
        String file = source.substring(Math.max(source.lastIndexOf('/'), source.lastIndexOf('\\')) + 1); // the file's name: same caption from any folder
        String caption = file + ": " + log.rows() + " rows at " + Units.formatHz(log.sampleRateHz()) + " (" + Units.formatSeconds(log.durationS()) + ")";
        HtmlTable t = HtmlTable.of(caption, "Column (SI unit in the name)", "Min", "Max", "Peak |x|", "RMS");
        for (String name : log.columnNames()) {
            double[] x = log.column(name);
            double min = Double.POSITIVE_INFINITY, max = Double.NEGATIVE_INFINITY, sumSquares = 0;
            for (double v : x) {
                min = Math.min(min, v);
                max = Math.max(max, v);
                sumSquares += v * v;
            }
            double rms = x.length == 0 ? Double.NaN : Math.sqrt(sumSquares / x.length);
            t.row(name, Figures.num(min), Figures.num(max), Figures.num(Math.max(Math.abs(min), Math.abs(max))), Figures.num(rms));
        }
        return t;
    }

    private List<String> notes() {
        List<String> n = new ArrayList<>();
        if (log.warnings().isEmpty()) n.add("log checks: no warnings");
        for (LogIssue i : log.warnings()) n.add("log check warning: " + i);
        return n;
    }

    @Override public String toString() { return TableWithNotes.text(table(), notes()); }

    @Override public MimeBundle toMimeBundle() { return TableWithNotes.bundle("loopledger-log-summary", table(), notes()); }
}
