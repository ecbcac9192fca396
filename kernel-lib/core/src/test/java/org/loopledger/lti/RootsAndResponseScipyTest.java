package org.loopledger.lti;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopledger.testing.PythonOracle;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Polynomial roots and frequency responses against numpy/SciPy (Debian's python3-scipy), on 24
 * seeded random systems (see {@link RandomSystems}). One Python process for the whole class.
 *
 * <ul>
 *   <li>roots: {@code numpy.roots(coefficients)}; roots matched by nearest neighbour, tolerance 1e-9 of max(1, |root|).
 *       Both solvers are companion-matrix eigenvalue methods with errors of a few ulps times the root
 *       condition number; the well-separated random roots keep that far below 1e-9.</li>
 *   <li>continuous response: {@code scipy.signal.freqs(num, den, worN=ω)}, tolerance 1e-9 relative to |G|.</li>
 *   <li>discrete response: {@code scipy.signal.freqz(b, a, worN=ωT)} with b padded to len(a) (freqz takes
 *       powers of z<sup>-1</sup>), on a grid from 0 to the Nyquist frequency inclusive, 1e-9 relative, widened
 *       only where the evaluation itself is ill conditioned (see {@link #hornerBound}).</li>
 * </ul>
 * Horner evaluation at one point has a relative error of about n·eps·(Σ|c<sub>k</sub>||x|<sup>k</sup>)/|p(x)|;
 * with damping ratios of at least 0.1 that ratio stays below 1e3 here, so 1e-9 leaves a wide margin
 * while still catching any wrong formula (those give O(1) errors).
 */
class RootsAndResponseScipyTest {
    static final long SEED = 20_240_611L;
    static final int COUNT = 24;
    static final double SAMPLE_TIME_S = 0.02; // Nyquist 157 rad/s, above every random pole (<= 30 rad/s)
    static final double[] OMEGA = logGrid(0.01, 1000, 120);
    static final double[] OMEGA_DISCRETE = linGrid(0, Math.PI / SAMPLE_TIME_S, 101);

    static List<RandomSystems.Case> cases;
    static List<TransferFunction> discrete;
    static JsonArray answers;

    private static final String SCRIPT = """
            import json, sys
            import numpy as np
            from scipy import signal
            req = json.load(sys.stdin)
            out = []
            for c in req["cases"]:
                num, den = np.array(c["num"], float), np.array(c["den"], float)
                _, h = signal.freqs(num, den, worN=np.array(req["omega"]))
                bd, ad = np.array(c["numd"], float), np.array(c["dend"], float)
                bd = np.concatenate([np.zeros(len(ad) - len(bd)), bd])
                _, hz = signal.freqz(bd, ad, worN=np.array(req["omegaT"]))
                zr = np.roots(num) if len(num) > 1 else np.array([])
                pr = np.roots(den)
                out.append({"zr": zr.real.tolist(), "zi": zr.imag.tolist(),
                            "pr": pr.real.tolist(), "pi": pr.imag.tolist(),
                            "hr": h.real.tolist(), "hi": h.imag.tolist(),
                            "hzr": hz.real.tolist(), "hzi": hz.imag.tolist()})
            print(json.dumps(out))
            """;

    @BeforeAll
    static void askScipy() {
        PythonOracle.require("numpy", "scipy.signal");
        cases = RandomSystems.draw(SEED, COUNT);
        discrete = new ArrayList<>();
        List<Map<String, Object>> req = new ArrayList<>();
        for (RandomSystems.Case c : cases) {
            TransferFunction d = discreteTwin(c);
            discrete.add(d);
            Map<String, Object> m = new HashMap<>();
            m.put("num", c.num());
            m.put("den", c.den());
            m.put("numd", d.numerator().coefficientsDescending());
            m.put("dend", d.denominator().coefficientsDescending());
            req.add(m);
        }
        double[] wT = OMEGA_DISCRETE.clone();
        for (int i = 0; i < wT.length; i++) wT[i] *= SAMPLE_TIME_S;
        answers = PythonOracle.run(SCRIPT, Map.of("cases", req, "omega", OMEGA, "omegaT", wT)).getAsJsonArray();
    }

    /** The sampled system with poles and zeros mapped by z = e^{sT} (a discrete system to feed freqz). */
    static TransferFunction discreteTwin(RandomSystems.Case c) {
        List<Complex> zp = new ArrayList<>(), zz = new ArrayList<>();
        for (Complex p : c.poles()) zp.add(p.multiply(SAMPLE_TIME_S).exp());
        for (Complex z : c.zeros()) zz.add(z.multiply(SAMPLE_TIME_S).exp());
        return TransferFunction.zpk(zz, zp, c.gain(), TimeBase.sampled(SAMPLE_TIME_S));
    }

    static IntStream indices() { return IntStream.range(0, COUNT); }

    @Test
    void theRandomSetCoversWhatItClaims() {
        // The brief for these checks: stable and unstable, orders 1..6, complex poles, biproper systems.
        assertTrue(cases.stream().anyMatch(RandomSystems.Case::stable));
        assertTrue(cases.stream().anyMatch(c -> !c.stable()));
        assertTrue(cases.stream().anyMatch(RandomSystems.Case::hasComplexPoles));
        assertTrue(cases.stream().anyMatch(RandomSystems.Case::biproper));
        assertEquals(6, cases.stream().mapToInt(c -> c.poles().size()).max().orElseThrow());
        assertEquals(1, cases.stream().mapToInt(c -> c.poles().size()).min().orElseThrow());
    }

    // Source: numpy.roots of the same coefficients.
    @ParameterizedTest(name = "roots of case {0}")
    @MethodSource("indices")
    void rootsMatchNumpy(int i) {
        RandomSystems.Case c = cases.get(i);
        JsonObject a = answers.get(i).getAsJsonObject();
        TransferFunction g = c.continuous();
        assertRootsMatch(complexes(a, "pr", "pi"), g.poles(), c + " poles");
        assertRootsMatch(complexes(a, "zr", "zi"), g.zeros(), c + " zeros");
        // and both give back the roots the polynomial was built from (a definition check, looser since
        // rounding the coefficients perturbs the roots by eps times their condition number)
        assertRootsMatch(c.poles(), g.poles(), 1e-7, c + " generating poles");
    }

    // Source: scipy.signal.freqs(num, den, worN=omega).
    @ParameterizedTest(name = "freqs of case {0}")
    @MethodSource("indices")
    void continuousResponseMatchesFreqs(int i) {
        JsonObject a = answers.get(i).getAsJsonObject();
        TransferFunction g = cases.get(i).continuous();
        double[] re = new double[OMEGA.length], im = new double[OMEGA.length];
        g.response(OMEGA, re, im);
        assertResponse(PythonOracle.doubles(a.get("hr")), PythonOracle.doubles(a.get("hi")), re, im, OMEGA, cases.get(i) + " freqs");
    }

    // Source: scipy.signal.freqz(b padded to len(a), a, worN=omega*T), grid 0 .. Nyquist inclusive.
    @ParameterizedTest(name = "freqz of case {0}")
    @MethodSource("indices")
    void discreteResponseMatchesFreqz(int i) {
        JsonObject a = answers.get(i).getAsJsonObject();
        TransferFunction g = discrete.get(i);
        double[] re = new double[OMEGA_DISCRETE.length], im = new double[OMEGA_DISCRETE.length];
        g.response(OMEGA_DISCRETE, re, im);
        double[] er = PythonOracle.doubles(a.get("hzr")), ei = PythonOracle.doubles(a.get("hzi"));
        int plain = 0;
        for (int k = 0; k < er.length; k++) {
            double z = OMEGA_DISCRETE[k] * SAMPLE_TIME_S;
            double tol = Math.max(1e-9, hornerBound(g.numerator(), z) + hornerBound(g.denominator(), z));
            if (tol == 1e-9) plain++;
            double err = Math.hypot(re[k] - er[k], im[k] - ei[k]), mag = Math.hypot(er[k], ei[k]);
            assertTrue(err <= tol * mag, cases.get(i) + " freqz at " + OMEGA_DISCRETE[k] + " rad/s: got " + re[k] + " + j" + im[k]
                    + ", SciPy " + er[k] + " + j" + ei[k] + " (relative error " + err / mag + ", tolerance " + tol + ")");
        }
        // the widened tolerance is the exception (points near z = 1 with poles crowding there), not the rule
        assertTrue(plain >= er.length * 8 / 10, cases.get(i) + ": only " + plain + " of " + er.length + " points at 1e-9");
    }

    /**
     * Relative forward-error bound of Horner's rule at z = e^{jθ}, for both implementations together:
     * 2 · 4n·eps · Σ|c<sub>k</sub>| / |p(z)| (|z| = 1), from the classic bound |p̂ - p| &le; γ<sub>2n</sub> Σ|c<sub>k</sub>||z|<sup>k</sup>
     * (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., §5.1, from memory), doubled for complex
     * arithmetic and for rounding in z itself. Near z = 1 the coefficients of a polynomial with roots crowding
     * there cancel (Σ c<sub>k</sub> = ∏(1 - z<sub>i</sub>)), so SciPy and this library may then rightly disagree
     * by far more than 1e-9; that is the conditioning of coefficient form, which DESIGN.md warns about.
     */
    static double hornerBound(Polynomial p, double theta) {
        double[] c = p.coefficientsDescending();
        double sum = 0;
        for (double v : c) sum += Math.abs(v);
        double[] out = new double[2];
        p.evaluate(Math.cos(theta), Math.sin(theta), out);
        int n = Math.max(1, p.degree());
        return 2 * 4 * n * Math.ulp(1.0) * sum / Math.hypot(out[0], out[1]);
    }

    // ---------------------------------------------------------------------------------------------

    static void assertResponse(double[] er, double[] ei, double[] re, double[] im, double[] w, String what) {
        assertEquals(er.length, re.length);
        for (int k = 0; k < er.length; k++) {
            double err = Math.hypot(re[k] - er[k], im[k] - ei[k]);
            double mag = Math.hypot(er[k], ei[k]);
            assertTrue(err <= 1e-9 * mag, what + ": at " + w[k] + " rad/s got " + re[k] + " + j" + im[k]
                    + ", SciPy " + er[k] + " + j" + ei[k] + " (relative error " + err / mag + ")");
        }
    }

    static void assertRootsMatch(List<Complex> expected, List<Complex> got, String what) {
        assertRootsMatch(expected, got, 1e-9, what);
    }

    /** Each expected root is paired with the nearest unused root found; distance within tol·max(1, |root|). */
    static void assertRootsMatch(List<Complex> expected, List<Complex> got, double tol, String what) {
        assertEquals(expected.size(), got.size(), what + ": number of roots");
        List<Complex> left = new ArrayList<>(got);
        for (Complex e : expected) {
            int best = -1;
            double bestD = Double.POSITIVE_INFINITY;
            for (int j = 0; j < left.size(); j++) {
                double d = left.get(j).subtract(e).abs();
                if (d < bestD) { bestD = d; best = j; }
            }
            Complex g = left.remove(best);
            assertTrue(bestD <= tol * Math.max(1, e.abs()), what + ": expected root " + e + ", nearest found " + g
                    + " (distance " + bestD + "); all found: " + got);
        }
    }

    static List<Complex> complexes(JsonObject o, String re, String im) {
        double[] r = PythonOracle.doubles(o.get(re)), m = PythonOracle.doubles(o.get(im));
        List<Complex> out = new ArrayList<>();
        for (int k = 0; k < r.length; k++) out.add(new Complex(r[k], m[k]));
        return out;
    }

    static double[] logGrid(double lo, double hi, int n) {
        double[] w = new double[n];
        for (int i = 0; i < n; i++) w[i] = lo * Math.pow(hi / lo, i / (n - 1.0));
        return w;
    }

    static double[] linGrid(double lo, double hi, int n) {
        double[] w = new double[n];
        for (int i = 0; i < n; i++) w[i] = lo + (hi - lo) * i / (n - 1.0);
        w[n - 1] = hi;
        return w;
    }
}
