package org.loopledger.analysis;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.Discretization;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A sampled loop whose loop gain vanishes at the Nyquist frequency: a lead controller, a ZOH double integrator (zero at
 * z = -1, Franklin, Powell and Workman, Digital Control of Dynamic Systems, 3rd ed., ZOH of 1/s², from memory) and a
 * second-order Tustin low-pass (double zero at z = -1 by construction of the bilinear map), 8 kHz sampling. The
 * triple zero at z = -1 comes out of the root finder split by about 1e-7 and one root slightly outside the unit
 * circle, so L at Nyquist is -3e-22 instead of 0: before the fix a "phase crossover" with a gain margin of 430 dB was
 * reported there. Threshold 1e-12: a margin above 240 dB is no margin, and at such |L| the phase is rounding.
 */
class NyquistEdgeTest {
    static final double TS = 1.0 / 8000;

    static TransferFunction lowPass() {
        double wn = 2 * Math.PI * 400, z = 0.5;
        return Discretization.tustin(TransferFunction.continuous(new double[] {wn * wn}, new double[] {1, 2 * z * wn, wn * wn}), TS);
    }

    static TransferFunction loop() {
        double wn = 2 * Math.PI * 400, z = 0.5;
        TransferFunction lp = Discretization.tustin(TransferFunction.continuous(new double[] {wn * wn}, new double[] {1, 2 * z * wn, wn * wn}), TS);
        TransferFunction plant = Discretization.zoh(TransferFunction.continuous(new double[] {1}, new double[] {0.001, 0, 0}), TS);
        TransferFunction lead = TransferFunction.discrete(new double[] {3, -2.9}, new double[] {1, -0.5}, TS).times(0.5 * 2 * Math.PI * 80);
        return lead.times(plant).times(lp).times(2 * Math.PI * 50 * 0.001);
    }

    @Test void noPhaseCrossoverWhereTheLoopGainIsRounding() {
        Margins m = Margins.of(loop());
        for (PhaseCrossover p : m.phaseCrossovers()) {
            assertTrue(p.magnitude() >= Margins.NEGLIGIBLE_LOOP_GAIN, "phase crossover at " + p.frequencyHz() + " Hz with |L| = " + p.magnitude());
        }
        assertEquals(1, m.phaseCrossovers().size(), m.toString()); // the real one near 287 Hz
        assertTrue(m.warnings().stream().anyMatch(w -> w.kind() == LoopWarning.Kind.NEGLIGIBLE_CROSSOVERS_LEFT_OUT && w.message().contains("|L| < 1e-12")), m.warnings().toString());
    }

    @Test void theSampledGridStopsJustBelowNyquistAndIsAccepted() {
        double[] grid = FrequencyGrid.logSpacedRadPerSBelowNyquist(1, TS, 2000);
        assertEquals(FrequencyGrid.BELOW_NYQUIST * Math.PI / TS, grid[grid.length - 1], 1e-9 * Math.PI / TS);
        Frf l = Frf.ofModel(loop(), grid);
        Margins m = Margins.of(MeasuredLoop.ofSampled(l, TS).withIntegrators(2));
        assertTrue(Margins.of(MeasuredLoop.ofSampled(Frf.ofModel(lowPass(), grid), TS)) != null);
        for (PhaseCrossover p : m.phaseCrossovers()) assertTrue(p.magnitude() >= Margins.NEGLIGIBLE_LOOP_GAIN, p.toString());
        assertEquals(1, m.phaseCrossovers().size(), m.toString());
        // a grid up to Nyquist itself: the Tustin low-pass is exactly zero there, and a measured loop refuses the curve
        Frf toNyquist = Frf.ofModel(lowPass(), FrequencyGrid.logSpacedRadPerS(1, 0.5 / TS, 2000));
        var e = assertThrows(IllegalArgumentException.class, () -> MeasuredLoop.ofSampled(toNyquist, TS));
        assertTrue(e.getMessage().contains("non-zero"), e.getMessage());
    }
}
