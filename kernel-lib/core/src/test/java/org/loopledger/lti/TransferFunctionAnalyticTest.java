package org.loopledger.lti;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.List;
import java.util.stream.IntStream;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Analytic properties of {@link TransferFunction}: slopes, phases, block algebra, DC gain, minimal form. */
class TransferFunctionAnalyticTest {
    static final double T = 1e-3;

    static TransferFunction tf(double[] num, double[] den) { return TransferFunction.continuous(num, den); }

    static double db(Complex c) { return Units.ratioToDb(c.abs()); }

    static double deg(Complex c) { return Units.radToDeg(c.getArgument()); }

    /** (name, G, ω₁, ω₂ = 10ω₁, slope dB/decade, phase at ω₂ deg, tolerances, source). */
    static Stream<Arguments> slopes() {
        return Stream.of(
                // integrator: |1/(jω)| falls exactly 20 dB per decade, phase exactly -90° (common practice)
                Arguments.of("1/s", tf(new double[] {1}, new double[] {1, 0}), 3.0, -20.0, -90.0, 1e-12, 1e-12,
                        "common practice: integrator -20 dB/decade, -90°"),
                // double integrator: -40 dB/decade, -180° (common practice)
                Arguments.of("1/s²", tf(new double[] {1}, new double[] {1, 0, 0}), 0.2, -40.0, -180.0, 1e-12, 1e-12,
                        "common practice: double integrator -40 dB/decade, -180°"),
                // first order 1/(s+1) a decade above 1000× its corner: slope -20 dB/decade and phase -90° to within
                // 20 - 10 log10((1+ω₂²)/(1+ω₁²)) ≈ 10 log10(e)·(1/ω₁²) = 4.3e-6 dB and atan(1/ω₂) = 5.7e-3° (derivation by hand)
                Arguments.of("1/(s+1), far above the corner", tf(new double[] {1}, new double[] {1, 1}), 1000.0, -20.0, -90.0, 5e-6, 6e-3,
                        "common practice: first-order roll-off -20 dB/decade, phase toward -90°"),
                // first order at its corner: |G| = -3.0103 dB, phase -45° (derivation by hand: 1/(1+j))
                Arguments.of("5/(s+5) at the corner", tf(new double[] {5}, new double[] {1, 5}), 0.5, Double.NaN, -45.0, 0, 1e-12,
                        "derivation by hand: arg 1/(1+j) = -45°"),
                // sampled integrator T/(z-1): phase -90° - ωT/2 (derivation by hand: T/(e^{jωT}-1) = T e^{-jωT/2}/(2j sin(ωT/2)))
                Arguments.of("T/(z-1) sampled", TransferFunction.discrete(new double[] {T}, new double[] {1, -1}, T), 1.0, Double.NaN,
                        -90.0 - Units.radToDeg(10.0 * T / 2), 0, 1e-10, "derivation by hand: half-sample lag of the forward-Euler integrator"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("slopes")
    void slopeAndPhase(String name, TransferFunction g, double w1, double slopeDbPerDecade, double phaseDeg, double tolDb, double tolDeg, String source) {
        Complex a = g.response(w1), b = g.response(10 * w1);
        if (!Double.isNaN(slopeDbPerDecade)) assertEquals(slopeDbPerDecade, db(b) - db(a), tolDb, source);
        assertEquals(phaseDeg, deg(b), tolDeg, source);
    }

    @Test
    void aZeroAdds84Point3DegreesAtTenTimesItsFrequency() {
        // Source: arctan(10) = 84.2894° (common practice: "a zero adds 84.3° a decade above its corner").
        TransferFunction base = tf(new double[] {3}, new double[] {1, 4, 9});
        TransferFunction withZero = base.times(tf(new double[] {1 / 2.0, 1}, new double[] {1})); // zero at 2 rad/s
        double added = deg(withZero.response(20).divide(base.response(20)));
        assertEquals(Units.radToDeg(Math.atan(10)), added, 1e-12);
        assertEquals(84.29, added, 0.005);
    }

    @Test
    void firstOrderCornerIsMinus3Db() {
        // Source: 20 log10(1/√2) = -3.0103 dB (derivation by hand).
        assertEquals(-3.0103, db(tf(new double[] {5}, new double[] {1, 5}).response(5)), 1e-4);
    }

    // ------------------------------------- algebra on a grid -------------------------------------

    static final List<RandomSystems.Case> CASES = RandomSystems.draw(99L, 12);
    static final double[] GRID = RootsAndResponseScipyTest.logGrid(0.05, 500, 60);

    static IntStream pairs() { return IntStream.range(0, CASES.size() - 1); }

    /**
     * S + T = 1 and the block-diagram identities, evaluated pointwise (definitions). Tolerance 1e-9
     * relative to the sizes of the terms: the combined polynomials have degree up to 12, whose Horner
     * error at the largest grid point stays well inside that.
     */
    @ParameterizedTest(name = "pair {0}")
    @MethodSource("pairs")
    void blockAlgebraMatchesPointwiseArithmetic(int i) {
        TransferFunction g = CASES.get(i).continuous(), h = CASES.get(i + 1).continuous();
        TransferFunction sens = TransferFunction.gain(1).feedback(g);     // 1/(1 + G)
        TransferFunction comp = g.feedback();                            // G/(1 + G)
        TransferFunction series = g.times(h), parallel = g.plus(h), fb = g.feedback(h), inv = g.inverse(), diff = g.minus(h);
        for (double w : GRID) {
            Complex gw = g.response(w), hw = h.response(w);
            Complex s = sens.response(w), t = comp.response(w);
            assertClose(Complex.ONE, s.add(t), 1e-9 * (s.abs() + t.abs()), "S + T = 1 at " + w);
            assertClose(gw.multiply(hw), series.response(w), 1e-9 * gw.abs() * hw.abs(), "series at " + w);
            assertClose(gw.add(hw), parallel.response(w), 1e-9 * (gw.abs() + hw.abs()), "parallel at " + w);
            assertClose(gw.subtract(hw), diff.response(w), 1e-9 * (gw.abs() + hw.abs()), "difference at " + w);
            Complex loop = Complex.ONE.add(gw.multiply(hw));
            assertClose(gw.divide(loop), fb.response(w), 1e-9 * gw.abs() / loop.abs() * (1 + gw.abs() * hw.abs() / loop.abs()), "feedback at " + w);
            assertClose(Complex.ONE, inv.response(w).multiply(gw), 1e-12, "G·G⁻¹ = 1 at " + w);
        }
    }

    @Test
    void seriesAddsDelaysAndParallelNeedsEqualDelays() {
        TransferFunction a = tf(new double[] {1}, new double[] {1, 1}).withDelay(0.01);
        TransferFunction b = tf(new double[] {2}, new double[] {1, 3}).withDelay(0.02);
        assertEquals(0.03, a.times(b).delayS(), 1e-18);
        // exact frequency response of a delay: e^{-jωτ} (DESIGN: keep delays exact in the frequency domain)
        Complex ratio = a.response(7).divide(a.withoutDelay().response(7));
        assertClose(new Complex(Math.cos(0.07), -Math.sin(0.07)), ratio, 1e-15, "delay");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> a.plus(b));
        assertTrue(e.getMessage().contains("different delays"), e.getMessage());
        IllegalArgumentException e2 = assertThrows(IllegalArgumentException.class, () -> a.plus(1.0));
        assertTrue(e2.getMessage().contains("different delays"), e2.getMessage());
        assertSame(a, a.plus(0.0));
    }

    @Test
    void joiningDifferentTimeBasesThrowsAtTheJoin() {
        TransferFunction c = tf(new double[] {1}, new double[] {1, 1});
        TransferFunction d = TransferFunction.discrete(new double[] {1}, new double[] {1, -0.5}, 0.01);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> c.times(d));
        assertTrue(e.getMessage().contains("time bases differ"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> d.plus(TransferFunction.discrete(new double[] {1}, new double[] {1}, 0.02)));
    }

    // ------------------------------------------ DC gain -------------------------------------------

    static Stream<Arguments> dcGains() {
        return Stream.of(
                Arguments.of(tf(new double[] {1, 2}, new double[] {1, 4}), 0.5, "derivation by hand: 2/4"),
                Arguments.of(tf(new double[] {1}, new double[] {1, 0}), Double.POSITIVE_INFINITY, "pole at s = 0: infinite"),
                Arguments.of(tf(new double[] {-3}, new double[] {1, 2, 0}), Double.NEGATIVE_INFINITY, "pole at 0, negative gain: -inf"),
                Arguments.of(tf(new double[] {1, 0}, new double[] {1, 1}), 0.0, "zero at s = 0: 0"),
                Arguments.of(tf(new double[] {2, 0}, new double[] {1, 3, 0}), 2 / 3.0, "s cancels: 2/(s+3) → 2/3"),
                Arguments.of(TransferFunction.discrete(new double[] {0.01}, new double[] {1, -1}, 0.01), Double.POSITIVE_INFINITY,
                        "sampled integrator: pole at z = 1, infinite"),
                Arguments.of(TransferFunction.discrete(new double[] {0.5}, new double[] {1, -0.5}, 0.01), 1.0, "G(1) = 0.5/0.5"),
                Arguments.of(tf(new double[] {1}, new double[] {1, -2, 0}), Double.NEGATIVE_INFINITY,
                        "1/(s(s-2)) ≈ -1/(2s) near 0: -inf (sign of the residue, derivation by hand)"),
                Arguments.of(tf(new double[] {1}, new double[] {1, 1e-15}), Double.POSITIVE_INFINITY,
                        "integrator computed as s + 1e-15 is an integrator (DESIGN, traps)"),
                Arguments.of(tf(new double[] {1, 0, 0}, new double[] {1, 2, 0}), 0.0, "s²/(s(s+2)): a net zero at s = 0"),
                Arguments.of(tf(new double[] {4, 0}, new double[] {1, 0, 0}), Double.POSITIVE_INFINITY, "4s/s²: a net pole at s = 0"));
    }

    static Stream<Arguments> sampledIntegratingPlants() {
        // ZOH and Tustin of 1/(s(s+1.3)), 1/(s(s²+3.7s+2.1)) and 1/(s(s-2)), at sample times where the pole at
        // z = 1 is stored with rounding noise (measured: the old code gave finite values up to ±9e11): the DC gain is +inf (integrating plant; the residue is positive).
        return Stream.of(0.1, 0.01, 0.003, 1e-3, 6.25e-5).flatMap(t -> Stream.of(
                Arguments.of(Discretization.zoh(tf(new double[] {1}, new double[] {1, 1.3, 0}), t), Double.POSITIVE_INFINITY, "zoh T = " + t),
                Arguments.of(Discretization.zoh(tf(new double[] {1}, new double[] {1, 3.7, 2.1, 0}), t), Double.POSITIVE_INFINITY, "zoh 3rd order T = " + t),
                Arguments.of(Discretization.tustin(tf(new double[] {1}, new double[] {1, 3.7, 2.1, 0}), t), Double.POSITIVE_INFINITY, "tustin T = " + t),
                Arguments.of(Discretization.zoh(tf(new double[] {1}, new double[] {1, -2, 0}), t), Double.NEGATIVE_INFINITY, "zoh unstable T = " + t)));
    }

    @ParameterizedTest(name = "{2}")
    @MethodSource("sampledIntegratingPlants")
    void sampledIntegratorsHaveInfiniteDcGain(TransferFunction g, double expected, String source) {
        assertEquals(expected, g.dcGain(), source);
    }

    @ParameterizedTest(name = "{2}")
    @MethodSource("dcGains")
    void dcGain(TransferFunction g, double expected, String source) {
        assertEquals(expected, g.dcGain(), 1e-15, source);
    }

    // ------------------------------------------ minimal -------------------------------------------

    @Test
    void minimalCancelsANearPairWithinToleranceAndKeepsTheGain() {
        // 3 (s + 1 + 1e-10) / ((s + 1)(s + 2)): the pair at -1 is 1e-10 apart, inside 1e-8 but outside 1e-12.
        TransferFunction g = tf(new double[] {3, 3 * (1 + 1e-10)}, new double[] {1, 3, 2});
        TransferFunction m = g.minimal(1e-8);
        assertEquals(1, m.denominator().degree());
        assertEquals(0, m.numerator().degree());
        assertEquals(3.0, m.numerator().leading(), 1e-15);          // high-frequency gain factor kept
        assertArrayEquals(new double[] {1, 2}, m.denominator().coefficientsDescending(), 1e-12);
        assertSame(g, g.minimal(1e-12));                           // outside the tolerance: nothing cancels
    }

    @Test
    void minimalCancelsComplexPairsTogether() {
        // (s² + 2s + 5.0000001)/((s² + 2s + 5)(s + 3)): poles -1 ± 2j, zeros 2.2e-8 away.
        TransferFunction g = tf(new double[] {2, 4, 2 * 5.0000001}, Polynomial.ofDescending(1, 2, 5).times(Polynomial.ofDescending(1, 3)).coefficientsDescending());
        TransferFunction m = g.minimal(1e-6);
        assertEquals(0, m.numerator().degree());
        assertArrayEquals(new double[] {2}, m.numerator().coefficientsDescending(), 1e-12);
        assertArrayEquals(new double[] {1, 3}, m.denominator().coefficientsDescending(), 1e-9);
    }

    // ------------------------------- integer-valued coefficients ----------------------------------

    @Test
    void integerValuedCoefficientsGiveTheSameResultAsFractionalOnes() {
        // DESIGN: "coerce all inputs to double; an integer numerator must not change a result". 1/(2s + 3) built from
        // int values must be 0.5/(s + 1.5) exactly, not an integer-divided 0/(s + 1).
        int[] num = {1}, den = {2, 3};
        TransferFunction a = tf(toDouble(num), toDouble(den));
        TransferFunction b = tf(new double[] {0.5}, new double[] {1.0, 1.5});
        assertEquals(b, a);
        assertEquals(1 / 3.0, a.dcGain(), 1e-16);
        assertEquals(0.25, a.feedback().dcGain(), 1e-16); // G(0) = 1/3, so T(0) = (1/3)/(1 + 1/3) = 1/4 (by hand)
    }

    static double[] toDouble(int[] a) { return IntStream.of(a).asDoubleStream().toArray(); }

    static void assertClose(Complex want, Complex got, double tol, String what) {
        assertTrue(got.subtract(want).abs() <= tol, what + ": expected " + want + ", got " + got + " (|Δ| = " + got.subtract(want).abs() + ")");
    }
}
