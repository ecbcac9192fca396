package org.loopledger.ident.excitation;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;

/**
 * A sampled excitation signal that knows its sample rate and its period: {@code periods} repetitions
 * of one period of {@code periodSamples} samples. Periodic estimation (synchronous averaging) uses the
 * period to stay leakage-free. Immutable; arrays are copied out.
 */
public final class ExcitationSignal {
    private final String description;
    private final double sampleRateHz;
    private final double[] onePeriod;
    private final int periods;

    private ExcitationSignal(String description, double sampleRateHz, double[] onePeriod, int periods) {
        this.description = description;
        this.sampleRateHz = sampleRateHz;
        this.onePeriod = onePeriod;
        this.periods = periods;
    }

    /** From one period of samples (copied), repeated {@code periods} times. */
    public static ExcitationSignal ofPeriod(String description, double sampleRateHz, double[] onePeriod, int periods) {
        requireRate(sampleRateHz);
        if (onePeriod.length < 2) throw new IllegalArgumentException("an excitation period needs at least 2 samples, got " + onePeriod.length);
        if (periods < 1) throw new IllegalArgumentException("number of periods must be at least 1, got " + periods);
        for (int i = 0; i < onePeriod.length; i++) {
            if (!Double.isFinite(onePeriod[i])) throw new IllegalArgumentException("excitation sample " + i + " is " + onePeriod[i] + "; all samples must be finite");
        }
        return new ExcitationSignal(description, sampleRateHz, onePeriod.clone(), periods);
    }

    static void requireRate(double sampleRateHz) {
        if (!(sampleRateHz > 0) || Double.isInfinite(sampleRateHz)) {
            throw new IllegalArgumentException("sample rate must be finite and positive, got " + sampleRateHz + " Hz");
        }
    }

    public String description() { return description; }

    public double sampleRateHz() { return sampleRateHz; }

    public double sampleTimeS() { return 1.0 / sampleRateHz; }

    public int periodSamples() { return onePeriod.length; }

    public double periodS() { return onePeriod.length / sampleRateHz; }

    public int periods() { return periods; }

    public int totalSamples() { return onePeriod.length * periods; }

    public double durationS() { return totalSamples() / sampleRateHz; }

    /** Frequency spacing of the period's lines, fs/P, in Hz. */
    public double lineSpacingHz() { return sampleRateHz / onePeriod.length; }

    /** One period (copy). */
    public double[] onePeriod() { return onePeriod.clone(); }

    /** All periods one after the other (copy). */
    public double[] samples() {
        double[] s = new double[totalSamples()];
        for (int p = 0; p < periods; p++) System.arraycopy(onePeriod, 0, s, p * onePeriod.length, onePeriod.length);
        return s;
    }

    public double peak() {
        double m = 0;
        for (double v : onePeriod) m = Math.max(m, Math.abs(v));
        return m;
    }

    public double rms() {
        double s = 0;
        for (double v : onePeriod) s += v * v;
        return Math.sqrt(s / onePeriod.length);
    }

    /** Peak over RMS. */
    public double crestFactor() { return peak() / rms(); }

    /** The same signal repeated a different number of times. */
    public ExcitationSignal withPeriods(int newPeriods) { return ofPeriod(description, sampleRateHz, onePeriod, newPeriods); }

    /**
     * Writes {@code time_s,<column>} rows for a drive to play (header convention of
     * {@link org.loopledger.ident.log.LogColumns}); time is k/fs; numbers in Java's shortest round-trip form, so reading them back is exact.
     */
    public void writeCsv(Path file, String valueColumn) throws IOException {
        if (valueColumn == null || !valueColumn.matches("[A-Za-z][A-Za-z0-9_]*")) {
            throw new IllegalArgumentException("column name '" + valueColumn + "' must be letters, digits and underscores, e.g. current_injected_A");
        }
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("time_s," + valueColumn + "\n");
            int n = totalSamples();
            for (int k = 0; k < n; k++) {
                w.write(Double.toString(k / sampleRateHz));
                w.write(',');
                w.write(Double.toString(onePeriod[k % onePeriod.length]));
                w.write('\n');
            }
        }
    }

    @Override public boolean equals(Object o) {
        return o instanceof ExcitationSignal e && e.sampleRateHz == sampleRateHz && e.periods == periods && Arrays.equals(e.onePeriod, onePeriod)
                && e.description.equals(description);
    }

    @Override public int hashCode() { return Arrays.hashCode(onePeriod) * 31 + periods; }

    @Override public String toString() {
        return String.format(Locale.ROOT, "%s: %d samples per period (%.6g s) at %.6g Hz, %d period(s), peak %.4g, rms %.4g",
                description, periodSamples(), periodS(), sampleRateHz, periods, peak(), rms());
    }
}
