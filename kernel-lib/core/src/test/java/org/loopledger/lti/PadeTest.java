package org.loopledger.lti;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.loopledger.testing.PythonOracle;

import java.util.Map;
import java.util.stream.IntStream;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link Pade} against the handbook coefficients of the [n/n] approximant of e<sup>-sτ</sup> and against
 * {@code scipy.interpolate.pade} of the exponential series (one Python process for the class).
 * Coefficients are compared in the normalisation N(0) = D(0) = 1, as powers of (sτ).
 */
class PadeTest {
    static final double TAU = 2.5e-3; // a 2.5 ms transport delay
    static final int MAX = 8;
    static JsonArray scipy;

    @BeforeAll
    static void askScipy() {
        PythonOracle.require("numpy", "scipy.interpolate");
        String script = """
                import json, sys, math
                from scipy.interpolate import pade
                out = []
                for n in json.load(sys.stdin)["orders"]:
                    an = [(-1) ** k / math.factorial(k) for k in range(2 * n + 1)]   # Taylor series of e^{-x}
                    p, q = pade(an, n, n)
                    out.append({"p": p.coeffs.tolist(), "q": q.coeffs.tolist()})     # descending powers of x
                print(json.dumps(out))
                """;
        scipy = PythonOracle.run(script, Map.of("orders", IntStream.rangeClosed(1, MAX).boxed().toList())).getAsJsonArray();
    }

    /** Coefficients of (sτ)^k, ascending, in the normalisation D(0) = 1. */
    static double[][] ascendingInSTau(TransferFunction g) {
        double[] n = g.numerator().coefficientsDescending(), d = g.denominator().coefficientsDescending();
        int order = d.length - 1;
        double d0 = d[order];
        double[] na = new double[order + 1], da = new double[order + 1];
        for (int k = 0; k <= order; k++) {
            int idx = order - k;
            na[k] = (idx - (order + 1 - n.length) >= 0 ? n[idx - (order + 1 - n.length)] : 0) / d0 / Math.pow(TAU, k);
            da[k] = d[idx] / d0 / Math.pow(TAU, k);
        }
        return new double[][] {na, da};
    }

    static Stream<Arguments> handbook() {
        // Source: the classical table of [n/n] Padé approximants of e^{-x} (common handbook values; they
        // follow from (2n-k)! n! / ((2n)! k! (n-k)!)); numerator = denominator with odd powers negated.
        return Stream.of(
                Arguments.of(1, new double[] {1, 1 / 2.0}),
                Arguments.of(2, new double[] {1, 1 / 2.0, 1 / 12.0}),
                Arguments.of(3, new double[] {1, 1 / 2.0, 1 / 10.0, 1 / 120.0}),
                Arguments.of(4, new double[] {1, 1 / 2.0, 3 / 28.0, 1 / 84.0, 1 / 1680.0}));
    }

    @ParameterizedTest(name = "[{0}/{0}] handbook")
    @MethodSource("handbook")
    void matchesHandbookCoefficients(int n, double[] denAscending) {
        double[][] got = ascendingInSTau(Pade.approximant(TAU, n));
        for (int k = 0; k <= n; k++) {
            // 1e-12 relative: the coefficients are scaled by τ^k and back, a few roundings each
            assertEquals(denAscending[k], got[1][k], 1e-12 * denAscending[k], "denominator (sτ)^" + k);
            assertEquals((k % 2 == 0 ? 1 : -1) * denAscending[k], got[0][k], 1e-12 * denAscending[k], "numerator (sτ)^" + k);
        }
    }

    static IntStream orders() { return IntStream.rangeClosed(1, MAX); }

    // Source: scipy.interpolate.pade(Taylor coefficients of e^{-x}, n, n).
    @ParameterizedTest(name = "[{0}/{0}] vs scipy.interpolate.pade")
    @MethodSource("orders")
    void matchesScipyPade(int n) {
        JsonObject a = scipy.get(n - 1).getAsJsonObject();
        double[] p = PythonOracle.doubles(a.get("p")), q = PythonOracle.doubles(a.get("q"));
        double q0 = q[q.length - 1];
        double[][] got = ascendingInSTau(Pade.approximant(TAU, n));
        for (int k = 0; k <= n; k++) {
            double wantQ = q[q.length - 1 - k] / q0, wantP = p[p.length - 1 - k] / q0;
            // SciPy solves an ill-conditioned linear system for the coefficients: measured against the closed form
            // its error grows from 0 (n = 1) to 1.7e-10 (n = 8), so 1e-9 absolute (the largest coefficient is 1).
            assertEquals(wantQ, got[1][k], 1e-9, "denominator (sτ)^" + k + " of order " + n);
            assertEquals(wantP, got[0][k], 1e-9, "numerator (sτ)^" + k + " of order " + n);
        }
    }

    @ParameterizedTest(name = "order {0} is all-pass and tracks the phase")
    @MethodSource("orders")
    void isAllPassWithPhaseMinusOmegaTauAtLowFrequency(int n) {
        // Definition: N(s) = D(-s), so |N(jω)/D(jω)| = 1 exactly (derivation by hand); the phase error of the
        // [n/n] approximant grows like (ωτ)^{2n+1}, so at ωτ = 0.1 it is below 1e-3 rad even for n = 1.
        TransferFunction g = Pade.approximant(TAU, n);
        for (double wt : new double[] {0.01, 0.1, 1, 10}) {
            Complex r = g.response(wt / TAU);
            assertEquals(1.0, r.abs(), 1e-13, "|G| at ωτ = " + wt);
        }
        Complex r = g.response(0.1 / TAU);
        assertEquals(-0.1, r.getArgument(), 1e-3);
        assertTrue(g.zeros().stream().allMatch(z -> z.getReal() > 0), "zeros in the right half plane (non-minimum phase)");
        assertTrue(g.poles().stream().allMatch(z -> z.getReal() < 0), "stable poles");
    }

    @Test
    void replacingDelayKeepsTheRationalPart() {
        TransferFunction g = TransferFunction.continuous(new double[] {10}, new double[] {1, 10}).withDelay(TAU);
        TransferFunction approx = Pade.replacingDelay(g, 3);
        assertEquals(0, approx.delayS());
        assertEquals(g.withoutDelay().times(Pade.approximant(TAU, 3)), approx);
        TransferFunction plain = g.withoutDelay();
        assertSame(plain, Pade.replacingDelay(plain, 3));
        assertEquals(TransferFunction.gain(1.0), Pade.approximant(0.0, 4));
    }

    @ParameterizedTest(name = "order {0} refused")
    @ValueSource(ints = {0, -1, 11})
    void rejectsBadOrders(int n) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Pade.approximant(TAU, n));
        assertTrue(e.getMessage().contains("order") && e.getMessage().contains(String.valueOf(n)), e.getMessage());
    }

    @ParameterizedTest(name = "delay {0} refused")
    @ValueSource(doubles = {-1e-3, Double.NaN, Double.POSITIVE_INFINITY})
    void rejectsBadDelays(double d) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Pade.approximant(d, 2));
        assertTrue(e.getMessage().contains("delay"), e.getMessage());
    }

    @Test
    void refusesSampledSystems() {
        TransferFunction d = TransferFunction.discrete(new double[] {1}, new double[] {1, -0.5}, 1e-3).withDelay(2e-3);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Pade.replacingDelay(d, 2));
        assertTrue(e.getMessage().contains("z^-k"), e.getMessage());
    }
}
