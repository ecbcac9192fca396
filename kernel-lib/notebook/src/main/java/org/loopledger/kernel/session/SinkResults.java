package org.loopledger.kernel.session;

import jdk.jshell.ExpressionSnippet;
import jdk.jshell.Snippet;
import jdk.jshell.VarSnippet;

import java.util.Set;

/**
 * Which cell values are not worth showing: a cell ending in {@code System.out.printf(...)} has the
 * {@code PrintStream} as its value, and showing {@code java.io.PrintStream@1b2c3d} says nothing (the printed
 * text is already in the output). Hidden: any value of type {@code PrintStream} or {@code PrintWriter}
 * (their text is an identity hash, never content), and a {@code StringBuilder} or {@code StringBuffer}
 * whose expression ends in a call of {@code append} or {@code insert} (building text, not asking for it;
 * a cell ending in {@code sb} alone still shows the text). Nothing else is hidden.
 */
final class SinkResults {
    private static final Set<String> SINKS = Set.of("PrintStream", "PrintWriter");
    private static final Set<String> BUILDERS = Set.of("StringBuilder", "StringBuffer");
    private static final Set<String> BUILDING_CALLS = Set.of("append", "insert");

    private SinkResults() {}

    /** Whether the value of the expression snippet {@code s} should not be shown. */
    static boolean hides(Snippet s) {
        String type;
        if (s instanceof ExpressionSnippet e) type = e.typeName();
        else if (s instanceof VarSnippet v) type = v.typeName();
        else return false;
        return hides(type, s.source());
    }

    /** The rule on a type name as JShell spells it (simple or qualified) and the expression's source. */
    static boolean hides(String typeName, String source) {
        String simple = simpleName(typeName);
        boolean javaIoOrSimple = typeName.equals(simple) || typeName.equals("java.io." + simple) || typeName.equals("java.lang." + simple);
        if (!javaIoOrSimple) return false;
        if (SINKS.contains(simple)) return true;
        return BUILDERS.contains(simple) && BUILDING_CALLS.contains(lastCallName(source));
    }

    private static String simpleName(String typeName) {
        int dot = typeName.lastIndexOf('.');
        return dot < 0 ? typeName : typeName.substring(dot + 1);
    }

    /**
     * The name of the method called last in {@code source} ({@code "append"} for {@code sb.append("(").append(x);}),
     * or "" when the expression does not end in a call. String and character literals are skipped.
     */
    static String lastCallName(String source) {
        String s = source.strip();
        while (s.endsWith(";")) s = s.substring(0, s.length() - 1).stripTrailing();
        if (!s.endsWith(")")) return "";
        int depth = 0;
        int i = s.length() - 1;
        for (; i >= 0; i--) {
            char c = s.charAt(i);
            if (c == '"' || c == '\'') {
                i = skipLiteralBackwards(s, i, c);
                if (i < 0) return "";
                continue;
            }
            if (c == ')') depth++;
            else if (c == '(' && --depth == 0) break;
        }
        if (i <= 0) return "";
        int end = i;
        while (end > 0 && Character.isWhitespace(s.charAt(end - 1))) end--;
        int start = end;
        while (start > 0 && Character.isJavaIdentifierPart(s.charAt(start - 1))) start--;
        return s.substring(start, end);
    }

    /** The index just before the opening quote of the literal whose closing quote is at {@code close}. */
    private static int skipLiteralBackwards(String s, int close, char quote) {
        for (int j = close - 1; j >= 0; j--) {
            if (s.charAt(j) != quote) continue;
            int backslashes = 0;
            for (int k = j - 1; k >= 0 && s.charAt(k) == '\\'; k--) backslashes++;
            if (backslashes % 2 == 0) return j;
        }
        return -1;
    }
}
