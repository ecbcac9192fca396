package org.loopledger.ident.excitation;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.loopledger.testing.PythonOracle;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * PRBS against its definitions: the ITU-T O.150 register recurrence, SciPy's max_len_seq (Debian
 * python3-scipy 1.10), the maximum period 2^n - 1 and the two-valued autocorrelation (flat spectrum).
 */
class PrbsTest {
    /** Bits compared with SciPy per order (the whole period up to order 20, a prefix beyond). */
    private static int compared(PrbsPolynomial p) { return (int) Math.min(p.period(), 1 << 20); }

    private static JsonObject scipy;

    @BeforeAll
    static void askScipy() {
        PythonOracle.require("scipy", "numpy");
        List<Map<String, Object>> cases = new ArrayList<>();
        for (PrbsPolynomial p : PrbsPolynomial.values()) {
            Map<String, Object> c = new HashMap<>();
            c.put("name", p.name());
            c.put("n", p.order());
            c.put("m", p.middleExponent());
            c.put("length", compared(p));
            cases.add(c);
        }
        String script = """
                import json, sys, numpy as np
                from scipy.signal import max_len_seq
                out = {}
                for c in json.load(sys.stdin):
                    n, m, L = c['n'], c['m'], c['length']
                    # O.150 x^n + x^m + 1 is b[t] = b[t-m] ^ b[t-n]; SciPy's taps=[k] is a[t+n] = a[t] ^ a[t+k]: k = n - m
                    seq, _ = max_len_seq(n, length=L, taps=[n - m])
                    dflt, _ = max_len_seq(n, length=L) if n <= 20 else (np.zeros(0, dtype=np.int8), None)
                    out[c['name']] = {'o150': np.packbits(seq.astype(np.uint8)).tobytes().hex(),
                                      'default': np.packbits(dflt.astype(np.uint8)).tobytes().hex()}
                print(json.dumps(out))
                """;
        scipy = PythonOracle.run(script, cases).getAsJsonObject();
    }

    private static String packHex(byte[] bits) {
        StringBuilder sb = new StringBuilder(bits.length / 4 + 2);
        for (int i = 0; i < bits.length; i += 8) {
            int v = 0;
            for (int j = 0; j < 8; j++) v = (v << 1) | (i + j < bits.length ? bits[i + j] : 0);
            sb.append(Character.forDigit(v >> 4, 16)).append(Character.forDigit(v & 15, 16));
        }
        return sb.toString();
    }

    private static byte[] unpackHex(String hex, int bits) {
        byte[] b = new byte[bits];
        for (int i = 0; i < bits; i++) {
            int v = Character.digit(hex.charAt((i / 8) * 2), 16) * 16 + Character.digit(hex.charAt((i / 8) * 2 + 1), 16);
            b[i] = (byte) ((v >> (7 - i % 8)) & 1);
        }
        return b;
    }

    @ParameterizedTest
    @EnumSource(PrbsPolynomial.class)
    void equalsScipyMaxLenSeqWithO150Taps(PrbsPolynomial p) {
        // Source: scipy.signal.max_len_seq(n, taps=[n - m]) from the all-ones state, bit for bit.
        byte[] ours = Prbs.bits(p, compared(p));
        assertEquals(scipy.getAsJsonObject(p.name()).get("o150").getAsString(), packHex(ours), p.toString());
    }

    @Test
    void scipyDefaultTapsCoincideAtOrder20AndAreTheReciprocalElsewhere() {
        // Source: SciPy's default taps table; for order 20 its polynomial is O.150's (taps 17 = 20 - 3),
        // for the others it is the reciprocal polynomial, whose m-sequence is ours read backwards
        // (Golomb, Shift Register Sequences, 1967, reciprocal polynomials, from memory).
        assertEquals(scipy.getAsJsonObject("PRBS20").get("default").getAsString(), packHex(Prbs.bits(PrbsPolynomial.PRBS20)));
        for (PrbsPolynomial p : List.of(PrbsPolynomial.PRBS7, PrbsPolynomial.PRBS9, PrbsPolynomial.PRBS11, PrbsPolynomial.PRBS15)) {
            byte[] ours = Prbs.bits(p);
            String dflt = scipy.getAsJsonObject(p.name()).get("default").getAsString();
            assertNotEquals(dflt, packHex(ours), p + ": SciPy's default taps are not O.150's here");
            // reversed sequence equals SciPy's default up to a cyclic shift
            int len = ours.length;
            byte[] rev = new byte[len];
            for (int i = 0; i < len; i++) rev[i] = ours[len - 1 - i];
            byte[] d = unpackHex(dflt, len);
            // an n-bit window occurs once per period of an m-sequence, so it fixes the shift
            int n = p.order();
            boolean found = false;
            for (int shift = 0; shift < len && !found; shift++) {
                boolean window = true;
                for (int i = 0; i < n && window; i++) window = rev[(i + shift) % len] == d[i];
                if (!window) continue;
                found = true;
                for (int i = 0; i < len && found; i++) found = rev[(i + shift) % len] == d[i];
            }
            assertTrue(found, p + ": SciPy's default sequence should be ours reversed and shifted");
        }
    }

