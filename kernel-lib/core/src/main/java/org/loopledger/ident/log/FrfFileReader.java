package org.loopledger.ident.log;

import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;
import org.loopledger.provenance.Provenance;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;

/**
 * Reads a frequency response exported by a drive or an analyser (delimited text, any {@link LogFormat})
 * straight into an {@link Frf}: frequency in Hz with magnitude (dB or ratio) and phase (deg or rad), or
 * real and imaginary parts, optional coherence ({@link FrfColumns}). The file is recorded for the tuning
 * record. Frequencies must be positive and strictly increasing; a refusal names the file and line.
 */
public final class FrfFileReader {
    private FrfFileReader() {}

    /** The parsed response with the file's {@code # key = value} metadata. */
    public record Result(Frf frf, Map<String, String> metadata) {}

    /** Format and columns detected. */
    public static Frf read(Path file) throws IOException { return read(file, LogFormat.detect(), FrfColumns.detect()).frf(); }

    public static Result read(Path file, LogFormat format, FrfColumns columns) throws IOException {
        DelimitedText.Table t;
        try (InputStream in = Files.newInputStream(file)) {
            t = DelimitedText.read(file.toString(), in, Files.size(file), format);
        }
        Result r = build(file.toString(), t, columns);
        Provenance.recordDataset(file);
        return r;
    }

    public static Result readString(String source, String text, LogFormat format, FrfColumns columns) {
        try {
            byte[] b = text.getBytes(format.charset());
            return build(source, DelimitedText.read(source, new ByteArrayInputStream(b), b.length, format), columns);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    private static Result build(String source, DelimitedText.Table t, FrfColumns spec) {
        String where = source + ": line " + t.headerLine() + " (header)";
        FrfColumns c = spec.resolve(where, t.names());
        double[] f = col(where, t, c.frequencyHz);
        int n = t.rows();
        double[] re = new double[n], im = new double[n];
        if (c.magnitude != null) {
            double[] mag = col(where, t, c.magnitude), ph = col(where, t, c.phase);
            for (int i = 0; i < n; i++) {
                double m = c.magUnit == FrfColumns.MagUnit.DB ? Units.dbToRatio(mag[i]) : mag[i];
                double p = c.phaseUnit == FrfColumns.PhaseUnit.DEG ? Units.degToRad(ph[i]) : ph[i];
                if (c.magUnit == FrfColumns.MagUnit.RATIO && !(m >= 0)) {
                    throw new IllegalArgumentException(String.format(Locale.ROOT, "%s: %s, column '%s': magnitude %s is negative or not a number; "
                            + "a ratio magnitude is >= 0 (is the column in dB? pass .magnitudeDb(\"%s\"))", source, line(t, i), c.magnitude, mag[i], c.magnitude));
                }
                re[i] = m * Math.cos(p);
                im[i] = m * Math.sin(p);
            }
        } else {
            re = col(where, t, c.real);
            im = col(where, t, c.imag);
        }
        for (int i = 0; i < n; i++) {
            if (!(f[i] > 0) || !Double.isFinite(f[i])) {
                throw new IllegalArgumentException(String.format(Locale.ROOT, "%s: %s, column '%s': frequency %s Hz; frequencies must be positive and finite "
                        + "(drop a DC line)", source, line(t, i), c.frequencyHz, f[i]));
            }
            if (i > 0 && !(f[i] > f[i - 1])) {
                throw new IllegalArgumentException(String.format(Locale.ROOT, "%s: %s, column '%s': frequency %s Hz is not above the previous %s Hz; "
                        + "sort the file by frequency and drop duplicates", source, line(t, i), c.frequencyHz, f[i], f[i - 1]));
            }
            if (!Double.isFinite(re[i]) || !Double.isFinite(im[i])) {
                throw new IllegalArgumentException(String.format(Locale.ROOT, "%s: %s: the response at %s Hz is not finite (empty or NaN cell?); "
                        + "repair or drop that line", source, line(t, i), f[i]));
            }
        }
        Frf frf = Frf.ofPartsHz(f, re, im);
        if (c.coherence != null) {
            double[] coh = col(where, t, c.coherence);
            for (int i = 0; i < n; i++) {
                if (!(coh[i] >= 0 && coh[i] <= 1 + 1e-12)) {
                    throw new IllegalArgumentException(String.format(Locale.ROOT, "%s: %s, column '%s': coherence %s is outside [0, 1]; "
                            + "is it in percent? divide by 100 before reading", source, line(t, i), c.coherence, coh[i]));
                }
            }
            frf = frf.withCoherence(coh);
        }
        return new Result(frf, t.metadata());
    }

    private static String line(DelimitedText.Table t, int row) {
        return t.contiguous() ? "line " + (t.firstDataLine() + row) : "data row " + (row + 1);
    }

    private static double[] col(String where, DelimitedText.Table t, String name) {
        for (int i = 0; i < t.names().length; i++) if (t.names()[i].equals(name)) return java.util.Arrays.copyOf(t.columns()[i], t.rows());
        throw new IllegalArgumentException(where + ": no column '" + name + "'; the columns are " + java.util.Arrays.toString(t.names()));
    }
}
