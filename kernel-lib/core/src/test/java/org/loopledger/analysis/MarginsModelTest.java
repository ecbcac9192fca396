package org.loopledger.analysis;

import com.google.gson.JsonObject;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.loopledger.lti.TransferFunction;
import org.loopledger.testing.PythonOracle;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** Margins of model loop gains against hand derivations, textbook examples and numpy. */
class MarginsModelTest {

    /** K/(s(s+1)(s+2)) = K/(s³ + 3s² + 2s). */
    static TransferFunction third(double k) { return TransferFunction.continuous(new double[] {k}, new double[] {1, 3, 2, 0}); }

    /** Conditionally stable: K(s+10)²/(s³(s/200+1)²). */
    static TransferFunction conditional(double k) {
        return TransferFunction.continuous(new double[] {k, 20 * k, 100 * k}, new double[] {1.0 / 40000, 1.0 / 100, 1, 0, 0, 0});
    }

    static JsonObject py;

    @BeforeAll
    static void oracle() {
        PythonOracle.require("numpy");
        // numpy: (1) positive real root of x(x+1)(x+4) = K² (gain crossover of K/(s(s+1)(s+2)), x = ω²);
        // (2) closed-loop poles of the conditionally stable loop at given gains; (3) a brute-force
        // min |1 + L| for 3/(s+1)³ on 2e6 log-spaced points.
        String script = String.join("\n",
                "import json, sys, numpy as np",
                "req = json.load(sys.stdin)",
                "out = {}",
                "out['gc'] = {}",
                "for k in req['k']:",
                "    r = np.roots([1, 5, 4, -k*k])",
                "    x = [z.real for z in r if abs(z.imag) < 1e-12 and z.real > 0][0]",
                "    out['gc'][str(k)] = float(np.sqrt(x))",
                "out['cond'] = []",
                "for g in req['condGains']:",
                "    num = np.array([g, 20*g, 100*g]); den = np.array([1/40000, 1/100, 1, 0, 0, 0])",
                "    cl = np.polyadd(den, num)",
                "    out['cond'].append(float(max(np.roots(cl).real)))",
                "w = np.logspace(-3, 2, 2000001); s = 1j*w; L = 3/(s+1)**3",
                "out['sm'] = float(np.min(np.abs(1+L)))",
                "print(json.dumps(out))");
        JsonObject req = new JsonObject();
        var ks = new com.google.gson.JsonArray();
        for (double k : new double[] {1, 2}) ks.add(k);
        req.add("k", ks);
        var cg = new com.google.gson.JsonArray();
        // the gains at which stability must change, each probed 0.1 % inside and outside (set in the test)
        Margins m = Margins.of(conditional(20));
        double lower = m.lowerGainMargin().orElseThrow().gainMarginRatio(), upper = m.upperGainMargin().orElseThrow().gainMarginRatio();
        for (double f : new double[] {lower * 0.999, lower * 1.001, upper * 0.999, upper * 1.001}) cg.add(20 * f);
        req.add("condGains", cg);
        py = PythonOracle.run(script, req).getAsJsonObject();
    }

    // ---------------------------------------------------------------- analytic: K/(s(s+1)(s+2))

    /**
     * Derivation by hand: D(jω) = -3ω² + j(2ω - ω³), so Im D = 0 at ω = √2 where D = -6 and L = -K/6:
     * the phase crossover is at √2 rad/s and GM = 6/K. Routh on s³ + 3s² + 2s + K: stable iff K &lt; 3·2 = 6,
     * the same figure. Tolerance 1e-10: the exact path (roots of a cubic in ω², Newton-polished) is good
     * to round-off.
     */
    @ParameterizedTest
    @ValueSource(doubles = {0.5, 1, 2, 4, 5.9})
    void thirdOrderPhaseCrossoverAndGainMargin(double k) {
        Margins m = Margins.of(third(k));
        assertEquals(1, m.phaseCrossovers().size(), m.toString());
        PhaseCrossover pc = m.phaseCrossovers().get(0);
        assertEquals(Math.sqrt(2), pc.omegaRadPerS(), 1e-10 * Math.sqrt(2));
        assertEquals(6 / k, pc.gainMarginRatio(), 1e-10 * 6 / k);
        assertEquals(20 * Math.log10(6 / k), m.gainMarginDb().getAsDouble(), 1e-9);
        assertEquals(-180, pc.phaseDeg(), 0);
        // definition check (as ControlSystems.jl's tests): at the GM frequency Im L = 0 and 1/(-Re L) = GM
        Complex l = third(k).response(pc.omegaRadPerS());
        assertEquals(0, l.getImaginary(), 1e-12 * l.abs());
        assertEquals(pc.gainMarginRatio(), 1 / -l.getReal(), 1e-10 * pc.gainMarginRatio());
        assertTrue(m.lowerGainMargin().isEmpty(), "no gain decrease destabilises this loop (Routh: stable for all 0 < K < 6)");
        assertEquals(1, m.netIntegrators());
        assertEquals(0, m.openLoopUnstablePoles().getAsInt());
    }

