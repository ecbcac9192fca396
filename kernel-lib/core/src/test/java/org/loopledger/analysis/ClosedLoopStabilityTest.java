package org.loopledger.analysis;

import com.google.gson.JsonObject;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;
import org.loopledger.testing.PythonOracle;

import java.util.Comparator;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** Closed-loop stability: poles (models), Nyquist count (delay, data), against Routh, numpy and hand results. */
class ClosedLoopStabilityTest {

    static JsonObject py;

    /** numpy.roots of the closed-loop characteristic polynomial s³ + 3s² + 2s + K for K = 7. */
    @BeforeAll
    static void oracle() {
        PythonOracle.require("numpy");
        String script = "import json, sys, numpy as np\n"
                + "req = json.load(sys.stdin)\n"
                + "r = sorted(np.roots([1, 3, 2, req['K']]), key=lambda z: (z.real, z.imag))\n"
                + "print(json.dumps({'re': [float(z.real) for z in r], 'im': [float(z.imag) for z in r]}))\n";
        JsonObject req = new JsonObject();
        req.addProperty("K", 7);
        py = PythonOracle.run(script, req).getAsJsonObject();
    }

    static Frf data(TransferFunction l) { return Frf.ofModel(l, FrequencyGrid.logRadPerS(0.01, 100, 2000)); }

    /**
     * Routh on s³ + 3s² + 2s + K (derivation by hand): first column 1, 3, (6-K)/3, K, so stable for K &lt; 6 and
     * two right-half-plane poles for K &gt; 6. The poles themselves against numpy.roots (1e-9: both are
     * eigenvalue solvers on a well-conditioned cubic). The Nyquist count must agree (no note).
     */
    @Test
    void thirdOrderRouth() {
        ClosedLoopStability s5 = ClosedLoopStability.of(MarginsModelTest.third(5));
        assertTrue(s5.isStable(), s5.toString());
        assertEquals(ClosedLoopStability.Method.CLOSED_LOOP_POLES, s5.method());
        assertTrue(s5.notes().isEmpty(), s5.notes().toString());
        ClosedLoopStability s7 = ClosedLoopStability.of(MarginsModelTest.third(7));
        assertFalse(s7.isStable());
        assertEquals(2, s7.unstableClosedLoopPoles());
        assertEquals(2, s7.clockwiseEncirclements(), "Z = N + P with P = 0");
        assertTrue(s7.notes().isEmpty(), s7.notes().toString());
        List<Complex> poles = s7.closedLoopPoles().stream()
                .sorted(Comparator.comparingDouble(Complex::getReal).thenComparingDouble(Complex::getImaginary)).toList();
        double[] re = PythonOracle.doubles(py.get("re")), im = PythonOracle.doubles(py.get("im"));
        for (int i = 0; i < 3; i++) {
            assertEquals(re[i], poles.get(i).getReal(), 1e-9);
            assertEquals(im[i], poles.get(i).getImaginary(), 1e-9);
        }
        assertTrue(s7.toString().contains("UNSTABLE"), s7.toString());
    }

    /**
     * Delay: the delay margin is by definition the smallest added delay that brings the loop onto -1.
     * 1 % below it the loop is stable, 1 % above it unstable, decided by the Nyquist count (no pole list).
     */
    @Test
    void delayLoopUsesNyquistAndRespectsDelayMargin() {
        double dm = Margins.of(MarginsModelTest.third(1)).delayMarginS().getAsDouble();
        ClosedLoopStability below = ClosedLoopStability.of(MarginsModelTest.third(1).withDelay(0.99 * dm));
        ClosedLoopStability above = ClosedLoopStability.of(MarginsModelTest.third(1).withDelay(1.01 * dm));
        assertEquals(ClosedLoopStability.Method.NYQUIST, below.method());
        assertTrue(below.closedLoopPoles().isEmpty());
        assertTrue(below.notes().stream().anyMatch(n -> n.kind() == LoopWarning.Kind.DECIDED_ON_GRID && n.message().contains("infinite")), below.notes().toString());
        assertTrue(below.isStable(), below.toString());
        assertFalse(above.isStable(), above.toString());
        assertEquals(2, above.unstableClosedLoopPoles(), "crossing -1 once brings a complex pair across the axis");
    }

