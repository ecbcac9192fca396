package org.loopledger.display;

import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.tune.Resonance;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The resonances found in several load cases in one table, one row per case: the main (first) peak's frequency,
 * its height above the rigid-body trend, half-power width and damping estimate, how many other peaks were found,
 * and, when the true parameters are known (synthetic data), the true resonance and damping and the frequency error
 * in percent. Units in the headers; a peak whose damping the grid does not resolve is marked in its row, and every
 * resonance warning is listed below the table.
 *
 * <pre>{@code
 * ResonanceTable.builder().row("empty", Resonances.find(frf, 6), DemoDatasets.truth(EMPTY_CARRIAGE)).build()
 * }</pre>
 */
public final class ResonanceTable implements Displayable {
    private record Entry(String label, List<Resonance> found, TwoMassParameters truth) {}

    private final String title;
    private final List<Entry> entries;

    private ResonanceTable(String title, List<Entry> entries) {
        if (entries.isEmpty()) throw new IllegalArgumentException("a resonance table needs at least one load case; add rows with row(label, resonances)");
        this.title = title;
        this.entries = List.copyOf(entries);
    }

    public static Builder builder() { return new Builder(); }

    private boolean anyTruth() { return entries.stream().anyMatch(e -> e.truth() != null); }

    HtmlTable table() {
        boolean truth = anyTruth();
        List<String> header = new ArrayList<>(List.of("Load case", "Found (Hz)"));
        if (truth) header.addAll(List.of("Truth (Hz)", "Error (%)"));
        header.addAll(List.of("Above trend (dB)", "Half-power width (Hz)", "Damping ζ, estimate"));
        if (truth) header.add("Damping ζ, truth");
        header.add("Other peaks found");
        HtmlTable t = HtmlTable.of(title, header.toArray(String[]::new));
        for (Entry e : entries) {
            List<String> cells = new ArrayList<>();
            cells.add(e.label());
            if (e.found().isEmpty()) {
                cells.add("none found");
                if (truth) cells.addAll(List.of(e.truth() == null ? Figures.NONE : Figures.num(e.truth().resonanceHz()), Figures.NONE));
                cells.addAll(List.of(Figures.NONE, Figures.NONE, Figures.NONE));
                if (truth) cells.add(e.truth() == null ? Figures.NONE : Figures.num(e.truth().resonanceDamping()));
                cells.add("0");
                t.rowWithClass("fail", cells.toArray(String[]::new));
                continue;
            }
            Resonance r = e.found().get(0);
            cells.add(Figures.num(r.frequencyHz()));
            if (truth) {
                cells.add(e.truth() == null ? Figures.NONE : Figures.num(e.truth().resonanceHz()));
                cells.add(e.truth() == null ? Figures.NONE : signedFixed2(100 * (r.frequencyHz() / e.truth().resonanceHz() - 1)));
            }
            cells.add(Figures.num(r.prominenceDb()));
            cells.add(Figures.num(r.halfPowerWidthHz()));
            cells.add(Figures.num(r.dampingEstimate()) + (r.dampingResolved() ? "" : " (not resolved)"));
            if (truth) cells.add(e.truth() == null ? Figures.NONE : Figures.num(e.truth().resonanceDamping()));
            cells.add(String.valueOf(e.found().size() - 1));
            t.row(cells.toArray(String[]::new));
        }
        return t;
    }

    /** A percentage with its sign and two decimals ("+1.08", "-0.25", "0.00"). */
    private static String signedFixed2(double v) {
        return Math.abs(v) < 0.005 ? "0.00" : String.format(java.util.Locale.ROOT, "%+.2f", v);
    }

    private List<String> warnings() {
        List<String> w = new ArrayList<>();
        for (Entry e : entries) {
            if (e.found().isEmpty()) w.add(e.label() + ": no resonance found above the threshold");
            for (Resonance r : e.found()) for (var x : r.warnings()) w.add(e.label() + ": " + x.message());
        }
        return w;
    }

    @Override public String toString() {
        StringBuilder t = new StringBuilder(table().toText());
        for (String w : warnings()) t.append("warning: ").append(w).append('\n');
        return t.toString().stripTrailing();
    }

    @Override public MimeBundle toMimeBundle() {
        StringBuilder h = new StringBuilder("<div class=\"loopledger-resonances\">");
        table().appendTo(h);
        List<String> warnings = warnings();
        if (!warnings.isEmpty()) {
            h.append("<ul class=\"loopledger-warnings\">");
            for (String w : warnings) h.append("<li>").append(HtmlEscape.escape(w)).append("</li>");
            h.append("</ul>");
        }
        return MimeBundle.builder(toString()).put(MimeBundle.TEXT_HTML, h.append("</div>").toString()).build();
    }

    /** Collects load cases in order. */
    public static final class Builder {
        private final List<Entry> entries = new ArrayList<>();
        private String title = "Resonances found per load case";

        private Builder() {}

        /** The resonances found on one load case (as {@code Resonances.find} returns them, main peak first). */
        public Builder row(String label, List<Resonance> found) { return row(label, found, null); }

        /** The resonances found and the true parameters ({@code null} when unknown). */
        public Builder row(String label, List<Resonance> found, TwoMassParameters truth) {
            entries.add(new Entry(Objects.requireNonNull(label, "label"), List.copyOf(Objects.requireNonNull(found, "found")), truth));
            return this;
        }

        public Builder title(String title) {
            this.title = Objects.requireNonNull(title, "title");
            return this;
        }

        public ResonanceTable build() { return new ResonanceTable(title, entries); }
    }
}