    /**
     * Phase margin from the exact gain crossover: |D(jω)|² = ω²(ω²+1)(ω²+4) (derivation by hand), so
     * |L| = 1 at x = ω² solving x³ + 5x² + 4x - K² = 0 (solved here by numpy.roots), and
     * PM = 180° - 90° - atan ω - atan(ω/2). Tolerances: 1e-10 relative on ω (both exact), 1e-8 deg.
     */
    @ParameterizedTest
    @ValueSource(doubles = {1, 2})
    void thirdOrderPhaseMarginFromExactCrossover(double k) {
        double wgc = py.getAsJsonObject("gc").get(String.valueOf(k)).getAsDouble();
        double pm = 90 - Math.toDegrees(Math.atan(wgc)) - Math.toDegrees(Math.atan(wgc / 2));
        Margins m = Margins.of(third(k));
        assertEquals(1, m.gainCrossovers().size());
        GainCrossover gc = m.gainCrossovers().get(0);
        assertEquals(wgc, gc.omegaRadPerS(), 1e-10 * wgc);
        assertEquals(pm, gc.phaseMarginDeg(), 1e-8);
        assertEquals(Math.toRadians(pm) / wgc, gc.delayMarginS(), 1e-9);
        // definition: |L(jω_gc)| = 1
        assertEquals(1, third(k).response(gc.omegaRadPerS()).abs(), 1e-12);
        // by hand for K = 1: x ≈ 0.19869, ω ≈ 0.4457 rad/s, PM ≈ 53.4 deg (a sanity anchor on the numpy figure)
        if (k == 1) assertEquals(53.41, gc.phaseMarginDeg(), 0.01);
    }

    /**
     * Ms = 1/min|1+L| (definition), against a brute-force scan of 1e6 log-spaced points (independent of the
     * analysis grid). The refined peak can only be higher than any sampled value, and the scan's spacing
     * (1.2e-5 in ln ω) bounds the miss at ~1e-9 relative; tolerance 1e-7.
     */
    @ParameterizedTest
    @ValueSource(doubles = {1, 2, 4})
    void sensitivityPeakIsInverseOfDistanceToMinusOne(double k) {
        TransferFunction l = third(k);
        int n = 1_000_001;
        double[] w = new double[n], re = new double[n], im = new double[n];
        for (int i = 0; i < n; i++) w[i] = Math.pow(10, -2 + 4.0 * i / (n - 1));
        l.response(w, re, im);
        double minD = Double.POSITIVE_INFINITY, maxT = 0;
        for (int i = 0; i < n; i++) {
            double d = Math.hypot(1 + re[i], im[i]);
            minD = Math.min(minD, d);
            maxT = Math.max(maxT, Math.hypot(re[i], im[i]) / d);
        }
        Margins m = Margins.of(l);
        assertEquals(1 / minD, m.sensitivityPeak().magnitude(), 1e-7 * m.sensitivityPeak().magnitude());
        assertTrue(m.sensitivityPeak().magnitude() >= 1 / minD * (1 - 1e-12));
        assertEquals(minD, m.modulusMargin(), 1e-7);
        assertEquals(maxT, m.complementaryPeak().magnitude(), 1e-7 * maxT);
        // the peak frequency really gives |1 + L| = 1/Ms
        assertEquals(1 / m.sensitivityPeak().magnitude(), l.response(m.sensitivityPeak().omegaRadPerS()).add(1).abs(), 1e-12);
    }

