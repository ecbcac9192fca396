package org.loopledger.frf;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@link Frf#atHz}, {@link Frf#magnitudeDbAtHz}, {@link Frf#phaseDegAtHz}: one value at a frequency in Hz. */
class FrfAtHzTest {
    static final double FN_HZ = 50, ZETA = 0.2;
    static final double WN = 2 * Math.PI * FN_HZ;

    /** Textbook standard second-order low-pass: G(jω) = ωn² / (ωn² − ω² + j·2ζωn·ω). */
    static Complex textbook(double hz) {
        double w = 2 * Math.PI * hz;
        return new Complex(WN * WN, 0).divide(new Complex(WN * WN - w * w, 2 * ZETA * WN * w));
    }

    static final double[] GRID = FrequencyGrid.logSpacedRadPerS(1, 1000, 400);
    static final Frf FRF = Frf.ofModel(TransferFunction.continuous(new double[] {WN * WN}, new double[] {1, 2 * ZETA * WN, WN * WN}), GRID);

    @Test
    void atAGridPointItIsTheStoredValueExactly() {
        int tested = 0;
        for (int i = 0; i < GRID.length; i++) {
            double hz = Units.radPerSToHz(GRID[i]);
            // radPerSToHz then hzToRadPerS may move ω by an ulp; only test the points that round-trip exactly
            if (Units.hzToRadPerS(hz) != GRID[i]) continue;
            assertEquals(FRF.valueAt(i), FRF.atHz(hz));
            assertEquals(FRF.magnitudeDb()[i], FRF.magnitudeDbAtHz(hz), 0.0);
            assertEquals(FRF.phaseDegUnwrapped()[i], FRF.phaseDegAtHz(hz), 0.0);
            tested++;
        }
        assertTrue(tested > 100, "only " + tested + " grid points round-trip through Hz");
    }

    @Test
    void betweenGridPointsItAgreesWithTheModel() {
        // Tolerance: linear interpolation of f(ln ω) over a step h has error <= h²/8·max|f''|. Here h = ln(1000)/399
        // = 0.0173, and for ζ = 0.2 the curvature of ln|G| and of the phase against ln ω peaks near ωn at about
        // 1/(2ζ²) = 12.5 (common practice for the standard second-order section), so the error bound is about
        // 3.75e-5·12.5 = 4.7e-4 in ln|G| and in rad: allow 1e-3 relative on the complex value and 0.01 dB / 0.06 deg.
        double worst = 0;
        for (int i = 0; i + 1 < GRID.length; i++) {
            double hz = Units.radPerSToHz(Math.sqrt(GRID[i] * GRID[i + 1])); // log midpoint: the worst place
            Complex want = textbook(hz), got = FRF.atHz(hz);
            double rel = got.subtract(want).abs() / want.abs();
            worst = Math.max(worst, rel);
            assertTrue(rel < 1e-3, "at " + hz + " Hz: " + got + " vs textbook " + want + " (relative error " + rel + ")");
            assertEquals(Units.ratioToDb(want.abs()), FRF.magnitudeDbAtHz(hz), 0.01, "magnitude at " + hz + " Hz");
            // unwrapped phase of a 2nd-order low-pass runs 0 .. -180 deg, so atan2 is already on its branch
            assertEquals(Math.toDegrees(Math.atan2(want.getImaginary(), want.getReal())), FRF.phaseDegAtHz(hz), 0.06, "phase at " + hz + " Hz");
        }
        assertTrue(worst > 0, "the midpoints must really be interpolated");
        // the resonance peak itself (between grid points): textbook peak 1/(2ζ·sqrt(1-ζ²)) = 2.552 = +8.14 dB at fn·sqrt(1-2ζ²)
        double peakHz = FN_HZ * Math.sqrt(1 - 2 * ZETA * ZETA);
        assertEquals(Units.ratioToDb(1 / (2 * ZETA * Math.sqrt(1 - ZETA * ZETA))), FRF.magnitudeDbAtHz(peakHz), 0.01);
    }

    @Test
    void theUnwrappedBranchIsKeptBeyondMinus180() {
        // a triple pole at 10 Hz: phase goes to -270 deg; at 100 Hz the textbook phase is -3·atan(10) = -252.9 deg
        double wp = 2 * Math.PI * 10;
        TransferFunction one = TransferFunction.continuous(new double[] {wp}, new double[] {1, wp});
        Frf f = Frf.ofModel(one.times(one).times(one), FrequencyGrid.logSpacedRadPerS(1, 300, 500));
        assertEquals(-3 * Math.toDegrees(Math.atan(10)), f.phaseDegAtHz(100.0001), 0.01);
    }

    @Test
    void refusesFrequenciesOutsideTheGrid() {
        IllegalArgumentException below = assertThrows(IllegalArgumentException.class, () -> FRF.atHz(0.5));
        assertTrue(below.getMessage().contains("outside") && below.getMessage().contains("extrapolated"), below.getMessage());
        assertThrows(IllegalArgumentException.class, () -> FRF.atHz(1001));
        assertThrows(IllegalArgumentException.class, () -> FRF.magnitudeDbAtHz(2000));
        assertThrows(IllegalArgumentException.class, () -> FRF.phaseDegAtHz(0.1));
        IllegalArgumentException nan = assertThrows(IllegalArgumentException.class, () -> FRF.atHz(Double.NaN));
        assertTrue(nan.getMessage().contains("finite positive"), nan.getMessage());
        assertThrows(IllegalArgumentException.class, () -> FRF.atHz(-3));
    }
}