    @ParameterizedTest
    @EnumSource(value = PrbsPolynomial.class, names = {"PRBS7", "PRBS9", "PRBS11", "PRBS15", "PRBS20", "PRBS23"})
    void registerPeriodIsTwoToTheNMinusOne(PrbsPolynomial p) {
        // Source: definition of a maximum-length sequence (ITU-T O.150 section 5: "length 2^n - 1 bits").
        // Orders 29 and 31 would take 2^31 steps; they are covered by the SciPy prefix comparison.
        assertEquals((1L << p.order()) - 1, Prbs.registerPeriod(p));
    }

    @ParameterizedTest
    @ValueSource(ints = {7, 9, 11})
    void recurrenceAndBalance(int order) {
        PrbsPolynomial p = PrbsPolynomial.ofOrder(order);
        byte[] b = Prbs.bits(p, (int) (2 * p.period()));
        int n = p.order(), m = p.middleExponent();
        // O.150 recurrence b[t] = b[t-m] xor b[t-n] on the output
        for (int t = n; t < b.length; t++) assertEquals(b[t - m] ^ b[t - n], b[t], "recurrence at t = " + t);
        // repeats with period 2^n - 1
        for (int t = 0; t < p.period(); t++) assertEquals(b[t], b[(int) (t + p.period())]);
        // balance property: 2^(n-1) ones per period (Golomb's postulate R1)
        int ones = 0;
        for (int t = 0; t < p.period(); t++) ones += b[t];
        assertEquals(1 << (n - 1), ones);
    }

    @ParameterizedTest
    @ValueSource(ints = {7, 9, 11})
    void flatSpectrumOfTheMls(int order) {
        // Derivation by hand: the circular autocorrelation of a ±1 MLS of length L is L at lag 0 and -1
        // elsewhere, so its DFT power is |X_0|^2 = 1 and |X_k|^2 = L + 1 for every k != 0.
        // Naive O(L^2) DFT as the oracle; tolerance 1e-9 relative covers the DFT's rounding at L = 2047.
        double[] x = Prbs.of(order, 1.0, 1, 1, 1000).signal().onePeriod();
        int l = x.length;
        for (int k = 0; k < l; k++) {
            double re = 0, im = 0;
            for (int i = 0; i < l; i++) {
                double a = 2 * Math.PI * (((long) i * k) % l) / l;
                re += x[i] * Math.cos(a);
                im -= x[i] * Math.sin(a);
            }
            double pow = re * re + im * im;
            assertEquals(k == 0 ? 1.0 : l + 1.0, pow, 1e-9 * (l + 1), "bin " + k);
        }
    }

    @Test
    void dividerHoldsBitsAndPutsNullsAtMultiplesOfTheBitRate() {
        // Derivation by hand: holding each bit N samples multiplies the bit spectrum by the Dirichlet
        // kernel D_N, which vanishes at k = j·L (frequency j·fs/N) for j not a multiple of N.
        Prbs prbs = Prbs.of(7, 0.5, 3, 2, 3000);
        ExcitationSignal s = prbs.signal();
        assertEquals(127 * 3, s.periodSamples());
        assertEquals(2 * 127 * 3, s.totalSamples());
        assertEquals(1000.0, prbs.firstNullHz(), 0);
        double[] x = s.onePeriod();
        for (int i = 0; i < x.length; i++) assertEquals(x[i - i % 3], x[i]);
        assertEquals(0.5, s.peak());
        int l = x.length;
        for (int j = 1; j <= 2; j++) {
            int k = j * 127;
            double re = 0, im = 0;
            for (int i = 0; i < l; i++) {
                double a = 2 * Math.PI * (((long) i * k) % l) / l;
                re += x[i] * Math.cos(a);
                im -= x[i] * Math.sin(a);
            }
            assertEquals(0.0, Math.hypot(re, im), 1e-9, "null at " + j * 1000 + " Hz");
        }
    }

    @Test
    void badInputsAreClearErrors() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> PrbsPolynomial.ofOrder(8));
        assertTrue(e.getMessage().contains("order 8") && e.getMessage().contains("7, 9, 11, 15, 20, 23, 29, 31"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Prbs.of(9, 0, 1, 1, 1000));
        assertThrows(IllegalArgumentException.class, () -> Prbs.of(9, 1, 0, 1, 1000));
        assertThrows(IllegalArgumentException.class, () -> Prbs.of(9, 1, 1, 0, 1000));
        assertThrows(IllegalArgumentException.class, () -> Prbs.of(9, 1, 1, 1, Double.NaN));
        e = assertThrows(IllegalArgumentException.class, () -> Prbs.of(31, 1, 1, 1, 16000).signal());
        assertTrue(e.getMessage().contains("order 31"), e.getMessage());
    }
}
