package org.loopledger.frf;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;
import org.loopledger.testing.PythonOracle;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.stream.IntStream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@link Frf}, {@link Phase} and {@link FrequencyGrid}: interpolation, bands, grids, unwrapping (numpy.unwrap). */
class FrfTest {
    static final long SEED = 4_242L;
    static final List<double[]> PHASES = new ArrayList<>();
    static JsonObject numpy;

    @BeforeAll
    static void askNumpy() {
        PythonOracle.require("numpy");
        SplittableRandom rnd = new SplittableRandom(SEED);
        for (int k = 0; k < 12; k++) {
            // a random walk whose steps reach ±3π, then wrapped to (-π, π]: unwrapping must undo whole turns
            double[] p = new double[200];
            double acc = rnd.nextDouble(-10, 10);
            for (int i = 0; i < p.length; i++) {
                acc += rnd.nextDouble(-1, 1) * (k < 6 ? 2.5 : 9.0);
                p[i] = k % 2 == 0 ? Math.atan2(Math.sin(acc), Math.cos(acc)) : acc; // odd k: raw, not wrapped
            }
            PHASES.add(p);
        }
        // edge cases: steps of exactly +π, -π, +3π, and a constant
        PHASES.add(new double[] {0, Math.PI, 0, -Math.PI, 0, 3 * Math.PI, 0});
        PHASES.add(new double[] {1, 1, 1});
        PHASES.add(new double[] {0.5});
        String script = """
                import json, sys
                import numpy as np
                req = json.load(sys.stdin)
                print(json.dumps({"unwrap": [np.unwrap(np.array(p)).tolist() for p in req["phases"]],
                                  "logspace": (2 * np.pi * np.logspace(np.log10(req["lo"]), np.log10(req["hi"]), req["n"])).tolist()}))
                """;
        numpy = PythonOracle.run(script, Map.of("phases", PHASES, "lo", 0.5, "hi", 2000.0, "n", 57)).getAsJsonObject();
    }

    static IntStream phaseIndices() { return IntStream.range(0, PHASES.size()); }

    // Source: numpy.unwrap(p) (default discontinuity π, period 2π).
    @ParameterizedTest(name = "unwrap sequence {0}")
    @MethodSource("phaseIndices")
    void unwrapMatchesNumpy(int i) {
        double[] want = PythonOracle.doubles(numpy.getAsJsonArray("unwrap").get(i));
        double[] in = PHASES.get(i).clone();
        double[] got = Phase.unwrapRad(in);
        assertArrayEquals(PHASES.get(i), in); // not modified
        // 1e-12 absolute: both add whole multiples of 2π; numpy forms them as (mod(d+π, 2π) - π) - d, which
        // rounds differently by a few ulps of the accumulated phase (up to ~1e3 rad here)
        assertArrayEquals(want, got, 1e-12);
    }

    // Source: 2π·numpy.logspace(log10(lo Hz), log10(hi Hz), n).
    @Test
    void logSpacedRadPerSGridMatchesNumpyLogspace() {
        double[] want = PythonOracle.doubles(numpy.get("logspace"));
        double[] got = FrequencyGrid.logSpacedRadPerS(0.5, 2000, 57);
        for (int i = 0; i < want.length; i++) assertEquals(want[i], got[i], 1e-13 * want[i], "point " + i);
        assertEquals(Units.hzToRadPerS(0.5), got[0]);      // end points exact
        assertEquals(Units.hzToRadPerS(2000), got[56]);
    }

    /** Each grid's name states the unit of what it returns (the old {@code logHz} took Hz and returned rad/s). */
    @Test
    void gridNamesStateTheReturnedUnit() {
        java.util.Set<String> names = new java.util.TreeSet<>();
        for (var m : FrequencyGrid.class.getDeclaredMethods()) if (java.lang.reflect.Modifier.isPublic(m.getModifiers())) names.add(m.getName());
        assertEquals(java.util.Set.of("forModelRadPerS", "logRadPerS", "logSpacedHz", "logSpacedRadPerS", "logSpacedRadPerSBelowNyquist"), names);
        assertEquals(2 * Math.PI, FrequencyGrid.logSpacedRadPerS(1, 1000, 4)[0]);   // 1 Hz is 2π rad/s (common practice)
        assertEquals(1, FrequencyGrid.logSpacedHz(1, 1000, 4)[0]);
    }

