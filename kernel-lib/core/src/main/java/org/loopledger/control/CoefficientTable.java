package org.loopledger.control;

import org.loopledger.lti.Units;

import java.util.List;
import java.util.Locale;
import java.util.Objects;

/** The discrete filter coefficients a drive needs, one row per filter, at one sample rate. */
public record CoefficientTable(double sampleRateHz, List<Row> rows) {
    /** One filter and its section coefficients. */
    public record Row(Filter filter, BiquadCoefficients coefficients) {
        public Row {
            Objects.requireNonNull(filter, "filter");
            Objects.requireNonNull(coefficients, "coefficients");
        }
    }

    public CoefficientTable {
        Checks.sampleRateHz(sampleRateHz);
        rows = List.copyOf(rows);
    }

    /** A fixed-width text table, 15 significant digits per coefficient. */
    @Override public String toString() {
        StringBuilder sb = new StringBuilder();
        sb.append("Filter coefficients at ").append(Units.formatHz(sampleRateHz))
                .append(" (Tustin prewarped at each filter's characteristic frequency; H(z) = (b0 + b1 z^-1 + b2 z^-2)/(1 + a1 z^-1 + a2 z^-2))\n");
        int w = "filter".length();
        for (Row r : rows) w = Math.max(w, r.filter().describe().length());
        String fmt = "%-3s %-" + w + "s %23s %23s %23s %23s %23s%n";
        sb.append(String.format(Locale.ROOT, fmt, "#", "filter", "b0", "b1", "b2", "a1", "a2"));
        int i = 1;
        for (Row r : rows) {
            BiquadCoefficients c = r.coefficients();
            sb.append(String.format(Locale.ROOT, fmt, i++, r.filter().describe(), num(c.b0()), num(c.b1()), num(c.b2()), num(c.a1()), num(c.a2())));
        }
        if (rows.isEmpty()) sb.append("(no filters)\n");
        return sb.toString();
    }

    private static String num(double v) { return String.format(Locale.ROOT, "%+.15e", v); }
}
