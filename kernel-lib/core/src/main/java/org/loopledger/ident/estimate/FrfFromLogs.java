package org.loopledger.ident.estimate;

import org.loopledger.frf.Frf;
import org.loopledger.ident.log.ColumnMap;
import org.loopledger.ident.log.DriveLog;
import org.loopledger.ident.log.DriveLogReader;
import org.loopledger.ident.log.LogCheckOptions;
import org.loopledger.ident.log.Quantity;
import org.loopledger.ident.spectral.PeriodDetection;
import org.loopledger.ident.spectral.PeriodicAverage;
import org.loopledger.lti.Motion;
import org.loopledger.lti.Units;
import org.loopledger.provenance.Provenance;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;

/**
 * Load cases from drive logs in one call: for every log file, read it (checks, SI units, SHA-256 recorded for the
 * tuning record), take the input, output and excitation columns by {@link Quantity}, average synchronously over whole
 * periods of the excitation ({@link PeriodicAverage}; period stated or detected by {@link PeriodDetection}) and keep
 * the FRF output/input on the excited lines within the band.
 *
 * <pre>{@code
 * LoadCases cases = FrfFromLogs.currentToVelocity().periodSamples(4094).bandHz(4, 4000)
 *         .load(List.of(Path.of("datasets/gantry-x-empty.csv"), Path.of("datasets/gantry-x-heavy-head.csv")));
 * TuningResult t = AutoTune.onMeasured(cases.plantCases(), drive, FilterChain.none(), spec);
 * }</pre>
 *
 * <p>An immutable settings value: every {@code with}-style method returns a new one. Defaults: columns by the log's
 * own header ({@code quantity_unit}, see {@code LogColumns}), {@link LogCheckOptions#defaults()}, the period detected
 * in the excitation column, one leading period skipped (the transient as the excitation starts; common practice),
 * every excited line.
 */
public final class FrfFromLogs {
    private final Quantity input, output, excitation;
    private final ColumnMap columns;
    private final LogCheckOptions checks;
    private final int periodSamples; // 0: detect
    private final int skipPeriods;
    private final double bandLowHz, bandHighHz;

    private FrfFromLogs(Quantity input, Quantity output, Quantity excitation, ColumnMap columns, LogCheckOptions checks, int periodSamples,
                        int skipPeriods, double bandLowHz, double bandHighHz) {
        this.input = input;
        this.output = output;
        this.excitation = excitation;
        this.columns = columns;
        this.checks = checks;
        this.periodSamples = periodSamples;
        this.skipPeriods = skipPeriods;
        this.bandLowHz = bandLowHz;
        this.bandHighHz = bandHighHz;
    }

    /**
     * The plant as the tuner reads it: measured current ({@link Quantity#CURRENT_MEASURED}, A) to velocity
     * ({@link Quantity#VELOCITY}, rad/s or m/s), excited by the injected current ({@link Quantity#CURRENT_INJECTED}).
     */
    public static FrfFromLogs currentToVelocity() {
        return of(Quantity.CURRENT_MEASURED, Quantity.VELOCITY, Quantity.CURRENT_INJECTED);
    }

    /**
     * Any FRF {@code output}/{@code input} between two logged quantities, on the lines excited by {@code excitation}
     * (for a closed-loop measurement: the signal injected into the loop).
     */
    public static FrfFromLogs of(Quantity input, Quantity output, Quantity excitation) {
        Objects.requireNonNull(input, "input quantity");
        Objects.requireNonNull(output, "output quantity");
        Objects.requireNonNull(excitation, "excitation quantity");
        if (input == Quantity.TIME || output == Quantity.TIME || excitation == Quantity.TIME) {
            throw new IllegalArgumentException("time is the log's time base, not a signal; name the input, output and excitation quantities (e.g. CURRENT_MEASURED, VELOCITY, CURRENT_INJECTED)");
        }
        if (input == output) throw new IllegalArgumentException("input and output are both " + input + "; an FRF needs two different quantities");
        return new FrfFromLogs(input, output, excitation, ColumnMap.of(), LogCheckOptions.defaults(), 0, 1, 0, Double.POSITIVE_INFINITY);
    }

    /** Reads the logs through this column map (file columns to quantities in SI units) instead of their own header. */
    public FrfFromLogs columns(ColumnMap map) {
        return new FrfFromLogs(input, output, excitation, Objects.requireNonNull(map, "column map"), checks, periodSamples, skipPeriods, bandLowHz, bandHighHz);
    }

