package org.loopledger.control;

import org.loopledger.lti.Units;

import java.util.List;
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

    /** One line; the table a drive needs (15 significant digits, with the caution) is the notebook side's {@code display.FilterTable}. */
    @Override public String toString() {
        return "coefficients of " + rows.size() + " filter(s) at " + Units.formatHz(sampleRateHz) + " (b0, b1, b2, a1, a2 per section)";
    }
}
