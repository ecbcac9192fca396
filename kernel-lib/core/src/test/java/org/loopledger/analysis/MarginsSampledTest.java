package org.loopledger.analysis;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.Discretization;
import org.loopledger.lti.TransferFunction;
import org.loopledger.testing.PythonOracle;

import static org.junit.jupiter.api.Assertions.*;

/** Margins of sampled loops: hand derivation, SciPy/numpy on the unit circle, and the T → 0 limit. */
class MarginsSampledTest {

    static JsonObject py;
    static final double T = 0.1;
    static final double K = 2;

    /**
     * SciPy/numpy reference for G = K/(s(s+1)) discretised by SciPy's zoh at T = 0.1 s: gain crossovers are
     * the unit-circle roots of N(z)N(1/z) - D(z)D(1/z), phase crossovers those of N(z)D(1/z) - N(1/z)D(z)
     * with Re L &lt; 0 (both multiplied by z^n, numpy.roots), L evaluated by scipy.signal.freqz. This is
     * the same root-finding idea as ours in ω² for continuous loops, carried out independently on z.
     */
    @BeforeAll
    static void oracle() {
        PythonOracle.require("numpy", "scipy");
        String script = String.join("\n",
                "import json, sys, numpy as np",
                "from scipy import signal",
                "req = json.load(sys.stdin)",
                "T = req['T']; K = req['K']",
                "b, a, _ = signal.cont2discrete(([K], [1, 1, 0]), T, method='zoh')",
                "b = np.atleast_1d(np.squeeze(b)); a = np.atleast_1d(np.squeeze(a))",
                "n = max(len(a), len(b)) - 1",
                "B = np.concatenate([np.zeros(n + 1 - len(b)), b]); A = np.concatenate([np.zeros(n + 1 - len(a)), a])",
                "Br, Ar = B[::-1], A[::-1]",
                "def on_circle(p):",
                "    r = np.roots(np.trim_zeros(p, 'f'))",
                "    th = [float(np.angle(z)) for z in r if abs(abs(z) - 1) < 1e-7 and np.angle(z) > 1e-9]",
                "    return sorted(set(round(t, 12) for t in th))",
                "gth = on_circle(np.polysub(np.polymul(B, Br), np.polymul(A, Ar)))",
                "pth = on_circle(np.polysub(np.polymul(B, Ar), np.polymul(Br, A)))",
                "def L(th):",
                "    _, h = signal.freqz(B, A, worN=np.array(th))",
                "    return h",
                "out = {'b': list(map(float, b)), 'a': list(map(float, a))}",
                "hg = L(gth)",
                "out['gc'] = [t / T for t in gth]",
                "out['pm'] = [float(180 + np.degrees(np.angle(h))) for h in hg]",
                "hp = L(pth) if pth else []",
                "out['pc'] = [t / T for t, h in zip(pth, hp) if h.real < 0]",
                "out['gm'] = [float(-1 / h.real) for h in hp if h.real < 0]",
                "num8 = np.polymul([1/500**2, 0.02/500, 1], [2, 120])",
                "den8 = np.polymul(np.polymul([0.01/700**2, 0.01*0.04/700, 0.01, 0], [1, 0]), np.polymul([1/3000**2, 1.4/3000, 1], [1/3000**2, 1.4/3000, 1]))",
                "b8, a8, _ = signal.cont2discrete((num8, den8), 1/16000, method='zoh')",
                "out['b8'] = list(map(float, np.squeeze(b8))); out['a8'] = list(map(float, a8))",
                "print(json.dumps(out))");
        JsonObject req = new JsonObject();
        req.addProperty("T", T);
        req.addProperty("K", K);
        py = PythonOracle.run(script, req).getAsJsonObject();
    }

    static double[] arr(JsonArray a) { return PythonOracle.doubles(a); }

