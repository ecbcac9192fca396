package org.loopledger.control;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.testing.PythonOracle;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Discrete filter coefficients against three outside references, computed in one Python run:
 * <ol>
 *   <li>{@code scipy.signal.iirnotch(f0, Q, fs)} (Debian python3-scipy). It fixes the <em>digital</em> -3 dB width
 *       f0/Q (S. J. Orfanidis, Introduction to Signal Processing, §11.3, which SciPy cites). Exact equivalence,
 *       derivation by hand: it is the Tustin transform prewarped at ω0 of the full continuous notch with
 *       Q<sub>analog</sub> = sin(ω0T)/(2·tan(ω0T/(2Q))), which {@link Notch#ofDigitalQ} builds.</li>
 *   <li>{@code scipy.signal.bilinear(b, a, fs_eff)} of the continuous filter. bilinear has no prewarp (s = 2·fs·(z-1)/(z+1));
 *       passing fs_eff = ω_c/(2·tan(ω_c·T/2)) makes its substitution equal the prewarped one, s = c(z-1)/(z+1).</li>
 *   <li>The W3C Audio EQ Cookbook (R. Bristow-Johnson, "Cookbook formulae for audio EQ biquad filter coefficients",
 *       W3C Working Group Note, 2021, https://www.w3.org/TR/audio-eq-cookbook/): LPF, notch and peakingEQ formulae,
 *       typed into the Python script below from the note (from memory of the note's text: α = sin(w0)/(2Q),
 *       A = 10^(dBgain/40)). Our finite-depth notch is its peakingEQ with dBgain = -depth and Q_cb = Q/A.</li>
 *   <li>{@code scipy.signal.butter(N, fc, fs=fs)}, which prewarps at fc: our first-order low-pass and the
 *       second-order one with ζ = 1/√2.</li>
 * </ol>
 * Tolerance 1e-12 absolute on coefficients of order 1 (measured worst: 4.4e-16): our route expands polynomials with c² ≈ (2·fs)² ≈ 1e9
 * and normalises, so a few hundred ulps of rounding are expected; a formula error would be orders larger.
 */
class FilterReferenceTest {
    private static final String SCRIPT = """
            import json, sys, math
            import numpy as np
            from scipy import signal
            cases = json.load(sys.stdin)
            out = []
            def norm(b, a):
                b = np.atleast_1d(np.asarray(b, float)); a = np.atleast_1d(np.asarray(a, float))
                b = b / a[0]; a = a / a[0]
                b = np.concatenate([b, np.zeros(3 - len(b))]); a = np.concatenate([a, np.zeros(3 - len(a))])
                return [b[0], b[1], b[2], a[1], a[2]]
            for c in cases:
                fs = c['fs']; T = 1.0 / fs; r = {}
                wc = c['prewarp']
                fs_eff = wc / (2.0 * math.tan(wc * T / 2.0))
                bz, az = signal.bilinear(c['num'], c['den'], fs=fs_eff)
                r['bilinear'] = norm(bz, az)
                w0 = 2 * math.pi * c.get('f0', 0) / fs
                k = c['kind']
                if k == 'notchDigitalQ':
                    b, a = signal.iirnotch(c['f0'], c['qd'], fs=fs)
                    r['iirnotch'] = norm(b, a)
                if k in ('notchFull', 'notchDigitalQ'):
                    al = math.sin(w0) / (2 * c['q'])
                    r['cookbook'] = norm([1, -2 * math.cos(w0), 1], [1 + al, -2 * math.cos(w0), 1 - al])
                if k == 'notchDepth':
                    A = 10 ** (-c['depth'] / 40.0); qcb = c['q'] / A
                    al = math.sin(w0) / (2 * qcb)
                    r['cookbook'] = norm([1 + al * A, -2 * math.cos(w0), 1 - al * A], [1 + al / A, -2 * math.cos(w0), 1 - al / A])
                if k == 'lp2':
                    al = math.sin(w0) / (2 * c['q']); cw = math.cos(w0)
                    r['cookbook'] = norm([(1 - cw) / 2, 1 - cw, (1 - cw) / 2], [1 + al, -2 * cw, 1 - al])
                    if abs(c['q'] - 1 / math.sqrt(2)) < 1e-15:
                        b, a = signal.butter(2, c['f0'], fs=fs); r['butter'] = norm(b, a)
                if k == 'lp1':
                    b, a = signal.butter(1, c['f0'], fs=fs); r['butter'] = norm(b, a)
                out.append(r)
            print(json.dumps(out))
            """;

    private record Case(String name, Filter filter, double fs, Map<String, Object> extra) {}

    private static final List<Case> CASES = new ArrayList<>();
    private static JsonArray answers;

    private static void add(String name, String kind, Filter f, double fs, Map<String, Object> extra) {
        Map<String, Object> m = new LinkedHashMap<>(extra);
        m.put("kind", kind);
        CASES.add(new Case(name, f, fs, m));
    }

    @BeforeAll static void runReference() {
        PythonOracle.require("scipy", "numpy");
        double[][] notchDigital = {{50, 2, 16000}, {450, 5, 16000}, {2000, 0.7, 16000}, {6500, 30, 16000}, {300, 3, 4000}, {1200, 10, 8000}};
        for (double[] n : notchDigital) {
            Notch f = Notch.ofDigitalQ(n[0], n[1], n[2]);
            add("digital-Q notch " + f, "notchDigitalQ", f, n[2], Map.of("f0", n[0], "qd", n[1], "q", f.q()));
        }
        double[][] notchFull = {{450, 90, 16000}, {80, 40, 16000}, {5000, 500, 16000}};
        for (double[] n : notchFull) {
            Notch f = Notch.ofHz(n[0], Double.POSITIVE_INFINITY, n[1]);
            add("full notch " + f, "notchFull", f, n[2], Map.of("f0", n[0], "q", f.q()));
        }
        double[][] notchDepth = {{450, 20, 90, 16000}, {120, 6, 30, 16000}, {3000, 40, 1500, 16000}, {700, 12, 50, 5000}};
        for (double[] n : notchDepth) {
            Notch f = Notch.ofHz(n[0], n[1], n[2]);
            add("notch " + f, "notchDepth", f, n[3], Map.of("f0", n[0], "q", f.q(), "depth", n[1]));
        }
        double[][] lp2 = {{800, 1 / Math.sqrt(2), 16000}, {100, 0.3, 16000}, {3000, 1.2, 16000}, {1500, 1 / Math.sqrt(2), 8000}};
        for (double[] n : lp2) {
            LowPass2 f = LowPass2.ofHz(n[0], n[1]);
            add("low-pass " + f, "lp2", f, n[2], Map.of("f0", n[0], "q", f.q()));
        }
        for (double[] n : new double[][] {{1000, 16000}, {20, 16000}, {3500, 8000}}) {
            add("low-pass " + n[0], "lp1", LowPass1.ofHz(n[0]), n[1], Map.of("f0", n[0]));
        }
        add("lead 40 deg at 200 Hz", "leadlag", LeadLag.ofCentreHz(200, 40), 16000, Map.of());
        add("lag -25 deg at 30 Hz", "leadlag", LeadLag.ofCentreHz(30, -25), 16000, Map.of());
        add("general biquad", "biquad", Biquad.ofContinuous(new double[] {2e-6, 3e-3, 5}, new double[] {1e-6, 4e-3, 7}, 350), 16000, Map.of());
        List<Map<String, Object>> in = new ArrayList<>();
        for (Case c : CASES) {
            Map<String, Object> m = new LinkedHashMap<>(c.extra());
            m.put("fs", c.fs());
            m.put("prewarp", c.filter().prewarpRadPerS());
            m.put("num", c.filter().continuous().numerator().coefficientsDescending());
            m.put("den", c.filter().continuous().denominator().coefficientsDescending());
            in.add(m);
        }
        JsonElement e = PythonOracle.run(SCRIPT, in);
        answers = e.getAsJsonArray();
    }

    @Test void coefficientsAgreeWithEveryReference() {
        int checks = 0;
        double worst = 0;
        for (int i = 0; i < CASES.size(); i++) {
            Case c = CASES.get(i);
            double[] ours = c.filter().coefficients(c.fs()).toArray();
            JsonObject refs = answers.get(i).getAsJsonObject();
            for (String key : refs.keySet()) {
                double[] ref = PythonOracle.doubles(refs.get(key));
                for (int j = 0; j < 5; j++) {
                    worst = Math.max(worst, Math.abs(ours[j] - ref[j]));
                    assertEquals(ref[j], ours[j], 1e-12, c.name() + " vs " + key + ", coefficient " + j);
                }
                checks++;
            }
        }
        // every case has the bilinear reference; notches, low-passes add iirnotch / cookbook / butter
        assertTrue(checks >= 2 * CASES.size() - 3, "references consulted: " + checks + " for " + CASES.size() + " cases");
        System.out.println("FilterReferenceTest: " + checks + " reference comparisons, worst abs coefficient difference " + worst);
    }

    @Test void prewarpedFrequencyIsExact() {
        // Definition of prewarping: H(e^{jω_c T}) = H(jω_c).
        for (Case c : CASES) {
            double w = c.filter().prewarpRadPerS();
            Complex a = c.filter().discrete(c.fs()).response(w), b = c.filter().continuous().response(w);
            assertEquals(0, a.subtract(b).abs(), 1e-9 * Math.max(1, b.abs()), c.name());
        }
    }

    @Test void notchCentreDepthAndWidthMeanWhatTheJavadocSays() {
        Notch n = Notch.ofHz(450, 20, 90);
        Complex h0 = n.continuous().response(n.centreRadPerS());
        assertEquals(-20, 20 * Math.log10(h0.abs()), 1e-12);           // depth: attenuation at the centre
        assertEquals(0, h0.getImaginary(), 1e-12);                       // no phase at the centre
        // Full notch with the same poles: -3 dB points ω1, ω2 with ω2 - ω1 = width, ω1ω2 = ω0² (derivation by hand).
        Notch full = Notch.ofHz(450, Double.POSITIVE_INFINITY, 90);
        double w0 = full.centreRadPerS(), dw = full.widthRadPerS();
        double w1 = -dw / 2 + Math.sqrt(dw * dw / 4 + w0 * w0), w2 = w1 + dw;
        assertEquals(1 / Math.sqrt(2), full.continuous().response(w1).abs(), 1e-12);
        assertEquals(1 / Math.sqrt(2), full.continuous().response(w2).abs(), 1e-12);
        assertEquals(w0 * w0, w1 * w2, 1e-9 * w0 * w0);
    }

    @Test void coefficientTableHoldsEveryFilterInOrder() {
        FilterChain chain = FilterChain.of(LowPass2.ofHz(1200, 0.6), Notch.ofHz(450, 20, 90), LowPass1.ofHz(3000));
        CoefficientTable t = chain.coefficientTable(16000);
        assertEquals(16000, t.sampleRateHz());
        assertEquals(chain.filters(), t.rows().stream().map(CoefficientTable.Row::filter).toList());
        for (int i = 0; i < 3; i++) assertEquals(chain.filters().get(i).coefficients(16000), t.rows().get(i).coefficients());
        assertEquals("coefficients of 3 filter(s) at 16 kHz (b0, b1, b2, a1, a2 per section)", t.toString(), "one line: the table is display.FilterTable");
    }

    @Test void badFiltersAndSampleRatesAreClearErrors() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Notch.ofHz(9000, 20, 100).discrete(16000));
        assertTrue(e.getMessage().contains("9 kHz") && e.getMessage().contains("Nyquist") && e.getMessage().contains("8 kHz"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> LowPass1.ofHz(8000).coefficients(16000)); // exactly at Nyquist
        assertThrows(IllegalArgumentException.class, () -> LowPass2.ofHz(5000, 0.7).discrete(8000));
        assertThrows(IllegalArgumentException.class, () -> LeadLag.ofCornersHz(100, 9000).discrete(16000)); // pole above Nyquist
        assertThrows(IllegalArgumentException.class, () -> Notch.ofHz(450, 20, 0));
        assertThrows(IllegalArgumentException.class, () -> Notch.ofHz(450, 20, -10));
        assertThrows(IllegalArgumentException.class, () -> Notch.ofHz(450, 0, 90));
        assertThrows(IllegalArgumentException.class, () -> Notch.ofHz(450, -6, 90));
        assertThrows(IllegalArgumentException.class, () -> Notch.ofHz(0, 20, 90));
        assertThrows(IllegalArgumentException.class, () -> LowPass1.ofHz(-100));
        assertThrows(IllegalArgumentException.class, () -> LowPass2.ofHz(100, 0));
        assertThrows(IllegalArgumentException.class, () -> LeadLag.ofCentreHz(100, 95));
        assertThrows(IllegalArgumentException.class, () -> Biquad.ofContinuous(new double[] {1, 0, 0}, new double[] {1, 1}, 100));
        for (double fs : new double[] {0, -16000, Double.NaN, Double.POSITIVE_INFINITY}) {
            IllegalArgumentException g = assertThrows(IllegalArgumentException.class, () -> LowPass1.ofHz(100).discrete(fs));
            assertTrue(g.getMessage().contains("sample rate"), g.getMessage());
        }
    }

    /** A notch is made only through unit-named factories: {@code new Notch(620, 20, 250)} read as Hz but took rad/s. */
    @Test
    void notchHasNoUnitlessConstructor() {
        assertEquals(0, Notch.class.getConstructors().length, "no public constructor");
        Notch hz = Notch.ofHz(620, 20, 250), rad = Notch.ofRadPerS(2 * Math.PI * 620, 20, 2 * Math.PI * 250); // 1 Hz = 2π rad/s
        assertEquals(hz, rad);
        assertEquals(hz.hashCode(), rad.hashCode());
        assertEquals(620, hz.centreHz(), 1e-12);
        assertEquals(250, hz.widthHz(), 1e-12);
        assertNotEquals(hz, Notch.ofHz(620, 20, 251));
    }
}
