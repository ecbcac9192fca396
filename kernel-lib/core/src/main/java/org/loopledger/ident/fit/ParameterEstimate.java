package org.loopledger.ident.fit;

import java.util.Locale;

/**
 * One fitted parameter in physical units with its standard error and 95 % confidence interval
 * (from the linearised covariance at the optimum; for parameters fitted on a log scale the interval is
 * value·e<sup>±1.96σ<sub>ln</sub></sup>, hence not symmetric).
 */
public record ParameterEstimate(String name, String unit, double value, double standardError, double low95, double high95) {
    /** Whether {@code x} lies inside the 95 % interval. */
    public boolean covers(double x) { return x >= low95 && x <= high95; }

    /** |x - value| in standard errors. */
    public double standardErrorsFrom(double x) { return Math.abs(x - value) / standardError; }

    @Override public String toString() {
        return String.format(Locale.ROOT, "%s = %.5g %s (95 %%: %.5g .. %.5g)", name, value, unit, low95, high95);
    }
}
