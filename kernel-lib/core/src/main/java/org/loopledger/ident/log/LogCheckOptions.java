package org.loopledger.ident.log;

/**
 * Limits for the log checks.
 *
 * @param expectedSampleRateHz NaN: take the rate from the time column (span over count); else the stated rate is
 *                             authoritative and the time column must agree with it within {@code jitterErrorFraction}
 * @param jitterWarningFraction a time step deviating from the nominal step by more than this fraction (beyond the
 *                              timestamps' printed resolution) is a warning (jitter)
 * @param jitterErrorFraction   ... by more than this fraction (but below a gap) is an error
 * @param gapFactor             a time step longer than this many nominal steps is a gap (error)
 * @param minimumSamples        fewer rows is an error (too short to estimate spectra)
 * @param clipRunSamples        this many consecutive current samples at the column's extreme value count as clipping (warning)
 * @param minimumPlausibleRateHz a rate taken from the time column below this is refused (time in ms under a
 *                               {@code time_s} header?); state the rate or lower this limit for slow logs
 */
public record LogCheckOptions(double expectedSampleRateHz, double jitterWarningFraction, double jitterErrorFraction, double gapFactor,
                              int minimumSamples, int clipRunSamples, double minimumPlausibleRateHz) {
    public LogCheckOptions {
        if (!(jitterWarningFraction > 0) || !(jitterErrorFraction >= jitterWarningFraction) || !(gapFactor > 1 + jitterErrorFraction)) {
            throw new IllegalArgumentException("need 0 < jitter warning <= jitter error and gap factor > 1 + jitter error, got "
                    + jitterWarningFraction + ", " + jitterErrorFraction + ", " + gapFactor);
        }
        if (minimumSamples < 2 || clipRunSamples < 2) throw new IllegalArgumentException("minimum samples and clip run must be at least 2");
        if (!Double.isNaN(expectedSampleRateHz) && !(expectedSampleRateHz > 0 && Double.isFinite(expectedSampleRateHz))) {
            throw new IllegalArgumentException("stated sample rate must be positive and finite (or NaN for none), got " + expectedSampleRateHz);
        }
        if (!(minimumPlausibleRateHz >= 0)) throw new IllegalArgumentException("minimum plausible rate must be >= 0 Hz, got " + minimumPlausibleRateHz);
    }

    /** With the default plausible-rate limit (200 Hz). */
    public LogCheckOptions(double expectedSampleRateHz, double jitterWarningFraction, double jitterErrorFraction, double gapFactor,
                           int minimumSamples, int clipRunSamples) {
        this(expectedSampleRateHz, jitterWarningFraction, jitterErrorFraction, gapFactor, minimumSamples, clipRunSamples, 200);
    }

    /** Rate from the time column, jitter warning above 1 %, error above 10 %, gap above 1.5 steps, at least 4096 rows, clipping at 8 equal extreme samples, rates below 200 Hz refused. */
    public static LogCheckOptions defaults() { return new LogCheckOptions(Double.NaN, 0.01, 0.10, 1.5, 4096, 8, 200); }

    /** The drive's sample rate, authoritative (the time column, if any, is checked against it). */
    public LogCheckOptions withSampleRateHz(double hz) {
        return new LogCheckOptions(hz, jitterWarningFraction, jitterErrorFraction, gapFactor, minimumSamples, clipRunSamples, minimumPlausibleRateHz);
    }

    public LogCheckOptions withMinimumSamples(int n) {
        return new LogCheckOptions(expectedSampleRateHz, jitterWarningFraction, jitterErrorFraction, gapFactor, n, clipRunSamples, minimumPlausibleRateHz);
    }

    /** For slow logs (e.g. a thermal log at 10 Hz): the lowest rate taken from a time column without refusal. */
    public LogCheckOptions withMinimumPlausibleRateHz(double hz) {
        return new LogCheckOptions(expectedSampleRateHz, jitterWarningFraction, jitterErrorFraction, gapFactor, minimumSamples, clipRunSamples, hz);
    }
}
