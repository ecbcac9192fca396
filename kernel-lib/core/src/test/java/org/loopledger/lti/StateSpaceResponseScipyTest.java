package org.loopledger.lti;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopledger.testing.PythonOracle;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Realisations and their polynomial-free frequency response ({@link StateSpace#response}) on the 24
 * seeded random systems of {@link RandomSystems}, against scipy.signal.freqs (continuous) and
 * scipy.signal.cont2discrete(..., 'zoh') + scipy.signal.freqz (sampled), one Python process for the class.
 *
 * <p>Tolerance 1e-9 relative for the continuous responses (orders 1 to 6, separated roots, freqs evaluates
 * the same coefficients). For the sampled ones 1e-9·max(1, κ), with κ = (n + 1)·max|c|·(1/|N(z)| + 1/|D(z)|)
 * over SciPy's coefficients c = [b, a] (computed in the script): SciPy's ZOH coefficients carry errors of
 * about 3e-10·max|c| each (normwise over numerator and denominator together, see {@link DiscretizationScipyTest}),
 * which freqz turns into relative response errors up to 3e-10·κ (derivation by hand: δG/G = δN/N - δD/D).
 * Where the numerator is much smaller than the denominator, or near z = 1, κ is large: e.g. case 5 at
 * 18.6 rad/s, where SciPy's response is off by 1.5e-7 and ours by 9e-16 (both against mpmath at 50 digits,
 * checked by hand while writing this test). Our state-space route has no such floor (checked to 1e-8
 * against mpmath in {@link ZohHighOrderTest}).
 */
class StateSpaceResponseScipyTest {
    static final long SEED = 20_240_611L; // same set as RootsAndResponseScipyTest
    static final int COUNT = 24;
    static final double SAMPLE_TIME_S = 0.05;

    static List<RandomSystems.Case> cases;
    static JsonArray answers;
    static final double[] W = RootsAndResponseScipyTest.logGrid(0.05, 0.99 * Math.PI / SAMPLE_TIME_S, 60);

    private static final String SCRIPT = """
            import json, sys
            import numpy as np
            from scipy import signal
            req = json.load(sys.stdin)
            T, w = req["T"], np.array(req["w"], float)
            out = []
            for c in req["cases"]:
                num, den = np.array(c["num"], float), np.array(c["den"], float)
                _, hc = signal.freqs(num, den, worN=w)
                bd, ad, _ = signal.cont2discrete((num, den), T, method="zoh")
                _, hd = signal.freqz(np.atleast_1d(np.squeeze(bd)), ad, worN=w * T)
                bd = np.atleast_1d(np.squeeze(bd))
                scale = max(np.max(np.abs(bd)), np.max(np.abs(ad))) * len(ad)
                kap = scale * (1 / np.abs(np.polyval(bd, np.exp(1j * w * T))) + 1 / np.abs(np.polyval(ad, np.exp(1j * w * T))))
                out.append({"cRe": hc.real.tolist(), "cIm": hc.imag.tolist(), "dRe": hd.real.tolist(), "dIm": hd.imag.tolist(),
                            "kappa": kap.tolist()})
            print(json.dumps(out))
            """;

    @BeforeAll
    static void askScipy() {
        PythonOracle.require("numpy", "scipy.signal");
        cases = RandomSystems.draw(SEED, COUNT);
        List<Map<String, Object>> req = new ArrayList<>();
        for (RandomSystems.Case c : cases) {
            Map<String, Object> m = new HashMap<>();
            m.put("num", c.num());
            m.put("den", c.den());
            req.add(m);
        }
        answers = PythonOracle.run(SCRIPT, Map.of("cases", req, "T", SAMPLE_TIME_S, "w", W)).getAsJsonArray();
    }

    static IntStream indices() { return IntStream.range(0, COUNT); }

    // Source: scipy.signal.freqs(num, den, w). Every realisation must reproduce N/D: the definition of a realisation.
    @ParameterizedTest(name = "realisations reproduce the continuous response: case {0}")
    @MethodSource("indices")
    void realisationsMatchFreqs(int i) {
        TransferFunction g = cases.get(i).continuous();
        JsonObject a = answers.get(i).getAsJsonObject();
        double[] rr = PythonOracle.doubles(a.get("cRe")), ri = PythonOracle.doubles(a.get("cIm"));
        StateSpace[] forms = {StateSpace.controllableCanonical(g), StateSpace.seriesSections(g), StateSpace.seriesSections(g).balanced(),
                StateSpace.controllableCanonical(g).balanced()};
        String[] names = {"control canonical", "series sections", "balanced series sections", "balanced control canonical"};
        double[] one = new double[W.length];
        java.util.Arrays.fill(one, 1.0);
        for (int f = 0; f < forms.length; f++) assertClose(forms[f], rr, ri, one, cases.get(i) + " " + names[f]);
    }

    // Source: scipy.signal.cont2discrete((num, den), T, 'zoh') + scipy.signal.freqz.
    @ParameterizedTest(name = "state-space ZOH matches cont2discrete + freqz: case {0}")
    @MethodSource("indices")
    void zohStateSpaceMatchesFreqz(int i) {
        TransferFunction g = cases.get(i).continuous();
        JsonObject a = answers.get(i).getAsJsonObject();
        assertClose(Discretization.zohStateSpace(g, SAMPLE_TIME_S), PythonOracle.doubles(a.get("dRe")), PythonOracle.doubles(a.get("dIm")),
                PythonOracle.doubles(a.get("kappa")), cases.get(i) + " zohStateSpace");
    }

    static void assertClose(StateSpace ss, double[] rr, double[] ri, double[] kappa, String what) {
        double[] re = new double[W.length], im = new double[W.length];
        ss.response(W, re, im);
        for (int k = 0; k < W.length; k++) {
            double e = Math.hypot(re[k] - rr[k], im[k] - ri[k]) / Math.hypot(rr[k], ri[k]);
            double tol = 1e-9 * Math.max(1, kappa[k]);
            assertTrue(e <= tol, what + " at " + W[k] + " rad/s: relative error " + e + " above " + tol);
        }
    }
}
