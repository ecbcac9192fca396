package org.loopledger.kernel.session;

import jdk.jshell.Diag;
import jdk.jshell.EvalException;
import jdk.jshell.JShellException;
import jdk.jshell.UnresolvedReferenceException;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Turns JShell's compile diagnostics and exceptions into Jupyter error outputs whose line numbers are
 * lines of the notebook cell (1-based), with stack traces cut to user code: JShell already removes its
 * wrapper frames; we also drop the frames below the outermost user frame (the JShell agent's).
 */
final class Tracebacks {
    /** Where a snippet came from: the label of its cell and the 0-based cell line it starts on. */
    record Origin(String cellLabel, int firstLine) {}

    private static final int MAX_FRAMES = 40;

    private Tracebacks() {}

    static CellOutput.Error compileError(CellSnippet snippet, List<Diag> diags) {
        List<String> lines = new ArrayList<>();
        String first = null;
        for (Diag d : diags) {
            if (!d.isError()) continue;
            String msg = d.getMessage(Locale.ROOT);
            long pos = Math.max(0, d.getStartPosition() < 0 ? d.getPosition() : d.getStartPosition());
            String src = snippet.source();
            int p = (int) Math.min(pos, src.length());
            int lineInSnippet = 0;
            int lineStart = 0;
            for (int i = 0; i < p; i++) {
                if (src.charAt(i) == '\n') {
                    lineInSnippet++;
                    lineStart = i + 1;
                }
            }
            int lineEnd = src.indexOf('\n', lineStart);
            String text = src.substring(lineStart, lineEnd < 0 ? src.length() : lineEnd);
            int cellLine = snippet.firstLine() + lineInSnippet + 1;
            if (first == null) first = "line " + cellLine + ": " + firstLine(msg);
            lines.add("Compile error in line " + cellLine + ": " + msg);
            lines.add("    " + text);
            lines.add("    " + " ".repeat(Math.max(0, p - lineStart)) + "^");
        }
        if (first == null) {
            first = "the snippet was rejected";
            lines.add("Compile error: JShell rejected: " + snippet.source());
        }
        return new CellOutput.Error("CompileError", first, lines);
    }

    static CellOutput.Error runtimeError(JShellException e, Map<String, Origin> origins, String currentLabel) {
        List<String> lines = new ArrayList<>();
        String name;
        String value;
        if (e instanceof UnresolvedReferenceException u) {
            name = "UnresolvedReference";
            value = u.getSnippet() + " cannot run until what it refers to is defined";
            lines.add(name + ": " + value);
        } else {
            name = e instanceof EvalException ee ? ee.getExceptionClassName() : e.getClass().getName();
            value = e.getMessage() == null ? "" : e.getMessage();
            lines.add(value.isEmpty() ? name : name + ": " + value);
        }
        appendFrames(lines, e.getStackTrace(), origins, currentLabel);
        Throwable cause = e.getCause();
        int depth = 0;
        while (cause != null && depth++ < 10) {
            String cn = cause instanceof EvalException ce ? ce.getExceptionClassName() : cause.getClass().getName();
            lines.add("Caused by: " + cn + (cause.getMessage() == null ? "" : ": " + cause.getMessage()));
            appendFrames(lines, cause.getStackTrace(), origins, currentLabel);
            cause = cause.getCause();
        }
        return new CellOutput.Error(name, value, lines);
    }

    private static void appendFrames(List<String> lines, StackTraceElement[] frames, Map<String, Origin> origins, String currentLabel) {
        int lastUser = -1;
        for (int i = 0; i < frames.length; i++) if (isUser(frames[i])) lastUser = i;
        int end = lastUser >= 0 ? lastUser + 1 : frames.length;
        for (int i = 0; i < end && i < MAX_FRAMES; i++) lines.add("    at " + frame(frames[i], origins, currentLabel));
        if (end > MAX_FRAMES) lines.add("    ... " + (end - MAX_FRAMES) + " more");
    }

    private static boolean isUser(StackTraceElement f) {
        return f.getFileName() != null && f.getFileName().startsWith("#");
    }

    private static String frame(StackTraceElement f, Map<String, Origin> origins, String currentLabel) {
        if (!isUser(f)) return f.toString();
        Origin o = origins.get(f.getFileName().substring(1));
        String method = f.getMethodName() == null || f.getMethodName().isEmpty() ? "cell code" : f.getMethodName();
        String cls = f.getClassName() == null || f.getClassName().isEmpty() ? "" : f.getClassName() + ".";
        if (o == null) return cls + method + " (snippet " + f.getFileName() + " line " + f.getLineNumber() + ")";
        int line = o.firstLine() + f.getLineNumber();
        String where = o.cellLabel().equals(currentLabel) ? "line " + line : o.cellLabel() + " line " + line;
        return cls + method + " (" + where + ")";
    }

    private static String firstLine(String s) {
        int nl = s.indexOf('\n');
        return nl < 0 ? s : s.substring(0, nl);
    }
}
