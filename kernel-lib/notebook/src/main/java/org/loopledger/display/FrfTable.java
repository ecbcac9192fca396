package org.loopledger.display;

import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * Frequency responses side by side at a few chosen frequencies, one row per frequency: |G| in dB and the phase in
 * degrees of each response; with {@link #withCoherenceAndError()}, also the coherence and the relative standard error
 * (standard deviation over |G|, in percent) of each measured response that carries them.
 *
 * <p>A measured response is read at its line nearest each frequency asked, never interpolated: a measured line is
 * what was measured, and estimates on different grids (Welch bins, periodic-average lines) are compared line by line.
 * Where a response's lines are not exactly at the frequencies asked, a column gives the line read. Below the table,
 * each measured response's lines and band (and, with coherence shown, its lowest coherence and where). A model
 * ({@link TransferFunction}) is evaluated exactly at the frequencies asked. The phase is the unwrapped phase
 * ({@link Frf#phaseDegUnwrapped()}) of the whole response.
 *
 * <pre>{@code
 * FrfTable.atHz(20, 100, 300).add("measured", g).add("1/C", controllerInverse)
 * }</pre>
 * Immutable: {@code add} returns a new table.
 */
public final class FrfTable implements Displayable {
    private record Entry(String label, Frf frf, boolean model) {}

    private final String title;
    private final double[] hz;
    private final List<Entry> entries;
    private final boolean quality;

    private FrfTable(String title, double[] hz, List<Entry> entries, boolean quality) {
        this.title = title;
        this.hz = hz;
        this.entries = List.copyOf(entries);
        this.quality = quality;
    }

    /** A table at these frequencies in Hz (positive, any order; rows follow the order given). */
    public static FrfTable atHz(double... hz) {
        Objects.requireNonNull(hz, "hz");
        if (hz.length == 0) throw new IllegalArgumentException("give at least one frequency in Hz, e.g. FrfTable.atHz(10, 100, 1000)");
        for (double f : hz) {
            if (!(f > 0) || !Double.isFinite(f)) throw new IllegalArgumentException("frequencies must be positive and finite (Hz), got " + f);
        }
        return new FrfTable("Frequency responses at chosen frequencies", hz.clone(), List.of(), false);
    }

    /**
     * Adds a measured (or computed) response, read at its line nearest each frequency; a frequency more than one line
     * spacing outside the response's band is refused (no extrapolation).
     */
    public FrfTable add(String label, Frf frf) {
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(frf, () -> "frf of " + label);
        double[] f = frf.frequencyHz();
        double below = f.length > 1 ? f[1] - f[0] : 0, above = f.length > 1 ? f[f.length - 1] - f[f.length - 2] : 0;
        for (double x : hz) {
            if (x < f[0] - below || x > f[f.length - 1] + above) {
                throw new IllegalArgumentException(label + ": " + Units.formatHz(x) + " is outside the response's band " + Units.formatHz(f[0]) + " .. "
                        + Units.formatHz(f[f.length - 1]) + "; ask for frequencies inside it (no extrapolation)");
            }
        }
        return with(new Entry(label, frf, false));
    }

    /** Adds a model, evaluated exactly at the frequencies asked. */
    public FrfTable add(String label, TransferFunction model) {
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(model, () -> "model of " + label);
        double[] sorted = hz.clone();
        Arrays.sort(sorted);
        double[] w = Arrays.stream(sorted).distinct().map(Units::hzToRadPerS).toArray();
        return with(new Entry(label, Frf.ofModel(model, w), true));
    }

    /** The same table with another caption. */
    public FrfTable titled(String title) { return new FrfTable(Objects.requireNonNull(title, "title"), hz, entries, quality); }

    /** The same table with the coherence and relative standard error columns of the measured responses that carry them. */
    public FrfTable withCoherenceAndError() { return new FrfTable(title, hz, entries, true); }

    private FrfTable with(Entry e) {
        List<Entry> all = new ArrayList<>(entries);
        all.add(e);
        return new FrfTable(title, hz, all, quality);
    }

    /** Index of the line of {@code f} (increasing) nearest {@code x}. */
    static int nearest(double[] f, double x) {
        int i = Arrays.binarySearch(f, x);
        if (i >= 0) return i;
        int hi = -i - 1;
        if (hi == 0) return 0;
        if (hi == f.length) return f.length - 1;
        return x - f[hi - 1] <= f[hi] - x ? hi - 1 : hi;
    }

    /** Whether the response's line nearest some frequency asked is not that frequency (to 1e-9 relative). */
    private boolean offLine(Entry e) {
        if (e.model()) return false;
        double[] f = e.frf().frequencyHz();
        for (double x : hz) if (Math.abs(f[nearest(f, x)] - x) > 1e-9 * x) return true;
        return false;
    }

    private boolean showsCoherence(Entry e) { return quality && !e.model() && e.frf().hasCoherence(); }

    private boolean showsError(Entry e) { return quality && !e.model() && e.frf().uncertainty().isPresent(); }

    HtmlTable table() {
        if (entries.isEmpty()) throw new IllegalStateException("add at least one response with add(label, frf) or add(label, model)");
        List<String> header = new ArrayList<>(List.of("Frequency (Hz)"));
        for (Entry e : entries) {
            if (offLine(e)) header.add(e.label() + ": line (Hz)");
            header.add(e.label() + ": |G| (dB)");
            header.add(e.label() + ": phase (deg)");
            if (showsCoherence(e)) header.add(e.label() + ": coherence");
            if (showsError(e)) header.add(e.label() + ": rel. std. error (%)");
        }
        HtmlTable t = HtmlTable.of(title, header.toArray(String[]::new));
        for (double x : hz) {
            List<String> cells = new ArrayList<>(List.of(Figures.num(x)));
            for (Entry e : entries) {
                Frf g = e.frf();
                int i = nearest(g.frequencyHz(), x);
                double mag = Math.hypot(g.realAt(i), g.imagAt(i));
                if (offLine(e)) cells.add(Figures.num(g.frequencyHz()[i]));
                cells.add(Figures.fixed2(g.magnitudeDb()[i]));
                cells.add(Figures.fixed2(g.phaseDegUnwrapped()[i]));
                if (showsCoherence(e)) cells.add(Figures.num(g.coherence().orElseThrow()[i]));
                if (showsError(e)) cells.add(Figures.num(100 * g.uncertainty().orElseThrow()[i] / mag));
            }
            t.row(cells.toArray(String[]::new));
        }
        return t;
    }

    /** One line per measured response: lines, band, distance of the lines read from the frequencies asked, lowest coherence. */
    List<String> notes() {
        List<String> n = new ArrayList<>();
        for (Entry e : entries) {
            if (e.model()) {
                n.add(e.label() + ": model, evaluated at the frequencies asked");
                continue;
            }
            double[] f = e.frf().frequencyHz();
            double far = 0;
            for (double x : hz) far = Math.max(far, Math.abs(f[nearest(f, x)] - x));
            StringBuilder s = new StringBuilder(e.label() + ": " + f.length + " lines, " + Units.formatHz(f[0]) + " .. " + Units.formatHz(f[f.length - 1])
                    + "; read at the nearest line, " + (far == 0 ? "exactly at the frequencies asked" : "at most " + Units.formatHz(far) + " away"));
            if (showsCoherence(e)) {
                double[] c = e.frf().coherence().orElseThrow();
                int lo = 0;
                for (int i = 1; i < c.length; i++) if (c[i] < c[lo]) lo = i;
                s.append("; lowest coherence ").append(Figures.num(c[lo])).append(" at ").append(Units.formatHz(f[lo]));
            }
            n.add(s.toString());
        }
        return n;
    }

    @Override public String toString() { return TableWithNotes.text(table(), notes()); }

    @Override public MimeBundle toMimeBundle() { return TableWithNotes.bundle("loopledger-frf-table", table(), notes()); }
}
