package org.loopledger.ident.spectral;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.ident.excitation.Multisine;
import org.loopledger.ident.excitation.Prbs;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Synchronous averaging: exact on noise-free periodic data (leakage-free, derivation by hand: the DFT
 * of a whole period of a steady-state periodic response is G(e^{jωkT})·X(k) exactly), noise estimate
 * consistent with the actual error, unexcited lines excluded, bad requests refused.
 */
class PeriodicAverageTest {
    static final double FS = 1000;
    static final DiscreteFilter G = new DiscreteFilter(new double[] {0.2, 0.1}, new double[] {1, -1.2, 0.5});

    static double[][] simulate(double[] x, double noise, long seed) {
        double[] y = G.apply(x);
        Random r = new Random(seed);
        for (int i = 0; i < y.length; i++) y[i] += noise * r.nextGaussian();
        return new double[][] {x, y};
    }

    @Test
    void exactWithoutNoiseAfterTheTransient() {
        double[] x = Multisine.schroederLogLines(2, 400, 60, 1000, 1.0, FS, 6).signal().samples();
        double[][] d = simulate(x, 0, 1);
        PeriodicAverage pa = PeriodicAverage.of(FS, 1000, 1, d[0], d[1]);
        Frf h = pa.frf(0, 1, 0);
        double[] w = h.omegaRadPerS(), gr = new double[w.length], gi = new double[w.length];
        G.tf(1 / FS).response(w, gr, gi);
        // the transient decays as 0.71^k: after one skipped 1000-sample period it is ~1e-150; rounding only
        for (int k = 0; k < w.length; k++) {
            assertEquals(gr[k], h.realAt(k), 1e-12);
            assertEquals(gi[k], h.imagAt(k), 1e-12);
        }
        assertTrue(h.size() >= 50 && h.size() <= 60, "only the multisine's lines: " + h.size());
    }

    @Test
    void noiseEstimateMatchesTheActualError() {
        Prbs prbs = Prbs.of(9, 1.0, 1, 41, FS);
        double[][] d = simulate(prbs.signal().samples(), 0.2, 5);
        PeriodicAverage pa = PeriodicAverage.of(FS, prbs.periodSamples(), 1, d[0], d[1]);
        assertEquals(40, pa.averagedPeriods());
        Frf h = pa.frf(0, 1, 0);
        double[] w = h.omegaRadPerS(), gr = new double[w.length], gi = new double[w.length];
        G.tf(1 / FS).response(w, gr, gi);
        double[] s = h.uncertainty().orElseThrow();
        double sum = 0;
        for (int k = 0; k < w.length; k++) {
            double e2 = Math.pow(h.realAt(k) - gr[k], 2) + Math.pow(h.imagAt(k) - gi[k], 2);
            sum += e2 / (s[k] * s[k]);
        }
        // mean of |e|²/σ̂² over 255 lines ≈ 1; with 40 periods σ̂² itself scatters ~16 %, 0.75 .. 1.3 covers it
        double mean = sum / w.length;
        assertEquals(1.0, mean, 0.3, "mean normalised squared error");
        double[] c = h.coherence().orElseThrow();
        for (double v : c) assertTrue(v > 0 && v <= 1);
    }

    @Test
    void dividerNullsAreNotExcitedAndEmptyBandsAreRefused() {
        Prbs prbs = Prbs.of(7, 1.0, 4, 4, FS); // nulls at 250 Hz and 500 Hz
        double[][] d = simulate(prbs.signal().samples(), 0.01, 2);
        PeriodicAverage pa = PeriodicAverage.of(FS, prbs.periodSamples(), 1, d[0], d[1]);
        boolean[] exc = pa.excitedLines(0);
        double[] f = pa.frequencyHz();
        for (int k = 0; k < f.length; k++) {
            boolean atNull = Math.abs(f[k] - 250) < 1e-9 || Math.abs(f[k] - 500) < 1e-9;
            assertEquals(!atNull, exc[k], "line " + f[k] + " Hz");
        }
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> pa.frf(0, 1, 0, 249.9, 250.1));
        assertTrue(e.getMessage().contains("no energy"), e.getMessage());
        double[] x = Multisine.schroederLogLines(10, 100, 10, 1000, 1.0, FS, 3).signal().samples();
        PeriodicAverage pm = PeriodicAverage.of(FS, 1000, 0, x, x);
        e = assertThrows(IllegalArgumentException.class, () -> pm.frf(0, 1, 0, 200, 400));
        assertTrue(e.getMessage().contains("200 Hz") && e.getMessage().contains("no energy"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> PeriodicAverage.of(FS, 1000, 3, x, x));
        assertTrue(e.getMessage().contains("at least 1"), e.getMessage());
    }

    @Test
    void logDecimationKeepsAPlainFrfAndShrinksTheGrid() {
        double[] w = new double[1000], re = new double[1000], im = new double[1000], sig = new double[1000];
        for (int i = 0; i < w.length; i++) { w[i] = 10 + i; re[i] = 2; im[i] = -1; sig[i] = 0.1; }
        Frf f = LogDecimation.decimate(Frf.ofParts(w, re, im).withUncertainty(sig), 20);
        // 10 .. 1009 rad/s is two decades: about 40 points (derivation by hand)
        assertTrue(f.size() >= 39 && f.size() <= 41, "points " + f.size());
        for (int i = 0; i < f.size(); i++) {
            assertEquals(2.0, f.realAt(i), 1e-12);
            assertEquals(-1.0, f.imagAt(i), 1e-12);
        }
        // a bin holding m points has σ = 0.1/√m: the first bin holds 10 and 11 rad/s (log10(1.1) < 1/20), σ = 0.1/√2; about
        // 110 points in a full bin near 1000 rad/s (12 % wide), σ ≈ 0.0095 (derivation by hand)
        double[] s = f.uncertainty().orElseThrow();
        assertEquals(0.1 / Math.sqrt(2), s[0], 1e-12);
        double min = Double.MAX_VALUE;
        for (double v : s) min = Math.min(min, v);
        assertTrue(min < 0.011 && min > 0.008, "combined σ of the fullest bin: " + min);
        assertThrows(IllegalArgumentException.class, () -> LogDecimation.decimate(f, 0));
    }
}
