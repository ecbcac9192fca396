package org.loopledger.ident.log;

import org.loopledger.provenance.Provenance;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * A checked drive log: a regular time base and named columns in SI units (header convention of
 * {@link LogColumns}), with the warnings the checks raised, the file's metadata ({@code # key = value}
 * lines), where each column came from, and the file's digest. Immutable; arrays are copied out.
 */
public final class DriveLog {
    private final String source;
    private final double sampleRateHz;
    private final int rows;
    private final double[] time;
    private final Map<String, double[]> columns;
    private final List<LogIssue> warnings;
    private final Map<String, String> metadata;
    private final Map<String, String> columnSources;
    private final Provenance.Dataset dataset;

    DriveLog(String source, double sampleRateHz, double[] time, Map<String, double[]> columns, List<LogIssue> warnings) {
        this(source, sampleRateHz, time.length, time, columns, warnings, Map.of(), Map.of(), null);
    }

    /** {@code rows} values of each array are the log's; the arrays may be longer (the reader's capacity, never trimmed by a copy). */
    DriveLog(String source, double sampleRateHz, int rows, double[] time, Map<String, double[]> columns, List<LogIssue> warnings,
             Map<String, String> metadata, Map<String, String> columnSources, Provenance.Dataset dataset) {
        this.source = source;
        this.sampleRateHz = sampleRateHz;
        this.rows = rows;
        this.time = time;
        this.columns = new LinkedHashMap<>(columns);
        this.warnings = List.copyOf(warnings);
        this.metadata = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(metadata));
        this.columnSources = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(columnSources));
        this.dataset = dataset;
    }

    /** The file's {@code # key = value} lines (or a .mat file's scalar and text variables), in file order. */
    public Map<String, String> metadata() { return metadata; }

    /** For each column, where it came from: the file's column and its unit, e.g. {@code 'Vel[rpm]' [rpm] → velocity_rad_s}. */
    public Map<String, String> columnSources() { return columnSources; }

    /** The file read (path, size, SHA-256), empty for text from a cell. */
    public Optional<Provenance.Dataset> dataset() { return Optional.ofNullable(dataset); }

    public boolean hasColumn(String name) { return columns.containsKey(name); }

    /** Linear axes: velocity in m/s ({@link LogColumns#VELOCITY_LINEAR}). */
    public double[] velocityMPerS() { return column(LogColumns.VELOCITY_LINEAR); }

    /** Linear axes: position in m ({@link LogColumns#POSITION_LINEAR}). */
    public double[] positionM() { return column(LogColumns.POSITION_LINEAR); }

    /** Force in N ({@link LogColumns#FORCE}). */
    public double[] forceN() { return column(LogColumns.FORCE); }

    public String source() { return source; }

    /** As stated (read options, column map or the file's {@code sample_rate_Hz} metadata), else the time column's span over its count. */
    public double sampleRateHz() { return sampleRateHz; }

    public int rows() { return rows; }

    public double durationS() { return rows / sampleRateHz; }

    public double[] timeS() { return Arrays.copyOf(time, rows); }

    public List<String> columnNames() { return List.copyOf(columns.keySet()); }

    /** The column's values (copy); throws listing the columns when absent. */
    public double[] column(String name) {
        double[] c = columns.get(name);
        if (c == null) throw new IllegalArgumentException("the log " + source + " has no column '" + name + "'; it has " + columnNames());
        return Arrays.copyOf(c, rows);
    }

    public double[] injectedCurrentA() { return column(LogColumns.INJECTED_CURRENT); }

    public double[] measuredCurrentA() { return column(LogColumns.MEASURED_CURRENT); }

    public double[] velocityRadPerS() { return column(LogColumns.VELOCITY); }

    public double[] positionRad() { return column(LogColumns.POSITION); }

    public List<LogIssue> warnings() { return warnings; }

    @Override public String toString() {
        return String.format(Locale.ROOT, "DriveLog[%s: %d rows at %.6g Hz (%.4g s), columns %s%s]", source, rows(), sampleRateHz, durationS(),
                columnNames(), warnings.isEmpty() ? "" : ", " + warnings.size() + " warning(s)");
    }

    @Override public boolean equals(Object o) {
        if (!(o instanceof DriveLog d) || rows != d.rows || !Arrays.equals(time, 0, rows, d.time, 0, rows) || !columns.keySet().equals(d.columns.keySet())) return false;
        for (String k : columns.keySet()) if (!Arrays.equals(columns.get(k), 0, rows, d.columns.get(k), 0, rows)) return false;
        return true;
    }

    @Override public int hashCode() { return Arrays.hashCode(Arrays.copyOf(time, Math.min(rows, 64))) * 31 + columns.keySet().hashCode() + rows; }
}
