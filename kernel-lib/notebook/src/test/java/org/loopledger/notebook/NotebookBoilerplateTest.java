package org.loopledger.notebook;

import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The boilerplate counter of issue 10 §6, and its figures for every bundled notebook. */
class NotebookBoilerplateTest {
    @Test
    void classifiesTheFourKindsAndLeavesEngineeringStepsAlone() {
        // boilerplate, one line of each kind (the shapes the notebooks had before the display layer)
        assertEquals(BoilerplateCount.Kind.TABLE_COLUMNS, BoilerplateCount.classify("StringColumn caseCol = StringColumn.create(\"load case\");"));
        assertEquals(BoilerplateCount.Kind.APPENDS_CELLS, BoilerplateCount.classify("    mPm.append(label);"));
        assertEquals(BoilerplateCount.Kind.CONVERTS_ELEMENTWISE, BoilerplateCount.classify("for (int i = 0; i < x.length; i++) x[i] = x[i] / radPerMm * 1000;"));
        assertEquals(BoilerplateCount.Kind.FORMATS_BY_HAND, BoilerplateCount.classify("System.out.printf(Locale.ROOT, \"%.1e%n\", d);"));
        assertEquals(BoilerplateCount.Kind.FORMATS_BY_HAND, BoilerplateCount.classify("sRise.add(m.riseTimeS().getAsDouble() * 1e3 + \" ms\");"));
        // engineering steps
        assertNull(BoilerplateCount.classify("TuningResult tuning = AutoTune.onMeasured(plants, drive, FilterChain.none(), spec);"));
        assertNull(BoilerplateCount.classify("display(MarginsTable.of(cascades, spec.limits()));"));
        assertNull(BoilerplateCount.classify("double[] w = FrequencyGrid.logSpacedHz(1, 4000, 400);"));
    }

    /** Issue 10's targets: at most 10 % boilerplate in every notebook, notebook 02 at most 120 non-blank code lines. */
    @Test
    void everyBundledNotebookMeetsTheTargets() throws Exception {
        List<String> missed = new ArrayList<>();
        for (Path nb : DemoNotebooksTest.notebooks()) {
            BoilerplateCount.Count c = BoilerplateCount.of(nb);
            System.out.println(c.summary());
            if (c.fraction() > 0.10) {
                missed.add(c.summary() + ": over 10 %, by " + (c.boilerplate().size() - (int) Math.floor(0.10 * c.codeLines())) + " line(s): "
                        + c.boilerplate().stream().map(l -> "cell " + l.cell() + " (" + l.kind().description + "): " + l.text()).toList());
            }
            if (nb.getFileName().toString().startsWith("02-") && c.codeLines() > 120) {
                missed.add(c.summary() + ": over 120 code lines by " + (c.codeLines() - 120));
            }
        }
        assertTrue(missed.isEmpty(), String.join("\n", missed));
    }
}