    /** The log checks (e.g. {@code LogCheckOptions.defaults().withSampleRateHz(16000)} to check the time column against the drive's rate). */
    public FrfFromLogs checks(LogCheckOptions options) {
        return new FrfFromLogs(input, output, excitation, columns, Objects.requireNonNull(options, "log check options"), periodSamples, skipPeriods, bandLowHz, bandHighHz);
    }

    /**
     * The excitation's period in samples, as designed (a PRBS of order n with b samples per bit: (2<sup>n</sup> - 1)·b);
     * without it the period is detected in the excitation column.
     */
    public FrfFromLogs periodSamples(int samples) {
        if (samples < 4) throw new IllegalArgumentException("the excitation period must be at least 4 samples, got " + samples
                + "; give the designed period (PRBS: (2^order - 1) × samples per bit) or leave it out to detect it");
        return new FrfFromLogs(input, output, excitation, columns, checks, samples, skipPeriods, bandLowHz, bandHighHz);
    }

    /** Detects the period in every log's excitation column ({@link PeriodDetection#detect(double[], double)}); the default. */
    public FrfFromLogs detectPeriod() {
        return new FrfFromLogs(input, output, excitation, columns, checks, 0, skipPeriods, bandLowHz, bandHighHz);
    }

    /** Leading periods dropped before averaging (default 1, the start-up transient); 0 for a record that starts in steady state. */
    public FrfFromLogs skipPeriods(int periods) {
        if (periods < 0) throw new IllegalArgumentException("periods to skip must be 0 or more, got " + periods);
        return new FrfFromLogs(input, output, excitation, columns, checks, periodSamples, periods, bandLowHz, bandHighHz);
    }

    /** Keeps the excited lines from {@code lowHz} to {@code highHz} (inclusive); default every excited line. */
    public FrfFromLogs bandHz(double lowHz, double highHz) {
        if (!(lowHz >= 0) || !(highHz > lowHz)) {
            throw new IllegalArgumentException("band " + lowHz + " .. " + highHz + " Hz: give 0 <= low < high, in Hz");
        }
        return new FrfFromLogs(input, output, excitation, columns, checks, periodSamples, skipPeriods, lowHz, highHz);
    }

    /** Loads one log as one load case. */
    public LoadCaseEstimate load(String label, Path file) {
        Map<String, Path> one = new LinkedHashMap<>();
        one.put(label, file);
        return load(one).cases().get(0);
    }

    /** Loads each log as a load case labelled by its file name without the extension ({@code gantry-x-empty.csv} → "gantry-x-empty"). */
    public LoadCases load(List<Path> files) {
        Objects.requireNonNull(files, "files");
        Map<String, Path> byLabel = new LinkedHashMap<>();
        for (Path f : files) {
            Objects.requireNonNull(f, "file");
            String name = f.getFileName().toString();
            int dot = name.lastIndexOf('.');
            String label = dot > 0 ? name.substring(0, dot) : name;
            if (byLabel.put(label, f) != null) {
                throw new IllegalArgumentException("two logs would both be labelled '" + label + "' (" + byLabel.get(label) + ", " + f
                        + "); give the labels yourself with load(Map<String, Path>)");
            }
        }
        return load(byLabel);
    }

    /**
     * Loads each log as a load case under its label, in the map's order, which must be defined: a {@link LinkedHashMap}
     * or a {@link SortedMap} ({@code Map.of} has no order, so the load cases would come out shuffled). Every file is
     * checked to exist before the first is read.
     */
    public LoadCases load(Map<String, Path> labelToFile) {
        Objects.requireNonNull(labelToFile, "load cases");
        if (labelToFile.isEmpty()) throw new IllegalArgumentException("no logs given; give one file per load case");
        if (labelToFile.size() > 1 && !(labelToFile instanceof LinkedHashMap) && !(labelToFile instanceof SortedMap)) {
            throw new IllegalArgumentException("the load cases' order is undefined in a " + labelToFile.getClass().getSimpleName()
                    + " (Map.of has no order); put them into a LinkedHashMap in the order you want them shown");
        }
        List<String> missing = new ArrayList<>();
        for (var e : labelToFile.entrySet()) {
            if (e.getKey() == null || e.getKey().isBlank()) throw new IllegalArgumentException("give every log a label (e.g. \"heavy head\"); " + e.getValue() + " has none");
            Path f = Objects.requireNonNull(e.getValue(), "file of load case '" + e.getKey() + "'");
            if (!Files.isRegularFile(f)) missing.add("'" + e.getKey() + "': " + f + (Files.isDirectory(f) ? " is a folder" : " does not exist"));
        }
        if (!missing.isEmpty()) {
            throw new IllegalArgumentException("log file(s) not found: " + String.join("; ", missing) + " (relative paths start at "
                    + Path.of("").toAbsolutePath() + "); check the file names or run from the folder the paths are relative to");
        }
        List<LoadCaseEstimate> cases = new ArrayList<>();
        for (var e : labelToFile.entrySet()) cases.add(estimate(e.getKey(), e.getValue()));
        return new LoadCases(cases);
    }

