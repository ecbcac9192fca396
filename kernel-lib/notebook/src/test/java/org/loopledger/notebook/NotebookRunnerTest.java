package org.loopledger.notebook;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

class NotebookRunnerTest {

    /** A scripted engine: "fail" in a cell makes it fail; everything else echoes the source. */
    static final class ScriptedEngine implements CellEngine {
        final List<String> ran = new ArrayList<>();

        @Override public List<Output> execute(String source, int count) {
            ran.add(source);
            if (source.contains("fail")) return List.of(new Output.Stream("stdout", "before\n"), new Output.Error("RuntimeException", "it failed", List.of()));
            return List.of(new Output.ExecuteResult(count, Map.of("text/plain", source.toUpperCase()), Map.of()));
        }

        @Override public String provenanceJson() {
            return "[{\"path\":\"datasets/a.csv\",\"bytes\":3,\"sha256\":\"" + "0".repeat(64) + "\",\"reads\":1}]";
        }

        @Override public void close() {}
    }

    private static Notebook nb(String... sources) {
        List<Cell> cells = new ArrayList<>();
        cells.add(new Cell.Markdown("m", "# Title", "{}"));
        for (int i = 0; i < sources.length; i++) cells.add(new Cell.Code("c" + i, sources[i], null, List.of(), "{}"));
        return new Notebook(5, "{}", cells);
    }

    @Test
    void runsEveryCellInOrderAndRecordsProvenance() {
        ScriptedEngine eng = new ScriptedEngine();
        List<String> progress = new ArrayList<>();
        var out = NotebookRunner.run(nb("a", "b"), eng, "0.1.0", "2026-12-01", progress::add);
        assertTrue(out.succeeded());
        assertEquals(List.of("a", "b"), eng.ran);
        Cell.Code c2 = (Cell.Code) out.executed().cells().get(2);
        assertEquals(2, c2.executionCount());
        assertEquals("B", ((Output.ExecuteResult) c2.outputs().get(0)).data().get("text/plain"));
        assertEquals(1, out.datasets().size());
        assertTrue(progress.get(0).startsWith("cell 1 of 2"));
        RecordInfo info = NotebookRunner.recordInfo(out.executed(), "x.ipynb", "17");
        assertEquals("2026-12-01", info.runDate());
        assertEquals("datasets/a.csv", info.datasets().get(0).path());
    }

    @Test
    void stopsAtTheFirstFailingCellAndNamesIt() {
        ScriptedEngine eng = new ScriptedEngine();
        var out = NotebookRunner.run(nb("a", "fail here", "never"), eng, "0.1.0", "2026-12-01", s -> {});
        assertFalse(out.succeeded());
        assertEquals(3, out.failedCellNumber(), "notebook cell 3 (markdown is cell 1)");
        assertEquals("RuntimeException: it failed", out.failure());
        assertEquals(List.of("a", "fail here"), eng.ran, "cells after the failure do not run");
        assertTrue(((Cell.Code) out.executed().cells().get(3)).outputs().isEmpty());
    }

    @Test
    void renderingAnUnexecutedNotebookExplainsWhatToDo() {
        var e = assertThrows(IllegalArgumentException.class, () -> NotebookRunner.recordInfo(nb("a"), "x.ipynb", "17"));
        assertTrue(e.getMessage().contains("loopledger run"));
    }

    /** An engine whose "spin" cell runs until interrupted and whose "stubborn" cell until forced; "read X" reads dataset X. */
    static final class BlockingEngine implements CellEngine {
        final java.util.concurrent.CountDownLatch interrupted = new java.util.concurrent.CountDownLatch(1);
        final java.util.concurrent.CountDownLatch forced = new java.util.concurrent.CountDownLatch(1);
        final java.util.Map<String, Integer> reads = new java.util.LinkedHashMap<>();

