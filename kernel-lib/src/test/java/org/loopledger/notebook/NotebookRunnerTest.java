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
}
