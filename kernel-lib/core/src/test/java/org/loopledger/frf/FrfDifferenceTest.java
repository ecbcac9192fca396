package org.loopledger.frf;

import org.junit.jupiter.api.Test;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@link FrfDifference}: the largest relative difference |a − b|/|b| on a common grid, checked against its definition. */
class FrfDifferenceTest {
    static final double[] GRID = FrequencyGrid.logSpacedRadPerS(1, 1000, 300);
    /** 1/(s + 2π·50): a first-order lag. */
    static final TransferFunction LAG = TransferFunction.continuous(new double[] {1}, new double[] {1, 2 * Math.PI * 50});

    @Test
    void aResponseAgainstItselfDiffersByNothing() {
        Frf b = Frf.ofModel(LAG, GRID);
        FrfDifference d = FrfDifference.between(b, b);
        assertEquals(0, d.maxRelative(), 0.0);
        assertEquals(GRID.length, d.points());
        assertTrue(d.within(0));
    }

    @Test
    void aScaledCopyDiffersByTheScaleEverywhere() {
        // definition: |(1 + e)·b − b| / |b| = |e| at every point, whatever b is
        Frf b = Frf.ofModel(LAG, GRID);
        FrfDifference d = FrfDifference.between(b.times(1 + 1e-3), b);
        assertEquals(1e-3, d.maxRelative(), 1e-15);
        assertFalse(d.within(1e-4));
        assertTrue(d.within(2e-3));
    }

    @Test
    void theLargestDifferenceIsFoundWithItsFrequency() {
        // a = b·(1 + s/(2π·1000)) differs from b by |jω/(2π·1000)|, largest at the top of the grid (1 kHz): exactly 1 there
        Frf b = Frf.ofModel(LAG, GRID);
        Frf a = b.times(TransferFunction.continuous(new double[] {1 / (2 * Math.PI * 1000), 1}, new double[] {1}));
        FrfDifference d = FrfDifference.between(a, b);
        assertEquals(1.0, d.maxRelative(), 1e-12);
        assertEquals(1000, d.atHz(), 1e-9);
        assertTrue(d.toString().startsWith("largest relative difference 1 (at ") && d.toString().endsWith(", 300 points)"), d.toString());
    }

    @Test
    void differentGridsAreRefusedWithTheFix() {
        Frf b = Frf.ofModel(LAG, GRID);
        Frf other = Frf.ofModel(LAG, FrequencyGrid.logSpacedRadPerS(1, 1000, 299));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> FrfDifference.between(other, b));
        assertTrue(e.getMessage().contains("resampledTo"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> FrfDifference.between(b, b).within(-1));
    }
}
