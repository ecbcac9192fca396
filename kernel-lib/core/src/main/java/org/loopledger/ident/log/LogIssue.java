package org.loopledger.ident.log;

/**
 * A problem found in a log, naming the column and the data row (1-based; row 0 when the issue concerns
 * the whole column). {@code firstDataLine} is the file line of row 1 (2 for a file whose header is line 1;
 * 0 when rows do not map to lines, e.g. comments among the data or a .mat file).
 */
public record LogIssue(Severity severity, String column, int row, String message, int firstDataLine) {
    public enum Severity { WARNING, ERROR }

    /** An issue of a log whose header is line 1. */
    public LogIssue(Severity severity, String column, int row, String message) {
        this(severity, column, row, message, 2);
    }

    /** The file line of the row, 0 when unknown. */
    public int line() { return row > 0 && firstDataLine > 0 ? row + firstDataLine - 1 : 0; }

    LogIssue atFirstDataLine(int line) { return new LogIssue(severity, column, row, message, line); }

    @Override public String toString() {
        return severity.name().toLowerCase(java.util.Locale.ROOT) + ": column " + column
                + (row > 0 ? ", row " + row + (line() > 0 ? " (line " + line() + ")" : "") : "") + ": " + message;
    }
}
