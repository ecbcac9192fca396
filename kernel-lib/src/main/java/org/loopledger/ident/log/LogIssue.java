package org.loopledger.ident.log;

/**
 * A problem found in a log, naming the column and the data row (1-based, the header is line 1, so row r
 * is file line r + 1; row 0 when the issue concerns the whole column).
 */
public record LogIssue(Severity severity, String column, int row, String message) {
    public enum Severity { WARNING, ERROR }

    @Override public String toString() {
        return severity.name().toLowerCase(java.util.Locale.ROOT) + ": column " + column + (row > 0 ? ", row " + row + " (line " + (row + 1) + ")" : "") + ": " + message;
    }
}
