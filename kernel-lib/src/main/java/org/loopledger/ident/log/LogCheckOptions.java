package org.loopledger.ident.log;

/**
 * Limits for the log checks.
 *
 * @param expectedSampleRateHz NaN: take the rate from the time column; else the time step must match it
 *                             within {@code jitterErrorFraction}
 * @param jitterWarningFraction a time step deviating from the median step by more than this fraction is a warning (jitter)
 * @param jitterErrorFraction   ... by more than this fraction (but below a gap) is an error
 * @param gapFactor             a time step longer than this many median steps is a gap (error)
 * @param minimumSamples        fewer rows is an error (too short to estimate spectra)
 * @param clipRunSamples        this many consecutive current samples at the column's extreme value count as clipping (warning)
 */
public record LogCheckOptions(double expectedSampleRateHz, double jitterWarningFraction, double jitterErrorFraction, double gapFactor,
                              int minimumSamples, int clipRunSamples) {
    public LogCheckOptions {
        if (!(jitterWarningFraction > 0) || !(jitterErrorFraction >= jitterWarningFraction) || !(gapFactor > 1 + jitterErrorFraction)) {
            throw new IllegalArgumentException("need 0 < jitter warning <= jitter error and gap factor > 1 + jitter error, got "
                    + jitterWarningFraction + ", " + jitterErrorFraction + ", " + gapFactor);
        }
        if (minimumSamples < 2 || clipRunSamples < 2) throw new IllegalArgumentException("minimum samples and clip run must be at least 2");
    }

    /** Rate from the time column, jitter warning above 1 %, error above 10 %, gap above 1.5 steps, at least 4096 rows, clipping at 8 equal extreme samples. */
    public static LogCheckOptions defaults() { return new LogCheckOptions(Double.NaN, 0.01, 0.10, 1.5, 4096, 8); }

    public LogCheckOptions withSampleRateHz(double hz) {
        return new LogCheckOptions(hz, jitterWarningFraction, jitterErrorFraction, gapFactor, minimumSamples, clipRunSamples);
    }

    public LogCheckOptions withMinimumSamples(int n) {
        return new LogCheckOptions(expectedSampleRateHz, jitterWarningFraction, jitterErrorFraction, gapFactor, n, clipRunSamples);
    }
}
