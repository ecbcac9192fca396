package org.loopledger.lti;

import com.google.gson.JsonArray;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.loopledger.testing.PythonOracle;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.stream.IntStream;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link MatrixExponential} against closed forms (derivation by hand) and against
 * {@code scipy.linalg.expm} (Al-Mohy and Higham's scaling and squaring, a different Padé degree, so an
 * independent implementation). Errors are measured in the Frobenius norm relative to ‖e<sup>A</sup>‖.
 */
class MatrixExponentialTest {
    static final long SEED = 7_031_965L;
    static final double[] SCALES = {0.1, 1, 5, 30, 200}; // ‖A‖ from below 1/2 (no squaring) to ~1e3 (10+ squarings)
    static final int PER_SCALE = 4;
    static List<double[][]> random = new ArrayList<>();
    static JsonArray scipy;

    @BeforeAll
    static void askScipy() {
        PythonOracle.require("numpy", "scipy.linalg");
        SplittableRandom rnd = new SplittableRandom(SEED);
        for (double scale : SCALES) {
            for (int k = 0; k < PER_SCALE; k++) {
                int n = 2 + rnd.nextInt(5);
                double[][] a = new double[n][n];
                // entries uniform in [-1, 1] scaled, with the diagonal shifted negative so that e^A stays in
                // range (a stable system's A·T), and one unstable case per scale for growth.
                for (int i = 0; i < n; i++) {
                    for (int j = 0; j < n; j++) a[i][j] = scale * rnd.nextDouble(-1, 1);
                    a[i][i] -= k == 0 ? -0.2 * scale / n : scale;
                }
                random.add(a);
            }
        }
        String script = """
                import json, sys
                import numpy as np
                from scipy.linalg import expm
                print(json.dumps([expm(np.array(a, float)).tolist() for a in json.load(sys.stdin)]))
                """;
        scipy = PythonOracle.run(script, random).getAsJsonArray();
    }

    static IntStream randomIndices() { return IntStream.range(0, SCALES.length * PER_SCALE); }

    // Source: scipy.linalg.expm of the same matrix.
    @ParameterizedTest(name = "random matrix {0}")
    @MethodSource("randomIndices")
    void matchesScipyExpm(int i) {
        double[][] a = random.get(i);
        double[][] want = new double[a.length][];
        JsonArray rows = scipy.get(i).getAsJsonArray();
        for (int r = 0; r < a.length; r++) want[r] = PythonOracle.doubles(rows.get(r));
        RealMatrix am = MatrixUtils.createRealMatrix(a);
        double norm = am.getNorm();
        // Tolerance: relative error of scaling and squaring grows like ‖A‖·eps (Moler and Van Loan 2003,
        // §3; each squaring doubles the relative error of the previous step); two independent
        // implementations may therefore differ by about 2·50·‖A‖·eps; floor 1e-13 for small norms.
        double tol = Math.max(1e-13, 100 * norm * Math.ulp(1.0));
        assertClose(want, MatrixExponential.expm(am), tol, "‖A‖₁ = " + norm);
    }

    static Stream<Arguments> closedForms() {
        List<Arguments> rows = new ArrayList<>();
        for (double th : new double[] {0.3, 2.5, 40}) {
            // [[0, -θ], [θ, 0]] generates a rotation by θ (derivation by hand: A² = -θ² I)
            rows.add(Arguments.of("rotation θ = " + th, new double[][] {{0, -th}, {th, 0}},
                    new double[][] {{Math.cos(th), -Math.sin(th)}, {Math.sin(th), Math.cos(th)}}));
        }
        for (double t : new double[] {0.5, 3}) {
            // Jordan block λI + N (N nilpotent, 4×4): e^{(λI+N)t} = e^{λt} Σ_k N^k t^k / k! (derivation by hand)
            double lam = -1.5, e = Math.exp(lam * t);
            double[][] a = new double[4][4], want = new double[4][4];
            for (int i = 0; i < 4; i++) {
                a[i][i] = lam * t;
                if (i < 3) a[i][i + 1] = t;
                double f = 1;
                for (int k = 0; i + k < 4; k++) {
                    want[i][i + k] = e * Math.pow(t, k) / f;
                    f *= k + 1;
                }
            }
            rows.add(Arguments.of("Jordan block λ = -1.5, t = " + t, a, want));
        }
        {   // pure nilpotent: e^N = I + N + N²/2 + N³/6
            double[][] n = {{0, 1, 0, 0}, {0, 0, 1, 0}, {0, 0, 0, 1}, {0, 0, 0, 0}};
            double[][] want = {{1, 1, 0.5, 1 / 6.0}, {0, 1, 1, 0.5}, {0, 0, 1, 1}, {0, 0, 0, 1}};
            rows.add(Arguments.of("nilpotent 4×4", n, want));
        }
        {   // diagonal: e^{diag(d)} = diag(e^d), including a large entry to force squaring
            double[] d = {-50, -2, 0, 0.7, 10};
            double[][] a = new double[5][5], want = new double[5][5];
            for (int i = 0; i < 5; i++) { a[i][i] = d[i]; want[i][i] = Math.exp(d[i]); }
            rows.add(Arguments.of("diagonal", a, want));
        }
        {   // the zero matrix: e^0 = I
            rows.add(Arguments.of("zero 3×3", new double[3][3], MatrixUtils.createRealIdentityMatrix(3).getData()));
        }
        return rows.stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("closedForms")
    void matchesClosedForm(String name, double[][] a, double[][] want) {
        RealMatrix am = MatrixUtils.createRealMatrix(a);
        // Same error model as above; the rotation by 40 rad squares 8 times (‖A‖ = 40).
        double tol = Math.max(1e-14, 100 * am.getNorm() * Math.ulp(1.0));
        assertClose(want, MatrixExponential.expm(am), tol, name);
    }

    @Test
    void inputIsNotModified() {
        double[][] a = {{1, 2}, {-3, 4}};
        RealMatrix am = MatrixUtils.createRealMatrix(a);
        RealMatrix copy = am.copy();
        MatrixExponential.expm(am);
        assertTrue(am.equals(copy));
    }

    @ParameterizedTest(name = "bad entry {0}")
    @ValueSource(doubles = {Double.NaN, Double.POSITIVE_INFINITY})
    void rejectsNonFiniteEntries(double bad) {
        RealMatrix am = MatrixUtils.createRealMatrix(new double[][] {{1, 0}, {bad, 1}});
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> MatrixExponential.expm(am));
        assertTrue(e.getMessage().contains("(1,0)") && e.getMessage().contains("not finite"), e.getMessage());
    }

    @Test
    void rejectsNonSquare() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> MatrixExponential.expm(MatrixUtils.createRealMatrix(2, 3)));
        assertTrue(e.getMessage().contains("2x3"), e.getMessage());
    }

    static void assertClose(double[][] want, RealMatrix got, double tol, String what) {
        RealMatrix w = MatrixUtils.createRealMatrix(want);
        double rel = got.subtract(w).getFrobeniusNorm() / w.getFrobeniusNorm();
        assertTrue(rel <= tol, what + ": relative error " + rel + " > " + tol);
        assertArrayEquals(new int[] {w.getRowDimension(), w.getColumnDimension()}, new int[] {got.getRowDimension(), got.getColumnDimension()});
    }
}
