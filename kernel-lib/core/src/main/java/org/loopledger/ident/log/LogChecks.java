package org.loopledger.ident.log;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * The checks a drive log must pass before estimation, on plain arrays (so they serve any reader): too
 * few rows, non-finite values (NaN, empty cells), non-monotonic time, gaps, jitter, a time base that does
 * not match the stated rate, an implausibly low rate (time in ms under a {@code time_s} header),
 * quantised timestamps, dead (constant) channels and clipped (saturated) current. Each issue names the
 * column and the first row where it occurs, and how many rows share it.
 *
 * <p>The nominal sample step is the stated one, else the span over the count, (t<sub>n-1</sub> − t<sub>0</sub>)/(n − 1):
 * unlike the median step it is not biased by timestamps printed to a coarse resolution (1 µs at 16 kHz
 * puts every step at 62 or 63 µs; the median would give 16.13 kHz, 0.8 % off). Steps are judged against
 * the nominal step with the timestamps' printed resolution allowed for.
 *
 * <p>Clipping is looked for in current columns ({@code _A}) other than the injected excitation (a PRBS is
 * flat by design): a run of {@code clipRunSamples} or more consecutive samples at the column's extreme value.
 */
public final class LogChecks {
    private LogChecks() {}

    /** All issues of the given columns; {@code time} is the time column (s), its printed resolution unknown. */
    public static List<LogIssue> check(double[] time, String[] names, double[][] columns, LogCheckOptions o) {
        return check(time, 0, names, columns, o);
    }

    /**
     * All issues of the given columns. {@code time} is the time column (s), or null when the time base
     * comes from a stated rate; {@code timeResolutionS} the last printed digit of the timestamps (0 unknown).
     */
    public static List<LogIssue> check(double[] time, double timeResolutionS, String[] names, double[][] columns, LogCheckOptions o) {
        return check(time != null ? time.length : columns.length > 0 ? columns[0].length : 0, time, timeResolutionS, names, columns, o);
    }