    /**
     * Bandwidth: with an integrator |T(0)| = 1, so the bandwidth is where |T| = 1/√2 (definition). Checked by
     * evaluating T at the reported frequency, and that |T| stays above 1/√2 below it (scan).
     */
    @Test
    void bandwidthIsFirstMinus3dbOfT() {
        TransferFunction l = third(1);
        Margins m = Margins.of(l);
        double wb = m.bandwidth().omegaRadPerS().getAsDouble();
        Complex lv = l.response(wb);
        assertEquals(1 / Math.sqrt(2), lv.divide(lv.add(1)).abs(), 1e-12);
        for (double w = 1e-3; w < wb * 0.999; w *= 1.001) {
            Complex v = l.response(w);
            assertTrue(v.divide(v.add(1)).abs() > 1 / Math.sqrt(2), "|T| dips below -3 dB at " + w);
        }
        // a loop without integrator: T(0) = L(0)/(1+L(0)) is the reference; 4/(s+1) has T = 4/(s+5),
        // |T(jω)| = |T(0)|/√2 at ω = 5 rad/s exactly (derivation by hand)
        Margins m2 = Margins.of(TransferFunction.continuous(new double[] {4}, new double[] {1, 1}));
        assertEquals(0.8, m2.bandwidth().referenceMagnitude(), 1e-15);
        assertEquals(5, m2.bandwidth().omegaRadPerS().getAsDouble(), 1e-10);
    }

    // ---------------------------------------------------------------- textbook worked examples

    /**
     * Åström and Murray, Feedback Systems, 1st ed. (2008), Example 9.9 "Stability margins for a third-order
     * system" (from memory): L(s) = 3/(s+1)³ has gm = 2.67 and φm = 41.7°. By hand: -3·atan ω = -180° at
     * ω = √3 where |L| = 3/8, so gm = 8/3; |L| = 1 at 1 + ω² = 3^(2/3). The stability margin s_m = 1/Ms is
     * checked against numpy's brute-force min|1+L| (2e6 points; tolerance 1e-6 covers the scan's spacing).
     */
    @Test
    void astromMurrayThirdOrderExample() {
        Margins m = Margins.of(TransferFunction.continuous(new double[] {3}, new double[] {1, 3, 3, 1}));
        PhaseCrossover pc = m.upperGainMargin().orElseThrow();
        assertEquals(2.67, pc.gainMarginRatio(), 0.005);            // book, 3 significant figures
        assertEquals(8.0 / 3, pc.gainMarginRatio(), 1e-10);         // by hand
        assertEquals(Math.sqrt(3), pc.omegaRadPerS(), 1e-10);       // by hand
        GainCrossover gc = m.phaseMarginCrossover().orElseThrow();
        assertEquals(41.7, gc.phaseMarginDeg(), 0.05);             // book, 0.1 deg
        double wgc = Math.sqrt(Math.cbrt(9) - 1);                   // 1 + ω² = 3^(2/3)
        assertEquals(wgc, gc.omegaRadPerS(), 1e-10);
        assertEquals(180 - 3 * Math.toDegrees(Math.atan(wgc)), gc.phaseMarginDeg(), 1e-8);
        assertEquals(py.get("sm").getAsDouble(), m.modulusMargin(), 1e-6);
    }

    /**
     * Skogestad and Postlethwaite, Multivariable Feedback Control, 2nd ed. (2005), Example 2.4 (from memory):
     * G(s) = 3(-2s+1)/((5s+1)(10s+1)) with the Ziegler-Nichols PI controller Kc = 1.136, τI = 12.7 gives
     * GM = 1.63, PM = 19.4°, Ms = 3.92, Mt = 3.35, ωc = 0.236 rad/s. The book's figures are rounded and come
     * from rounded controller settings: tolerance 0.01 on GM, Ms, Mt, 0.1 deg on PM, 0.001 rad/s on ωc.
     * A non-minimum-phase zero: the phase anchor must still start at -90° (integrator) and fall from there.
     */
    @Test
    void skogestadPostlethwaitePiExample() {
        TransferFunction g = TransferFunction.continuous(new double[] {-6, 3}, new double[] {50, 15, 1});
        TransferFunction c = TransferFunction.continuous(new double[] {1.136 * 12.7, 1.136}, new double[] {12.7, 0});
        Margins m = Margins.of(g.times(c));
        assertEquals(1.63, m.upperGainMargin().orElseThrow().gainMarginRatio(), 0.01);
        assertEquals(19.4, m.phaseMarginDeg().getAsDouble(), 0.1);
        assertEquals(3.92, m.sensitivityPeak().magnitude(), 0.01);
        assertEquals(3.35, m.complementaryPeak().magnitude(), 0.01);
        assertEquals(0.236, m.phaseMarginCrossover().orElseThrow().omegaRadPerS(), 0.001);
    }

