package org.loopledger.kernel.session;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.display.MimeBundle;

import static org.junit.jupiter.api.Assertions.*;

/** The unit-bearing tables work as a cell's last value with only the preloaded imports (what a notebook user types). */
class UnitTablesInSessionTest {
    static CellSession session;

    @BeforeAll
    static void start() { session = CellSession.start(SessionOptions.defaults()); }

    @AfterAll
    static void stop() { session.close(); }

    @Test
    void marginsTableAndDriveGainsRenderAsTheLastValue() {
        CellResult r = session.execute("""
                var l = TransferFunction.continuous(new double[] {2}, new double[] {1, 3, 3, 1});
                var loops = new LinkedHashMap<String, Frf>();
                loops.put("velocity", Frf.ofModel(l, FrequencyGrid.logRadPerS(1e-3, 1e3, 2000)));
                MarginsTable.of(Map.of("empty", loops), Spec.builder().minPhaseMarginDeg(70).build())""", "cell [1]", OutputListener.IGNORE);
        assertTrue(r.ok(), r.toString());
        MimeBundle b = ((CellOutput.Result) r.outputs().get(0)).bundle();
        // 2/(s+1)^3: PM 67.60 deg by hand (MarginsRendererTest), so a 70 deg limit is missed by 2.40 deg.
        assertTrue(b.plainText().contains("MISSED by 2.4 deg"), b.plainText());
        assertTrue(b.get(MimeBundle.TEXT_HTML).orElseThrow().contains("<table"), "HTML table");

        CellResult g = session.execute("Piv.of(50, 0.3, 20)", "cell [2]", OutputListener.IGNORE);
        MimeBundle gb = ((CellOutput.Result) g.outputs().get(0)).bundle();
        assertTrue(gb.plainText().contains("A/rpm") && gb.plainText().contains("Caution"), gb.plainText());
    }
}
