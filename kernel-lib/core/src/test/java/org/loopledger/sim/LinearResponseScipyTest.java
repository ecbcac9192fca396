package org.loopledger.sim;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopledger.lti.Discretization;
import org.loopledger.lti.Polynomial;
import org.loopledger.lti.StateSpace;
import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;
import org.loopledger.testing.PythonOracle;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.stream.IntStream;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link LinearResponse} on 12 seeded random stable systems (orders 1 to 5, real and complex poles, zeros in either
 * half-plane, some biproper) against SciPy 1.10: scipy.signal.step, impulse, lsim (interp=True, the first-order hold,
 * and interp=False, the zero-order hold) from rest and from an initial state, dstep, dimpulse, dlsim and lfilter
 * on the ZOH equivalents. One Python process for the class.
 *
 * <p>Tolerance: 1e-9·max(1, max|y|). Both sides discretise exactly with a matrix exponential (relative error near
 * 1e-15) but from different realisations (ours: balanced series sections; SciPy: control canonical form from tf2ss,
 * whose coefficients reach 20^5 = 3e6 for these orders), so the responses differ by rounding amplified by the
 * conditioning of SciPy's realisation; the largest difference measured over all continuous cases was
 * 1.1e-13 relative; 1e-9 leaves room for other BLAS builds.
 * The sampled cases use the same coefficients on both sides (our Discretization.zoh passed to SciPy), but a coefficient
 * form with poles clustered near z = 1 is ill-conditioned: the DC gain N(1)/D(1) moves by ε·κ under rounding of the
 * coefficients, κ = Σ|b|/|Σb| + Σ|a|/|Σa| (hand derivation), and SciPy works on the coefficients (companion form, difference
 * equation) while we simulate balanced series sections built from the roots. The sampled tolerance is therefore
 * (1e-9 + 10·ε·κ)·max(1, max|y|). Measured: case 5 (order 5, slow poles, κ about 3e8) differs by 3.0e-8 in dstep; even
 * lfilter against lfilter (the same recursion) differs by 1.2e-11 there; every continuous response differed by at most
 * 1.1e-13 relative (step), every other sampled one by at most 3.1e-11 (dlsim).
 */
class LinearResponseScipyTest {
    static final long SEED = 20_261_202L;
    static final int COUNT = 12;
    static final double SAMPLE_TIME_S = 0.02;
    static final int N = 401;

    record Case(TransferFunction g, TransferFunction gd, double[] timeS, double[] input, double[] x0, StateSpace ss, double[] dInput) {}

    static List<Case> cases = new ArrayList<>();
    static JsonArray answers;

    private static final String SCRIPT = """
            import json, sys
            import numpy as np
            from scipy import signal
            req = json.load(sys.stdin)
            out = []
            for c in req["cases"]:
                num, den = np.array(c["num"], float), np.array(c["den"], float)
                T, u, x0 = np.array(c["t"], float), np.array(c["u"], float), np.array(c["x0"], float)
                A, B, C, D = np.array(c["A"], float), np.array(c["B"], float).reshape(-1, 1), np.array(c["C"], float).reshape(1, -1), np.array([[c["D"]]])
                r = {}
                r["step"] = signal.step((num, den), T=T)[1].tolist()
                r["impulse"] = signal.impulse((num, den), T=T)[1].tolist()
                r["foh"] = signal.lsim((num, den), u, T)[1].tolist()
                r["zoh"] = signal.lsim((num, den), u, T, interp=False)[1].tolist()
                r["initial"] = signal.lsim((A, B, C, D), np.zeros_like(T), T, X0=x0)[1].tolist()
                r["ssfoh"] = signal.lsim((A, B, C, D), u, T, X0=x0)[1].tolist()
                bd, ad, dt = np.array(c["bd"], float), np.array(c["ad"], float), c["dt"]
                du = np.array(c["du"], float)
                n = len(du)
                r["dstep"] = np.squeeze(signal.dstep((bd, ad, dt), n=n)[1][0]).tolist()
                r["dimpulse"] = np.squeeze(signal.dimpulse((bd, ad, dt), n=n)[1][0]).tolist()
                r["dlsim"] = np.squeeze(signal.dlsim((bd, ad, dt), du)[1]).tolist()
                bpad = np.concatenate([np.zeros(len(ad) - len(bd)), bd])
                r["lfilter"] = signal.lfilter(bpad, ad, du).tolist()
                out.append(r)
            print(json.dumps(out))
            """;

