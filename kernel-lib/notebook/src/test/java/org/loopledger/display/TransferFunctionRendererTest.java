package org.loopledger.display;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import org.junit.jupiter.api.Test;
import org.loopledger.lti.TransferFunction;
import org.loopledger.testing.PythonOracle;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class TransferFunctionRendererTest {
    static final TransferFunction SECOND_ORDER = TransferFunction.continuous(new double[] {1, 1}, new double[] {1, 3, 2});
    static final TransferFunction LAG_WITH_DELAY = TransferFunction.continuous(new double[] {1}, new double[] {1, 1}).withDelay(0.001);
    static final TransferFunction SAMPLED = TransferFunction.discrete(new double[] {0.5}, new double[] {1, -0.5}, 1e-4);
    static final TransferFunction NEGATIVE = TransferFunction.continuous(new double[] {-2, -1, 3}, new double[] {1e-7, 0, 1});
    static final TransferFunction GAIN = TransferFunction.gain(42);
    /** Sampled at 1 ms with a delay of 1.5 samples: the fractional delay the removed lti formatter wrote as z^{-1.5}. */
    static final TransferFunction SAMPLED_FRACTIONAL_DELAY = TransferFunction.discrete(new double[] {0.5}, new double[] {1, -0.5}, 0.001).withDelay(0.0015);

    @Test
    void latexIsTheFractionInDescendingPowers() {
        // Expected strings derived by hand from the coefficients (descending powers, monic denominator, 4 significant digits).
        assertEquals("$$\\frac{s + 1}{s^{2} + 3 s + 2}$$", Latex.of(SECOND_ORDER));
        assertEquals("$$\\frac{1}{s + 1}\\, e^{-0.001\\, s}$$", Latex.of(LAG_WITH_DELAY));
        assertEquals("$$\\frac{0.5}{z - 0.5}\\qquad T_s = 0.0001\\,\\mathrm{s}$$", Latex.of(SAMPLED));
        // 1e-7 s^2 + 1 made monic: s^2 + 1e7; the numerator is divided by 1e-7 likewise (values of 1e6 and above get powers of ten).
        assertEquals("$$\\frac{-2 \\times 10^{7} s^{2} - 10^{7} s + 3 \\times 10^{7}}{s^{2} + 10^{7}}$$", Latex.of(NEGATIVE));
        assertEquals("$$42$$", Latex.of(GAIN));
        // A delay is e^{-τ s} with s the Laplace variable on every time base (z = e^{sT}), as the plain text says
        // "e^(-0.0015 s)": a fractional number of samples needs no fractional power of z (written by hand).
        assertEquals("$$\\frac{0.5}{z - 0.5}\\, e^{-0.0015\\, s}\\qquad T_s = 0.001\\,\\mathrm{s}$$", Latex.of(SAMPLED_FRACTIONAL_DELAY));
        assertEquals("1.5 \\times 10^{-5}", Latex.number(1.5e-5));
        assertEquals("10^{6}", Latex.number(1e6));
        assertEquals("-\\infty", Latex.number(Double.NEGATIVE_INFINITY));
    }

    /** One LaTeX formatter, in display: the domain value has none of its own. */
    @Test
    void transferFunctionHasNoLatexOfItsOwn() {
        assertThrows(NoSuchMethodException.class, () -> TransferFunction.class.getMethod("toLatex"));
        assertThrows(NoSuchMethodException.class, () -> org.loopledger.lti.Polynomial.class.getMethod("toLatex", String.class));
    }

    @Test
    void bundleHasLatexAndTheValuesOwnText() {
        MimeBundle b = Bundles.of(SECOND_ORDER);
        assertEquals(SECOND_ORDER.toString(), b.plainText());
        assertEquals(Latex.of(SECOND_ORDER), b.get(MimeBundle.TEXT_LATEX).orElseThrow());
        assertEquals(List.of(MimeBundle.TEXT_PLAIN, MimeBundle.TEXT_LATEX), List.copyOf(b.data().keySet()));
        assertEquals(b, Bundles.of(TransferFunction.continuous(new double[] {1, 1}, new double[] {1, 3, 2})), "deterministic");
    }

    @Test
    void latexIsValidTexMathForAnOutsideParser() {
        // Outside reference: matplotlib's mathtext parser (Debian python3-matplotlib) must accept every formula.
        PythonOracle.require("matplotlib");
        JsonArray cases = new JsonArray();
        for (TransferFunction g : List.of(SECOND_ORDER, LAG_WITH_DELAY, SAMPLED, NEGATIVE, GAIN, SAMPLED_FRACTIONAL_DELAY)) {
            String tex = Latex.of(g);
            cases.add("$" + tex.substring(2, tex.length() - 2) + "$"); // mathtext takes inline math
        }
        String script = """
                import json, sys
                from matplotlib.mathtext import MathTextParser
                p = MathTextParser("path")
                out = []
                for s in json.load(sys.stdin):
                    try:
                        p.parse(s); out.append("ok")
                    except Exception as e:
                        out.append(str(e))
                print(json.dumps(out))
                """;
        JsonArray r = PythonOracle.run(script, cases).getAsJsonArray();
        for (int i = 0; i < r.size(); i++) {
            JsonElement e = r.get(i);
            assertEquals("ok", e.getAsString(), cases.get(i).getAsString());
        }
    }
}
