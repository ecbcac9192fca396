package org.loopledger.sim;

import org.junit.jupiter.api.Test;
import org.loopledger.lti.Discretization;
import org.loopledger.lti.StateSpace;
import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link LinearResponse} and {@link StepMetrics} against closed-form responses (hand derivations, textbook formulas).
 * Exact-response tolerance 1e-12 absolute on responses of order 1: the recursion over up to 1000 steps accumulates
 * rounding of about one ulp per step (measured: 1.0e-13 at 282 steps).
 */
class LinearResponseAnalyticTest {
    static final double TAU = 0.1;
    static final TransferFunction LAG = TransferFunction.continuous(new double[] {1}, new double[] {TAU, 1});

    // Hand derivation: the step response of e^{-ds}/(τs + 1) is 1 - e^{-(t-d)/τ} for t ≥ d, 0 before; exact for any d.
    @Test void stepWithWholeAndFractionalDelayIsExact() {
        double[] t = LinearResponse.timesS(1, 1001);   // step 1 ms
        for (double d : new double[] {0.012, 0.0123, 0.0005}) {
            double[] y = LinearResponse.step(LAG.withDelay(d), t).values();
            for (int k = 0; k < t.length; k++) {
                double want = t[k] >= d ? 1 - Math.exp(-(t[k] - d) / TAU) : 0;
                assertEquals(want, y[k], 1e-12, "delay " + d + " s at t = " + t[k]);
            }
        }
    }

    // Hand derivation: a ramp u = t is reproduced exactly by the first-order hold; through e^{-ds}/(τs+1) it gives
    // (t - d) - τ + τ e^{-(t-d)/τ} for t ≥ d.
    @Test void rampWithFractionalDelayIsExactUnderFirstOrderHold() {
        double[] t = LinearResponse.timesS(1, 501);
        double d = 0.0137;
        double[] y = LinearResponse.forced(LAG.withDelay(d), t, t.clone()).values();
        for (int k = 0; k < t.length; k++) {
            double s = t[k] - d;
            double want = s >= 0 ? s - TAU + TAU * Math.exp(-s / TAU) : 0;
            assertEquals(want, y[k], 1e-12, "t = " + t[k]);
        }
    }

    // Hand derivation: the impulse response of e^{-ds}/(τs + 1) is e^{-(t-d)/τ}/τ for t ≥ d.
    @Test void impulseWithFractionalDelayIsExact() {
        double[] t = LinearResponse.timesS(0.5, 501);
        double d = 0.0123;
        double[] y = LinearResponse.impulse(LAG.withDelay(d), t).values();
        for (int k = 0; k < t.length; k++) assertEquals(t[k] >= d ? Math.exp(-(t[k] - d) / TAU) / TAU : 0, y[k], 1e-12, "t = " + t[k]);
    }

    // Definition: a delay of 3 samples on a sampled system shifts its response by 3 samples.
    @Test void sampledDelayShiftsBySamples() {
        double ts = 0.001;
        TransferFunction gd = Discretization.zoh(LAG, ts);
        double[] t = new double[50];
        for (int k = 0; k < t.length; k++) t[k] = k * ts;
        double[] y0 = LinearResponse.step(gd, t).values(), y3 = LinearResponse.step(gd.withDelay(3 * ts), t).values();
        for (int k = 0; k < t.length; k++) assertEquals(k >= 3 ? y0[k - 3] : 0, y3[k], 1e-15);
        assertArrayEquals(LinearResponse.filter(gd.withDelay(3 * ts), LinearResponseAnalyticTest.ones(50)), y3, 1e-15);
        var e = assertThrows(IllegalArgumentException.class, () -> LinearResponse.step(gd.withDelay(2.5 * ts), t));
        assertTrue(e.getMessage().contains("2.5 samples"), e.getMessage());
    }

