package org.loopledger.display;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Computed figures set beside reference figures (a textbook's worked example, a hand derivation, a SciPy result),
 * one row each: the quantity, the computed and the reference value (6 significant digits), the unit, the
 * difference computed − reference and its size relative to the reference (two significant digits), and where the
 * reference comes from. It states differences only and draws no verdict: how close is close enough depends on
 * how the reference was obtained (a book's rounded figure or an exact derivation), which the source column names.
 *
 * <pre>{@code
 * ReferenceChecks.titled("3/(s+1)^3 against Åström and Murray, Example 9.9")
 *         .check("phase margin", m.phaseMarginDeg().getAsDouble(), 41.7, "deg", "book (from memory)")
 *         .check("gain margin (ratio)", gm, 8.0 / 3, "", "by hand")
 * }</pre>
 *
 * <p>Immutable: {@link #check} returns a new table with one more row, so a cell can end with the chain.
 */
public final class ReferenceChecks implements Displayable {
    /**
     * One check.
     *
     * @param quantity  what was computed, e.g. "phase margin"
     * @param computed  the library's value
     * @param reference the reference value, in the same unit
     * @param unit      the unit of both (empty for a ratio)
     * @param source    where the reference comes from, e.g. "by hand", "numpy.roots", "book (from memory)"
     */
    public record Row(String quantity, double computed, double reference, String unit, String source) {
        /** computed − reference. */
        public double difference() { return computed - reference; }

        /** |computed − reference| / |reference|; empty when the reference is 0. */
        public OptionalDouble relativeDifference() {
            return reference == 0 ? OptionalDouble.empty() : OptionalDouble.of(Math.abs(difference() / reference));
        }
    }

    private final String title;
    private final List<Row> rows;

    private ReferenceChecks(String title, List<Row> rows) {
        this.title = title;
        this.rows = List.copyOf(rows);
    }

    /** An empty table with this caption; add rows with {@link #check}. */
    public static ReferenceChecks titled(String title) {
        return new ReferenceChecks(Objects.requireNonNull(title, "title"), List.of());
    }

    /**
     * This table with one more row: {@code computed} beside {@code reference}, both in {@code unit} ("" for a ratio).
     * Both values must be finite numbers (a NaN or an infinite computed value is an error to look at, not a row).
     */
    public ReferenceChecks check(String quantity, double computed, double reference, String unit, String source) {
        if (quantity == null || quantity.isBlank()) throw new IllegalArgumentException("name the quantity checked, e.g. \"phase margin\"");
        if (!Double.isFinite(computed)) {
            throw new IllegalArgumentException("'" + quantity + "': the computed value is " + computed + "; a reference check needs a finite number");
        }
        if (!Double.isFinite(reference)) {
            throw new IllegalArgumentException("'" + quantity + "': the reference value is " + reference + "; give the published or derived figure as a finite number");
        }
        if (source == null || source.isBlank()) {
            throw new IllegalArgumentException("'" + quantity + "': name where the reference comes from (\"by hand\", \"numpy.roots\", \"book (from memory)\", ...)");
        }
        List<Row> more = new ArrayList<>(rows);
        more.add(new Row(quantity, computed, reference, Objects.requireNonNull(unit, "unit (\"\" for a ratio)"), source));
        return new ReferenceChecks(title, more);
    }

    public String title() { return title; }

    public List<Row> rows() { return rows; }

    /** The largest relative difference over the rows whose reference is not 0; empty when there is none. */
    public OptionalDouble largestRelativeDifference() {
        return rows.stream().map(Row::relativeDifference).filter(OptionalDouble::isPresent).mapToDouble(OptionalDouble::getAsDouble).max();
    }

    static String sixDigits(double v) { return String.format(Locale.ROOT, "%.6g", v); }

    static String twoDigitsSigned(double v) { return String.format(Locale.ROOT, "%+.1e", v); }

    HtmlTable table() {
        HtmlTable t = HtmlTable.of(title, "Quantity", "Computed", "Reference", "Unit", "Difference", "Relative difference", "Source of the reference");
        for (Row r : rows) {
            OptionalDouble rel = r.relativeDifference();
            t.row(r.quantity(), sixDigits(r.computed()), sixDigits(r.reference()), r.unit(), twoDigitsSigned(r.difference()),
                    rel.isPresent() ? String.format(Locale.ROOT, "%.1e", rel.getAsDouble()) : Figures.NONE, r.source());
        }
        return t;
    }

    @Override public String toString() {
        return rows.isEmpty() ? title + "\n  (no checks yet: add them with check(quantity, computed, reference, unit, source))" : table().toText().stripTrailing();
    }

    @Override public MimeBundle toMimeBundle() {
        return MimeBundle.builder(toString()).put(MimeBundle.TEXT_HTML, table().toString()).build();
    }
}
