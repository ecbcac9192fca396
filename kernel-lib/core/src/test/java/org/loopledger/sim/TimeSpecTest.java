package org.loopledger.sim;

import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Spec;
import org.loopledger.analysis.SpecReport;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@link TimeSpec} into {@link SpecReport}, and combined reports, on hand-computed responses. */
class TimeSpecTest {
    static final double WN = 10, ZETA = 0.5;
    /** Overshoot of ωn²/(s² + 2ζωn s + ωn²): exp(-πζ/√(1-ζ²)) (textbook, common practice) = 16.30 % at ζ = 0.5. */
    static final double OVERSHOOT_PCT = 100 * Math.exp(-Math.PI * ZETA / Math.sqrt(1 - ZETA * ZETA));

    static TimeSeries secondOrderStep() {
        TransferFunction t = TransferFunction.continuous(new double[] {WN * WN}, new double[] {1, 2 * ZETA * WN, WN * WN});
        return LinearResponse.step(t, LinearResponse.timesS(3, 30_001));
    }

    @Test void overshootOfASecondOrderStepAgainstTheTextbookFormula() {
        StepMetrics m = secondOrderStep().stepMetrics(1.0, 0.02);
        SpecReport pass = TimeSpec.builder().maxOvershootPct(20).build().check(m);
        SpecReport fail = TimeSpec.builder().maxOvershootPct(15).build().check(m);
        assertTrue(pass.passed(), pass.toString());
        assertFalse(fail.passed(), fail.toString());
        assertEquals(OVERSHOOT_PCT, fail.rows().get(0).achievedValue(), 1e-4);
        assertTrue(fail.rows().get(0).requirement().contains("overshoot"), fail.toString());
    }

    // Hand derivation: 1 - e^{-t/τ} rises 10-90 % in τ ln 9 (219.7 ms at τ = 0.1 s) and settles into 2 % at τ ln 50 (391.2 ms).
    @Test void riseAndSettlingOfAFirstOrderStep() {
        TimeSeries y = LinearResponse.step(TransferFunction.continuous(new double[] {1}, new double[] {0.1, 1}), LinearResponse.timesS(1, 10_001));
        SpecReport r = TimeSpec.builder().maxRiseTimeS(0.22).maxSettlingTimeS(0.39).build().check(y.stepMetrics(1.0, 0.02));
        assertTrue(r.rows().get(0).pass(), r.toString());
        assertEquals(0.1 * Math.log(9), r.rows().get(0).achievedValue(), 1e-7);
        assertFalse(r.rows().get(1).pass(), r.toString());
        assertEquals(0.1 * Math.log(50), r.rows().get(1).achievedValue(), 1e-4);
    }

    // L = ωn²/(s(s + 2ζωn)) closes into the same second-order T; its phase margin is
    // atan(2ζ/√(√(1 + 4ζ⁴) - 2ζ²)) = 51.83° at ζ = 0.5 (Franklin, Powell and Emami-Naeini, §6.4, from memory; derivable by hand).
    @Test void frequencyAndTimeReportsCombine() {
        TransferFunction l = TransferFunction.continuous(new double[] {WN * WN}, new double[] {1, 2 * ZETA * WN, 0});
        SpecReport freq = Spec.builder().minPhaseMarginDeg(45).build().check(l).titled("frequency");
        double pm = Math.toDegrees(Math.atan(2 * ZETA / Math.sqrt(Math.sqrt(1 + 4 * Math.pow(ZETA, 4)) - 2 * ZETA * ZETA)));
        assertEquals(pm, freq.rows().get(0).achievedValue(), 1e-6);
        StepMetrics m = secondOrderStep().stepMetrics(1.0, 0.02);
        SpecReport okTime = TimeSpec.builder().maxOvershootPct(20).build().check(m).titled("time");
        SpecReport badTime = TimeSpec.builder().maxOvershootPct(10).build().check(m).titled("time");
        SpecReport both = SpecReport.combined("velocity loop", freq, okTime);
        assertTrue(both.passed(), both.toString());
        assertEquals(2, both.rows().size());
        assertEquals("velocity loop", both.title());
        SpecReport failing = freq.and(badTime);
        assertEquals(1, failing.failures().size(), failing.toString());
        assertEquals("time: overshoot", failing.failures().get(0).requirement());
    }

    // Hand-built servo responses: a position step whose current command peaks at 3.5 (A), and a disturbance response
    // x(t) = 0.002·(t/a)·e^{1 - t/a}, whose peak 0.002 rad lies at t = a (derivative zero there).
    @Test void servoResponsesGivePeakCurrentAndDisturbanceDeviation() {
        double[] t = LinearResponse.timesS(0.1, 1001), zero = new double[t.length];
        double[] pos = secondOrderStep().values();
        double[] p = new double[t.length], fe = new double[t.length], cur = new double[t.length], dist = new double[t.length], dfe = new double[t.length];
        for (int k = 0; k < t.length; k++) {
            p[k] = pos[k * 30];            // any shape; the rows below judge current and deviation
            fe[k] = 1 - p[k];
            cur[k] = 3.5 * Math.sin(Math.PI * k / (t.length - 1));
            double a = 0.01;
            dist[k] = 0.002 * (t[k] / a) * Math.exp(1 - t[k] / a);
            dfe[k] = -dist[k];
        }
        TimeResponse step = new TimeResponse(Excitation.POSITION_STEP, 1, 10_000, t, ones(t.length), p, zero, cur, fe);
        TimeResponse disturbance = new TimeResponse(Excitation.TORQUE_DISTURBANCE_STEP, 1, 10_000, t, zero, dist, zero, zero, dfe);
        TimeSpec spec = TimeSpec.builder().maxPeakCurrent(4).maxDisturbanceDeviation(0.001).build();
        SpecReport r = spec.check(step, disturbance);
        assertEquals(3.5, r.rows().get(0).achievedValue(), 1e-12);
        assertTrue(r.rows().get(0).pass(), r.toString());
        assertEquals(0.002, r.rows().get(1).achievedValue(), 1e-12);
        assertFalse(r.rows().get(1).pass(), r.toString());
        // a requirement with nothing to judge it on fails and says what is missing
        SpecReport missing = spec.check(step);
        assertFalse(missing.rows().get(1).pass());
        assertTrue(missing.rows().get(1).achieved().contains("no disturbance response"), missing.toString());
        assertThrows(IllegalArgumentException.class, () -> TimeSpec.builder().maxOvershootPct(-1));
        assertThrows(IllegalArgumentException.class, () -> TimeSpec.builder().build());
    }

    static double[] ones(int n) {
        double[] u = new double[n];
        java.util.Arrays.fill(u, 1);
        return u;
    }
}
