package org.loopledger.ident.log;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * How the columns of a log that does not follow {@link LogColumns} become SI columns: each entry names a
 * column of the file (its header text exactly, surrounding quotes and blanks removed), what it measures and
 * the unit it was written in; optionally the sample rate when the log has no time column. Immutable; each
 * method returns a new map. Columns the map does not name are read by the header convention when they
 * follow it, and otherwise skipped with a warning.
 *
 * <pre>{@code
 * ColumnMap map = ColumnMap.of()
 *     .column("Pos[inc]", Quantity.POSITION, LogUnit.countsPerMetre(10_000))
 *     .column("Vel[rpm]", Quantity.VELOCITY, LogUnit.rpm())
 *     .column("Iq[mA]", Quantity.CURRENT_MEASURED, LogUnit.milliamperes())
 *     .sampleRateHz(8000);
 * }</pre>
 */
public final class ColumnMap {
    /** One mapped column: the file's header text, the quantity name, the unit. */
    public record Entry(String fileColumn, String quantity, LogUnit unit) {
        /** The column's name in the {@link DriveLog}, e.g. {@code velocity_m_s}. */
        public String siName() { return quantity + "_" + unit.siToken(); }

        @Override public String toString() { return "'" + fileColumn + "' [" + unit.label() + "] → " + siName(); }
    }

    private static final ColumnMap EMPTY = new ColumnMap(List.of(), Double.NaN);

    private final List<Entry> entries;
    private final double sampleRateHz;

    private ColumnMap(List<Entry> entries, double sampleRateHz) {
        this.entries = List.copyOf(entries);
        this.sampleRateHz = sampleRateHz;
    }

    /** No mapping: the header convention of {@link LogColumns} alone (the zero-configuration path). */
    public static ColumnMap of() { return EMPTY; }

    /** Maps the file's column {@code fileColumn} to {@code quantity} written in {@code unit}. */
    public ColumnMap column(String fileColumn, Quantity quantity, LogUnit unit) {
        if (!quantity.siTokens().contains(unit.siToken())) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "column '%s': %s is in %s, but %s is given (becomes %s); pick a unit of %s",
                    fileColumn, quantity.key(), quantity.siTokens(), unit.label(), unit.siToken(), quantity.siTokens()));
        }
        return column(fileColumn, quantity.key(), unit);
    }

    /** Maps to a quantity of your own naming (lower-case words joined by underscores, e.g. {@code load_position}). */
    public ColumnMap column(String fileColumn, String quantity, LogUnit unit) {
        if (fileColumn == null || fileColumn.isBlank()) throw new IllegalArgumentException("the file column name must not be blank");
        if (quantity == null || !quantity.matches("[a-z][a-z0-9]*(_[a-z0-9]+)*")) {
            throw new IllegalArgumentException("quantity '" + quantity + "' must be lower-case words joined by underscores, e.g. load_position");
        }
        List<Entry> e = new ArrayList<>(entries);
        for (Entry x : entries) {
            if (x.fileColumn.equals(fileColumn.strip())) throw new IllegalArgumentException("column '" + fileColumn + "' is mapped twice");
            if (x.siName().equals(quantity + "_" + unit.siToken())) {
                throw new IllegalArgumentException("columns '" + x.fileColumn + "' and '" + fileColumn + "' would both become " + x.siName() + "; give one another quantity");
            }
        }
        e.add(new Entry(fileColumn.strip(), quantity, unit));
        return new ColumnMap(e, sampleRateHz);
    }

    /** The drive's sample rate, for a log without a time column (authoritative: a time column, if any, is checked against it). */
    public ColumnMap sampleRateHz(double hz) {
        if (!(hz > 0 && Double.isFinite(hz))) throw new IllegalArgumentException("sample rate must be positive and finite, got " + hz + " Hz");
        return new ColumnMap(entries, hz);
    }

    /** The sample period instead of the rate (e.g. 125e-6 s for 8 kHz). */
    public ColumnMap samplePeriodS(double s) {
        if (!(s > 0 && Double.isFinite(s))) throw new IllegalArgumentException("sample period must be positive and finite, got " + s + " s");
        return sampleRateHz(1 / s);
    }

    public List<Entry> entries() { return entries; }

    /** The stated rate, NaN when none. */
    public double statedSampleRateHz() { return sampleRateHz; }

    public Optional<Entry> entryFor(String fileColumn) {
        String k = fileColumn.strip();
        return entries.stream().filter(e -> e.fileColumn.equals(k)).findFirst();
    }

    @Override public String toString() {
        return "ColumnMap" + entries + (Double.isNaN(sampleRateHz) ? "" : " at " + LogUnit.fmt(sampleRateHz) + " Hz");
    }
}