    // ---------------------------------------------------------------- conditionally stable loops

    /**
     * The conditionally stable loop of Franklin, Powell and Emami-Naeini, Feedback Control of Dynamic
     * Systems, 7th ed., §6.4 (KG(s) = K(s+10)²/s³, from memory). Derivation by hand: L(jω) =
     * K(-20ω + j(100 - ω²))/ω³, so Im L = 0 at ω = 10 rad/s with L = -0.2K: the lower gain margin is 5/K.
     * Routh on s³ + Ks² + 20Ks + 100K: stable iff 20K² &gt; 100K, i.e. K &gt; 5, the same figure.
     */
    @Test
    void franklinConditionallyStableLowerMargin() {
        for (double k : new double[] {7, 20}) {
            Margins m = Margins.of(TransferFunction.continuous(new double[] {k, 20 * k, 100 * k}, new double[] {1, 0, 0, 0}));
            PhaseCrossover lower = m.lowerGainMargin().orElseThrow();
            assertEquals(10, lower.omegaRadPerS(), 1e-10);
            assertEquals(5 / k, lower.gainMarginRatio(), 1e-10);
            assertTrue(lower.gainMarginDb() < 0);
            assertTrue(m.upperGainMargin().isEmpty(), "no phase crossover with |L| < 1: gain can rise without limit");
            assertEquals(3, m.netIntegrators());
            // -90 deg per integrator: the phase starts at -270 deg and rises through -180 deg at 10 rad/s
            assertEquals(-180, lower.phaseDeg(), 0);
        }
    }

    /**
     * Both margins: K(s+10)²/(s³(s/200+1)²). By hand, ∠L = -270° + 2atan(ω/10) - 2atan(ω/200) = -180° where
     * (ω/10 - ω/200)/(1 + ω²/2000) = 1, i.e. ω² - 190ω + 2000 = 0, ω = 95 ∓ √7025. Closed-loop poles from
     * numpy.roots at 0.1 % inside and outside each margin: stable inside, unstable outside, which is what
     * "the smallest increase and the smallest decrease that destabilise" means.
     */
    @Test
    void conditionallyStableUpperAndLowerMargins() {
        Margins m = Margins.of(conditional(20));
        assertEquals(2, m.phaseCrossovers().size(), m.toString());
        assertEquals(95 - Math.sqrt(7025), m.lowerGainMargin().orElseThrow().omegaRadPerS(), 1e-9);
        assertEquals(95 + Math.sqrt(7025), m.upperGainMargin().orElseThrow().omegaRadPerS(), 1e-9);
        assertTrue(m.upperGainMargin().get().gainMarginRatio() > 1);
        assertTrue(m.lowerGainMargin().get().gainMarginRatio() < 1);
        var cond = py.getAsJsonArray("cond");
        assertTrue(cond.get(0).getAsDouble() > 0, "0.1 % below the lower margin the loop is unstable (numpy.roots)");
        assertTrue(cond.get(1).getAsDouble() < 0, "0.1 % above the lower margin it is stable");
        assertTrue(cond.get(2).getAsDouble() < 0, "0.1 % below the upper margin it is stable");
        assertTrue(cond.get(3).getAsDouble() > 0, "0.1 % above the upper margin it is unstable");
        assertEquals(1, m.toString().lines().count(), "one line; the report is display.MarginsReportText: " + m);
    }

    // ---------------------------------------------------------------- delay

