package org.loopledger.ident.log;

import org.loopledger.provenance.Provenance;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * Reads a drive log: delimited text (CSV, semicolon, tab or blank separated, decimal point or comma,
 * see {@link LogFormat}) or a Level 5 {@code .mat} file (see {@link MatLogReader}), names and units by the
 * header convention of {@link LogColumns} or by a {@link ColumnMap}; values become SI. Then runs
 * {@link LogChecks}: any error throws an {@link IllegalArgumentException} naming the file and listing
 * every error (column and row, line); warnings travel with the returned {@link DriveLog}.
 *
 * <p>The text is streamed: numbers go straight from the file's bytes into {@code double[]} columns, so
 * memory beyond the arrays stays a fixed buffer ({@code ./loopledger bench logs} measures it).
 *
 * <p>The sample rate: a stated rate ({@link LogCheckOptions#withSampleRateHz}, {@link ColumnMap#sampleRateHz}
 * or a {@code # sample_rate_Hz = ...} metadata line) is authoritative, and a time column must agree with it;
 * without one it is the time column's span over its count. A log without a time column needs a stated rate.
 */
public final class DriveLogReader {
    /** Metadata keys taken as a stated rate (case-insensitive). */
    public static final String RATE_KEY = "sample_rate_Hz";

    private DriveLogReader() {}

    /** From a file by the header convention, format detected; the file is recorded (path, size, SHA-256) for the tuning record, see {@link Provenance}. */
    public static DriveLog read(Path file, LogCheckOptions o) throws IOException {
        return read(file, LogFormat.detect(), ColumnMap.of(), o);
    }

    /** From a file with a column map, format detected. */
    public static DriveLog read(Path file, ColumnMap map, LogCheckOptions o) throws IOException {
        return read(file, LogFormat.detect(), map, o);
    }

    /** From a text file in the given format, or a {@code .mat} file (by its extension; the format is then ignored). */
    public static DriveLog read(Path file, LogFormat format, ColumnMap map, LogCheckOptions o) throws IOException {
        if (file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".mat")) return MatLogReader.read(file, map, o);
        DelimitedText.Table t;
        try (InputStream in = Files.newInputStream(file)) {
            t = DelimitedText.read(file.toString(), in, Files.size(file), format);
        }
        Provenance.Dataset d = Provenance.recordDataset(file);
        return assemble(file.toString(), t.rows(), t.names(), t.columns(), t.resolution(), t.contiguous() ? t.firstDataLine() : 0, t.headerLine(),
                t.metadata(), map, o, d);
    }

    /** From CSV text (e.g. a notebook cell) by the header convention; {@code source} names it in messages. */
    public static DriveLog readString(String source, String csv, LogCheckOptions o) {
        return readString(source, csv, LogFormat.detect(), ColumnMap.of(), o);
    }

    /** From text in the given format with a column map; {@code source} names it in messages. Not recorded as a dataset. */
    public static DriveLog readString(String source, String text, LogFormat format, ColumnMap map, LogCheckOptions o) {
        try {
            byte[] b = text.getBytes(format.charset());
            DelimitedText.Table t = DelimitedText.read(source, new ByteArrayInputStream(b), b.length, format);
            return assemble(source, t.rows(), t.names(), t.columns(), t.resolution(), t.contiguous() ? t.firstDataLine() : 0, t.headerLine(),
                    t.metadata(), map, o, null);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    /**
     * Names, units, time base, checks: shared by the text and .mat readers. {@code columns} are owned
     * (scaled in place) and hold {@code n} rows (they may be longer). {@code firstDataLine} 0 when rows do not map to lines; {@code headerLine} 0 when there is no header line.
     */
    static DriveLog assemble(String source, int n, String[] fileNames, double[][] columns, double[] resolution, int firstDataLine, int headerLine,
                             Map<String, String> metadata, ColumnMap map, LogCheckOptions o, Provenance.Dataset dataset) {
        String where = headerLine > 0 ? source + ": line " + headerLine + " (header)" : source;
        List<LogIssue> early = new ArrayList<>();
        for (ColumnMap.Entry e : map.entries()) {
            boolean found = false;
            for (String fn : fileNames) if (fn.equals(e.fileColumn())) found = true;
            if (!found) {
                throw new IllegalArgumentException(where + ": the column map names '" + e.fileColumn() + "', which the file does not have; its columns are "
                        + java.util.Arrays.toString(fileNames) + " (names must match exactly, case and blanks included)");
            }
        }
        Map<String, double[]> cols = new LinkedHashMap<>();
        Map<String, String> sources = new LinkedHashMap<>();
        double[] time = null;
        double timeRes = 0;
        for (int c = 0; c < fileNames.length; c++) {
            String name = fileNames[c];
            var entry = map.entryFor(name);
            String si;
            double factor;
            String desc;
            if (entry.isPresent()) {
                si = entry.get().siName();
                factor = entry.get().unit().toSi();
                desc = entry.get().toString();
            } else if (LogColumns.follows(name)) {
                LogColumns.Column col = LogColumns.parse(name);
                si = col.siName();
                factor = col.toSiFactor();
                desc = "'" + name + "' [" + col.unit() + "] → " + si;
            } else if (!map.entries().isEmpty()) {
                early.add(new LogIssue(LogIssue.Severity.WARNING, name, 0,
                        "not in the column map and not named by the header convention: skipped; map it with .column(\"" + name + "\", Quantity..., LogUnit...) to use it"));
                continue;
            } else {
                String m;
                try {
                    LogColumns.parse(name);
                    m = "";
                } catch (IllegalArgumentException e) {
                    m = e.getMessage();
                }
                throw new IllegalArgumentException(where + ", field " + (c + 1) + ": " + m);
            }
            double[] v = columns[c];
            if (factor != 1) for (int i = 0; i < n; i++) v[i] *= factor;
            if (cols.containsKey(si) || (si.equals(LogColumns.TIME) && time != null)) {
                throw new IllegalArgumentException(where + ": two columns become " + si + " (" + sources.getOrDefault(si, "time") + " and '" + name
                        + "'); drop one or map one to another quantity");
            }
            if (si.equals(LogColumns.TIME)) {
                time = v;
                timeRes = resolution == null ? 0 : resolution[c] * Math.abs(factor);
                sources.put(si, desc);
            } else {
                cols.put(si, v);
                sources.put(si, desc);
            }
        }
        // the stated rate: options, column map, metadata; they must agree
        double stated = Double.NaN;
        String statedBy = null;
        double[] candidates = {o.expectedSampleRateHz(), map.statedSampleRateHz(), metadataRate(source, metadata)};
        String[] by = {"LogCheckOptions.withSampleRateHz", "ColumnMap.sampleRateHz", "the file's " + RATE_KEY + " metadata"};
        for (int k = 0; k < 3; k++) {
            if (Double.isNaN(candidates[k])) continue;
            if (Double.isNaN(stated)) {
                stated = candidates[k];
                statedBy = by[k];
            } else if (Math.abs(candidates[k] - stated) > 1e-9 * stated) {
                throw new IllegalArgumentException(String.format(Locale.ROOT, "%s: %s says %.9g Hz but %s says %.9g Hz; state one rate", source,
                        statedBy, stated, by[k], candidates[k]));
            }
        }
        LogCheckOptions eff = Double.isNaN(stated) ? o : o.withSampleRateHz(stated);
        if (time == null && Double.isNaN(stated)) {
            throw new IllegalArgumentException(where + ": no time column (time_s, time_ms, ... or one mapped to Quantity.TIME) and no stated sample rate; "
                    + "state the drive's rate: ColumnMap.of()...sampleRateHz(8000), LogCheckOptions.defaults().withSampleRateHz(8000), or a line "
                    + "'# " + RATE_KEY + " = 8000' in the file");
        }
        String[] names = cols.keySet().toArray(String[]::new);
        double[][] values = cols.values().toArray(double[][]::new);
        List<LogIssue> issues = new ArrayList<>(early);
        issues.addAll(LogChecks.check(n, time, timeRes, names, values, eff));
        if (firstDataLine != 2) issues.replaceAll(i -> i.atFirstDataLine(firstDataLine));
        List<LogIssue> errors = issues.stream().filter(i -> i.severity() == LogIssue.Severity.ERROR).toList();
        if (!errors.isEmpty()) {
            throw new IllegalArgumentException(source + ": the log fails its checks:\n  "
                    + issues.stream().map(LogIssue::toString).collect(Collectors.joining("\n  ")));
        }
        double rate = Double.isNaN(stated) ? LogChecks.rateFromTimeHz(time, n) : stated;
        if (time == null) {
            time = new double[n];
            for (int k = 0; k < n; k++) time[k] = k / stated;
            sources.put(LogColumns.TIME, "k / " + LogUnit.fmt(stated) + " Hz (" + statedBy + "; no time column)");
        }
        Map<String, String> srcOrdered = new LinkedHashMap<>();
        srcOrdered.put(LogColumns.TIME, sources.remove(LogColumns.TIME));
        srcOrdered.putAll(sources);
        return new DriveLog(source, rate, n, time, cols, issues, metadata, srcOrdered, dataset);
    }

    private static double metadataRate(String source, Map<String, String> metadata) {
        for (var e : metadata.entrySet()) {
            if (e.getKey().equalsIgnoreCase(RATE_KEY)) {
                String v = e.getValue().strip().replace(',', '.');
                try {
                    double hz = Double.parseDouble(v);
                    if (hz > 0 && Double.isFinite(hz)) return hz;
                } catch (NumberFormatException ignored) {
                    // below
                }
                throw new IllegalArgumentException(source + ": metadata " + e.getKey() + " = '" + e.getValue() + "' is not a positive number of Hz; repair the line");
            }
        }
        return Double.NaN;
    }

    static byte[] utf8(String s) { return s.getBytes(StandardCharsets.UTF_8); }
}