    static TransferFunction randomStable(SplittableRandom rnd, int order) {
        List<Complex> poles = new ArrayList<>();
        while (poles.size() < order) {
            double wn = Math.exp(rnd.nextDouble(Math.log(0.5), Math.log(20)));
            if (order - poles.size() >= 2 && rnd.nextBoolean()) {
                double z = rnd.nextDouble(0.1, 0.9);
                poles.add(new Complex(-z * wn, wn * Math.sqrt(1 - z * z)));
                poles.add(new Complex(-z * wn, -wn * Math.sqrt(1 - z * z)));
            } else {
                poles.add(new Complex(-wn, 0));
            }
        }
        int nz = rnd.nextInt(order + 1);
        List<Complex> zeros = new ArrayList<>();
        for (int i = 0; i < nz; i++) zeros.add(new Complex(Math.exp(rnd.nextDouble(Math.log(0.5), Math.log(30))) * (rnd.nextBoolean() ? -1 : 1), 0));
        double k = Math.exp(rnd.nextDouble(Math.log(0.2), Math.log(5))) * (rnd.nextBoolean() ? 1 : -1);
        Polynomial num = Polynomial.ofRoots(zeros.toArray(Complex[]::new)).times(k);
        Polynomial den = Polynomial.ofRoots(poles.toArray(Complex[]::new));
        // scale the numerator so that the DC gain is k (keeps every case of order one in amplitude)
        double dc = num.evaluate(0) / den.evaluate(0);
        return TransferFunction.of(num.times(k / dc), den, TimeBase.continuous());
    }

    @BeforeAll
    static void askScipy() {
        PythonOracle.require("numpy", "scipy.signal");
        SplittableRandom rnd = new SplittableRandom(SEED);
        List<Map<String, Object>> req = new ArrayList<>();
        for (int i = 0; i < COUNT; i++) {
            TransferFunction g = randomStable(rnd, 1 + i % 5);
            double slowest = g.poles().stream().mapToDouble(p -> -p.getReal()).min().orElseThrow();
            double[] t = LinearResponse.timesS(8 / slowest, N);
            double[] u = new double[N];
            for (int k = 0; k < N; k++) u[k] = rnd.nextDouble(-1, 1);
            StateSpace ss = StateSpace.seriesSections(g).balanced();
            double[] x0 = new double[ss.order()];
            for (int k = 0; k < x0.length; k++) x0[k] = rnd.nextDouble(-1, 1);
            TransferFunction gd = Discretization.zoh(g, SAMPLE_TIME_S);
            double[] du = new double[200];
            for (int k = 0; k < du.length; k++) du[k] = rnd.nextDouble(-1, 1);
            cases.add(new Case(g, gd, t, u, x0, ss, du));
            Map<String, Object> m = new HashMap<>();
            m.put("num", g.numerator().coefficientsDescending());
            m.put("den", g.denominator().coefficientsDescending());
            m.put("t", t);
            m.put("u", u);
            m.put("x0", x0);
            m.put("A", ss.a());
            m.put("B", ss.b());
            m.put("C", ss.c());
            m.put("D", ss.d());
            m.put("bd", gd.numerator().coefficientsDescending());
            m.put("ad", gd.denominator().coefficientsDescending());
            m.put("dt", SAMPLE_TIME_S);
            m.put("du", du);
            req.add(m);
        }
        answers = PythonOracle.run(SCRIPT, Map.of("cases", req)).getAsJsonArray();
    }

    static IntStream indices() { return IntStream.range(0, COUNT); }

    private static void close(double[] ours, JsonObject a, String key, String what) { close(ours, a, key, what, 0); }

