package org.loopledger.kernel.session;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.loopledger.display.MimeBundle;

import java.util.List;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Long cells (issue 12): a cell of 3,000 statements hung for over 300 s because every statement was a
 * JShell snippet of its own. Runs of plain statements now compile as blocks ({@link StatementBatches}); the
 * speed itself is measured by {@code loopledger bench kernel} (statements per second at 100, 1,000 and
 * 3,000 statements). The other tests check that grouping changes nothing a user can see.
 */
class LargeCellTest {
    static CellSession session;

    @BeforeAll
    static void start() {
        session = CellSession.start(SessionOptions.defaults());
    }

    @AfterAll
    static void stop() {
        session.close();
    }

    static CellResult run(String code) {
        return session.execute(code, "cell [t]", OutputListener.IGNORE);
    }

    /** Not a speed target: the bound tells "finished" from "hung" on a loaded machine (before: over 300 s). */
    @Test
    @Timeout(value = 180, unit = TimeUnit.SECONDS, threadMode = Timeout.ThreadMode.SEPARATE_THREAD)
    void threeThousandStatementsFinish() {
        StringBuilder b = new StringBuilder("long total = 0;\n");
        for (int i = 0; i < 3000; i++) b.append("total += ").append(i).append(";\n");
        b.append("total");
        CellResult r = run(b.toString());
        // sum of 0..2999 = 2999 * 3000 / 2 (arithmetic series)
        assertEquals(List.of(new CellOutput.Result(MimeBundle.ofText("4498500"))), r.outputs(), r.toString());
    }

    static String longCell(String middle) {
        StringBuilder b = new StringBuilder("int counted = 0;\n");
        for (int i = 0; i < 10; i++) b.append("counted++;\n");
        b.append(middle).append("\n");
        for (int i = 0; i < 10; i++) b.append("counted++;\n");
        return b.toString();
    }

    @Test
    void declarationsAmongStatementsLiveOn() {
        CellResult r = run(longCell("int declaredMidway = counted * 2;\nString word = \"w\";"));
        assertTrue(r.ok(), r.toString());
        assertEquals(List.of(new CellOutput.Result(MimeBundle.ofText("2021"))), run("declaredMidway * 100 + counted + word.length()").outputs());
    }

    @Test
    void aRuntimeErrorNamesItsLineAndStopsTheRest() {
        // line 12 of the cell (1-based): after "int counted = 0;" and ten increments
        CellResult r = run(longCell("int[] none = new int[0];\nnone[counted] = 1;"));
        CellOutput.Error e = r.error().orElseThrow(() -> new AssertionError(r.toString()));
        assertEquals("java.lang.ArrayIndexOutOfBoundsException", e.name());
        assertTrue(e.traceback().stream().anyMatch(l -> l.contains("(line 13)")), e.traceback().toString());
        assertEquals(List.of(new CellOutput.Result(MimeBundle.ofText("10"))), run("counted").outputs(), "the ten statements before ran, none after");
    }

    @Test
    void aCompileErrorInsideARunOfStatementsRunsTheOnesBefore() {
        StringBuilder b = new StringBuilder("int before = 0;\n");
        for (int i = 0; i < 10; i++) b.append("before++;\n");
        b.append("before += notDeclaredAnywhere;\n");
        for (int i = 0; i < 10; i++) b.append("before++;\n");
        CellOutput.Error e = run(b.toString()).error().orElseThrow();
        assertEquals("CompileError", e.name());
        assertTrue(e.value().startsWith("line 12: cannot find symbol"), e.value());
        assertEquals(List.of(new CellOutput.Result(MimeBundle.ofText("10"))), run("before").outputs());
    }

