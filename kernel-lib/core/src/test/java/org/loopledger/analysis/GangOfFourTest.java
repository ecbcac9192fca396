package org.loopledger.analysis;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;
import org.loopledger.testing.PythonOracle;

import static org.junit.jupiter.api.Assertions.*;

/** Gang of Four: definitions (S + T = 1, PS = P·S, CS = C·S) and SciPy's freqs/freqz of the exact forms. */
class GangOfFourTest {

    /** P = 1/(s(s+1)), C = 2/(s+2): L = 2/(s(s+1)(s+2)). */
    static final TransferFunction P = TransferFunction.continuous(new double[] {1}, new double[] {1, 1, 0});
    static final TransferFunction C = TransferFunction.continuous(new double[] {2}, new double[] {1, 2});
    /** Sampled: P = 0.01/(z - 1) (an integrator, T = 0.01 s) with C = 5(z - 0.9)/(z - 0.5). */
    static final double TS = 0.01;
    static final TransferFunction PD = TransferFunction.discrete(new double[] {0.01}, new double[] {1, -1}, TS);
    static final TransferFunction CD = TransferFunction.discrete(new double[] {5, -4.5}, new double[] {1, -0.5}, TS);
    static final double[] W = FrequencyGrid.logRadPerS(0.01, 100, 200);
    static final double[] WD = FrequencyGrid.logRadPerS(0.1, Math.PI / TS, 200);
    static JsonObject py;

    /**
     * SciPy: S, T, PS, CS built with numpy polynomial arithmetic from the same P and C (S = DpDc/(DpDc + NpNc),
     * ...), evaluated with scipy.signal.freqs (continuous) and freqz (discrete, ω·T rad/sample).
     */
    @BeforeAll
    static void oracle() {
        PythonOracle.require("numpy", "scipy");
        String script = String.join("\n",
                "import json, sys, numpy as np",
                "from scipy import signal",
                "req = json.load(sys.stdin)",
                "def gof(Np, Dp, Nc, Dc):",
                "    den = np.polyadd(np.polymul(Dp, Dc), np.polymul(Np, Nc))",
                "    return {'S': (np.polymul(Dp, Dc), den), 'T': (np.polymul(Np, Nc), den), 'PS': (np.polymul(Np, Dc), den), 'CS': (np.polymul(Nc, Dp), den)}",
                "out = {}",
                "for name, (b, a) in gof([1], [1, 1, 0], [2], [1, 2]).items():",
                "    _, h = signal.freqs(b, a, worN=np.array(req['w']))",
                "    out[name] = [list(map(float, h.real)), list(map(float, h.imag))]",
                "T = req['T']",
                "for name, (b, a) in gof([0.01], [1, -1], [5, -4.5], [1, -0.5]).items():",
                "    n = len(a); b = np.concatenate([np.zeros(n - len(b)), b])",
                "    _, h = signal.freqz(b, a, worN=np.array(req['wd']) * T)",
                "    out['d' + name] = [list(map(float, h.real)), list(map(float, h.imag))]",
                "print(json.dumps(out))");
        JsonObject req = new JsonObject();
        req.add("w", new com.google.gson.Gson().toJsonTree(W));
        req.add("wd", new com.google.gson.Gson().toJsonTree(WD));
        req.addProperty("T", TS);
        py = PythonOracle.run(script, req).getAsJsonObject();
    }

    /** Relative 1e-10: both evaluate the same rational functions; the worst conditioning is near |S| ~ 1e-4. */
    static void assertMatches(String key, Frf f) {
        double[] re = PythonOracle.doubles(py.getAsJsonArray(key).get(0)), im = PythonOracle.doubles(py.getAsJsonArray(key).get(1));
        for (int i = 0; i < re.length; i++) {
            double scale = Math.hypot(re[i], im[i]);
            assertEquals(re[i], f.realAt(i), 1e-10 * scale, key + " at " + i);
            assertEquals(im[i], f.imagAt(i), 1e-10 * scale, key + " at " + i);
        }
    }