    /**
     * L = K e^(-sτ)/s (derivation by hand): |L| = K/ω, so ω_gc = K; ∠L = -90° - ωτ, so PM = 90° - Kτ (deg)
     * and the delay margin is (π/2 - Kτ)/K; phase crossovers at ωτ = π/2 + 2πk with GM = ω/K. Every one
     * of them inside the analysed band must be listed.
     */
    @Test
    void integratorWithDelayAllCrossovers() {
        double k = 2, tau = 0.1;
        TransferFunction l = TransferFunction.continuous(new double[] {k}, new double[] {1, 0}).withDelay(tau);
        Margins m = Margins.of(l);
        GainCrossover gc = m.phaseMarginCrossover().orElseThrow();
        assertEquals(k, gc.omegaRadPerS(), 1e-12);
        assertEquals(90 - Math.toDegrees(k * tau), gc.phaseMarginDeg(), 1e-9);
        assertEquals((Math.PI / 2 - k * tau) / k, m.delayMarginS().getAsDouble(), 1e-12);
        List<PhaseCrossover> pcs = m.phaseCrossovers();
        assertTrue(pcs.size() >= 3, m.toString());
        for (int i = 0; i < pcs.size(); i++) {
            double w = (Math.PI / 2 + 2 * Math.PI * i) / tau;
            assertEquals(w, pcs.get(i).omegaRadPerS(), 1e-9 * w);
            assertEquals(w / k, pcs.get(i).gainMarginRatio(), 1e-9 * w / k);
            assertEquals(-180 - 360 * i, pcs.get(i).phaseDeg(), 0);
        }
        assertTrue(pcs.get(pcs.size() - 1).omegaRadPerS() <= m.highRadPerS());
    }

    /**
     * Delay margin = PM/ω_gc (definition): adding a delay τ leaves |L| and so ω_gc unchanged and lowers the
     * phase by ω_gc·τ (by hand); the margins of L·e^(-sτ) must show PM - ω_gc·τ, and for τ equal to the
     * delay margin a phase margin of 0 within round-off.
     */
    @Test
    void delayMarginIsPhaseMarginOverCrossover() {
        Margins m0 = Margins.of(third(1));
        GainCrossover gc0 = m0.phaseMarginCrossover().orElseThrow();
        double dm = m0.delayMarginS().getAsDouble();
        assertEquals(Math.toRadians(gc0.phaseMarginDeg()) / gc0.omegaRadPerS(), dm, 1e-15);
        for (double frac : new double[] {0.25, 0.5, 1.0}) {
            Margins m = Margins.of(third(1).withDelay(frac * dm));
            GainCrossover gc = m.phaseMarginCrossover().orElseThrow();
            assertEquals(gc0.omegaRadPerS(), gc.omegaRadPerS(), 1e-12);
            assertEquals(gc0.phaseMarginDeg() * (1 - frac), gc.phaseMarginDeg(), 1e-8);
            assertEquals(dm * (1 - frac), m.delayMarginS().getAsDouble(), 1e-8);
        }
    }

    /**
     * A lightly damped resonance, L = K/(s(s²/ω0² + 2ζs/ω0 + 1)) with ζ = 0.001, ω0 = 100 rad/s, K = 0.1.
     * By hand: at ω0 the bracket term vanishes, L = K/(jω0·2jζ) = -K/(2ζω0), so the phase crossover is at
     * ω0 with GM = 2ζω0/K = 2. The exact path (roots in ω²) and the bracketing path (forced by a 1 ns delay,
     * which moves the crossing by ~1e-10 relative) must both find it: the grid carries a cluster of points at
     * every lightly damped natural frequency. Tolerance 1e-7 relative.
     */
    @Test
    void lightlyDampedResonanceFoundByBothPaths() {
        double z = 0.001, w0 = 100, k = 0.1;
        TransferFunction l = TransferFunction.continuous(new double[] {k}, new double[] {1 / (w0 * w0), 2 * z / w0, 1, 0});
        for (TransferFunction v : new TransferFunction[] {l, l.withDelay(1e-9)}) {
            Margins m = Margins.of(v);
            PhaseCrossover pc = m.upperGainMargin().orElseThrow(() -> new AssertionError(m.toString()));
            assertEquals(w0, pc.omegaRadPerS(), 1e-7 * w0, m.toString());
            assertEquals(2 * z * w0 / k, pc.gainMarginRatio(), 1e-7 * 2);
        }
        assertEquals(Margins.of(l).phaseMarginDeg().getAsDouble(), Margins.of(l.withDelay(1e-9)).phaseMarginDeg().getAsDouble(), 1e-6);
    }

    // ---------------------------------------------------------------- phase branch, unstable open loop

