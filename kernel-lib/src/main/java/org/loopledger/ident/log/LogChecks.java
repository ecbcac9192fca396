package org.loopledger.ident.log;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * The checks a drive log must pass before estimation, on plain arrays (so they serve any reader): too
 * few rows, non-finite values (NaN, empty cells), non-monotonic time, gaps, jitter, a time step that does
 * not match the stated rate, and clipped (saturated) current. Each issue names the column and the first
 * row where it occurs, and how many rows share it.
 *
 * <p>Clipping is looked for in current columns ({@code _A}) other than the injected excitation (a PRBS is
 * flat by design): a run of {@code clipRunSamples} or more consecutive samples at the column's extreme value.
 */
public final class LogChecks {
    private LogChecks() {}

    /** All issues of the given columns; {@code time} is the time column (s). */
    public static List<LogIssue> check(double[] time, String[] names, double[][] columns, LogCheckOptions o) {
        List<LogIssue> issues = new ArrayList<>();
        int n = time.length;
        if (n < o.minimumSamples()) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, 0, String.format(Locale.ROOT,
                    "the log has %d rows, fewer than the %d needed; record longer", n, o.minimumSamples())));
        }
        checkFinite(LogColumns.TIME, time, issues);
        for (int c = 0; c < names.length; c++) checkFinite(names[c], columns[c], issues);
        if (n >= 2) checkTime(time, o, issues);
        for (int c = 0; c < names.length; c++) {
            LogColumns.Column col = LogColumns.parse(names[c]);
            if (col.unitToken().equals("A") && !col.quantity().contains("injected")) checkClipping(names[c], columns[c], o, issues);
        }
        return issues;
    }

    private static void checkFinite(String name, double[] x, List<LogIssue> issues) {
        int first = -1, count = 0;
        for (int i = 0; i < x.length; i++) {
            if (!Double.isFinite(x[i])) {
                if (first < 0) first = i;
                count++;
            }
        }
        if (first >= 0) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, name, first + 1, String.format(Locale.ROOT,
                    "value is %s (missing or not a number)%s; repair or cut the record", x[first], count > 1 ? ", " + count + " rows in all" : "")));
        }
    }

    private static void checkTime(double[] t, LogCheckOptions o, List<LogIssue> issues) {
        int n = t.length;
        double[] dt = new double[n - 1];
        int firstBad = -1, bad = 0;
        for (int i = 1; i < n; i++) {
            dt[i - 1] = t[i] - t[i - 1];
            if (!(dt[i - 1] > 0) && Double.isFinite(dt[i - 1])) {
                if (firstBad < 0) firstBad = i;
                bad++;
            }
        }
        if (firstBad >= 0) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, firstBad + 1, String.format(Locale.ROOT,
                    "time does not increase (%.9g s after %.9g s)%s; sort the log or cut it at the restart", t[firstBad], t[firstBad - 1],
                    bad > 1 ? ", " + bad + " rows in all" : "")));
        }
        double[] pos = Arrays.stream(dt).filter(d -> d > 0 && Double.isFinite(d)).sorted().toArray();
        if (pos.length == 0) return;
        double median = pos[pos.length / 2];
        int gapRow = -1, gaps = 0, jitErrRow = -1, jitErr = 0, jitWarnRow = -1, jitWarn = 0;
        double worst = 0;
        for (int i = 0; i < dt.length; i++) {
            if (!(dt[i] > 0) || !Double.isFinite(dt[i])) continue;
            double dev = Math.abs(dt[i] - median) / median;
            worst = Math.max(worst, dev);
            if (dt[i] > o.gapFactor() * median) { if (gapRow < 0) gapRow = i + 2; gaps++; }
            else if (dev > o.jitterErrorFraction()) { if (jitErrRow < 0) jitErrRow = i + 2; jitErr++; }
            else if (dev > o.jitterWarningFraction()) { if (jitWarnRow < 0) jitWarnRow = i + 2; jitWarn++; }
        }
        if (gapRow > 0) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, gapRow, String.format(Locale.ROOT,
                    "gap: time step %.6g s is more than %.3g times the median step %.6g s%s; samples are missing, cut the record there",
                    dt[gapRow - 2], o.gapFactor(), median, gaps > 1 ? " (" + gaps + " gaps in all)" : "")));
        }
        if (jitErrRow > 0) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, jitErrRow, String.format(Locale.ROOT,
                    "jitter: time step %.6g s deviates %.1f %% from the median %.6g s (limit %.1f %%)%s; the sampling is not regular",
                    dt[jitErrRow - 2], 100 * Math.abs(dt[jitErrRow - 2] - median) / median, median, 100 * o.jitterErrorFraction(),
                    jitErr > 1 ? ", " + jitErr + " steps in all" : "")));
        }
        if (jitWarnRow > 0) {
            issues.add(new LogIssue(LogIssue.Severity.WARNING, LogColumns.TIME, jitWarnRow, String.format(Locale.ROOT,
                    "jitter: %d time step(s) deviate more than %.1f %% from the median %.6g s (worst %.2f %%); spectra assume regular sampling",
                    jitWarn, 100 * o.jitterWarningFraction(), median, 100 * worst)));
        }
        if (!Double.isNaN(o.expectedSampleRateHz())) {
            double expected = 1 / o.expectedSampleRateHz();
            if (Math.abs(median - expected) / expected > o.jitterErrorFraction()) {
                issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, 0, String.format(Locale.ROOT,
                        "median time step %.6g s (%.6g Hz) does not match the stated sample rate %.6g Hz; check the rate or the time unit",
                        median, 1 / median, o.expectedSampleRateHz())));
            }
        }
    }

    private static void checkClipping(String name, double[] x, LogCheckOptions o, List<LogIssue> issues) {
        double max = 0;
        for (double v : x) if (Double.isFinite(v)) max = Math.max(max, Math.abs(v));
        if (max == 0) return;
        double level = max * (1 - 1e-9);
        int run = 0, runStart = -1, firstRow = -1, runs = 0;
        for (int i = 0; i <= x.length; i++) {
            boolean at = i < x.length && Math.abs(x[i]) >= level && (run == 0 || Math.signum(x[i]) == Math.signum(x[runStart]));
            if (at) {
                if (run == 0) runStart = i;
                run++;
            } else {
                if (run >= o.clipRunSamples()) {
                    if (firstRow < 0) firstRow = runStart + 1;
                    runs++;
                }
                run = 0;
                if (i < x.length && Math.abs(x[i]) >= level) { runStart = i; run = 1; }
            }
        }
        if (firstRow > 0) {
            issues.add(new LogIssue(LogIssue.Severity.WARNING, name, firstRow, String.format(Locale.ROOT,
                    "current held at its extreme %.6g A for %d+ samples (%d run(s)): the drive likely saturated; the loop was not linear there, "
                            + "reduce the excitation or exclude those periods", max, o.clipRunSamples(), runs)));
        }
    }
}