    /**
     * P = 1/(s-1), C = 2 (Åström and Murray's standard example of an unstable plant stabilised by a
     * proportional controller; by hand: closed loop s - 1 + 2 = s + 1, stable). On data with the stated
     * P = 1: the Nyquist curve of 2/(s-1) encircles -1 once anticlockwise, N = -1, Z = N + P = 0.
     * With C = 0.5 the closed loop s - 0.5 is unstable: N = 0, Z = 1.
     */
    @Test
    void unstablePlantStabilisedOnData() {
        TransferFunction p = TransferFunction.continuous(new double[] {1}, new double[] {1, -1});
        ClosedLoopStability ok = ClosedLoopStability.of(data(p.times(2)), 1);
        assertTrue(ok.isStable(), ok.toString());
        assertEquals(-1, ok.clockwiseEncirclements());
        assertEquals(ClosedLoopStability.Method.NYQUIST, ok.method());
        ClosedLoopStability weak = ClosedLoopStability.of(data(p.times(0.5)), 1);
        assertFalse(weak.isStable());
        assertEquals(1, weak.unstableClosedLoopPoles());
        // the same verdicts from the models' poles
        assertTrue(ClosedLoopStability.of(p.times(2)).isStable());
        assertFalse(ClosedLoopStability.of(p.times(0.5)).isStable());
        // a wrong statement (P = 0) for the stabilised loop gives Z = -1, which is flagged
        ClosedLoopStability wrong = ClosedLoopStability.of(data(p.times(2)), 0);
        assertTrue(wrong.notes().stream().anyMatch(n -> n.kind() == LoopWarning.Kind.IMPOSSIBLE_COUNT && n.message().contains("negative")), wrong.notes().toString());
    }

    /** Data: the same Routh verdicts as the models for K = 5 and 7 (Z = 0 and 2), with P = 0 stated. */
    @Test
    void dataCountMatchesRouth() {
        assertTrue(ClosedLoopStability.of(data(MarginsModelTest.third(5)), 0).isStable());
        ClosedLoopStability s7 = ClosedLoopStability.of(data(MarginsModelTest.third(7)), 0);
        assertEquals(2, s7.unstableClosedLoopPoles(), s7.toString());
    }

    /**
     * Conditionally stable loop on data: stable at K = 20, and unstable 5 % below the lower gain margin
     * (the lower margin's meaning, checked against numpy's poles in MarginsModelTest).
     */
    @Test
    void conditionallyStableOnData() {
        double lower = Margins.of(MarginsModelTest.conditional(20)).lowerGainMargin().orElseThrow().gainMarginRatio();
        double[] w = FrequencyGrid.logRadPerS(0.5, 2000, 3000);
        assertTrue(ClosedLoopStability.of(Frf.ofModel(MarginsModelTest.conditional(20), w), 0).isStable());
        assertFalse(ClosedLoopStability.of(Frf.ofModel(MarginsModelTest.conditional(20 * lower * 0.95), w), 0).isStable());
        assertFalse(ClosedLoopStability.of(MarginsModelTest.conditional(20 * lower * 0.95)).isStable());
    }

    /** Data must state P; a band that misses the crossover is warned about. */
    @Test
    void dataRequiresStatedUnstablePolesAndWarnsOnBand() {
        Frf f = Frf.ofModel(MarginsModelTest.third(1), FrequencyGrid.logRadPerS(1, 100, 400));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> ClosedLoopStability.of(MeasuredLoop.of(f)));
        assertTrue(e.getMessage().contains("withOpenLoopUnstablePoles"), e.getMessage());
        ClosedLoopStability s = ClosedLoopStability.of(f, 0);
        assertTrue(s.notes().stream().anyMatch(n -> n.message().contains("band") && n.frequencyHz().isPresent()), s.notes().toString());
    }

    /**
     * Discrete integrator KT/(z-1): closed-loop pole 1 - KT (by hand), stable for 0 &lt; KT &lt; 2. The Nyquist
     * count on the unit circle (closed at z = -1) must agree with the pole count.
     */
    @Test
    void discreteIntegrator() {
        for (double kt : new double[] {0.2, 1.5, 3}) {
            ClosedLoopStability s = ClosedLoopStability.of(TransferFunction.discrete(new double[] {kt}, new double[] {1, -1}, 0.01));
            assertEquals(kt < 2, s.isStable(), s.toString());
            assertEquals(1 - kt, s.closedLoopPoles().get(0).getReal(), 1e-12);
            assertTrue(s.notes().isEmpty(), "Nyquist and poles agree: " + s.notes());
        }
    }

}
