package org.loopledger.kernel.session;

import jdk.jshell.SourceCodeAnalysis;

import java.util.ArrayList;
import java.util.List;

/**
 * One JShell snippet cut out of a cell: its source as JShell should evaluate it and the 0-based line of
 * the cell where it starts, so JShell's snippet-relative line numbers can be shown as cell lines.
 *
 * @param completeness JShell's verdict on this piece (the last piece of a cell may be incomplete)
 */
record CellSnippet(String source, int firstLine, SourceCodeAnalysis.Completeness completeness) {

    /**
     * Cells up to this many characters are split by analysing the whole rest of the cell for each piece;
     * longer ones through a window ({@link #split}).
     */
    static final int WINDOW_CHARS = 2_000;

    /**
     * Splits a cell with JShell's own analysis; empty or comment-only pieces are dropped.
     *
     * <p>JShell's {@code analyzeCompletion} first masks comments over its whole input, so analysing the whole
     * rest of the cell for every piece costs time quadratic in the cell's length. Long cells are analysed
     * through a window of whole lines of about {@value #WINDOW_CHARS} characters: of the pieces found in a
     * window, all but the last are kept (each is followed inside the window by the start of another piece,
     * so JShell saw the token after it, as it decides on {@code else}, {@code catch} and the like); the
     * window then moves to the last piece. A piece longer than the window is analysed on the whole rest.
     */
    static List<CellSnippet> split(SourceCodeAnalysis analysis, String cell) {
        List<CellSnippet> result = new ArrayList<>();
        int consumed = 0;
        int line = 0;
        while (consumed < cell.length()) {
            String rest = cell.substring(consumed);
            if (rest.isBlank()) break;
            int windowEnd = rest.length() > WINDOW_CHARS ? lineEndAfter(rest, WINDOW_CHARS) : rest.length();
            List<Piece> pieces = analyse(analysis, rest.substring(0, windowEnd), Integer.MAX_VALUE);
            if (windowEnd < rest.length()) {
                pieces = pieces.size() >= 2 ? pieces.subList(0, pieces.size() - 1) : analyse(analysis, rest, 1);
            }
            if (pieces.isEmpty()) break;
            int at = 0;
            for (Piece p : pieces) {
                line += countLines(rest, at, p.start);
                result.add(new CellSnippet(p.source, line, p.completeness));
                line += countLines(rest, p.start, p.end);
                at = p.end;
            }
            if (at <= 0) break;
            consumed += at;
            if (!pieces.get(pieces.size() - 1).completeness.isComplete()) break;
        }
        return result;
    }

    /** One piece of {@code text}: its evaluable source, where its first non-blank character is, where it ends. */
    private record Piece(String source, int start, int end, SourceCodeAnalysis.Completeness completeness) {}

    /** The first {@code limit} pieces of {@code text} (fewer where it ends or a piece is incomplete). */
    private static List<Piece> analyse(SourceCodeAnalysis analysis, String text, int limit) {
        List<Piece> pieces = new ArrayList<>();
        String rest = text;
        int offset = 0;
        while (!rest.isBlank() && pieces.size() < limit) {
            SourceCodeAnalysis.CompletionInfo info = analysis.analyzeCompletion(rest);
            SourceCodeAnalysis.Completeness c = info.completeness();
            if (c == SourceCodeAnalysis.Completeness.EMPTY) break;
            String remaining = c.isComplete() ? info.remaining() : "";
            int used = rest.length() - remaining.length();
            String piece = rest.substring(0, used);
            int lead = 0;
            while (lead < piece.length() && Character.isWhitespace(piece.charAt(lead))) lead++;
            String source = c.isComplete() && info.source() != null ? info.source().stripLeading() : piece.substring(lead);
            if (source.isEmpty()) break;
            pieces.add(new Piece(source, offset + lead, offset + used, c));
            if (used <= 0 || !c.isComplete()) break;
            offset += used;
            rest = remaining;
        }
        return pieces;
    }

    /** The index just after the first line break at or after {@code from}, or the text's length. */
    private static int lineEndAfter(String s, int from) {
        int nl = s.indexOf('\n', from);
        return nl < 0 ? s.length() : nl + 1;
    }

    private static int countLines(String s, int from, int end) {
        int n = 0;
        for (int i = from; i < end && i < s.length(); i++) if (s.charAt(i) == '\n') n++;
        return n;
    }
}
