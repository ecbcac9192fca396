package org.loopledger.analysis;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.*;

/** Degenerate and bad loops: stated results or clear errors, never a silent NaN. */
class MarginsBadInputTest {

    /** 0.5/(s+1): |L| &le; 0.5 and ∠L &gt; -90° everywhere (by hand), so no crossover of either kind. */
    @Test
    void noCrossoverIsStatedNotNaN() {
        TransferFunction l = TransferFunction.continuous(new double[] {0.5}, new double[] {1, 1});
        for (Margins m : new Margins[] {Margins.of(l), Margins.of(Frf.ofModel(l, FrequencyGrid.logRadPerS(0.01, 100, 300)))}) {
            assertTrue(m.gainCrossovers().isEmpty());
            assertTrue(m.phaseCrossovers().isEmpty());
            assertTrue(m.phaseMarginDeg().isEmpty());
            assertTrue(m.gainMarginDb().isEmpty());
            assertTrue(m.delayMarginS().isEmpty());
            String s = m.toString();
            assertFalse(s.contains("NaN"), s);
            assertTrue(s.contains(m.measured() ? "none in band" : "no crossover"), s);
            assertTrue(Double.isFinite(m.sensitivityPeak().magnitude()));
        }
    }

    @Test
    void improperLoopRejected() {
        TransferFunction l = TransferFunction.continuous(new double[] {1, 0, 0}, new double[] {1, 1});
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Margins.of(l));
        assertTrue(e.getMessage().contains("proper"), e.getMessage());
    }

    @Test
    void zeroLoopRejected() {
        TransferFunction l = TransferFunction.continuous(new double[] {0}, new double[] {1, 1});
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Margins.of(l));
        assertTrue(e.getMessage().contains("zero"), e.getMessage());
    }

    /** An all-pass loop (s-1)/(s+1) has |L| = 1 everywhere: no isolated gain crossover, said so. */
    @Test
    void allPassLoopIsFlagged() {
        Margins m = Margins.of(TransferFunction.continuous(new double[] {1, -1}, new double[] {1, 1}));
        assertTrue(m.gainCrossovers().isEmpty());
        assertTrue(m.warnings().stream().anyMatch(w -> w.kind() == LoopWarning.Kind.GAIN_NOT_ISOLATED && w.message().contains("all-pass")), m.warnings().toString());
    }

    /** A constant loop gain of 0.5: nothing crosses, bandwidth never reached, stated. */
    @Test
    void constantLoop() {
        Margins m = Margins.of(TransferFunction.gain(0.5));
        assertTrue(m.gainCrossovers().isEmpty() && m.phaseCrossovers().isEmpty());
        assertTrue(m.bandwidth().omegaRadPerS().isEmpty());
        assertFalse(m.bandwidth().toString().contains("NaN"));
    }
}
