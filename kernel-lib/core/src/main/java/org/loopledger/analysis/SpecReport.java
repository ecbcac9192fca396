package org.loopledger.analysis;

import java.util.List;
import java.util.OptionalDouble;

/**
 * The outcome of checking a {@link Spec}: one row per requirement with the limit, the achieved value
 * and the frequency where it is achieved, and the warnings of the underlying margin analysis.
 *
 * @param rows     one per requirement, in the order of {@link Spec}'s fields
 * @param warnings analysis warnings (band coverage, estimated integrators, ...), structured
 * @param title    what was checked, for the record ("heavy head: velocity loop"); empty when not given
 */
public record SpecReport(List<Row> rows, List<LoopWarning> warnings, String title) {

    public SpecReport {
        rows = List.copyOf(rows);
        warnings = List.copyOf(warnings);
        title = title == null ? "" : title.strip();
    }

    /** An untitled report. */
    public SpecReport(List<Row> rows, List<LoopWarning> warnings) { this(rows, warnings, ""); }

    /** The same report under a title that says what was checked (shown in the record's spec summary). */
    public SpecReport titled(String what) { return new SpecReport(rows, warnings, what); }

    /**
     * One requirement.
     *
     * @param requirement   what is required, in words
     * @param limit         the limit with its unit
     * @param achieved      the achieved value with its unit (or why there is none)
     * @param frequencyHz   where it is achieved (empty when not applicable)
     * @param pass          whether the requirement is met
     * @param achievedValue the achieved value in the limit's unit (Hz, deg, dB, ratio, s); NaN when there is none
     * @param limitValue    the limit in the same unit
     */
    public record Row(String requirement, String limit, String achieved, OptionalDouble frequencyHz, boolean pass,
                      double achievedValue, double limitValue) {
        /** Whether the requirement is met; false when there is no achieved value to check. */
        @Override public boolean pass() { return pass; }

        /** The achieved value as a number in the limit's unit (Hz, deg, dB, ratio, s); NaN when there is none. */
        @Override public double achievedValue() { return achievedValue; }

        /** The limit as a number, in the same unit as {@link #achievedValue()}. */
        @Override public double limitValue() { return limitValue; }

        @Override public String toString() {
            return (pass ? "PASS " : "FAIL ") + requirement + ": " + achieved + " (limit " + limit + ")"
                    + (frequencyHz.isPresent() ? " at " + org.loopledger.lti.Units.formatHz(frequencyHz.getAsDouble()) : "");
        }
    }

    /**
     * One report from several (a frequency-domain {@link Spec} report and a time-domain one, for example), rows in the
     * given order; a row of a titled part is prefixed with that title ("velocity loop: phase margin"), warnings likewise.
     */
    public static SpecReport combined(String title, SpecReport... parts) {
        if (parts.length == 0) throw new IllegalArgumentException("combine at least one report");
        List<Row> rows = new java.util.ArrayList<>();
        List<LoopWarning> warnings = new java.util.ArrayList<>();
        for (SpecReport p : parts) {
            java.util.Objects.requireNonNull(p, "report");
            String prefix = p.title.isEmpty() ? "" : p.title + ": ";
            for (Row r : p.rows) {
                rows.add(new Row(prefix + r.requirement(), r.limit(), r.achieved(), r.frequencyHz(), r.pass(), r.achievedValue(), r.limitValue()));
            }
            for (LoopWarning w : p.warnings) warnings.add(p.title.isEmpty() ? w : w.in(p.title));
        }
        return new SpecReport(rows, warnings, title);
    }

    /** This report and {@code other} as one untitled report (see {@link #combined}). */
    public SpecReport and(SpecReport other) { return combined("", this, other); }

    /** True when every requirement passes. */
    public boolean passed() { return rows.stream().allMatch(Row::pass); }

    /** The requirements that fail. */
    public List<Row> failures() { return rows.stream().filter(r -> !r.pass()).toList(); }

    /** One line: the title and the verdict (the table: {@code display.SpecReportText}). */
    @Override public String toString() {
        return (title.isEmpty() ? "Spec check: " : "Spec check, " + title + ": ") + (passed() ? "all requirements met" : failures().size() + " of " + rows.size() + " requirements FAIL");
    }
}
