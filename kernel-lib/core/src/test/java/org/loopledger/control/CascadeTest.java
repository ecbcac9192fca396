package org.loopledger.control;

import com.google.gson.JsonObject;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;
import org.loopledger.testing.PythonOracle;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/** The PIV cascade: controller, plant and loop gains at every break point. References named at each check. */
class CascadeTest {
    /** Invented two-mass axis (demo-style numbers): J = 2e-4 kg·m², Kt = 0.5 N·m/A, resonance near 400 Hz, antiresonance near 280 Hz. */
    static TransferFunction twoMassPlant() {
        double kt = 0.5, jTot = 2e-4;
        double wa = 2 * Math.PI * 280, za = 0.03, wr = 2 * Math.PI * 400, zr = 0.04;
        // P_v(s) = Kt/(J s) · (s²/wa² + 2 za s/wa + 1)/(s²/wr² + 2 zr s/wr + 1)
        TransferFunction rigid = TransferFunction.continuous(new double[] {kt / jTot}, new double[] {1, 0});
        TransferFunction mode = TransferFunction.continuous(new double[] {1 / (wa * wa), 2 * za / wa, 1}, new double[] {1 / (wr * wr), 2 * zr / wr, 1});
        return rigid.times(mode);
    }

    static final TransferFunction INTEGRATOR = TransferFunction.continuous(new double[] {1}, new double[] {1, 0});

    private static void assertFrfEquals(Frf expected, Frf actual, double relTol, String what) {
        assertTrue(expected.sameGridAs(actual), what + ": grids differ");
        double worst = 0;
        for (int i = 0; i < expected.size(); i++) {
            double d = Math.hypot(expected.realAt(i) - actual.realAt(i), expected.imagAt(i) - actual.imagAt(i));
            double m = Math.hypot(expected.realAt(i), expected.imagAt(i));
            if (d > 0) worst = Math.max(worst, d / m);
        }
        assertTrue(worst <= relTol, what + ": worst relative difference " + worst + " > " + relTol);
    }

    @Test void equivalentSingleLoopEqualsCascadeAtPlantInput() {
        // Common practice / algebra: C_v(1 + Kp/s)P_v = C_eq·P_v/s with C_eq = Kv(s + ωi)(s + Kp)/s (see Piv Javadoc).
        Random r = new Random(4242L);
        double[] w = FrequencyGrid.logSpacedRadPerS(0.5, 5000, 400);
        TransferFunction p = twoMassPlant();
        for (int n = 0; n < 30; n++) {
            Piv piv = Piv.of(20 + 300 * r.nextDouble(), 0.01 + 0.2 * r.nextDouble(), 1 + 60 * r.nextDouble());
            FilterChain f = FilterChain.of(Notch.ofHz(350 + 100 * r.nextDouble(), 10 + 20 * r.nextDouble(), 60 + 60 * r.nextDouble()),
                    LowPass2.ofHz(1000 + 1000 * r.nextDouble(), 0.5 + 0.3 * r.nextDouble()));
            Cascade loops = Cascade.of(p, piv, f, DriveTiming.continuous(), w);
            Frf single = Frf.ofModel(piv.equivalentSingleLoop().times(f.continuous()).times(p).times(INTEGRATOR), w);
            // 1e-10: the two sides multiply the same factors in a different order (expanded 9th-order product on one side);
            // rounding in the expanded polynomials is about 1e-13 here.
            assertFrfEquals(single, loops.plantInputLoop(), 1e-10, "single loop vs cascade, case " + n);
            // and as exact transfer functions
            Cascade.Models tf = loops.models().orElseThrow();
            assertFrfEquals(single, Frf.ofModel(tf.plantInputLoop(), w), 1e-10, "transfer-function form, case " + n);
        }
    }