    /**
     * Against SciPy: same coefficients (SciPy's zoh), our margins from the grid-and-Brent path on
     * z = e^(jωT) versus numpy's unit-circle roots. Tolerance 1e-9 relative: both are root-finders at
     * round-off; the unit-circle filter (1e-7) and the polynomial's conditioning leave ~1e-10.
     * numpy's principal angle suffices for PM here: the phase lies within (-180°, 0°) at the crossover.
     */
    @Test
    void zohLoopAgainstScipyUnitCircleRoots() {
        TransferFunction l = TransferFunction.discrete(arr(py.getAsJsonArray("b")), arr(py.getAsJsonArray("a")), T);
        Margins m = Margins.of(l);
        double[] gc = arr(py.getAsJsonArray("gc")), pm = arr(py.getAsJsonArray("pm"));
        double[] pc = arr(py.getAsJsonArray("pc")), gm = arr(py.getAsJsonArray("gm"));
        assertTrue(gc.length >= 1 && pc.length >= 1, "the reference found crossings to compare");
        assertEquals(gc.length, m.gainCrossovers().size(), m.toString());
        for (int i = 0; i < gc.length; i++) {
            assertEquals(gc[i], m.gainCrossovers().get(i).omegaRadPerS(), 1e-9 * gc[i]);
            assertEquals(pm[i], m.gainCrossovers().get(i).phaseMarginDeg(), 1e-7);
        }
        assertEquals(pc.length, m.phaseCrossovers().size(), m.toString());
        for (int i = 0; i < pc.length; i++) {
            assertEquals(pc[i], m.phaseCrossovers().get(i).omegaRadPerS(), 1e-9 * pc[i]);
            assertEquals(gm[i], m.phaseCrossovers().get(i).gainMarginRatio(), 1e-9 * gm[i]);
        }
        assertTrue(m.highRadPerS() <= Math.PI / T * (1 + 1e-12), "sampled loops are analysed up to Nyquist only");
        assertTrue(m.delayMarginSamples().isPresent());
        assertEquals(m.delayMarginS().getAsDouble() / T, m.delayMarginSamples().getAsDouble(), 1e-12);
    }

    /**
     * Discrete integrator L(z) = KT/(z - 1), derivation by hand: L(e^{jθ}) = KT e^{-jθ/2}/(2j sin(θ/2)), so
     * |L| = KT/(2 sin(θ/2)) and ∠L = -90° - θ/2. The phase reaches -180° only at the Nyquist point θ = π,
     * where L = -KT/2: GM = 2/(KT) (closed-loop pole 1 - KT leaves the unit circle at KT = 2, the same
     * figure). Gain crossover at θ = 2 asin(KT/2), PM = 90° - asin(KT/2), delay margin PM/θ samples.
     */
    @Test
    void discreteIntegratorByHand() {
        double ts = 0.01, k = 20;                 // KT = 0.2
        double kt = k * ts;
        Margins m = Margins.of(TransferFunction.discrete(new double[] {kt}, new double[] {1, -1}, ts));
        PhaseCrossover pc = m.upperGainMargin().orElseThrow();
        assertEquals(Math.PI / ts, pc.omegaRadPerS(), 1e-9);
        assertEquals(2 / kt, pc.gainMarginRatio(), 1e-12);
        double theta = 2 * Math.asin(kt / 2);
        GainCrossover gc = m.phaseMarginCrossover().orElseThrow();
        assertEquals(theta / ts, gc.omegaRadPerS(), 1e-10 * theta / ts);
        assertEquals(90 - Math.toDegrees(Math.asin(kt / 2)), gc.phaseMarginDeg(), 1e-9);
        double pmRad = Math.PI / 2 - Math.asin(kt / 2);
        assertEquals(pmRad / theta, m.delayMarginSamples().getAsDouble(), 1e-9);
        assertEquals(1, m.netIntegrators());
    }

    /**
     * T → 0: the zoh equivalent of a continuous loop behaves like the loop with a half-sample delay,
     * G(jω)e^{-jωT/2}(1 + O((ωT)²)) (Franklin, Powell and Workman, Digital Control of Dynamic Systems,
     * 3rd ed., §6.3, from memory). So PM_d = PM_c - ω_gc·T/2 to second order (tolerance 1e-3 deg at
     * ω_gc·T ≈ 4e-4), and the gain margin converges to the continuous 6 with an O(T) error.
     */
    @Test
    void zohConvergesToContinuousAsSampleTimeShrinks() {
        TransferFunction c = MarginsModelTest.third(1);
        Margins mc = Margins.of(c);
        double pmC = mc.phaseMarginDeg().getAsDouble();
        double wgc = mc.phaseMarginCrossover().get().omegaRadPerS();
        double prevErr = Double.POSITIVE_INFINITY;
        for (double ts : new double[] {1e-2, 1e-3}) {
            Margins md = Margins.of(Discretization.zoh(c, ts));
            assertEquals(pmC - Math.toDegrees(wgc * ts / 2), md.phaseMarginDeg().getAsDouble(), 1e-3 * ts / 1e-3);
            double err = Math.abs(md.upperGainMargin().orElseThrow().gainMarginRatio() - 6);
            assertTrue(err < 10 * ts * 6, "GM error " + err + " at T = " + ts);
            assertTrue(err < prevErr);
            prevErr = err;
        }
    }