        @Override public List<Output> execute(String source, int count) {
            try {
                if (source.contains("spin")) {
                    interrupted.await();
                    return List.of(new Output.Error("Interrupted", "stopped", List.of()));
                }
                if (source.contains("stubborn")) {
                    forced.await();
                    return List.of(new Output.Error("SessionRestarted", "ended", List.of()));
                }
            } catch (InterruptedException e) {
                throw new AssertionError(e);
            }
            if (source.startsWith("read ")) reads.merge(source.substring(5), 1, Integer::sum);
            return List.of();
        }

        @Override public String provenanceJson() {
            StringBuilder sb = new StringBuilder("[");
            reads.forEach((p, n) -> sb.append(sb.length() > 1 ? "," : "").append("{\"path\":\"").append(p)
                    .append("\",\"bytes\":1,\"sha256\":\"ab\",\"reads\":").append(n).append('}'));
            return sb.append(']').toString();
        }

        @Override public void interrupt() { interrupted.countDown(); }

        @Override public void forceStop() { forced.countDown(); }

        @Override public void close() {}
    }

    @Test
    void aCellPastTheTimeoutIsInterruptedAndNamedByIndexAndFirstLine() {
        BlockingEngine eng = new BlockingEngine();
        var out = NotebookRunner.run(nb("int a = 1;", "\n  spin forever();\n more", "never"), eng, "0.1.0", "2026-12-01", s -> {},
                new NotebookRunner.Options(java.time.Duration.ofMillis(200), false));
        assertFalse(out.succeeded());
        assertEquals(3, out.failedCellNumber());
        assertTrue(out.failure().startsWith("CellTimeout: code cell 2 (notebook cell 3, first line: spin forever();)"), out.failure());
        assertTrue(out.failure().contains("timeout of 0.2 s"), out.failure());
        Cell.Code c = (Cell.Code) out.executed().cells().get(2);
        assertEquals(1, c.outputs().size(), "the engine's own interrupt error is replaced: " + c.outputs());
        Cell.Code after = (Cell.Code) out.executed().cells().get(3);
        assertTrue(after.outputs().isEmpty() && after.executionCount() == null,
                "the cell after it did not run and says so");
        assertTrue(out.executed().metadataJson().contains("\"failed_cells\""), out.executed().metadataJson());
    }

    @Test
    void aCellIgnoringTheInterruptIsForcedAfterTheGrace() {
        BlockingEngine eng = new BlockingEngine();
        var out = NotebookRunner.run(nb("stubborn"), eng, "0.1.0", "2026-12-01", s -> {},
                new NotebookRunner.Options(java.time.Duration.ofMillis(100), false, java.time.Duration.ofMillis(100)));
        assertEquals(0, eng.interrupted.getCount(), "interrupted first");
        assertTrue(out.failure().contains("ignored the interrupt"), out.failure());
    }

    @Test
    void allowErrorsRunsEveryCellAndListsEveryFailure() {
        ScriptedEngine eng = new ScriptedEngine();
        var out = NotebookRunner.run(nb("a", "fail one", "b", "fail two"), eng, "0.1.0", "2026-12-01", s -> {},
                new NotebookRunner.Options(java.time.Duration.ZERO, true));
        assertEquals(List.of("a", "fail one", "b", "fail two"), eng.ran);
        assertEquals(List.of(3, 5), out.failures().stream().map(NotebookRunner.CellFailure::cellNumber).toList());
        assertEquals(3, out.failedCellNumber());
    }

    @Test
    void theCellsThatReadEachDatasetAreKnownAlsoOnASecondRead() {
        BlockingEngine eng = new BlockingEngine();
        var out = NotebookRunner.run(nb("read a.csv", "nothing", "read b.csv", "read a.csv"), eng, "0.1.0", "2026-12-01", s -> {});
        assertEquals(List.of(2, 5), out.readersOf("a.csv"));
        assertEquals(List.of(4), out.readersOf("b.csv"));
        assertEquals(2, out.datasets().size());
    }
}