    private static void close(double[] ours, JsonObject a, String key, String what, double kappa) {
        double[] ref = PythonOracle.doubles(a.get(key));
        assertTrue(ref.length == ours.length, what + ": " + ours.length + " samples vs SciPy's " + ref.length);
        double scale = 1, err = 0;
        for (double v : ref) scale = Math.max(scale, Math.abs(v));
        for (int k = 0; k < ref.length; k++) err = Math.max(err, Math.abs(ours[k] - ref[k]));
        double tol = (1e-9 + 10 * Math.ulp(1.0) * kappa) * scale;
        assertTrue(err <= tol, what + ": max difference " + err + " against SciPy (scale " + scale + ")");
    }

    // Source: scipy.signal.step / impulse / lsim (SciPy 1.10), continuous transfer functions from rest.
    @ParameterizedTest(name = "continuous step, impulse, lsim (FOH and ZOH) match SciPy: case {0}")
    @MethodSource("indices")
    void continuousMatchesScipy(int i) {
        Case c = cases.get(i);
        JsonObject a = answers.get(i).getAsJsonObject();
        close(LinearResponse.step(c.g(), c.timeS()).values(), a, "step", "step " + c.g());
        close(LinearResponse.impulse(c.g(), c.timeS()).values(), a, "impulse", "impulse " + c.g());
        close(LinearResponse.forced(c.g(), c.timeS(), c.input()).values(), a, "foh", "lsim interp=True " + c.g());
        close(LinearResponse.forced(c.g(), c.timeS(), c.input(), LinearResponse.Hold.ZERO_ORDER).values(), a, "zoh", "lsim interp=False " + c.g());
    }

    // Source: scipy.signal.lsim with X0 on the same (A, B, C, D).
    @ParameterizedTest(name = "initial-condition and forced state-space responses match SciPy: case {0}")
    @MethodSource("indices")
    void stateSpaceMatchesScipy(int i) {
        Case c = cases.get(i);
        JsonObject a = answers.get(i).getAsJsonObject();
        close(LinearResponse.initial(c.ss(), c.x0(), c.timeS()).values(), a, "initial", "initial " + c.g());
        close(LinearResponse.forced(c.ss(), c.x0(), c.timeS(), c.input(), LinearResponse.Hold.FIRST_ORDER).values(), a, "ssfoh", "lsim X0 " + c.g());
    }

    /** Σ|c| / |Σc|: how much coefficient rounding (relative ε each) can move N(1) or D(1), hence the DC gain. */
    private static double kappa(double[] c) {
        double abs = 0, sum = 0;
        for (double v : c) { abs += Math.abs(v); sum += v; }
        return abs / Math.abs(sum);
    }

    // Source: scipy.signal.dstep / dimpulse / dlsim / lfilter on the same coefficients.
    @ParameterizedTest(name = "sampled step, impulse, forced response and lfilter match SciPy: case {0}")
    @MethodSource("indices")
    void sampledMatchesScipy(int i) {
        Case c = cases.get(i);
        JsonObject a = answers.get(i).getAsJsonObject();
        double[] t = new double[c.dInput().length];
        for (int k = 0; k < t.length; k++) t[k] = k * SAMPLE_TIME_S;
        double kappa = kappa(c.gd().numerator().coefficientsDescending()) + kappa(c.gd().denominator().coefficientsDescending());
        close(LinearResponse.filter(c.gd(), c.dInput()), a, "lfilter", "lfilter " + c.gd(), kappa);
        close(LinearResponse.step(c.gd(), t).values(), a, "dstep", "dstep " + c.gd(), kappa);
        close(LinearResponse.impulse(c.gd(), t).values(), a, "dimpulse", "dimpulse " + c.gd(), kappa);
        close(LinearResponse.forced(c.gd(), t, c.dInput()).values(), a, "dlsim", "dlsim " + c.gd(), kappa);
        close(LinearResponse.filter(c.gd(), c.dInput()), a, "lfilter", "lfilter " + c.gd(), kappa);
    }
}
