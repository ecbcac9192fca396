package org.loopledger.ident.log;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * A checked drive log: a regular time base and named columns (header convention of {@link LogColumns}),
 * with the warnings the checks raised. Immutable; arrays are copied out.
 */
public final class DriveLog {
    private final String source;
    private final double sampleRateHz;
    private final double[] time;
    private final Map<String, double[]> columns;
    private final List<LogIssue> warnings;

    DriveLog(String source, double sampleRateHz, double[] time, Map<String, double[]> columns, List<LogIssue> warnings) {
        this.source = source;
        this.sampleRateHz = sampleRateHz;
        this.time = time;
        this.columns = new LinkedHashMap<>(columns);
        this.warnings = List.copyOf(warnings);
    }

    public String source() { return source; }

    /** From the median time step, or as stated in the read options. */
    public double sampleRateHz() { return sampleRateHz; }

    public int rows() { return time.length; }

    public double durationS() { return time.length / sampleRateHz; }

    public double[] timeS() { return time.clone(); }

    public List<String> columnNames() { return List.copyOf(columns.keySet()); }

    /** The column's values (copy); throws listing the columns when absent. */
    public double[] column(String name) {
        double[] c = columns.get(name);
        if (c == null) throw new IllegalArgumentException("the log " + source + " has no column '" + name + "'; it has " + columnNames());
        return c.clone();
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
        if (!(o instanceof DriveLog d) || !Arrays.equals(time, d.time) || !columns.keySet().equals(d.columns.keySet())) return false;
        for (String k : columns.keySet()) if (!Arrays.equals(columns.get(k), d.columns.get(k))) return false;
        return true;
    }

    @Override public int hashCode() { return Arrays.hashCode(time) * 31 + columns.keySet().hashCode(); }
}