    // Hand derivation: for 1 - e^{-t/τ} the 10-90 % rise time is τ ln 9 and the 2 % settling time τ ln 50 (here the
    // first sample at or after it); no overshoot; a 5 % band gives τ ln 20.
    @Test void firstOrderStepMetrics() {
        double[] t = LinearResponse.timesS(1, 100_001);
        TimeSeries y = LinearResponse.step(LAG, t);
        StepMetrics m = y.stepMetrics(1.0, StepMetrics.DEFAULT_SETTLING_BAND);
        assertEquals(TAU * Math.log(9), m.riseTimeS().getAsDouble(), 1e-8);
        assertEquals(TAU * Math.log(50), m.settlingTimeS().getAsDouble(), 1e-5);
        assertEquals(0, m.overshootPct(), 0);
        assertEquals(TAU * Math.log(20), y.stepMetrics(1.0, 0.05).settlingTimeS().getAsDouble(), 1e-5);
    }

    // Textbook (common practice; e.g. Franklin, Powell and Emami-Naeini, Feedback Control of Dynamic Systems, §3.4, from
    // memory): for ωn²/(s² + 2ζωn s + ωn²) the overshoot is exp(-πζ/√(1-ζ²)) and the peak time π/(ωn√(1-ζ²)).
    @Test void secondOrderOvershootAndPeakTime() {
        double wn = 10;
        for (double zeta : new double[] {0.2, 0.5, 0.7}) {
            TransferFunction g = TransferFunction.continuous(new double[] {wn * wn}, new double[] {1, 2 * zeta * wn, wn * wn});
            double[] t = LinearResponse.timesS(3, 30_001);
            StepMetrics m = LinearResponse.step(g, t).stepMetrics(1.0, 0.02);
            double os = Math.exp(-Math.PI * zeta / Math.sqrt(1 - zeta * zeta));
            // the sampled maximum lies within max|y''|·dt²/8 ≤ ωn²·dt²/8 = 1.3e-7 of the true peak (dt = 0.1 ms), and its time
            // within half a sample of the true peak time: tolerances 1e-4 % (overshoot), 1e-6 (peak value), 1e-4 s (time)
            assertEquals(os * 100, m.overshootPct(), 1e-4, "zeta " + zeta);
            assertEquals(1 + os, m.peakValue(), 1e-6, "zeta " + zeta);
            assertEquals(Math.PI / (wn * Math.sqrt(1 - zeta * zeta)), m.peakTimeS(), 1e-4, "zeta " + zeta);
        }
    }

    // Hand derivation: x' = -x/τ from x0 gives y = x0 e^{-t/τ}.
    @Test void initialConditionOfAFirstOrderStateSpace() {
        StateSpace ss = StateSpace.of(new double[][] {{-1 / TAU}}, new double[] {1}, new double[] {1}, 0, TimeBase.continuous());
        double[] t = LinearResponse.timesS(0.5, 101);
        double[] y = LinearResponse.initial(ss, new double[] {2}, t).values();
        for (int k = 0; k < t.length; k++) assertEquals(2 * Math.exp(-t[k] / TAU), y[k], 1e-12);
    }

    @Test void badInputIsNamed() {
        double[] t = LinearResponse.timesS(1, 11);
        assertTrue(assertThrows(IllegalArgumentException.class, () -> LinearResponse.forced(LAG, t, new double[3])).getMessage().contains("one input value per instant"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> LinearResponse.step(LAG, new double[] {0, 0.1, 0.3})).getMessage().contains("evenly spaced"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> LinearResponse.filter(LAG, new double[3])).getMessage().contains("sampled"));
        TransferFunction gd = Discretization.zoh(LAG, 0.01);
        assertTrue(assertThrows(IllegalArgumentException.class, () -> LinearResponse.step(gd, t)).getMessage().contains("sample time"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> LinearResponse.step(LAG, t).stepMetrics(0, 0.02)).getMessage().contains("no step"));
        double[] tc = t.clone();
        TimeSeries s = LinearResponse.step(LAG, tc);
        tc[3] = 99;
        assertEquals(0.3, s.timeS()[3], 1e-15, "arrays are copied in");
    }

    static double[] ones(int n) {
        double[] u = new double[n];
        java.util.Arrays.fill(u, 1);
        return u;
    }
}
