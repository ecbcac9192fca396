package org.loopledger.notebook;

import org.junit.jupiter.api.Test;
import org.loopledger.display.Bundles;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Regression: {@code verify} compares a notebook read from disk (JSON outputs stored with sorted keys)
 * with a fresh run (renderers write keys in insertion order); plots must still reproduce.
 */
class VerifyRoundTripTest {
    private static Notebook withPlotOf(double pole) {
        TransferFunction g = TransferFunction.continuous(new double[] {pole}, new double[] {1, pole});
        Frf f = Frf.ofModel(g, FrequencyGrid.logSpacedRadPerS(0.01, 100, 200));
        return new Notebook(5, "{}", List.of(new Cell.Code("p", "f", 1,
                List.of(new Output.ExecuteResult(1, Bundles.of(f).data(), Map.of())), "{}")));
    }

    @Test
    void aPlotReadBackFromItsFileReproducesTheFreshRun() {
        Notebook fresh = withPlotOf(1);
        Notebook stored = NotebookJson.parse(NotebookJson.toJson(fresh), "stored.ipynb");
        OutputComparison cmp = OutputComparison.withTolerance(1e-6, 1e-12);
        var report = cmp.compare(stored, withPlotOf(1));
        assertTrue(report.allReproduced(), report.toString());
    }

    @Test
    void aChangedPlotStillDiffersThroughItsData() {
        Notebook stored = NotebookJson.parse(NotebookJson.toJson(withPlotOf(1)), "stored.ipynb");
        var report = OutputComparison.withTolerance(1e-6, 1e-12).compare(stored, withPlotOf(1.1));
        assertFalse(report.allReproduced());
        assertTrue(report.differing().get(0).detail().contains("plot-data"), report.toString());
    }

    @Test
    void canonicalJsonSortsKeysAtEveryLevelAndLeavesOtherTextAlone() {
        assertEquals("{\"a\":[{\"x\":1,\"y\":2}],\"b\":\"t\"}", OutputComparison.canonicalJson("{\"b\":\"t\",\"a\":[{\"y\":2,\"x\":1}]}"));
        assertEquals("not json {", OutputComparison.canonicalJson("not json {"));
    }
}
