package org.loopledger.display;

import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.analysis.GangOfFour;
import org.loopledger.lti.TransferFunction;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** {@link GangOfFourPeaks}: the peaks of |S|, |T|, |PS|, |CS| with the position in a unit of the user's choice. */
class GangOfFourPeaksTest {
    // P = 1/(s(s+1)) (rad per A), C = 1: PS = P/(1 + P) = 1/(s^2 + s + 1), zeta = 0.5, wn = 1. Resonant peak (Ogata,
    // Modern Control Engineering, 5th ed., section 7-2): Mr = 1/(2 zeta sqrt(1 - zeta^2)) = 1.1547 at wr = wn sqrt(1 - 2 zeta^2).
    static final double MR = 1 / (2 * 0.5 * Math.sqrt(0.75)), WR_HZ = Math.sqrt(0.5) / (2 * Math.PI);
    static final GangOfFour GANG = GangOfFour.of(MarginsTableTest.TYPE1, TransferFunction.gain(1), MarginsTableTest.GRID);

    @Test
    void loadSensitivityPeakIsShownPerInputUnitInThePositionUnitAsked() {
        double umPerRad = 1591.549; // 10 mm screw lead: 1 rad = 10 mm / 2π of carriage travel
        GangOfFourPeaks p = GangOfFourPeaks.of(GANG).positionUnit("µm", umPerRad);
        assertEquals(MR * umPerRad, p.loadSensitivityPeak().value(), 2e-3 * MR * umPerRad, "grid of 4000 points over 6 decades");
        assertEquals(WR_HZ, p.loadSensitivityPeak().frequencyHz(), 3e-3 * WR_HZ);
        assertEquals("µm/A", p.loadSensitivityPeak().unit());
        // With C = 1, CS = C·S = S: the same peak, shown per µm, so divided by the scale.
        double[] ms = MarginsTableTest.msByDefinition(MarginsTableTest.TYPE1);
        assertEquals(ms[0] / umPerRad, p.noiseSensitivityPeak().value(), 2e-3 * ms[0] / umPerRad);
        assertEquals("A/µm", p.noiseSensitivityPeak().unit());
        assertEquals(ms[0], p.sensitivityPeak().value(), 2e-3 * ms[0]);
        assertEquals(MR, p.complementarySensitivityPeak().value(), 2e-3 * MR, "T = PS here");
        assertFalse(p.loadSensitivityPeak().atGridEdge());

        Document d = ResultTablesTest.html(Bundles.of(p));
        List<String> ps = ResultTablesTest.row(d, "|PS|");
        assertEquals(MR * umPerRad, Double.parseDouble(ps.get(2)), 2e-3 * MR * umPerRad);
        assertEquals("µm/A", ps.get(3));
        assertTrue(p.toString().contains("µm/A"), p.toString());
    }

    @Test
    void withoutAUnitTheAxisUnitIsShownAndBadUnitsAreRefused() {
        GangOfFourPeaks p = GangOfFourPeaks.of(GANG);
        assertEquals(MR, p.loadSensitivityPeak().value(), 2e-3 * MR);
        assertEquals("rad/A", p.loadSensitivityPeak().unit());
        assertEquals("rad/N·m", p.inputUnit("N·m").loadSensitivityPeak().unit());
        assertThrows(IllegalArgumentException.class, () -> p.positionUnit("µm", 0));
        assertThrows(IllegalArgumentException.class, () -> p.positionUnit(" ", 1));
        assertThrows(IllegalArgumentException.class, () -> p.inputUnit(""));
    }
}
