package org.loopledger.ident.spectral;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.ident.RawDoubles;
import org.loopledger.ident.excitation.Multisine;
import org.loopledger.testing.PythonOracle;

import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * One period of an odd multisine through a linear filter with a weak square-law output nonlinearity
 * (y = g + 0.05·g², g = G·x): the single-period FRF on the excited (odd) lines against numpy.fft.rfft of the
 * same samples (Debian python3-numpy), the detected lines against the construction, and the floor on the
 * even lines against the same definition computed by numpy. A square law maps odd lines only onto even
 * lines (sums and differences of odd numbers are even; derivation by hand), so the odd lines see G alone
 * and the even lines carry the distortion.
 */
class SinglePeriodTest {
    static final double FS = 1000;
    static final int P = 1000;
    static final DiscreteFilter G = PeriodicAverageTest.G;
    static int[] odd;
    static double[] r, u, y;
    static JsonObject ref;

    static double[] nonlinear(double[] x, double a) {
        double[] g = G.apply(x);
        for (int i = 0; i < g.length; i++) g[i] += a * g[i] * g[i];
        return g;
    }

    @BeforeAll
    static void reference() {
        PythonOracle.require("numpy");
        odd = new int[200];
        for (int i = 0; i < odd.length; i++) odd[i] = 2 * i + 1; // 1, 3, .. 399 Hz
        double[] x = Multisine.ofHarmonics(odd, P, 1.0, FS, 2).signal().samples(); // one period to settle, one to use
        Random rnd = new Random(9);
        r = x.clone();
        for (int i = 0; i < r.length; i++) r[i] += 1e-5 * rnd.nextGaussian(); // the reference as a log holds it: a small noise floor
        u = x;
        y = nonlinear(x, 0.05);
        Path file = RawDoubles.write(u, y);
        Map<String, Object> in = new HashMap<>();
        in.put("file", file.toString());
        in.put("n", u.length);
        in.put("p", P);
        in.put("edges", new double[] {1, 10, 100, 500});
        String script = """
                import json, sys, numpy as np
                req = json.load(sys.stdin)
                d = np.fromfile(req['file'], dtype='<f8'); n = req['n']; p = req['p']
                u, y = d[:n][p:2*p], d[n:2*n][p:2*p]
                U, Y = np.fft.rfft(u), np.fft.rfft(y)
                k = np.arange(1, 400, 2)
                H = Y[k] / U[k]
                f = np.arange(len(Y)) * 1000.0 / p
                e = req['edges']; floors = []
                for b in range(len(e) - 1):
                    last = b == len(e) - 2
                    sel = (f >= e[b]) & ((f <= e[b + 1]) if last else (f < e[b + 1]))
                    sel[0] = False; sel[-1] = False   # DC and the Nyquist line are not used
                    ex = sel & (np.arange(len(Y)) % 2 == 1) & (np.arange(len(Y)) < 400)
                    qu = sel & ~ex
                    floors.append(10 * np.log10(np.mean(np.abs(Y[qu])**2) / np.mean(np.abs(Y[ex])**2)))
                print(json.dumps({'re': H.real.tolist(), 'im': H.imag.tolist(), 'floors': floors}))
                """;
        ref = PythonOracle.run(script, in).getAsJsonObject();
    }

