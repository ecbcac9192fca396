package org.loopledger.ident.fit;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.testing.PythonOracle;

import java.util.HashMap;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Model fitting on FRFs of known models: the sampled-data (ZOH) response against
 * scipy.signal.cont2discrete(method='zoh') + freqz (Debian python3-scipy 1.10), parameter recovery from
 * seeded noisy data within the stated confidence, and bad requests as clear errors.
 */
class ModelFitTest {
    static final double KT = 0.45, T = 1 / 16000.0;
    static final TwoMassParameters TRUE = new TwoMassParameters(3e-4, 2e-3, 420, 0.04, 310, 0.03, 62.5e-6);
    static double[] fHz;
    static JsonObject ref;

    @BeforeAll
    static void reference() {
        PythonOracle.require("scipy", "numpy");
        fHz = new double[300];
        for (int i = 0; i < fHz.length; i++) fHz[i] = 2 * Math.pow(7000 / 2.0, i / 299.0); // 2 Hz .. 7 kHz, log spaced
        TransferFunction g = TRUE.withoutDelay().model(KT, false);
        Map<String, Object> in = new HashMap<>();
        in.put("num", g.numerator().coefficientsDescending());
        in.put("den", g.denominator().coefficientsDescending());
        in.put("f", fHz);
        in.put("dt", T);
        String script = """
                import json, sys, numpy as np
                from scipy import signal
                r = json.load(sys.stdin)
                numd, dend, _ = signal.cont2discrete((r['num'], r['den']), r['dt'], method='zoh')
                w = 2 * np.pi * np.array(r['f']) * r['dt']
                _, h = signal.freqz(numd.ravel(), dend, worN=w)
                print(json.dumps({'re': h.real.tolist(), 'im': h.imag.tolist()}))
                """;
        ref = PythonOracle.run(script, in).getAsJsonObject();
    }

    static double[] omega() {
        double[] w = new double[fHz.length];
        for (int i = 0; i < w.length; i++) w[i] = 2 * Math.PI * fHz[i];
        return w;
    }

    @Test
    void sampledDataResponseMatchesScipyZoh() {
        double[] th = {Math.log(TRUE.inertiaKgM2()), Math.log(TRUE.viscousNmsPerRad()), Math.log(TRUE.resonanceHz()), Math.log(TRUE.resonanceDamping()),
                Math.log(TRUE.antiresonanceHz()), Math.log(TRUE.antiresonanceDamping()), 0};
        double[] w = omega(), re = new double[w.length], im = new double[w.length];
        ModelFit.response(ModelFit.Kind.TWO_MASS, FitOptions.velocity(KT).sampledAt(T).withDelay(), th, w, re, im);
        double[] er = PythonOracle.doubles(ref.get("re")), ei = PythonOracle.doubles(ref.get("im"));
        for (int i = 0; i < w.length; i++) {
            // SciPy goes through a 4th-order polynomial in z with roots near z = 1 (cancellation ~1e-9 at
            // 2 Hz); ours sums pole by pole. 1e-6 relative bounds SciPy's side of that rounding.
            double mag = Math.hypot(er[i], ei[i]);
            assertEquals(0, Math.hypot(re[i] - er[i], im[i] - ei[i]), 1e-6 * mag, "at " + fHz[i] + " Hz");
        }
    }

    static Frf noisy(TransferFunction g, double[] w, double rel, long seed, boolean sampled) {
        double[] re = new double[w.length], im = new double[w.length], sig = new double[w.length];
        if (sampled) {
            double[] th = {Math.log(TRUE.inertiaKgM2()), Math.log(TRUE.viscousNmsPerRad()), Math.log(TRUE.resonanceHz()), Math.log(TRUE.resonanceDamping()),
                    Math.log(TRUE.antiresonanceHz()), Math.log(TRUE.antiresonanceDamping()), TRUE.delayS() / 1e-4};
            ModelFit.response(ModelFit.Kind.TWO_MASS, FitOptions.velocity(KT).sampledAt(T).withDelay(), th, w, re, im);
        } else g.response(w, re, im);
        Random r = new Random(seed);
        for (int i = 0; i < w.length; i++) {
            double m = Math.hypot(re[i], im[i]);
            sig[i] = rel * m;
            // circular complex noise with E|e|² = σ²
            re[i] += sig[i] / Math.sqrt(2) * r.nextGaussian();
            im[i] += sig[i] / Math.sqrt(2) * r.nextGaussian();
        }
        return Frf.ofParts(w, re, im).withUncertainty(sig);
    }