    private LoadCaseEstimate estimate(String label, Path file) {
        DriveLog log;
        try {
            log = DriveLogReader.read(file, columns, checks);
        } catch (IOException ex) {
            throw new IllegalArgumentException("load case '" + label + "': cannot read " + file + ": " + ex.getMessage(), ex);
        } catch (IllegalArgumentException ex) {
            throw new IllegalArgumentException("load case '" + label + "': " + ex.getMessage(), ex);
        }
        String in = column(label, log, input, "input"), out = column(label, log, output, "output"), exc = column(label, log, excitation, "excitation");
        double fs = log.sampleRateHz();
        double[] r = log.column(exc), u = log.column(in), y = log.column(out);
        int period = periodSamples;
        if (period == 0) {
            try {
                period = PeriodDetection.detect(r, fs).periodSamples();
            } catch (IllegalArgumentException ex) {
                throw new IllegalArgumentException("load case '" + label + "': no period found in " + exc + " (" + ex.getMessage()
                        + "); state the designed period with periodSamples(...)", ex);
            }
        }
        int whole = r.length / period;
        if (whole - skipPeriods < 1) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT,
                    "load case '%s': the log holds %d whole period(s) of %d samples and %d are skipped, so none is left to average; "
                            + "record a longer log or skip fewer periods (skipPeriods(0) when it starts in steady state)", label, whole, period, skipPeriods));
        }
        PeriodicAverage avg = PeriodicAverage.of(fs, period, skipPeriods, r, u, y);
        Frf g;
        try {
            g = avg.frf(1, 2, 0, bandLowHz, bandHighHz);
        } catch (IllegalArgumentException ex) {
            throw new IllegalArgumentException("load case '" + label + "' (" + file.getFileName() + "): " + ex.getMessage(), ex);
        }
        Provenance.Dataset d = log.dataset().orElseThrow(() -> new IllegalStateException("the reader did not record " + file));
        return new LoadCaseEstimate(label, file, d, in, out, exc, fs, period, periodSamples == 0, avg.averagedPeriods(), g, motionOf(output, out), log.warnings());
    }

    /** The log's column holding {@code q} in one of its SI units; an error naming the columns there are and the fix when it is absent or ambiguous. */
    private String column(String label, DriveLog log, Quantity q, String role) {
        List<String> found = new ArrayList<>();
        for (String name : log.columnNames()) {
            for (String token : q.siTokens()) if (name.equals(q.key() + "_" + token)) found.add(name);
        }
        if (found.size() == 1) return found.get(0);
        if (found.isEmpty()) {
            throw new IllegalArgumentException("load case '" + label + "': the log " + log.source() + " has no " + role + " column for " + q
                    + " (expected " + String.join(" or ", q.siTokens().stream().map(t -> q.key() + "_" + t).toList()) + "); it has " + log.columnNames()
                    + ". Name the file's column with a ColumnMap, e.g. columns(ColumnMap.of().column(\"<file column>\", Quantity." + q.name()
                    + ", LogUnit...)), or choose another quantity");
        }
        throw new IllegalArgumentException("load case '" + label + "': the log " + log.source() + " has " + found.size() + " columns for " + q + " " + found
                + "; keep one (a ColumnMap naming only the one to use)");
    }

    /** Linear when the column's SI unit is in metres (m, m/s, m/s²), else rotary. */
    private static Motion motionOf(Quantity q, String column) {
        String token = column.substring(q.key().length() + 1);
        return token.equals("m") || token.startsWith("m_") ? Motion.LINEAR : Motion.ROTARY;
    }

    @Override public String toString() {
        return "FrfFromLogs[" + output + " / " + input + ", excited by " + excitation + ", period "
                + (periodSamples == 0 ? "detected" : periodSamples + " samples") + ", " + skipPeriods + " period(s) skipped, band "
                + (bandLowHz == 0 && Double.isInfinite(bandHighHz) ? "all excited lines" : Units.formatHz(bandLowHz) + " .. " + Units.formatHz(bandHighHz))
                + (columns.entries().isEmpty() ? "" : ", " + columns.entries().size() + " mapped column(s)") + "]";
    }
}
