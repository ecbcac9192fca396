package org.loopledger.notebook;

import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * JSON outputs (plot data, spec reports) survive the store-and-reload that {@code verify} does: the
 * stored notebook has their object keys sorted, a fresh run has them in insertion order, and key order
 * carries no meaning in JSON (RFC 8259, section 4: "An object is an unordered collection").
 */
class JsonOutputComparisonTest {

    private static Notebook withPlotData(String json) {
        return new Notebook(5, "{}", List.of(new Cell.Code("c1", "plot()", 1, List.of(
                new Output.DisplayData(Map.of(OutputComparison.PLOT_DATA_MIME, json, "text/plain", "Figure[demo]"), Map.of())), "{}")));
    }

    @Test
    void keyOrderDoesNotMatterButValuesDo() {
        String fresh = "{\"title\":\"Bode\",\"panels\":[{\"x\":[1.0,2.0],\"y\":[3.5,-4.25]}]}";
        // what verify compares against: the notebook as written to disk and read back
        Notebook stored = NotebookJson.parse(NotebookJson.toJson(withPlotData(fresh)), "stored");
        OutputComparison cmp = OutputComparison.withTolerance(1e-9, 0);
        assertTrue(cmp.compare(stored, withPlotData(fresh)).allReproduced(), cmp.compare(stored, withPlotData(fresh)).toString());

        // a changed value is still found, with the tolerance applied to the numbers inside
        String changed = "{\"title\":\"Bode\",\"panels\":[{\"x\":[1.0,2.0],\"y\":[3.5,-4.3]}]}";
        OutputComparison.Report r = cmp.compare(stored, withPlotData(changed));
        assertFalse(r.allReproduced());
        assertTrue(r.toString().contains("-4.25 became -4.3"), r.toString());
        assertTrue(OutputComparison.withTolerance(0.02, 0).compare(stored, withPlotData(changed)).allReproduced(), "within 2 %");

        // a changed key is a change
        assertFalse(cmp.compare(stored, withPlotData(fresh.replace("\"y\"", "\"z\""))).allReproduced());
    }

    @Test
    void canonicalFormSortsNestedKeysAndLeavesNonJsonAlone() {
        assertEquals("{\"a\":{\"b\":2,\"c\":1},\"d\":[{\"e\":1,\"f\":0.10}]}",
                OutputComparison.canonicalJson("{\"d\":[{\"f\":0.10,\"e\":1}],\"a\":{\"c\":1,\"b\":2}}"));
        assertEquals("{not json", OutputComparison.canonicalJson("{not json"));
    }
}
