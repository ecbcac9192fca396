package org.loopledger.ident.spectral;

import org.junit.jupiter.api.Test;
import org.loopledger.ident.excitation.Multisine;
import org.loopledger.ident.excitation.Prbs;

import java.util.Arrays;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Period detection on signals built with a known period (the definition of periodicity is the reference):
 * PRBS with noise, a multisine cut at an arbitrary start, a back-and-forth position reference over 2.5
 * periods, a sine whose cycle is half a sample off a whole number; refusals for noise, non-whole periods,
 * constants and records too short. The FFT autocorrelation is checked against its direct sum (definition).
 */
class PeriodDetectionTest {
    static final double FS = 4000;

    @Test
    void prbsWithNoiseGivesItsPeriodWithHighConfidence() {
        Prbs prbs = Prbs.of(7, 1.0, 3, 5, FS); // 127 bits × 3 samples = 381
        double[] x = prbs.signal().samples();
        Random r = new Random(3);
        for (int i = 0; i < x.length; i++) x[i] += 0.1 * r.nextGaussian();
        PeriodDetection.Period p = PeriodDetection.detect(x, FS);
        assertEquals(381, p.periodSamples(), p.toString());
        assertEquals(1, p.cyclesPerPeriod());
        assertEquals(5, p.wholePeriods());
        // signal variance 1, noise 0.01: ρ ≈ 1/(1 + 0.01) = 0.990 (class comment); ±0.01 for the noise's own scatter over 1900 lags
        assertEquals(1 / 1.01, p.confidence(), 0.01, p.toString());
        assertEquals(FS / 381, p.lineSpacingHz(), 1e-12);
    }

    @Test
    void multisineFromAnArbitraryStartAndAPositionReferenceOverTwoAndAHalfPeriods() {
        double[] ms = Multisine.schroederLogLines(5, 800, 40, 1000, 1.0, FS, 4).signal().samples();
        PeriodDetection.Period p = PeriodDetection.detect(Arrays.copyOfRange(ms, 137, ms.length), FS);
        assertEquals(1000, p.periodSamples(), p.toString());
        assertEquals(1, p.confidence(), 1e-9, "exactly repeating");
        // a back-and-forth move: ramp up 400 samples, dwell 400, ramp down 400, dwell 400 (period 1600), 2.5 periods, offset 2 mm
        double[] ref = new double[4000];
        for (int i = 0; i < ref.length; i++) {
            int k = i % 1600;
            double v = k < 400 ? k / 400.0 : k < 800 ? 1 : k < 1200 ? 1 - (k - 800) / 400.0 : 0;
            ref[i] = 0.002 + 0.01 * v;
        }
        p = PeriodDetection.detect(ref, FS);
        assertEquals(1600, p.periodSamples(), p.toString());
        assertEquals(2, p.wholePeriods());
    }

    @Test
    void aCycleOfHalfASampleOffGivesTheWholeSamplePeriodOfTwoCycles() {
        double[] x = new double[3000];
        for (int i = 0; i < x.length; i++) x[i] = Math.sin(2 * Math.PI * i / 100.5);
        PeriodDetection.Period p = PeriodDetection.detect(x, FS);
        assertEquals(201, p.periodSamples(), p.toString());
        assertEquals(2, p.cyclesPerPeriod());
        assertEquals(100.5, p.fractionalPeriodSamples(), 0.01);
    }

    @Test
    void noiseAndNonWholePeriodsAreRefusedWithTheReason() {
        Random r = new Random(5);
        double[] noise = new double[8000];
        for (int i = 0; i < noise.length; i++) noise[i] = r.nextGaussian();
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> PeriodDetection.detect(noise, FS));
        assertTrue(e.getMessage().startsWith("not periodic"), e.getMessage());
        // a multisine whose period is 1000.37 samples: lines at h/1000.37 cycles per sample
        double[] drift = new double[6000];
        for (int h : new int[] {3, 7, 19, 41, 97, 211}) {
            for (int i = 0; i < drift.length; i++) drift[i] += Math.cos(2 * Math.PI * h * i / 1000.37 + h);
        }
        e = assertThrows(IllegalArgumentException.class, () -> PeriodDetection.detect(drift, FS));
        assertTrue(e.getMessage().contains("1000.3") && e.getMessage().contains("whole number"), e.getMessage());
        double[] flat = new double[100];
        Arrays.fill(flat, 2.5);
        e = assertThrows(IllegalArgumentException.class, () -> PeriodDetection.detect(flat, FS));
        assertTrue(e.getMessage().contains("constant"), e.getMessage());
        // one and a half periods: no repetition within half the record
        double[] ms = Multisine.schroederLogLines(5, 800, 40, 1000, 1.0, FS, 2).signal().samples();
        e = assertThrows(IllegalArgumentException.class, () -> PeriodDetection.detect(Arrays.copyOf(ms, 1500), FS));
        assertTrue(e.getMessage().contains("not periodic") || e.getMessage().contains("fit at least twice"), e.getMessage());
    }

    @Test
    void fftAutocorrelationEqualsTheDirectSum() {
        Random r = new Random(7);
        int n = 777;
        double[] x = new double[n], cum = new double[n + 1];
        for (int i = 0; i < n; i++) { x[i] = r.nextGaussian(); cum[i + 1] = cum[i] + x[i] * x[i]; }
        double[] rho = PeriodDetection.normalisedAutocorrelation(x, cum);
        for (int t : new int[] {0, 1, 5, 100, 388, 700, 776}) {
            double a = 0, e1 = 0, e2 = 0;
            for (int i = 0; i + t < n; i++) { a += x[i] * x[i + t]; e1 += x[i] * x[i]; e2 += x[i + t] * x[i + t]; }
            // Tolerance: FFT rounding on sums of ~800 terms of unit size
            assertEquals(a / Math.sqrt(e1 * e2), rho[t], 1e-12, "lag " + t);
        }
    }
}