    /** The 8th-order servo loop of the benchmark plus two 3 kHz low-pass filters, continuous (test-local definition). */
    static TransferFunction servoLoop() {
        TransferFunction plant = TransferFunction.continuous(new double[] {1.0 / (500 * 500), 0.02 / 500, 1},
                new double[] {0.01 / (700 * 700), 0.01 * 0.04 / 700, 0.01, 0});
        TransferFunction pi = TransferFunction.continuous(new double[] {2, 2 * 60}, new double[] {1, 0});
        TransferFunction lp = TransferFunction.continuous(new double[] {1}, new double[] {1 / (3000.0 * 3000), 2 * 0.7 / 3000, 1});
        return plant.times(pi).times(lp).times(lp);
    }

    /**
     * A high-order sampled loop at a drive rate of 16 kHz: SciPy's zoh of an 8th-order servo loop with a double
     * integrator. The double pole at z = 1 must count as two integrators (an eigenvalue solver splits it by
     * ~1e-8, one copy outside the unit circle), no open-loop pole as unstable, and no spurious crossing may
     * come from cancellation near z = 1. Against the continuous loop: same crossings, and each phase margin
     * lower by the zoh's half-sample lag ω·T/2 (Franklin, Powell and Workman, Digital Control, 3rd ed., §6.3,
     * from memory); tolerance 0.05 deg covers the (ωT)² terms at ω·T ≈ 0.05.
     */
    @Test
    void highOrderSampledServoLoopAgainstContinuous() {
        double ts = 1.0 / 16000;
        TransferFunction ld = TransferFunction.discrete(arr(py.getAsJsonArray("b8")), arr(py.getAsJsonArray("a8")), ts);
        Margins md = Margins.of(ld), mc = Margins.of(servoLoop());
        assertEquals(2, md.netIntegrators(), md.toString());
        assertEquals(0, md.openLoopUnstablePoles().getAsInt(), md.toString());
        assertEquals(mc.gainCrossovers().size(), md.gainCrossovers().size(), md.toString());
        for (int i = 0; i < mc.gainCrossovers().size(); i++) {
            GainCrossover c = mc.gainCrossovers().get(i), d = md.gainCrossovers().get(i);
            assertEquals(c.omegaRadPerS(), d.omegaRadPerS(), 2e-3 * c.omegaRadPerS());
            assertEquals(c.phaseMarginDeg() - Math.toDegrees(c.omegaRadPerS() * ts / 2), d.phaseMarginDeg(), 0.05);
        }
        assertTrue(ClosedLoopStability.of(ld).isStable());
    }

    /** A sampled FRF must not reach above Nyquist: rejected with the offending frequency named. */
    @Test
    void sampledFrfAboveNyquistRejected() {
        Frf f = Frf.ofModel(MarginsModelTest.third(1), FrequencyGrid.logSpacedRadPerS(0.01, 60, 100));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> MeasuredLoop.ofSampled(f, 0.01));
        assertTrue(e.getMessage().contains("Nyquist") && e.getMessage().contains("60 Hz"), e.getMessage());
        // at Nyquist (50 Hz) it is accepted
        MeasuredLoop ok = MeasuredLoop.ofSampled(Frf.ofModel(MarginsModelTest.third(1), FrequencyGrid.logSpacedRadPerS(0.01, 50, 100)), 0.01);
        assertEquals(0.01, ok.sampleTimeS().getAsDouble());
    }

    /** A sampled model evaluated above Nyquist is a bug the grid must never commit: the grid stops at π/T. */
    @Test
    void sampledGridStopsAtNyquist() {
        ModelLoop l = ModelLoop.of(Discretization.zoh(MarginsModelTest.third(1), 0.05));
        assertEquals(Math.PI / 0.05, l.highRadPerS(), 1e-9);
    }
}
