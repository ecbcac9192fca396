package org.loopledger.display;

import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Margins;
import org.loopledger.lti.TransferFunction;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** Computed beside reference figures: the differences against arithmetic done independently here. */
class ReferenceChecksTest {
    @Test
    void rowsStateComputedReferenceDifferenceAndSource() {
        // K/(s(s+1)(s+2)), K = 1: Routh on s^3 + 3s^2 + 2s + K gives the phase crossover at sqrt(2) rad/s and a gain margin of 6
        // (textbook derivation, e.g. Ogata, Modern Control Engineering, 5th ed., section 5-6).
        Margins m = Margins.of(TransferFunction.continuous(new double[] {1}, new double[] {1, 3, 2, 0}));
        double wpc = m.upperGainMargin().orElseThrow().omegaRadPerS();
        ReferenceChecks t = ReferenceChecks.titled("third-order loop")
                .check("phase crossover", wpc, Math.sqrt(2), "rad/s", "by hand, Routh")
                .check("gain margin (ratio)", 6.02, 6, "", "rounded on purpose")
                .check("offset", 0.25, 0, "V", "zero by construction");
        assertEquals(3, t.rows().size());
        assertEquals(wpc - Math.sqrt(2), t.rows().get(0).difference(), 0);
        assertTrue(t.rows().get(0).relativeDifference().getAsDouble() < 1e-12, "the library's crossover is exact to round-off");

        Document d = ResultTablesTest.html(t.toMimeBundle());
        // 6.02 against 6: difference +0.02 = +2.0e-02, relative 0.02/6 = 3.33e-3 -> 3.3e-03 (two significant digits).
        // (jsoup's eachText leaves out the empty unit cell of a ratio)
        assertEquals(List.of("gain margin (ratio)", "6.02000", "6.00000", "+2.0e-02", "3.3e-03", "rounded on purpose"),
                ResultTablesTest.row(d, "gain margin (ratio)"));
        // A zero reference has no relative difference: an en dash, not Infinity.
        assertEquals(List.of("offset", "0.250000", "0.00000", "V", "+2.5e-01", "–", "zero by construction"), ResultTablesTest.row(d, "offset"));
        assertEquals(0.02 / 6, t.largestRelativeDifference().getAsDouble(), 1e-15);
        assertTrue(t.toString().startsWith("third-order loop\n"), t.toString());
        assertTrue(t.toString().contains("by hand, Routh"), t.toString());
    }

    @Test
    void isImmutableAndRefusesWhatCannotBeChecked() {
        ReferenceChecks empty = ReferenceChecks.titled("t");
        ReferenceChecks one = empty.check("x", 1, 1, "", "by hand");
        assertTrue(empty.rows().isEmpty(), "check returns a new table");
        assertEquals(1, one.rows().size());
        assertTrue(empty.largestRelativeDifference().isEmpty());
        assertTrue(empty.toString().contains("no checks yet"));
        IllegalArgumentException nan = assertThrows(IllegalArgumentException.class, () -> empty.check("phase margin", Double.NaN, 45, "deg", "book"));
        assertTrue(nan.getMessage().contains("phase margin") && nan.getMessage().contains("NaN"), nan.getMessage());
        assertThrows(IllegalArgumentException.class, () -> empty.check("phase margin", 45, Double.POSITIVE_INFINITY, "deg", "book"));
        IllegalArgumentException noSource = assertThrows(IllegalArgumentException.class, () -> empty.check("phase margin", 45, 45, "deg", " "));
        assertTrue(noSource.getMessage().contains("where the reference comes from"), noSource.getMessage());
        assertThrows(IllegalArgumentException.class, () -> empty.check("", 1, 1, "", "by hand"));
    }
}
