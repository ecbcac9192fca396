package org.loopledger.ident.log;

import org.loopledger.provenance.Provenance;
import tech.tablesaw.api.ColumnType;
import tech.tablesaw.api.Table;
import tech.tablesaw.columns.Column;
import tech.tablesaw.io.csv.CsvReadOptions;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * Reads a drive log from CSV with Tablesaw: a header row following {@link LogColumns} (every column a
 * number, {@code time_s} required), comma separated; empty cells and {@code NaN} read as missing. Then
 * runs {@link LogChecks}: any error throws an {@link IllegalArgumentException} listing every error (column
 * and row); warnings travel with the returned {@link DriveLog}.
 */
public final class DriveLogReader {
    private DriveLogReader() {}

    /** From a CSV file; the file is recorded (path, size, SHA-256) for the tuning record, see {@link Provenance}. */
    public static DriveLog read(Path file, LogCheckOptions o) throws IOException {
        DriveLog log = read(file.toString(), Files.newBufferedReader(file, StandardCharsets.UTF_8), o);
        Provenance.recordDataset(file);
        return log;
    }

    /** From CSV text (e.g. a notebook cell); {@code source} names it in messages. */
    public static DriveLog readString(String source, String csv, LogCheckOptions o) {
        try {
            return read(source, new StringReader(csv), o);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    private static DriveLog read(String source, Reader reader, LogCheckOptions o) throws IOException {
        String text;
        try (BufferedReader br = new BufferedReader(reader)) {
            text = br.lines().collect(Collectors.joining("\n"));
        }
        int nl = text.indexOf('\n');
        String header = (nl < 0 ? text : text.substring(0, nl)).strip();
        if (header.isEmpty()) throw new IllegalArgumentException(source + ": empty file; a log needs a header row such as time_s,current_measured_A,velocity_rad_s");
        String[] names = Arrays.stream(header.split(",", -1)).map(String::strip).toArray(String[]::new);
        for (String name : names) LogColumns.parse(name);
        if (Arrays.stream(names).distinct().count() != names.length) throw new IllegalArgumentException(source + ": duplicate column names in header " + header);
        if (!Arrays.asList(names).contains(LogColumns.TIME)) {
            throw new IllegalArgumentException(source + ": no " + LogColumns.TIME + " column; the header has " + Arrays.toString(names));
        }
        ColumnType[] types = new ColumnType[names.length];
        Arrays.fill(types, ColumnType.DOUBLE);
        Table t;
        try {
            t = Table.read().csv(CsvReadOptions.builder(new StringReader(text)).header(true).separator(',').columnTypes(types)
                    .missingValueIndicator("", "NaN", "nan").tableName(source).build());
        } catch (RuntimeException e) {
            throw new IllegalArgumentException(source + ": cannot read as numbers under the header " + header + ": " + e.getMessage(), e);
        }
        double[] time = null;
        List<String> others = new ArrayList<>();
        List<double[]> values = new ArrayList<>();
        for (int c = 0; c < names.length; c++) {
            Column<?> col = t.column(c);
            double[] v = new double[col.size()];
            for (int i = 0; i < v.length; i++) v[i] = col.isMissing(i) ? Double.NaN : ((Number) col.get(i)).doubleValue();
            if (names[c].equals(LogColumns.TIME)) time = v;
            else {
                others.add(names[c]);
                values.add(v);
            }
        }
        List<LogIssue> issues = LogChecks.check(time, others.toArray(String[]::new), values.toArray(double[][]::new), o);
        List<LogIssue> errors = issues.stream().filter(i -> i.severity() == LogIssue.Severity.ERROR).toList();
        if (!errors.isEmpty()) {
            throw new IllegalArgumentException(source + ": the log fails its checks:\n  "
                    + issues.stream().map(LogIssue::toString).collect(Collectors.joining("\n  ")));
        }
        double rate = o.expectedSampleRateHz();
        if (Double.isNaN(rate)) {
            double[] dt = new double[time.length - 1];
            for (int i = 1; i < time.length; i++) dt[i - 1] = time[i] - time[i - 1];
            Arrays.sort(dt);
            rate = 1 / dt[dt.length / 2];
        }
        Map<String, double[]> cols = new LinkedHashMap<>();
        for (int i = 0; i < others.size(); i++) cols.put(others.get(i), values.get(i));
        return new DriveLog(source, rate, time, cols, issues);
    }
}
