package org.loopledger.display;

import org.loopledger.lti.Polynomial;
import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

/**
 * LaTeX for the library's algebraic values, as Jupyter shows {@code text/latex} (MathJax, display math
 * between {@code $$}). Coefficients carry four significant digits, the same rounding as the values'
 * {@code toString()}, so the typeset and the plain form agree; powers of ten are written
 * {@code 1.5 \times 10^{-5}}, never {@code 1.5e-05}.
 */
public final class Latex {
    private Latex() {}

    /**
     * A transfer function as display math: {@code $$\frac{num}{den}$$} in s or z, times
     * {@code e^{-τ s}} for a pure delay (s the Laplace variable, also on a sampled time base, where
     * z = e<sup>sT</sup>); a sampled one states its sample time.
     */
    public static String of(TransferFunction g) {
        String v = g.isDiscrete() ? "z" : "s";
        StringBuilder b = new StringBuilder("$$");
        Polynomial den = g.denominator();
        String num = polynomial(g.numerator(), v);
        if (den.degree() == 0 && den.leading() == 1.0) {
            b.append(num);
        } else {
            b.append("\\frac{").append(num).append("}{").append(polynomial(den, v)).append('}');
        }
        if (g.delayS() > 0) {
            b.append("\\, e^{-").append(number(g.delayS())).append("\\, s}");
        }
        if (g.timeBase() instanceof TimeBase.Sampled sm) {
            b.append("\\qquad T_s = ").append(number(sm.sampleTimeS())).append("\\,\\mathrm{s}");
        }
        return b.append("$$").toString();
    }

    /** A polynomial in descending powers of {@code variable}, e.g. {@code 2 s^{2} - s + 0.5}. */
    public static String polynomial(Polynomial p, String variable) {
        double[] c = p.coefficientsDescending();
        int n = c.length - 1;
        StringBuilder b = new StringBuilder();
        for (int i = 0; i <= n; i++) {
            double v = c[i];
            if (v == 0 && n > 0) continue;
            int power = n - i;
            if (b.length() == 0) {
                if (v < 0) b.append('-');
            } else {
                b.append(v < 0 ? " - " : " + ");
            }
            boolean unit = Math.abs(v) == 1.0 && power > 0;
            if (!unit) b.append(number(Math.abs(v)));
            if (power > 0) {
                if (!unit) b.append(' ');
                b.append(variable);
                if (power > 1) b.append("^{").append(power).append('}');
            }
        }
        return b.length() == 0 ? "0" : b.toString();
    }

    /** A number with four significant digits; exponents as powers of ten. */
    public static String number(double v) {
        String s = Units.g4(v);
        if (s.equals("inf")) return "\\infty";
        if (s.equals("-inf")) return "-\\infty";
        if (s.equals("NaN")) return "\\mathrm{NaN}";
        int e = s.indexOf('e');
        if (e < 0) return s;
        String mantissa = s.substring(0, e);
        int exponent = Integer.parseInt(s.substring(e + 1).replace("+", ""));
        return (mantissa.equals("1") ? "" : mantissa.equals("-1") ? "-" : mantissa + " \\times ") + "10^{" + exponent + "}";
    }
}