    @Test
    void printsInALongCellComeOutInOrder() {
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < 30; i++) b.append("System.out.println(").append(i).append(");\n");
        CellResult r = run(b.toString());
        StringBuilder expected = new StringBuilder();
        for (int i = 0; i < 30; i++) expected.append(i).append('\n');
        assertEquals(List.of(new CellOutput.Stream("stdout", expected.toString())), r.outputs());
    }

    @Test
    void groupsKeepEachPieceOnItsLine() {
        List<CellSnippet> pieces = List.of(new CellSnippet("a++;", 3, jdk.jshell.SourceCodeAnalysis.Completeness.COMPLETE),
                new CellSnippet("b++;", 3, jdk.jshell.SourceCodeAnalysis.Completeness.COMPLETE),
                new CellSnippet("if (a > 0)\n  b--;", 5, jdk.jshell.SourceCodeAnalysis.Completeness.COMPLETE),
                new CellSnippet("c++;", 7, jdk.jshell.SourceCodeAnalysis.Completeness.COMPLETE));
        CellSnippet g = StatementBatches.block(pieces);
        assertEquals(3, g.firstLine());
        assertEquals("{ a++; b++;\n\nif (a > 0)\n  b--;\nc++;\n}", g.source());
    }

    @Test
    void onlyPlainStatementsAreGrouped() {
        String[] src = {"x++;", "int y = 1;", "void f() {}", "import java.util.List;", "for (;;) break;", "class K {}", "x", "System.out.println(1);", "var z = 2;", "record R(int a) {}"};
        List<CellSnippet> pieces = new java.util.ArrayList<>();
        for (int i = 0; i < src.length; i++) pieces.add(new CellSnippet(src[i], i, jdk.jshell.SourceCodeAnalysis.Completeness.COMPLETE));
        boolean[] plain = StatementBatches.plainStatements(pieces);
        assertArrayEquals(new boolean[] {true, false, false, false, true, false, false, true, false, false}, plain);
    }

    /** The split before windowing: JShell's analysis of the whole rest of the cell for every piece. */
    static List<CellSnippet> splitWhole(jdk.jshell.SourceCodeAnalysis analysis, String cell) {
        List<CellSnippet> result = new java.util.ArrayList<>();
        String rest = cell;
        int consumed = 0;
        while (!rest.isBlank()) {
            jdk.jshell.SourceCodeAnalysis.CompletionInfo info = analysis.analyzeCompletion(rest);
            jdk.jshell.SourceCodeAnalysis.Completeness c = info.completeness();
            if (c == jdk.jshell.SourceCodeAnalysis.Completeness.EMPTY) break;
            String remaining = c.isComplete() ? info.remaining() : "";
            int used = rest.length() - remaining.length();
            String piece = rest.substring(0, used);
            int lead = 0;
            while (lead < piece.length() && Character.isWhitespace(piece.charAt(lead))) lead++;
            String source = c.isComplete() && info.source() != null ? info.source().stripLeading() : piece.substring(lead);
            if (source.isEmpty()) break;
            result.add(new CellSnippet(source, (int) cell.substring(0, consumed + lead).chars().filter(ch -> ch == '\n').count(), c));
            if (used <= 0) break;
            consumed += used;
            rest = remaining;
        }
        return result;
    }

    @Test
    void theWindowedSplitEqualsTheWholeSplit() {
        String[] kinds = {
                "int v%d = %d;\n",
                "v0 += %d; // a comment with ; and { in it %d\n",
                "if (v0 > %d) v0--;\nelse\n  v0++; /* %d */\n",
                "String s%d = \"text ; with } braces %d\";\n",
                "double f%d(double x) {\n  return x * %d;\n}\n",
                "try { v0 += %d; } catch (RuntimeException e) { v0 -= %d; }\n",
                "var t%d = \"\"\"\n    block ; text\n    %d\"\"\";\n",
                "\n\n// only a comment %d %d\n",
        };
        java.util.Random rnd = new java.util.Random(7);
        StringBuilder cell = new StringBuilder("int v0 = 0;\n");
        for (int i = 1; cell.length() < 5 * CellSnippet.WINDOW_CHARS; i++) {
            cell.append(String.format(kinds[rnd.nextInt(kinds.length)], i, i));
        }
        // a piece longer than the window
        cell.append("void big() {\n").append("  int q = 1;\n".repeat(CellSnippet.WINDOW_CHARS / 10)).append("}\n");
        cell.append("int last = (1 +"); // an incomplete last piece
        try (jdk.jshell.JShell js = jdk.jshell.JShell.builder().executionEngine("local").build()) {
            jdk.jshell.SourceCodeAnalysis a = js.sourceCodeAnalysis();
            List<CellSnippet> expected = splitWhole(a, cell.toString());
            assertTrue(expected.size() > 100, "pieces: " + expected.size());
            assertEquals(expected, CellSnippet.split(a, cell.toString()));
        }
    }
}