    @Test void returnDifferenceFactorsIntoTheTwoLoops() {
        // Algebra: 1 + L_u = 1 + L_v + (Kp/s)L_v = (1 + L_v)(1 + Kp T_v/s) = (1 + L_v)(1 + L_p). Checked with delay, hold and lag.
        double[] w = FrequencyGrid.logSpacedRadPerS(1, 7999, 500);
        DriveTiming t = DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1.5).withCurrentLoopBandwidthHz(2500);
        Cascade c = Cascade.of(twoMassPlant(), Piv.of(150, 0.08, 25), FilterChain.of(Notch.ofHz(400, 20, 100)), t, w);
        for (int i = 0; i < w.length; i++) {
            Complex lu = c.plantInputLoop().valueAt(i), lv = c.velocityLoop().valueAt(i), lp = c.positionLoop().valueAt(i);
            Complex lhs = lu.add(1), rhs = lv.add(1).multiply(lp.add(1));
            assertEquals(0, lhs.subtract(rhs).abs() / lhs.abs(), 1e-12, "at " + w[i] + " rad/s");
            // T_p = L_p/(1 + L_p) and T_v likewise (definitions)
            assertEquals(0, c.positionClosedLoop().valueAt(i).subtract(lp.divide(lp.add(1))).abs(), 1e-12 * Math.max(1, c.positionClosedLoop().valueAt(i).abs()));
            assertEquals(0, c.velocityClosedLoop().valueAt(i).subtract(lv.divide(lv.add(1))).abs(), 1e-12 * Math.max(1, c.velocityClosedLoop().valueAt(i).abs()));
        }
    }

    @Test void loopGainsAgreeWithAnIndependentNumpyEvaluation() {
        PythonOracle.require("scipy", "numpy");
        // Python evaluates the definitions with its own filters (scipy iirnotch and butter designs, which equal
        // Notch.ofDigitalQ and LowPass2 at ζ = 1/√2, see FilterReferenceTest), scipy.signal.freqz/freqs, numpy's sinc.
        double fs = 16000, delay = 0.7, fcl = 3000, kp = 120, kv = 0.06, fi = 20;
        double[] w = FrequencyGrid.logSpacedRadPerS(0.5, 0.999 * fs / 2, 600); // the low-pass's zero sits at Nyquist exactly
        TransferFunction p = twoMassPlant();
        FilterChain f = FilterChain.of(Notch.ofDigitalQ(400, 4, fs), LowPass2.ofHz(1500, 1 / Math.sqrt(2)));
        DriveTiming t = DriveTiming.sampledAtHz(fs).withComputationDelaySamples(delay).withCurrentLoopBandwidthHz(fcl);
        Cascade c = Cascade.of(p, Piv.of(kp, kv, fi), f, t, w);
        Map<String, Object> in = new LinkedHashMap<>();
        in.put("w", w);
        in.put("fs", fs);
        in.put("delay", delay);
        in.put("fcl", fcl);
        in.put("kp", kp);
        in.put("kv", kv);
        in.put("fi", fi);
        in.put("pnum", p.numerator().coefficientsDescending());
        in.put("pden", p.denominator().coefficientsDescending());
        String script = """
                import json, sys, math
                import numpy as np
                from scipy import signal
                d = json.load(sys.stdin)
                w = np.array(d['w']); fs = d['fs']; T = 1 / fs
                _, P = signal.freqs(d['pnum'], d['pden'], worN=w)
                bn, an = signal.iirnotch(400, 4, fs=fs)
                bl, al = signal.butter(2, 1500, fs=fs)
                _, Fn = signal.freqz(bn, an, worN=w / (2 * math.pi), fs=fs)
                _, Fl = signal.freqz(bl, al, worN=w / (2 * math.pi), fs=fs)
                z = np.exp(1j * w * T)
                wi = 2 * math.pi * d['fi']
                Cv = d['kv'] * ((1 + wi * T) * z - 1) / (z - 1)
                wcl = 2 * math.pi * d['fcl']
                D = np.exp(-1j * w * d['delay'] * T) * np.exp(-1j * w * T / 2) * np.sinc(w * T / (2 * math.pi)) * wcl / (1j * w + wcl)
                Lv = Cv * Fn * Fl * D * P
                Tv = Lv / (1 + Lv)
                Lp = d['kp'] * Tv / (1j * w)
                Lu = Lv * (1 + d['kp'] / (1j * w))
                Tp = Lp / (1 + Lp)
                out = {}
                for k, v in (('Lv', Lv), ('Lu', Lu), ('Lp', Lp), ('Tp', Tp), ('Tv', Tv)):
                    out[k] = {'re': v.real.tolist(), 'im': v.imag.tolist()}
                print(json.dumps(out))
                """;
        JsonObject ref = PythonOracle.run(script, in).getAsJsonObject();
        Map<String, Frf> ours = Map.of("Lv", c.velocityLoop(), "Lu", c.plantInputLoop(), "Lp", c.positionLoop(), "Tp", c.positionClosedLoop(),
                "Tv", c.velocityClosedLoop());
        for (var e : ours.entrySet()) {
            JsonObject o = ref.getAsJsonObject(e.getKey());
            Frf expected = Frf.ofParts(w, PythonOracle.doubles(o.get("re")), PythonOracle.doubles(o.get("im")));
            // 1e-9: both sides evaluate the same closed forms in double precision; the notch's deep minimum and
            // the 1/(1 + L) near crossover amplify rounding by at most ~1e4 over 1e-16.
            assertFrfEquals(expected, e.getValue(), 1e-9, e.getKey());
        }
    }

    @Test void modelAndMeasuredPathsGiveTheSameLoopsAsTheExactTransferFunctions() {
        // Definitions (class Javadoc): the Frf loops computed point by point must equal the exact continuous transfer
        // functions of the same cascade evaluated on the grid, whether the plant came in as a model or as data.
        double[] w = FrequencyGrid.logSpacedRadPerS(1, 5000, 500);
        TransferFunction p = twoMassPlant();
        Piv piv = Piv.of(150, 0.08, 25);
        FilterChain f = FilterChain.of(Notch.ofHz(400, 20, 100), LowPass2.ofHz(1500, 0.6));
        DriveTiming t = DriveTiming.continuous().withCurrentLoopBandwidthHz(2500);
        Cascade model = Cascade.of(p, piv, f, t, w);
        Frf data = Frf.ofModel(p, w);
        Cascade measured = Cascade.of(Frf.ofParts(w, data.real(), data.imag()), piv, f, t);
        Cascade.Models exact = model.models().orElseThrow();
        Map<String, TransferFunction> tf = Map.of("Lv", exact.velocityLoop(), "Tv", exact.velocityClosedLoop(), "Lp", exact.positionLoop(),
                "Tp", exact.positionClosedLoop(), "Lu", exact.plantInputLoop());
        Map<String, Frf> fromModel = Map.of("Lv", model.velocityLoop(), "Tv", model.velocityClosedLoop(), "Lp", model.positionLoop(),
                "Tp", model.positionClosedLoop(), "Lu", model.plantInputLoop());
        Map<String, Frf> fromData = Map.of("Lv", measured.velocityLoop(), "Tv", measured.velocityClosedLoop(), "Lp", measured.positionLoop(),
                "Tp", measured.positionClosedLoop(), "Lu", measured.plantInputLoop());
        for (String k : tf.keySet()) {
            // 1e-12: the transfer functions are expanded products of order up to 10 (a notch, a low-pass, the lag, the
            // two-mass plant and the PI); their evaluation rounds to about 1e-15 relative, amplified near the notch's
            // and the antiresonance's minima (measured worst 1.7e-14).
            assertFrfEquals(Frf.ofModel(tf.get(k), w), fromModel.get(k), 1e-12, k + ", model plant vs exact transfer function");
            assertFrfEquals(fromModel.get(k), fromData.get(k), 0, k + ", model plant vs the same values as data");
            assertTrue(fromModel.get(k).isComputedFromModel() && !fromData.get(k).isComputedFromModel(), k + ": origin carried");
        }
    }

    @Test void plantTimesControllerIsThePlantInputLoopAndTheGangOfFourUsesThem() {
        // Definitions: P = P_v/(jω), C = C_v·F·D·(jω + Kp), P·C = L_u; Gang of Four (Åström and Murray, Feedback Systems,
        // 2nd ed., §12.1): S + T = 1, T = L_u/(1 + L_u), PS = P·S, CS = C·S.
        double[] w = FrequencyGrid.logSpacedRadPerS(1, 7999, 500);
        DriveTiming t = DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1.5).withCurrentLoopBandwidthHz(2500);
        Cascade c = Cascade.of(twoMassPlant(), Piv.of(150, 0.08, 25), FilterChain.of(Notch.ofHz(400, 20, 100)), t, w);
        Frf pc = c.plantToPosition().times(c.controller());
        // 1e-13: the two sides multiply the same factors in another order (a few roundings of 1e-16 each; measured 6e-16)
        assertFrfEquals(c.plantInputLoop(), pc, 1e-13, "P·C vs L_u");
        assertFrfEquals(Frf.ofModel(twoMassPlant().times(INTEGRATOR), w), c.plantToPosition(), 1e-14, "P = P_v/s");
        var gof = c.gangOfFour();
        for (int i = 0; i < w.length; i++) {
            Complex lu = c.plantInputLoop().valueAt(i), s = gof.sensitivity().valueAt(i);
            assertEquals(0, s.add(gof.complementarySensitivity().valueAt(i)).subtract(1).abs(), 1e-12, "S + T = 1 at " + w[i]);
            assertEquals(0, s.subtract(lu.add(1).reciprocal()).abs() / s.abs(), 1e-12, "S = 1/(1 + L_u) at " + w[i]);
            Complex ps = c.plantToPosition().valueAt(i).multiply(s);
            assertEquals(0, gof.loadSensitivity().valueAt(i).subtract(ps).abs() / ps.abs(), 1e-12, "PS at " + w[i]);
        }
    }

    @Test void aPidRunsThroughItsPivFormWithTheSameControllerWhicheverZeroIsKp() {
        // Definition (Pid Javadoc): C(s) = KP + KI/s + KD·s/(τs + 1); the exact PIV form times the low-pass at 1/τ equals it,
        // so the controller on the position error and the plant-input loop are the PID's for either zero assignment, while
        // the velocity loops differ (they depend on which zero is the integral corner).
        double[] w = FrequencyGrid.logSpacedRadPerS(0.5, 5000, 400);
        Pid pid = Pid.withTimeConstant(12, 150, 0.05, 2e-4);
        FilterChain f = FilterChain.of(Notch.ofHz(400, 20, 100));
        Frf expected = Frf.ofModel(pid.continuous().times(f.continuous()), w);
        Cascade lower = Cascade.of(twoMassPlant(), pid.toPiv(ZeroAssignment.INTEGRAL_CORNER_IS_LOWER_ZERO), f, DriveTiming.continuous(), w);
        Cascade upper = Cascade.of(twoMassPlant(), pid.toPiv(ZeroAssignment.POSITION_GAIN_IS_LOWER_ZERO), f, DriveTiming.continuous(), w);
        // 1e-12: the PID's expanded numerator against the PIV's factors (the zeros come from a quadratic solved in
        // double precision; measured 6e-15)
        assertFrfEquals(expected, lower.controller(), 1e-12, "PID controller via the PIV form, lower zero as corner");
        assertFrfEquals(expected, upper.controller(), 1e-12, "PID controller via the PIV form, lower zero as Kp");
        assertFrfEquals(lower.plantInputLoop(), upper.plantInputLoop(), 1e-12, "plant-input loop independent of the assignment");
        assertTrue(lower.velocityLoop().valueAt(0).subtract(upper.velocityLoop().valueAt(0)).abs() > 0.1 * lower.velocityLoop().valueAt(0).abs(),
                "the velocity loops differ");
    }

    @Test void controllerAgreesWithScipy() {
        PythonOracle.require("scipy", "numpy");
        // The PIV as one controller on the position error, with filters and drive effects, evaluated by Python from its
        // own designs: continuous (scipy.signal.freqresp of Kv(s + wi)(s + Kp)/s times the low-pass) and sampled
        // (scipy.signal.freqz of the backward-Euler PI, scipy iirnotch and butter, which equal Notch.ofDigitalQ and
        // LowPass2 at ζ = 1/√2 (FilterReferenceTest), numpy's sinc for the hold, then times (jω + Kp)).
        double fs = 16000, delay = 0.7, fcl = 3000, kp = 120, kv = 0.06, fi = 20, flp = 1500;
        double[] w = FrequencyGrid.logSpacedRadPerS(0.5, 0.999 * fs / 2, 600);
        TransferFunction p = twoMassPlant();
        Cascade continuous = Cascade.of(p, Piv.of(kp, kv, fi), FilterChain.of(LowPass2.ofHz(flp, 1 / Math.sqrt(2))), DriveTiming.continuous(), w);
        Cascade sampled = Cascade.of(p, Piv.of(kp, kv, fi), FilterChain.of(Notch.ofDigitalQ(400, 4, fs), LowPass2.ofHz(flp, 1 / Math.sqrt(2))),
                DriveTiming.sampledAtHz(fs).withComputationDelaySamples(delay).withCurrentLoopBandwidthHz(fcl), w);
        Map<String, Object> in = new LinkedHashMap<>();
        in.put("w", w);
        in.put("fs", fs);
        in.put("delay", delay);
        in.put("fcl", fcl);
        in.put("kp", kp);
        in.put("kv", kv);
        in.put("fi", fi);
        in.put("flp", flp);
        String script = """
                import json, sys, math
                import numpy as np
                from scipy import signal
                d = json.load(sys.stdin)
                w = np.array(d['w']); fs = d['fs']; T = 1 / fs
                kp, kv, wi, wl = d['kp'], d['kv'], 2 * math.pi * d['fi'], 2 * math.pi * d['flp']
                num = np.polymul(kv * np.array([1.0, wi]), [1.0, kp])
                den = np.polymul([1.0, 0.0], [1.0, math.sqrt(2) * wl, wl * wl])
                _, Cc = signal.freqresp(signal.lti(np.polymul(num, [wl * wl]), den), w)
                _, Cv = signal.freqz([kv * (1 + wi * T), -kv], [1.0, -1.0], worN=w / (2 * math.pi), fs=fs)
                bn, an = signal.iirnotch(400, 4, fs=fs)
                bl, al = signal.butter(2, d['flp'], fs=fs)
                _, Fn = signal.freqz(bn, an, worN=w / (2 * math.pi), fs=fs)
                _, Fl = signal.freqz(bl, al, worN=w / (2 * math.pi), fs=fs)
                wcl = 2 * math.pi * d['fcl']
                D = np.exp(-1j * w * d['delay'] * T) * np.exp(-1j * w * T / 2) * np.sinc(w * T / (2 * math.pi)) * wcl / (1j * w + wcl)
                Cs = Cv * Fn * Fl * D * (1j * w + kp)
                print(json.dumps({k: {'re': v.real.tolist(), 'im': v.imag.tolist()} for k, v in (('continuous', Cc), ('sampled', Cs))}))
                """;
        JsonObject ref = PythonOracle.run(script, in).getAsJsonObject();
        for (var e : Map.of("continuous", continuous, "sampled", sampled).entrySet()) {
            JsonObject o = ref.getAsJsonObject(e.getKey());
            Frf expected = Frf.ofParts(w, PythonOracle.doubles(o.get("re")), PythonOracle.doubles(o.get("im")));
            // 1e-11: the same closed forms in double precision; the notch's deep minimum amplifies rounding (SciPy
            // evaluates each filter's polynomials, we the same factors in another order; measured 5e-13 sampled, 6e-16 continuous).
            assertFrfEquals(expected, e.getValue().controller(), 1e-11, "controller, " + e.getKey());
        }
        // and the same controller through Piv's own equivalent single loop (definition in Piv's Javadoc)
        assertFrfEquals(Frf.ofModel(Piv.of(kp, kv, fi).equivalentSingleLoop().times(LowPass2.ofHz(flp, 1 / Math.sqrt(2)).continuous()), w),
                continuous.controller(), 1e-12, "C = C_eq·F");
    }

    @Test void exactSampledLoopDiffersFromTheContinuousHoldModelBySincSquaredOnARigidBody() {
        // Derivation by hand: for P = K/s, ZOH{P}(z) = K·T/(z - 1) = K e^{-jωT/2}/(jω·sinc(ωT/2)) on z = e^{jωT},
        // while the continuous model gives P·e^{-jωT/2}·sinc(ωT/2). Same discrete controller and a whole-sample delay
        // (z^-1 = e^{-jωT} exactly), so L_exact / L_hold-model = 1/sinc²(ωT/2), a real number.
        double fs = 8000, tS = 1 / fs, k = 2500;
        TransferFunction p = TransferFunction.continuous(new double[] {k}, new double[] {1, 0});
        Piv piv = Piv.of(80, 0.2, 15);
        FilterChain f = FilterChain.of(LowPass1.ofHz(900));
        DriveTiming t = DriveTiming.sampledAtHz(fs).withComputationDelaySamples(1);
        double[] w = FrequencyGrid.logSpacedRadPerS(1, 3999, 200);
        Cascade approx = Cascade.of(p, piv, f, t, w);
        Cascade.Models exact = approx.models().orElseThrow();
        for (int i = 0; i < w.length; i++) {
            double x = w[i] * tS / 2, sinc = Math.sin(x) / x;
            Complex ratio = exact.velocityLoop().response(w[i]).divide(approx.velocityLoop().valueAt(i));
            assertEquals(1 / (sinc * sinc), ratio.getReal(), 1e-9, "at " + w[i]);
            assertEquals(0, ratio.getImaginary(), 1e-9, "at " + w[i]);
        }
    }

    @Test void driveTimingFactorClosedForms() {
        double fs = 10000, tS = 1 / fs;
        double wNyq = Math.PI * fs;
        double[] w = {wNyq / 4, wNyq / 2, wNyq};
        // Hold alone: |H| = sinc(ωT/2), phase -ωT/2; at Nyquist sinc(π/2) = 2/π (closed form).
        Frf h = DriveTiming.sampledAtHz(fs).factor(w);
        assertEquals(2 / Math.PI, h.magnitude()[2], 1e-15);
        for (int i = 0; i < w.length; i++) assertEquals(-w[i] * tS / 2, Math.atan2(h.imagAt(i), h.realAt(i)), 1e-14);
        // Delay alone (hold off): unit magnitude, phase -ω·0.5T.
        Frf d = DriveTiming.sampledAtHz(fs).withZeroOrderHold(false).withComputationDelaySamples(0.5).factor(w);
        for (int i = 0; i < w.length; i++) {
            assertEquals(1, d.magnitude()[i], 1e-15);
            assertEquals(-w[i] * 0.5 * tS, Math.atan2(d.imagAt(i), d.realAt(i)), 1e-14);
        }
        // Current loop alone: -3 dB and -45 deg at its bandwidth (first-order lag, definition).
        Frf c = DriveTiming.continuous().withCurrentLoopBandwidthHz(1000).factor(new double[] {2 * Math.PI * 1000});
        assertEquals(1 / Math.sqrt(2), c.magnitude()[0], 1e-15);
        assertEquals(-Math.PI / 4, Math.atan2(c.imagAt(0), c.realAt(0)), 1e-15);
        assertTrue(DriveTiming.continuous().isRational());
        assertFalse(DriveTiming.sampledAtHz(fs).isRational());
        assertTrue(DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1).toString().contains("62.5 µs"));
    }

    @Test void measuredPlantCoherenceIsCarriedAndGridIsKept() {
        double[] w = FrequencyGrid.logSpacedRadPerS(2, 2000, 100);
        double[] coh = new double[w.length];
        java.util.Arrays.fill(coh, 0.9);
        Frf plant = Frf.ofModel(twoMassPlant(), w).withCoherence(coh);
        Cascade c = Cascade.of(plant, Piv.of(100, 0.05, 10), FilterChain.none(), DriveTiming.sampledAtHz(8000));
        assertTrue(c.velocityLoop().hasCoherence() && c.plantInputLoop().hasCoherence());
        assertTrue(c.positionLoop().sameGridAs(plant));
        assertTrue(c.models().isEmpty(), "measured data have no transfer-function form");
        assertSame(c.positionLoop(), c.loops().get(Cascade.POSITION_LOOP));
        assertEquals(List.of("velocity loop", "position loop", "plant-input loop"), List.copyOf(c.loops().keySet()));
        assertFalse(c.controller().hasCoherence(), "the controller is no measurement");
        assertTrue(c.plantToPosition().hasCoherence());
    }

    @Test void badInputGivesClearErrors() {
        double[] w = FrequencyGrid.logSpacedRadPerS(1, 10000, 50);
        TransferFunction p = twoMassPlant();
        Piv piv = Piv.of(100, 0.05, 10);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Cascade.of(p, piv, FilterChain.none(), DriveTiming.sampledAtHz(8000), w));
        assertTrue(e.getMessage().contains("Nyquist") && e.getMessage().contains("10 kHz"), e.getMessage());
        double[] w2 = FrequencyGrid.logSpacedRadPerS(1, 3000, 50);
        IllegalArgumentException g = assertThrows(IllegalArgumentException.class,
                () -> Cascade.of(p, piv, FilterChain.of(Notch.ofHz(5000, 20, 100)), DriveTiming.sampledAtHz(8000), w2));
        assertTrue(g.getMessage().contains("notch centre"), g.getMessage());
        for (double fs : new double[] {0, -1, Double.NaN, Double.POSITIVE_INFINITY, 0.5, 1e9}) {
            assertThrows(IllegalArgumentException.class, () -> DriveTiming.sampledAtHz(fs), "fs = " + fs);
        }
        assertThrows(IllegalArgumentException.class, () -> DriveTiming.sampledAtHz(8000).withComputationDelaySamples(-0.5));
        assertThrows(IllegalArgumentException.class, () -> DriveTiming.sampledAtHz(8000).withComputationDelaySamples(62.5e-6 * 1e6)); // µs given as samples
        assertThrows(IllegalArgumentException.class, () -> DriveTiming.continuous().withComputationDelaySamples(1));
        assertThrows(IllegalArgumentException.class, () -> DriveTiming.continuous().withCurrentLoopBandwidthHz(0));
        assertTrue(Cascade.of(p, piv, FilterChain.none(), DriveTiming.sampledAtHz(8000).withComputationDelaySamples(0.5), w2).models().isEmpty(),
                "half a sample of delay has no plain z^-m model");
        assertThrows(IllegalArgumentException.class, () -> Cascade.of(Discretize.any(), piv, FilterChain.none(), DriveTiming.continuous(), w2));
    }

    /** A sampled plant, to check the "plant must be continuous" error. */
    private static final class Discretize {
        static TransferFunction any() { return TransferFunction.discrete(new double[] {1}, new double[] {1, -0.5}, 1e-3); }
    }
}
