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

    /** Splits a cell with JShell's own analysis; empty or comment-only pieces are dropped. */
    static List<CellSnippet> split(SourceCodeAnalysis analysis, String cell) {
        List<CellSnippet> result = new ArrayList<>();
        String rest = cell;
        int consumed = 0;
        while (!rest.isBlank()) {
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
            result.add(new CellSnippet(source, countLines(cell, consumed + lead), c));
            if (used <= 0) break;
            consumed += used;
            rest = remaining;
        }
        return result;
    }

    private static int countLines(String s, int end) {
        int n = 0;
        for (int i = 0; i < end && i < s.length(); i++) if (s.charAt(i) == '\n') n++;
        return n;
    }
}
