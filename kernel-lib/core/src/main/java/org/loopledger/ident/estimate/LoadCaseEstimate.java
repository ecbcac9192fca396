package org.loopledger.ident.estimate;

import org.loopledger.frf.Frf;
import org.loopledger.ident.log.LogIssue;
import org.loopledger.ident.log.Quantity;
import org.loopledger.lti.Motion;
import org.loopledger.lti.Units;
import org.loopledger.provenance.Provenance;
import org.loopledger.tune.PlantCase;

import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * One load case estimated from one log by {@link FrfFromLogs}: where it came from (label, file, the file's
 * SHA-256 as recorded for the tuning record), which columns were used, the excitation period, and the
 * frequency response with its coherence. Immutable; the {@link Frf} is itself immutable.
 *
 * @param label            the load case's name (e.g. "heavy head")
 * @param file             the log file as given
 * @param dataset          the file as read and recorded by {@link Provenance} (path, size in bytes, SHA-256)
 * @param inputColumn      the log column used as FRF input, SI name (e.g. {@code current_measured_A})
 * @param outputColumn     the log column used as FRF output, SI name (e.g. {@code velocity_rad_s})
 * @param excitationColumn the log column holding the excitation, SI name (e.g. {@code current_injected_A})
 * @param sampleRateHz     the log's sample rate, Hz
 * @param periodSamples    the excitation period used for the synchronous average, samples
 * @param periodDetected   true when the period was detected in the excitation column, false when stated
 * @param averagedPeriods  how many whole periods were averaged (after the skipped ones)
 * @param frf              output over input on the excited lines within the band (units of the columns, e.g. (rad/s)/A)
 * @param motion           {@link Motion#LINEAR} when the output column is in metres (m, m/s), else {@link Motion#ROTARY}
 * @param warnings         the log checks' warnings (structured: severity, column, row, message)
 */
public record LoadCaseEstimate(String label, Path file, Provenance.Dataset dataset, String inputColumn, String outputColumn,
                               String excitationColumn, double sampleRateHz, int periodSamples, boolean periodDetected,
                               int averagedPeriods, Frf frf, Motion motion, List<LogIssue> warnings) {
    public LoadCaseEstimate {
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(dataset, "dataset");
        Objects.requireNonNull(frf, "frf");
        Objects.requireNonNull(motion, "motion");
        warnings = List.copyOf(warnings);
    }

    /** The SHA-256 of the log file's bytes (hex), as recorded for the tuning record. */
    public String sha256() { return dataset.sha256(); }

    /** The lowest coherence over the FRF's lines; empty when a single period was averaged (no coherence without scatter). */
    public OptionalDouble minCoherence() {
        return frf.coherence().map(c -> java.util.Arrays.stream(c).min()).orElse(OptionalDouble.empty());
    }

    /** The frequency of the lowest coherence, Hz; empty as {@link #minCoherence()}. */
    public OptionalDouble minCoherenceHz() {
        if (frf.coherence().isEmpty()) return OptionalDouble.empty();
        double[] c = frf.coherence().get(), f = frf.frequencyHz();
        int at = 0;
        for (int i = 1; i < c.length; i++) if (c[i] < c[at]) at = i;
        return OptionalDouble.of(f[at]);
    }

    /** The first FRF line, Hz. */
    public double bandLowHz() { return frf.frequencyHz()[0]; }

    /** The last FRF line, Hz. */
    public double bandHighHz() { return frf.frequencyHz()[frf.size() - 1]; }

    /** The line spacing of the average, fs/P, Hz. */
    public double lineSpacingHz() { return sampleRateHz / periodSamples; }

    /**
     * This load case for the tuner ({@link PlantCase} with this label, FRF and motion). Throws unless the FRF runs
     * from a current (or force or torque) to a velocity, which is what the tuner reads.
     */
    public PlantCase plantCase() {
        if (!outputColumn.startsWith(Quantity.VELOCITY.key() + "_")) {
            throw new IllegalArgumentException("load case '" + label + "' is an FRF to " + outputColumn + ", but the tuner needs the plant to velocity; "
                    + "estimate it with output Quantity.VELOCITY (FrfFromLogs.currentToVelocity())");
        }
        return PlantCase.of(label, frf, motion);
    }

    @Override public String toString() {
        OptionalDouble c = minCoherence();
        return "LoadCaseEstimate[" + label + ": " + file.getFileName() + ", " + inputColumn + " -> " + outputColumn + ", " + frf.size() + " lines "
                + Units.formatHz(bandLowHz()) + " .. " + Units.formatHz(bandHighHz())
                + (c.isPresent() ? ", min coherence " + Units.g4(c.getAsDouble()) : ", no coherence (one period)")
                + (warnings.isEmpty() ? "" : ", " + warnings.size() + " log warning(s)") + "]";
    }
}