    // Source: numpy.logspace(log10(lo Hz), log10(hi Hz), n), the same reference as above divided by 2π;
    // logSpacedHz returns Hz, not rad/s (logSpacedRadPerS returns the same grid in rad/s). 1e-13 relative: both are
    // 10^x of the same exponents, off by a few ulps.
    @Test
    void logSpacedHzGridMatchesNumpyLogspaceInHz() {
        double[] want = PythonOracle.doubles(numpy.get("logspace"));
        double[] got = FrequencyGrid.logSpacedHz(0.5, 2000, 57);
        for (int i = 0; i < want.length; i++) assertEquals(want[i] / (2 * Math.PI), got[i], 1e-13 * got[i], "point " + i);
        assertEquals(0.5, got[0]);                      // end points exact, in Hz
        assertEquals(2000, got[56]);
        double[] rad = FrequencyGrid.logSpacedRadPerS(0.5, 2000, 57);
        for (int i = 0; i < got.length; i++) assertEquals(Units.hzToRadPerS(got[i]), rad[i], 1e-13 * rad[i], "logSpacedRadPerS is the same grid in rad/s");
    }

    // ---------------------------------------- interpolation ----------------------------------------

    /**
     * Resampling the FRF of a/(s+a) from 10 points per decade to 1000 points per decade. Derivation by
     * hand, with u = ln ω and r = ω/a = tan θ: ln|G| = ln cos θ has d²/du² = -sin²(2θ)/2 and arg G = -θ has
     * d²/du² = -sin(4θ)/4, so linear interpolation in u (error ≤ h²/8·max|f''|, the standard bound)
     * is off by at most h²/16 in ln|G| and h²/32 rad in phase, h = ln(10)/10 the coarse step.
     */
    @Test
    void resamplingAFirstOrderModelStaysWithinTheInterpolationBound() {
        double a = 7;
        TransferFunction g = TransferFunction.continuous(new double[] {a}, new double[] {1, a});
        double[] coarse = FrequencyGrid.logRadPerS(0.01, 1e4, 61);
        double[] fine = FrequencyGrid.logRadPerS(0.01, 1e4, 6001);
        Frf resampled = Frf.ofModel(g, coarse).resampledTo(fine);
        Frf exact = Frf.ofModel(g, fine);
        double h = Math.log(10) / 10;
        double[] m1 = resampled.magnitude(), m2 = exact.magnitude();
        double[] p1 = resampled.phaseRadUnwrapped(), p2 = exact.phaseRadUnwrapped();
        double worstMag = 0, worstPhase = 0;
        for (int i = 0; i < fine.length; i++) {
            worstMag = Math.max(worstMag, Math.abs(Math.log(m1[i] / m2[i])));
            worstPhase = Math.max(worstPhase, Math.abs(p1[i] - p2[i]));
        }
        assertTrue(worstMag <= h * h / 16 * (1 + 1e-9), "log-magnitude error " + worstMag + " > " + h * h / 16);
        assertTrue(worstPhase <= h * h / 32 * (1 + 1e-9), "phase error " + worstPhase + " > " + h * h / 32);
        // and the bound is nearly reached (linear in log ω, not some other scheme): h²/8·f'' at a midpoint near the peak
        assertTrue(worstMag > 0.8 * h * h / 16, "log-magnitude error " + worstMag + " suspiciously small");
        // at the coarse points themselves the data are returned unchanged
        Frf back = resampled.resampledTo(coarse);
        for (int i = 0; i < coarse.length; i++) {
            assertEquals(Frf.ofModel(g, coarse).valueAt(i).getReal(), back.realAt(i), 1e-12);
        }
    }