    @Test
    void twoMassContinuousAndSampledRecoverTheTruth() {
        double[] w = omega();
        Frf cont = noisy(TRUE.model(KT, false), w, 0.02, 1, false);
        TwoMassFit a = ModelFit.twoMass(cont, FitOptions.velocity(KT).withDelay().bandHz(2, 5000));
        Frf samp = noisy(null, w, 0.02, 2, true);
        TwoMassFit b = ModelFit.twoMass(samp, FitOptions.velocity(KT).sampledAt(T).withDelay().bandHz(2, 7000));
        for (TwoMassFit f : new TwoMassFit[] {a, b}) {
            // each truth within 3.5 standard errors (8 checks per fit; p ≈ 5e-4 each)
            assertTrue(f.fit().parameter("resonance").standardErrorsFrom(TRUE.resonanceHz()) < 3.5, f.toString());
            assertTrue(f.fit().parameter("antiresonance").standardErrorsFrom(TRUE.antiresonanceHz()) < 3.5, f.toString());
            assertTrue(f.fit().parameter("resonance damping").standardErrorsFrom(TRUE.resonanceDamping()) < 3.5, f.toString());
            assertTrue(f.fit().parameter("antiresonance damping").standardErrorsFrom(TRUE.antiresonanceDamping()) < 3.5, f.toString());
            assertTrue(f.fit().parameter("inertia").standardErrorsFrom(TRUE.inertiaKgM2()) < 3.5, f.toString());
            assertTrue(f.fit().parameter("viscous friction").standardErrorsFrom(TRUE.viscousNmsPerRad()) < 3.5, f.toString());
            assertTrue(f.fit().parameter("delay").standardErrorsFrom(TRUE.delayS()) < 3.5, f.toString());
            assertTrue(f.fit().parameter("inertia ratio").standardErrorsFrom(TRUE.inertiaRatio()) < 3.5, f.toString());
            // correct weights: reduced chi² ≈ 1 (600 residuals: ±0.2 is over 3 standard deviations of its scatter)
            assertEquals(1.0, f.fit().reducedChiSquare(), 0.2, f.toString());
            assertTrue(f.fit().isUsable(), f.toString());
        }
        // a continuous fit to sampled data is biased near Nyquist: its chi² reveals it
        TwoMassFit wrong = ModelFit.twoMass(samp, FitOptions.velocity(KT).withDelay().bandHz(2, 7000));
        assertTrue(wrong.fit().reducedChiSquare() > 2, "model mismatch must show: " + wrong.fit().reducedChiSquare());
    }

    @Test
    void rigidBodyOnItsOwnModel() {
        RigidBodyParameters p = new RigidBodyParameters(5e-4, 1e-2, 0);
        double[] w = omega();
        Frf data = noisy(p.model(KT, true), w, 0.01, 3, false);
        RigidBodyFit f = ModelFit.rigidBody(data, FitOptions.position(KT));
        assertTrue(f.fit().parameter("inertia").standardErrorsFrom(5e-4) < 3.5, f.toString());
        assertTrue(f.fit().parameter("viscous friction").standardErrorsFrom(1e-2) < 3.5, f.toString());
        assertEquals(p.mechanicalPoleHz(), f.estimate().mechanicalPoleHz(), 0.05 * p.mechanicalPoleHz());
        assertFalse(f.fit().quality().isEmpty());
        assertTrue(f.fit().isUsable(), f.toString());
    }

    @Test
    void badRequests() {
        double[] w = omega();
        Frf data = noisy(TRUE.model(KT, false), w, 0.01, 4, false);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> ModelFit.twoMass(data, FitOptions.velocity(KT).bandHz(2, 100)));
        assertTrue(e.getMessage().contains("no resonance peak"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> ModelFit.twoMass(data, FitOptions.velocity(KT).bandHz(9000, 9500)));
        assertTrue(e.getMessage().contains("no FRF point"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> ModelFit.twoMass(data, FitOptions.velocity(KT).sampledAt(1e-3).bandHz(2, 7000)));
        assertTrue(e.getMessage().contains("Nyquist"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> FitOptions.velocity(0));
    }
}