    /** As above on the first {@code n} values of each array (the reader's arrays may be longer than the log). */
    static List<LogIssue> check(int n, double[] time, double timeResolutionS, String[] names, double[][] columns, LogCheckOptions o) {
        List<LogIssue> issues = new ArrayList<>();
        if (n < o.minimumSamples()) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, time != null ? LogColumns.TIME : names.length > 0 ? names[0] : LogColumns.TIME, 0, String.format(Locale.ROOT,
                    "the log has %d rows, fewer than the %d needed; record longer", n, o.minimumSamples())));
        }
        if (time != null) checkFinite(LogColumns.TIME, time, n, issues);
        for (int c = 0; c < names.length; c++) checkFinite(names[c], columns[c], n, issues);
        if (time != null && n >= 2) checkTime(time, n, timeResolutionS, o, issues);
        for (int c = 0; c < names.length; c++) checkDead(names[c], columns[c], n, issues);
        for (int c = 0; c < names.length; c++) {
            if (!LogColumns.follows(names[c])) continue;
            LogColumns.Column col = LogColumns.parse(names[c]);
            if (col.siToken().equals("A") && !col.quantity().contains("injected")) checkClipping(names[c], columns[c], n, o, issues);
        }
        return issues;
    }

    /** The rate of a time column as the span over the count, (n − 1)/(t<sub>n-1</sub> − t<sub>0</sub>). */
    public static double rateFromTimeHz(double[] time) { return rateFromTimeHz(time, time.length); }

    static double rateFromTimeHz(double[] time, int n) {
        if (n < 2) throw new IllegalArgumentException("a rate needs at least 2 time stamps, got " + n);
        return (n - 1) / (time[n - 1] - time[0]);
    }

    private static void checkFinite(String name, double[] x, int n, List<LogIssue> issues) {
        int first = -1, count = 0;
        for (int i = 0; i < n; i++) {
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

    private static void checkDead(String name, double[] x, int n, List<LogIssue> issues) {
        if (n < 2) return;
        double v0 = x[0];
        for (int i = 1; i < n; i++) if (x[i] != v0) return;
        issues.add(new LogIssue(LogIssue.Severity.WARNING, name, 0, String.format(Locale.ROOT,
                "constant %s over all %d rows: a dead channel (not connected, wrong channel selected in the drive, or a zero scale)? "
                        + "a frequency response from it would be -infinity dB or undefined; check the drive's channel selection and the column map",
                Double.toString(v0), n)));
    }

    private static double medianOfSample(double[] t, int n) {
        int steps = n - 1;
        int stride = Math.max(1, steps / 10_001);
        double[] s = new double[(steps + stride - 1) / stride];
        int k = 0;
        for (int i = 0; i < steps && k < s.length; i += stride) s[k++] = t[i + 1] - t[i];
        s = Arrays.copyOf(s, k);
        Arrays.sort(s);
        return s[s.length / 2];
    }

    private static void checkTime(double[] t, int n, double res, LogCheckOptions o, List<LogIssue> issues) {
        int firstBad = -1, bad = 0;
        for (int i = 1; i < n; i++) {
            double d = t[i] - t[i - 1];
            if (!(d > 0) && Double.isFinite(d)) {
                if (firstBad < 0) firstBad = i;
                bad++;
            }
        }
        if (firstBad >= 0) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, firstBad + 1, String.format(Locale.ROOT,
                    "time does not increase (%.9g s after %.9g s)%s; sort the log or cut it at the restart", t[firstBad], t[firstBad - 1],
                    bad > 1 ? ", " + bad + " rows in all" : "")));
            return;
        }
        if (!Double.isFinite(t[0]) || !Double.isFinite(t[n - 1])) return;
        double stated = o.expectedSampleRateHz();
        double fromTime = rateFromTimeHz(t, n);
        double median = medianOfSample(t, n);
        if (!Double.isNaN(stated) && Math.abs(fromTime - stated) / stated > o.jitterErrorFraction()) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, 0, String.format(Locale.ROOT,
                    "the time column gives %.6g Hz (span over count), which does not match the stated sample rate %.6g Hz; check the rate or the time unit "
                            + "(time in ms under a time_s header? rename it time_ms)", fromTime, stated)));
            return;
        }
        double nominal = Double.isNaN(stated) ? 1 / fromTime : 1 / stated;
        // rounding of the printed timestamps moves a single step by up to one resolution; plus float error of the subtraction
        double allow = res * (1 + 1e-9) + 4 * Math.ulp(Math.max(Math.abs(t[0]), Math.abs(t[n - 1])));
        int gapRow = -1, gaps = 0, jitErrRow = -1, jitErr = 0, jitWarnRow = -1, jitWarn = 0;
        double worst = 0, gapStep = 0, errStep = 0, worstRaw = 0;
        double gapLimit = o.gapFactor() * Math.min(median, nominal) + allow;
        for (int i = 1; i < n; i++) {
            double d = t[i] - t[i - 1];
            if (!Double.isFinite(d)) continue;
            worstRaw = Math.max(worstRaw, Math.abs(d - nominal));
            double dev = Math.max(0, Math.abs(d - nominal) - allow) / nominal;
            worst = Math.max(worst, dev);
            if (d > gapLimit) { if (gapRow < 0) { gapRow = i + 1; gapStep = d; } gaps++; }
            else if (dev > o.jitterErrorFraction()) { if (jitErrRow < 0) { jitErrRow = i + 1; errStep = d; } jitErr++; }
            else if (dev > o.jitterWarningFraction()) { if (jitWarnRow < 0) jitWarnRow = i + 1; jitWarn++; }
        }
        if (gapRow > 0) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, gapRow, String.format(Locale.ROOT,
                    "gap: time step %.6g s is more than %.3g times the step %.6g s%s; samples are missing, cut the record there",
                    gapStep, o.gapFactor(), Math.min(median, nominal), gaps > 1 ? " (" + gaps + " gaps in all)" : "")));
            return;
        }
        if (jitErrRow > 0) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, jitErrRow, String.format(Locale.ROOT,
                    "jitter: time step %.6g s deviates %.1f %% from the nominal %.6g s (limit %.1f %%%s)%s; the sampling is not regular",
                    errStep, 100 * Math.abs(errStep - nominal) / nominal, nominal, 100 * o.jitterErrorFraction(),
                    res > 0 ? String.format(Locale.ROOT, " beyond the %.3g s print resolution", res) : "",
                    jitErr > 1 ? ", " + jitErr + " steps in all" : "")));
        }
        if (jitWarnRow > 0) {
            issues.add(new LogIssue(LogIssue.Severity.WARNING, LogColumns.TIME, jitWarnRow, String.format(Locale.ROOT,
                    "jitter: %d time step(s) deviate more than %.1f %% from the nominal %.6g s (worst %.2f %%); spectra assume regular sampling",
                    jitWarn, 100 * o.jitterWarningFraction(), nominal, 100 * worst)));
        }
        if (res > 0 && worstRaw > 64 * Math.ulp(Math.abs(t[n - 1])) && worstRaw <= allow) {
            issues.add(new LogIssue(LogIssue.Severity.WARNING, LogColumns.TIME, 0, String.format(Locale.ROOT,
                    "timestamps are printed to %.3g s, %.3g %% of the %.6g s step: single steps are off by up to that, so the rate is %s "
                            + "(the median step would give %.6g Hz); export time with more digits or state the rate",
                    res, 100 * res / nominal, nominal,
                    Double.isNaN(stated) ? String.format(Locale.ROOT, "the span over the count, %.8g Hz", fromTime) : String.format(Locale.ROOT, "the stated %.8g Hz", stated),
                    1 / median)));
        }
        if (!Double.isNaN(stated)) {
            double rel = Math.abs(fromTime - stated) / stated;
            if (rel > o.jitterErrorFraction()) {
                // reported before the step checks, which would only repeat it
            } else if (rel > Math.max(1e-4, 2 * res * fromTime / (n - 1))) {
                issues.add(new LogIssue(LogIssue.Severity.WARNING, LogColumns.TIME, 0, String.format(Locale.ROOT,
                        "the time column gives %.8g Hz, %.3g %% from the stated %.8g Hz; the stated rate is used", fromTime, 100 * rel, stated)));
            }
        } else if (fromTime < o.minimumPlausibleRateHz()) {
            issues.add(new LogIssue(LogIssue.Severity.ERROR, LogColumns.TIME, 0, String.format(Locale.ROOT,
                    "the time column gives %s Hz, below the %s Hz expected of a drive log: time in milliseconds under a time_s header? "
                            + "rename the column time_ms (or map it with LogUnit.milliseconds()), or state the rate with LogCheckOptions.withSampleRateHz(...); "
                            + "for a slow log lower the limit with withMinimumPlausibleRateHz(...)", LogUnit.fmt(fromTime), LogUnit.fmt(o.minimumPlausibleRateHz()))));
        }
    }

    private static void checkClipping(String name, double[] x, int n, LogCheckOptions o, List<LogIssue> issues) {
        double max = 0;
        for (int i = 0; i < n; i++) if (Double.isFinite(x[i])) max = Math.max(max, Math.abs(x[i]));
        if (max == 0) return;
        double level = max * (1 - 1e-9);
        int run = 0, runStart = -1, firstRow = -1, runs = 0;
        for (int i = 0; i <= n; i++) {
            boolean at = i < n && Math.abs(x[i]) >= level && (run == 0 || Math.signum(x[i]) == Math.signum(x[runStart]));
            if (at) {
                if (run == 0) runStart = i;
                run++;
            } else {
                if (run >= o.clipRunSamples()) {
                    if (firstRow < 0) firstRow = runStart + 1;
                    runs++;
                }
                run = 0;
                if (i < n && Math.abs(x[i]) >= level) { runStart = i; run = 1; }
            }
        }
        if (firstRow > 0) {
            issues.add(new LogIssue(LogIssue.Severity.WARNING, name, firstRow, String.format(Locale.ROOT,
                    "current held at its extreme %.6g A for %d+ samples (%d run(s)): the drive likely saturated; the loop was not linear there, "
                            + "reduce the excitation or exclude those periods", max, o.clipRunSamples(), runs)));
        }
    }
}