    @Test
    void pointMidwayInLogFrequencyUsesGeometricMeanAndMeanUnwrappedPhase() {
        // Two points 2∠170° at 10 rad/s and 8∠-160° at 40 rad/s. Unwrapped, -160° is 200°; midway in log ω
        // (√(10·40) = 20 rad/s) the value must be √(2·8) = 4 at (170° + 200°)/2 = 185° (definition of the scheme).
        Frf f = Frf.ofParts(new double[] {10, 40},
                new double[] {2 * cosd(170), 8 * cosd(-160)}, new double[] {2 * sind(170), 8 * sind(-160)});
        Frf mid = f.resampledTo(new double[] {20});
        Complex v = mid.valueAt(0);
        assertEquals(4.0, v.abs(), 1e-14);
        assertEquals(185.0, Units.radToDeg(Math.atan2(v.getImaginary(), v.getReal())) + 360, 1e-12);
        // interpolating real and imaginary parts instead would give |(2∠170° + 8∠-160°)/2| ≈ 4.96
        assertTrue(Math.abs(v.abs() - 4.96) > 0.5);
    }

    @Test
    void resamplingOutsideTheMeasuredBandIsAnError() {
        Frf f = Frf.ofModel(TransferFunction.continuous(new double[] {1}, new double[] {1, 1}), FrequencyGrid.logRadPerS(1, 100, 20));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> f.resampledTo(new double[] {0.5, 10}));
        assertTrue(e.getMessage().contains("outside the measured band") && e.getMessage().contains("no extrapolation"), e.getMessage());
        IllegalArgumentException z = assertThrows(IllegalArgumentException.class,
                () -> Frf.ofParts(new double[] {1, 2}, new double[] {0, 1}, new double[] {0, 0}).resampledTo(new double[] {1.5}));
        assertTrue(z.getMessage().contains("exactly zero"), z.getMessage());
    }

    // ------------------------------------------- bands -------------------------------------------

    @Test
    void restrictionKeepsThePointsInsideTheBandInclusive() {
        double[] w = {1, 2, 3, 4, 5};
        Frf f = Frf.ofParts(w, new double[] {1, 2, 3, 4, 5}, new double[5]).withCoherence(new double[] {0.1, 0.2, 0.3, 0.4, 0.5});
        Frf r = f.restrictedToRadPerS(2, 4);
        assertArrayEquals(new double[] {2, 3, 4}, r.omegaRadPerS());
        assertArrayEquals(new double[] {2, 3, 4}, r.real());
        assertArrayEquals(new double[] {0.2, 0.3, 0.4}, r.coherence().orElseThrow());
        Frf hz = f.restrictedToHz(Units.radPerSToHz(2.5), 100);
        assertArrayEquals(new double[] {3, 4, 5}, hz.omegaRadPerS());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> f.restrictedToRadPerS(10, 20));
        assertTrue(e.getMessage().contains("no FRF point") && e.getMessage().contains("the data cover"), e.getMessage());
        IllegalArgumentException n = assertThrows(IllegalArgumentException.class, () -> f.restrictedToRadPerS(Double.NaN, 3));
        assertTrue(n.getMessage().contains("not a band"), n.getMessage());
        assertThrows(IllegalArgumentException.class, () -> f.restrictedToRadPerS(4, 2));
    }

    // ----------------------------------------- arithmetic ----------------------------------------

    @Test
    void arithmeticWithAnotherFrfRequiresTheSameGrid() {
        TransferFunction g = TransferFunction.continuous(new double[] {1}, new double[] {1, 1});
        Frf a = Frf.ofModel(g, FrequencyGrid.logRadPerS(1, 100, 20));
        Frf b = Frf.ofModel(g, FrequencyGrid.logRadPerS(1, 100, 21));
        for (var call : List.<org.junit.jupiter.api.function.Executable>of(() -> a.times(b), () -> a.plus(b), () -> a.dividedBy(b))) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call);
            assertTrue(e.getMessage().contains("different frequency grids") && e.getMessage().contains("resampledTo"), e.getMessage());
        }
        assertFalse(a.sameGridAs(b));
        assertTrue(a.sameGridAs(b.resampledTo(a.omegaRadPerS())));
    }

    @Test
    void arithmeticWithModelsMatchesTheModelAlgebra() {
        // Definition: (FRF of G)·H = FRF of G·H on the same grid, and so on for + and /.
        TransferFunction g = TransferFunction.continuous(new double[] {3, 1}, new double[] {1, 2, 10});
        TransferFunction h = TransferFunction.continuous(new double[] {5}, new double[] {1, 5}).withDelay(1e-3);
        double[] w = FrequencyGrid.logRadPerS(0.1, 1000, 80);
        Frf fg = Frf.ofModel(g, w);
        assertFrfClose(Frf.ofModel(g.times(h), w), fg.times(h), 1e-13);
        assertFrfClose(Frf.ofModel(g.times(h), w), fg.times(Frf.ofModel(h, w)), 1e-13);
        assertFrfClose(Frf.ofModel(g.plus(TransferFunction.gain(2)), w), fg.plus(TransferFunction.gain(2)), 1e-13);
        assertFrfClose(Frf.ofModel(g.times(h.withoutDelay().inverse()), w), fg.dividedBy(h.withoutDelay()), 1e-13);
        assertFrfClose(Frf.ofModel(g.times(-2.5), w), fg.times(-2.5), 1e-15);
        assertFrfClose(fg, fg.times(Frf.ofModel(h, w)).dividedBy(Frf.ofModel(h, w)), 1e-13);
        // coherence survives scaling by a model; uncertainty is scaled by |H|
        double[] coh = new double[w.length], unc = new double[w.length];
        java.util.Arrays.fill(coh, 0.9);
        java.util.Arrays.fill(unc, 0.01);
        Frf m = fg.withCoherence(coh).withUncertainty(unc).times(h);
        assertArrayEquals(coh, m.coherence().orElseThrow());
        assertEquals(0.01 * h.response(w[10]).abs(), m.uncertainty().orElseThrow()[10], 1e-15);
        assertTrue(fg.withCoherence(coh).times(fg).coherence().isEmpty(), "product of two measured FRFs drops coherence");
    }

    @Test
    void sampledModelAboveNyquistIsAnError() {
        TransferFunction d = TransferFunction.discrete(new double[] {0.1}, new double[] {1, -0.9}, 1e-3); // Nyquist 500 Hz
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Frf.ofModel(d, FrequencyGrid.logSpacedRadPerS(1, 600, 50)));
        assertTrue(e.getMessage().contains("above the Nyquist frequency") && e.getMessage().contains("500 Hz"), e.getMessage());
        Frf ok = Frf.ofModel(d, FrequencyGrid.logSpacedRadPerS(1, 500, 50)); // up to Nyquist inclusive is fine
        assertEquals(50, ok.size());
    }

    @Test
    void unwrappedPhaseOfADelayKeepsFalling() {
        // e^{-jωτ}: unwrapped phase is exactly -ωτ while the grid is dense enough (steps below π)
        double tau = 0.01;
        double[] w = FrequencyGrid.logRadPerS(1, 2000, 400);
        double[] p = Frf.ofModel(TransferFunction.delay(tau), w).phaseRadUnwrapped();
        for (int i = 0; i < w.length; i++) assertEquals(-w[i] * tau, p[i], 1e-9, "at " + w[i]);
        assertEquals(-Units.radToDeg(w[399] * tau), Frf.ofModel(TransferFunction.delay(tau), w).phaseDegUnwrapped()[399], 1e-7);
    }

    static double cosd(double d) { return Math.cos(Math.toRadians(d)); }

    static double sind(double d) { return Math.sin(Math.toRadians(d)); }

    static void assertFrfClose(Frf want, Frf got, double rel) {
        assertTrue(want.sameGridAs(got));
        for (int i = 0; i < want.size(); i++) {
            Complex a = want.valueAt(i), b = got.valueAt(i);
            assertTrue(a.subtract(b).abs() <= rel * a.abs(), "at " + want.omegaAt(i) + ": " + a + " vs " + b);
        }
    }
}