    /**
     * L = 2/(s-1) (derivation by hand): |L| = 1 at ω = √3, ∠L = -180° + atan ω = -120° there, so PM = 60°;
     * L(0) = -2 is a phase crossover at DC: halving the gain (K &lt; 1, Routh on s - 1 + K) destabilises,
     * so the lower gain margin is 0.5 (-6.02 dB). The anchor puts a negative DC gain at -180°, not +180°.
     */
    @Test
    void unstableOpenLoopNegativeDcGainBranch() {
        Margins m = Margins.of(TransferFunction.continuous(new double[] {2}, new double[] {1, -1}));
        assertEquals(1, m.openLoopUnstablePoles().getAsInt());
        assertEquals(Math.sqrt(3), m.phaseMarginCrossover().orElseThrow().omegaRadPerS(), 1e-12);
        assertEquals(60, m.phaseMarginDeg().getAsDouble(), 1e-9);
        PhaseCrossover lower = m.lowerGainMargin().orElseThrow();
        assertEquals(0, lower.omegaRadPerS(), 0);
        assertEquals(0.5, lower.gainMarginRatio(), 1e-15);
        assertTrue(m.warnings().stream().anyMatch(w -> w.kind() == LoopWarning.Kind.OPEN_LOOP_UNSTABLE && w.message().contains("unstable pole")), m.warnings().toString());
    }

    /**
     * K(s+1)/(s(s-1)) (derivation by hand): low-frequency gain -K, one integrator, so the phase starts at
     * -270°; at K = 2, |L| = 2/ω so ω_gc = 2 and ∠L = -90° + atan 2 - (180° - atan 2) = -143.13°, PM = 36.87°.
     * An anchor on the principal branch would give +216.87° and a nonsense PM of 396.87°.
     */
    @Test
    void integratorWithUnstablePoleAnchoredAtMinus270() {
        Margins m = Margins.of(TransferFunction.continuous(new double[] {2, 2}, new double[] {1, -1, 0}));
        assertEquals(2, m.phaseMarginCrossover().orElseThrow().omegaRadPerS(), 1e-12);
        assertEquals(-90 + 2 * Math.toDegrees(Math.atan(2)), m.phaseMarginDeg().getAsDouble(), 1e-9); // PM = ∠L + 180°
    }

    /**
     * Poles within the axis tolerance count as integrators: s(s+1)(s+2) with the s-root perturbed to
     * -1e-15 must analyse exactly like the exact integrator (DESIGN.md, "Traps").
     */
    @Test
    void nearlyZeroPoleCountsAsIntegrator() {
        TransferFunction l = TransferFunction.zpk(List.of(), List.of(new Complex(-1e-15, 0), new Complex(-1, 0), new Complex(-2, 0)), 1,
                org.loopledger.lti.TimeBase.continuous());
        Margins m = Margins.of(l);
        assertEquals(1, m.netIntegrators());
        assertEquals(1, m.openLoopPolesOnAxis());
        assertEquals(0, m.openLoopUnstablePoles().getAsInt());
        assertEquals(6, m.upperGainMargin().orElseThrow().gainMarginRatio(), 1e-9);
        assertEquals(Margins.of(third(1)).phaseMarginDeg().getAsDouble(), m.phaseMarginDeg().getAsDouble(), 1e-9);
    }

    /**
     * Single-frequency phase on the right branch: for 1/(s(s+1)(s+2)) at 10 rad/s the phase is
     * -90° - atan 10 - atan 5 = -252.98° (derivation by hand), not the principal +107.02°; the same on an
     * Frf of the model (interpolated, 1e-3 deg at this grid density). Outside the band: refused.
     */
    @Test
    void singleFrequencyPhaseIsOnTheCanonicalBranch() {
        double expected = -90 - Math.toDegrees(Math.atan(10)) - Math.toDegrees(Math.atan(5));
        assertEquals(expected, Math.toDegrees(LoopResponse.of(third(1)).phaseRadAt(10)), 1e-10);
        var data = LoopResponse.of(org.loopledger.frf.Frf.ofModel(third(1), org.loopledger.frf.FrequencyGrid.logRadPerS(0.01, 100, 2000)));
        assertEquals(expected, Math.toDegrees(data.phaseRadAt(10)), 1e-3);
        assertThrows(IllegalArgumentException.class, () -> data.phaseRadAt(200));
    }

    /** The value's text is one line with units (the full report is display.MarginsReportText, tested there). */
    @Test
    void oneLineWithUnits() {
        String s = Margins.of(conditional(20)).toString();
        assertEquals(1, s.lines().count(), s);
        assertTrue(s.startsWith("Margins (model") && s.contains("Hz") && s.contains("dB") && s.contains("deg"), s);
        assertFalse(s.contains("NaN"), s);
    }
}