    @Test
    void onePeriodGivesTheDftRatioOnTheOddLinesOnly() {
        PeriodicAverage pa = PeriodicAverage.of(FS, P, 1, r, u, y);
        assertEquals(1, pa.averagedPeriods());
        assertFalse(pa.hasNoiseEstimate());
        Frf h = pa.frf(1, 2, 0);
        // the detected lines are the construction's odd lines, although r carries a -100 dB noise floor on the even ones
        assertEquals(odd.length, h.size());
        double[] re = PythonOracle.doubles(ref.get("re")), im = PythonOracle.doubles(ref.get("im"));
        for (int i = 0; i < odd.length; i++) {
            assertEquals(odd[i], h.frequencyHz()[i], 1e-9);
            // Tolerance: both sides divide the same DFT sums of 1000 samples; 1e-10 relative covers FFT rounding
            double mag = Math.hypot(re[i], im[i]);
            assertEquals(re[i], h.realAt(i), 1e-10 * mag, "line " + odd[i]);
            assertEquals(im[i], h.imagAt(i), 1e-10 * mag, "line " + odd[i]);
        }
        // and those are G itself: the transient after one 1000-sample period is ~1e-150 (poles at 0.707)
        double[] w = h.omegaRadPerS(), gr = new double[w.length], gi = new double[w.length];
        G.tf(1 / FS).response(w, gr, gi);
        for (int i = 0; i < w.length; i++) assertEquals(gr[i], h.realAt(i), 1e-9 * Math.hypot(gr[i], gi[i]));
        assertTrue(h.uncertainty().isEmpty() && h.coherence().isEmpty(), "one period: no scatter to estimate");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> pa.noiseStd(2));
        assertTrue(e.getMessage().contains("at least 2 averaged periods"), e.getMessage());
    }

    @Test
    void theFloorOnTheEvenLinesShowsTheDistortion() {
        PeriodicAverage pa = PeriodicAverage.of(FS, P, 1, r, u, y);
        LineFloor out = pa.floor(0, 2, 1, 10, 100, 500);
        double[] floors = PythonOracle.doubles(ref.get("floors"));
        assertEquals(3, out.bands().size(), out.toString());
        for (int b = 0; b < 3; b++) {
            // Tolerance 1e-9 dB: the same sums of squares on both sides
            assertEquals(floors[b], out.bands().get(b).floorDb(), 1e-9, out.toString());
            assertTrue(Double.isNaN(out.bands().get(b).noiseDb()));
        }
        assertTrue(out.worstFloorDb() > -60, "a 5 % square law stands well above rounding: " + out);
        // the input is the exact multisine: its even lines hold rounding only
        assertTrue(pa.floor(0, 1, 1, 10, 100, 500).worstFloorDb() < -200, pa.floor(0, 1).toString());
        // without the nonlinearity the output floor drops to rounding as well
        PeriodicAverage lin = PeriodicAverage.of(FS, P, 1, r, u, nonlinear(u, 0));
        assertTrue(lin.floor(0, 2).worstFloorDb() < -200, lin.floor(0, 2).toString());
    }

    @Test
    void withSeveralPeriodsTheFloorStandsOnTheNoiseOnlyWhereDistortionAdds() {
        double[] x = Multisine.ofHarmonics(odd, P, 1.0, FS, 9).signal().samples();
        Random rnd = new Random(11);
        double[] yl = nonlinear(x, 0), yn = nonlinear(x, 0.05);
        for (int i = 0; i < x.length; i++) { double v = 0.002 * rnd.nextGaussian(); yl[i] += v; yn[i] += v; }
        PeriodicAverage linear = PeriodicAverage.of(FS, P, 1, x, x, yl), squared = PeriodicAverage.of(FS, P, 1, x, x, yn);
        assertEquals(8, linear.averagedPeriods());
        LineFloor fl = linear.floor(0, 2, 100, 500), fn = squared.floor(0, 2, 100, 500);
        // Linear: on the 250 quiet lines |Ȳ|² and σ²_Ȳ both estimate the noise on the mean (Pintelon and Schoukens, from memory);
        // each is a mean of ~250 (and 250·7 dof) squared Gaussians, so they agree within about 10·log10(1 ± 3/√250) ≈ ±1 dB
        assertEquals(0, fl.bands().get(0).excessOverNoiseDb(), 1.2, fl.toString());
        // square law: the even lines stand far above the noise
        assertTrue(fn.bands().get(0).excessOverNoiseDb() > 20, fn.toString());
        assertTrue(linear.frf(1, 2, 0).uncertainty().isPresent());
    }

    @Test
    void badBandsAndTooShortRecordsAreRefused() {
        PeriodicAverage pa = PeriodicAverage.of(FS, P, 1, r, u, y);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> pa.floor(0, 2, 100, 10));
        assertTrue(e.getMessage().contains("must increase"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> PeriodicAverage.of(FS, P, 2, r, u, y));
        assertTrue(e.getMessage().contains("at least 1 must remain"), e.getMessage());
    }
}