    @Test
    void continuousAgainstScipyFreqs() {
        GangOfFour g = GangOfFour.of(P, C, W);
        assertMatches("S", g.sensitivity());
        assertMatches("T", g.complementarySensitivity());
        assertMatches("PS", g.loadSensitivity());
        assertMatches("CS", g.noiseSensitivity());
        // the exact forms on the same grid
        assertMatches("S", Frf.ofModel(g.sensitivityModel().orElseThrow(), W));
        assertMatches("CS", Frf.ofModel(g.noiseSensitivityModel().orElseThrow(), W));
        // by hand: the common denominator is s(s+1)(s+2) + 2 = s³ + 3s² + 2s + 2
        assertArrayEquals(new double[] {1, 3, 2, 2}, g.sensitivityModel().get().denominator().coefficientsDescending(), 1e-15);
    }

    /** Sampled loops are evaluated at z = e^(jωT), up to Nyquist: against scipy.signal.freqz. */
    @Test
    void discreteAgainstScipyFreqz() {
        GangOfFour g = GangOfFour.of(PD, CD, WD);
        assertMatches("dS", g.sensitivity());
        assertMatches("dT", g.complementarySensitivity());
        assertMatches("dPS", g.loadSensitivity());
        assertMatches("dCS", g.noiseSensitivity());
        assertTrue(g.sensitivityModel().orElseThrow().isDiscrete());
        GangOfFour auto = GangOfFour.of(PD, CD);
        assertTrue(auto.sensitivity().maxOmegaRadPerS() <= Math.PI / TS * (1 + 1e-12), "default grid ends at Nyquist");
    }

    /** Definitions: S + T = 1, PS = P·S, CS = C·S, S = 1/(1 + PC) (to round-off, 1e-12). */
    @Test
    void definitions() {
        GangOfFour g = GangOfFour.of(P, C);
        Frf s = g.sensitivity(), t = g.complementarySensitivity();
        Frf sum = s.plus(t);
        for (int i = 0; i < sum.size(); i++) {
            assertEquals(1, sum.realAt(i), 1e-12);
            assertEquals(0, sum.imagAt(i), 1e-12);
        }
        Frf ps = s.times(P), cs = s.times(C);
        for (int i = 0; i < s.size(); i++) {
            assertEquals(ps.realAt(i), g.loadSensitivity().realAt(i), 1e-12 * Math.max(1, Math.abs(ps.realAt(i))));
            assertEquals(cs.imagAt(i), g.noiseSensitivity().imagAt(i), 1e-12 * Math.max(1, Math.abs(cs.imagAt(i))));
        }
        // the peak of |S| on this grid agrees with the margin analysis' Ms (same loop, same grid, refined there)
        double peak = 0;
        for (double m : s.magnitude()) peak = Math.max(peak, m);
        double ms = Margins.of(P.times(C)).sensitivityPeak().magnitude();
        assertTrue(peak <= ms * (1 + 1e-12) && peak > ms * (1 - 1e-3), peak + " vs " + ms);
    }

    /** Measured plant with a model controller, and two measured FRFs: the same values as the model path. */
    @Test
    void frfPathsEqualModelPath() {
        GangOfFour m = GangOfFour.of(P, C, W);
        Frf pf = Frf.ofModel(P, W);
        GangOfFour a = GangOfFour.of(pf, C);
        GangOfFour b = GangOfFour.of(pf, Frf.ofModel(C, W));
        assertTrue(a.sensitivityModel().isEmpty());
        for (int i = 0; i < W.length; i++) {
            assertEquals(m.sensitivity().realAt(i), a.sensitivity().realAt(i), 1e-14);
            assertEquals(m.complementarySensitivity().imagAt(i), b.complementarySensitivity().imagAt(i), 1e-14);
        }
        assertThrows(IllegalArgumentException.class, () -> GangOfFour.of(pf, Frf.ofModel(C, FrequencyGrid.logRadPerS(0.02, 100, 200))));
    }

    /** A plant with delay: no exact forms (not rational), the grid values still satisfy S + T = 1. */
    @Test
    void delayPlantGivesFrfsOnly() {
        GangOfFour g = GangOfFour.of(P.withDelay(0.1), C);
        assertTrue(g.sensitivityModel().isEmpty());
        Frf sum = g.sensitivity().plus(g.complementarySensitivity());
        for (int i = 0; i < sum.size(); i++) assertEquals(1, sum.realAt(i), 1e-12);
        assertTrue(g.toString().startsWith("Gang of Four on ") && g.toString().contains("Hz") && g.toString().lines().count() == 1, g.toString());
    }
}
