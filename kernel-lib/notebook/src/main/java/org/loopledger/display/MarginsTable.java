package org.loopledger.display;

import org.loopledger.analysis.Margins;
import org.loopledger.analysis.MeasuredLoop;
import org.loopledger.analysis.PhaseCrossover;
import org.loopledger.analysis.Spec;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.Function;

/**
 * Margins of several loops on several load cases in one table, one row per (load case, loop): gain
 * crossover(s) in Hz, phase margin (deg), gain margin (dB), Ms and its frequency, delay margin (µs or ms)
 * and the closed-loop -3 dB bandwidth; "none in band" where measured data have no crossing. Below the
 * table, the worst phase margin, gain margin and Ms with where they occur, and, when a {@link Spec} is
 * given, its limit and the verdict: "meets" only when checked on every row, else by how much it is missed.
 *
 * <pre>{@code
 * MarginsTable.of(Map.of("heavy head", cascade.loops()), spec)       // load case -> loops in order
 * MarginsTable.builder().row("empty", "velocity", lv).row("empty", "position", lp).spec(spec).build()
 * }</pre>
 *
 * Only the phase margin, gain margin (increase) and Ms limits are checked here; any other limit of the
 * spec is named as not checked (use {@link Spec#check} for the full report). Immutable; the margins are
 * computed once, when the table is built.
 */
public final class MarginsTable implements Displayable {
    /** One row: the labels and the loop's margins. */
    public record Row(String loadCase, String loop, Margins margins) {
        public Row {
            Objects.requireNonNull(loadCase, "loadCase (use \"\" for none)");
            Objects.requireNonNull(loop, "loop (use \"\" for none)");
            Objects.requireNonNull(margins, "margins");
        }
    }

    private final String title;
    private final List<Row> rows;
    private final Spec spec;

    private MarginsTable(String title, List<Row> rows, Spec spec) {
        if (rows.isEmpty()) throw new IllegalArgumentException("a margins table needs at least one loop; add rows with row(loadCase, loop, loopGain)");
        this.title = title;
        this.rows = List.copyOf(rows);
        this.spec = spec;
    }

    /** Starts a table; add rows in the order they should show. */
    public static Builder builder() { return new Builder(); }

    /** Load case label to its loops (loop label to loop gain), both in the maps' iteration order (use LinkedHashMap). */
    public static MarginsTable of(Map<String, ? extends Map<String, Frf>> loopsByLoadCase) {
        Builder b = builder();
        loopsByLoadCase.forEach((lc, loops) -> loops.forEach((loop, l) -> b.row(lc, loop, l)));
        return b.build();
    }

    /** As {@link #of(Map)}, with the spec's phase margin, gain margin and Ms limits checked. */
    public static MarginsTable of(Map<String, ? extends Map<String, Frf>> loopsByLoadCase, Spec spec) {
        return of(loopsByLoadCase).withSpec(spec);
    }

    /** The loops of one load case (loop label to loop gain, in order). */
    public static MarginsTable ofLoops(String loadCase, Map<String, Frf> loops) {
        return of(Map.of(loadCase, loops));
    }

    /** The same rows checked against {@code spec}. */
    public MarginsTable withSpec(Spec spec) { return new MarginsTable(title, rows, Objects.requireNonNull(spec, "spec")); }

    /** The same table with another caption. */
    public MarginsTable titled(String title) { return new MarginsTable(Objects.requireNonNull(title, "title"), rows, spec); }

    public List<Row> rows() { return rows; }

    public Optional<Spec> spec() { return Optional.ofNullable(spec); }

    public String title() { return title; }

    /** The lowest phase margin over the rows, where it is, and the verdict against the spec's minimum. */
    public WorstMargin worstPhaseMargin() {
        return worst("phase margin", "deg", m -> m.phaseMarginCrossover().map(g -> new double[] {g.phaseMarginDeg(), g.frequencyHz()}),
                spec == null ? OptionalDouble.empty() : spec.minPhaseMarginDeg(), true, "no gain crossover");
    }

    /** The lowest gain margin (increase) over the rows, where it is, and the verdict against the spec's minimum. */
    public WorstMargin worstGainMargin() {
        return worst("gain margin", "dB", m -> m.upperGainMargin().map(p -> new double[] {p.gainMarginDb(), p.frequencyHz()}),
                spec == null ? OptionalDouble.empty() : spec.minGainMarginDb(), true, "no phase crossover");
    }

    /** The highest Ms = max |S| over the rows, where it is, and the verdict against the spec's maximum. */
    public WorstMargin worstSensitivityPeak() {
        return worst("Ms", "", m -> Optional.of(new double[] {m.sensitivityPeak().magnitude(), m.sensitivityPeak().frequencyHz()}),
                spec == null ? OptionalDouble.empty() : spec.maxSensitivityPeak(), false, "");
    }

    /** Whether a spec was given and one of its checked limits is missed. */
    public boolean anyMissed() {
        return worstPhaseMargin().missed() || worstGainMargin().missed() || worstSensitivityPeak().missed();
    }

    private WorstMargin worst(String figure, String unit, Function<Margins, Optional<double[]>> get, OptionalDouble limit, boolean lowerIsWorse,
                              String noneWhy) {
        Row worstRow = null;
        double worst = Double.NaN, at = Double.NaN;
        int unchecked = 0;
        for (Row r : rows) {
            Optional<double[]> v = get.apply(r.margins());
            if (v.isEmpty()) {
                if (r.margins().measured()) unchecked++; // measured: nothing in band says nothing outside it
                continue;
            }
            double x = v.get()[0];
            if (worstRow == null || (lowerIsWorse ? x < worst : x > worst)) {
                worstRow = r;
                worst = x;
                at = v.get()[1];
            }
        }
        String lc = worstRow == null ? "" : worstRow.loadCase(), loop = worstRow == null ? "" : worstRow.loop();
        if (limit.isEmpty()) return new WorstMargin(figure, worst, unit, lc, loop, at, limit, spec == null ? "" : "no limit in the spec", false);
        double lim = limit.getAsDouble();
        String limText = (lowerIsWorse ? "min " : "max ") + format(lim, unit);
        int atEdge = 0; // Ms only: a peak at the edge of a measured band may be lower than the true peak outside it
        if (!lowerIsWorse) for (Row r : rows) if (r.margins().measured() && r.margins().sensitivityPeak().atBandEdge()) atEdge++;
        String uncheckedText = unchecked == 0 ? "" : "; not checked on " + unchecked + (unchecked == 1 ? " loop" : " loops") + " (" + noneWhy + " in the analysed band)";
        if (atEdge > 0) {
            uncheckedText += "; on " + atEdge + (atEdge == 1 ? " loop" : " loops") + " the peak is at the edge of the analysed band, so the true Ms may be higher";
            unchecked += atEdge;
        }
        if (worstRow == null) {
            return new WorstMargin(figure, worst, unit, lc, loop, at, limit, "limit " + limText + " not checked: " + noneWhy + " in band on any loop", false);
        }
        double slack = lowerIsWorse ? worst - lim : lim - worst;
        if (slack < 0) {
            return new WorstMargin(figure, worst, unit, lc, loop, at, limit, "MISSED by " + format(-slack, unit) + " (limit " + limText + ")" + uncheckedText, true);
        }
        String verdict = unchecked == 0
                ? "meets the limit " + limText + " with " + format(slack, unit) + " to spare"
                : "limit " + limText + " kept with " + format(slack, unit) + " to spare where checked" + uncheckedText;
        return new WorstMargin(figure, worst, unit, lc, loop, at, limit, verdict, false);
    }

    private static String format(double v, String unit) {
        return switch (unit) {
            case "deg" -> Units.formatDeg(v);
            case "dB" -> Units.formatDb(v);
            default -> Figures.num(v);
        };
    }

    /** The spec's limits this table does not check, named. */
    List<String> uncheckedLimits() {
        List<String> u = new ArrayList<>();
        if (spec == null) return u;
        if (spec.minBandwidthHz().isPresent()) u.add("minimum bandwidth " + Units.formatHz(spec.minBandwidthHz().getAsDouble()));
        if (spec.minLowerGainMarginDb().isPresent()) u.add("gain margin for a decrease " + Units.formatDb(spec.minLowerGainMarginDb().getAsDouble()));
        if (spec.maxComplementaryPeak().isPresent()) u.add("max Mt " + Units.g4(spec.maxComplementaryPeak().getAsDouble()));
        if (spec.minDelayMarginS().isPresent()) u.add("minimum delay margin " + Units.formatSeconds(spec.minDelayMarginS().getAsDouble()));
        if (spec.requiresStability()) u.add("closed-loop stability");
        return u;
    }

    HtmlTable table() {
        HtmlTable t = HtmlTable.of(title, "load case", "loop", "gain crossover(s) (Hz)", "PM (deg)", "GM (dB)", "Ms", "Ms at (Hz)", "delay margin",
                "bandwidth, -3 dB of T (Hz)");
        for (Row r : rows) {
            Margins m = r.margins();
            String none = m.measured() ? "none in band" : "no crossover";
            String cross = m.gainCrossovers().isEmpty() ? none
                    : String.join(", ", m.gainCrossovers().stream().map(g -> Figures.num(g.frequencyHz())).toList());
            String pm = m.phaseMarginCrossover().map(g -> Figures.fixed2(g.phaseMarginDeg())).orElse(none);
            String gm = m.upperGainMargin().map(p -> Figures.fixed2(p.gainMarginDb())).orElse(none);
            String dm = m.delayMarginS().isPresent() ? Units.formatSeconds(m.delayMarginS().getAsDouble()) : none;
            String bw = m.bandwidth().frequencyHz().isPresent() ? Figures.num(m.bandwidth().frequencyHz().getAsDouble()) : (m.measured() ? "none in band" : "none");
            t.rowWithClass(rowMisses(m) ? "fail" : "", r.loadCase(), r.loop(), cross, pm, gm, Figures.num(m.sensitivityPeak().magnitude()),
                    Figures.num(m.sensitivityPeak().frequencyHz()) + (m.sensitivityPeak().atBandEdge() ? " (band edge)" : ""), dm, bw);
        }
        return t;
    }

    private boolean rowMisses(Margins m) {
        if (spec == null) return false;
        boolean pm = spec.minPhaseMarginDeg().isPresent() && m.phaseMarginDeg().isPresent() && m.phaseMarginDeg().getAsDouble() < spec.minPhaseMarginDeg().getAsDouble();
        Optional<PhaseCrossover> up = m.upperGainMargin();
        boolean gm = spec.minGainMarginDb().isPresent() && up.isPresent() && up.get().gainMarginDb() < spec.minGainMarginDb().getAsDouble();
        boolean ms = spec.maxSensitivityPeak().isPresent() && m.sensitivityPeak().magnitude() > spec.maxSensitivityPeak().getAsDouble();
        return pm || gm || ms;
    }

    private List<WorstMargin> worsts() { return List.of(worstPhaseMargin(), worstGainMargin(), worstSensitivityPeak()); }

    /** The analyses' warnings, one line per distinct message, naming every row it applies to (in row order). */
    private List<String> warnings() {
        Map<String, List<String>> rowsByMessage = new LinkedHashMap<>();
        for (Row r : rows) for (var s : r.margins().warnings()) rowsByMessage.computeIfAbsent(s.message(), m -> new ArrayList<>()).add(label(r));
        List<String> w = new ArrayList<>();
        rowsByMessage.forEach((message, labels) -> w.add(String.join(", ", labels) + ": " + message));
        return w;
    }

    private static String label(Row r) {
        return r.loadCase().isEmpty() ? r.loop() : r.loop().isEmpty() ? r.loadCase() : r.loadCase() + " / " + r.loop();
    }

    /** The fixed-width text form: the table, the worst figures with their verdicts, unchecked limits, warnings. */
    @Override public String toString() {
        StringBuilder t = new StringBuilder(table().toText());
        for (WorstMargin w : worsts()) t.append(w).append('\n');
        List<String> u = uncheckedLimits();
        if (!u.isEmpty()) t.append("not checked by this table: ").append(String.join(", ", u)).append(" (use Spec.check on each loop)\n");
        for (String w : warnings()) t.append("warning: ").append(w).append('\n');
        return t.toString().stripTrailing();
    }

    @Override public MimeBundle toMimeBundle() {
        StringBuilder h = new StringBuilder("<div class=\"loopledger-margins-table\">");
        table().appendTo(h);
        HtmlTable s = HtmlTable.of(spec == null ? "Worst case over the rows (no spec given: nothing checked)" : "Worst case over the rows, against the spec",
                "Figure", "Worst", "Where", "Verdict");
        for (WorstMargin w : worsts()) s.rowWithClass(w.missed() ? "fail" : "", w.figure(), w.valueText(), w.where(), w.verdict());
        s.appendTo(h);
        List<String> u = uncheckedLimits();
        if (!u.isEmpty()) h.append("<p>Not checked by this table: ").append(HtmlEscape.escape(String.join(", ", u))).append(" (use Spec.check on each loop).</p>");
        List<String> warnings = warnings();
        if (!warnings.isEmpty()) {
            h.append("<ul class=\"loopledger-warnings\">");
            for (String w : warnings) h.append("<li>").append(HtmlEscape.escape(w)).append("</li>");
            h.append("</ul>");
        }
        return MimeBundle.builder(toString()).put(MimeBundle.TEXT_HTML, h.append("</div>").toString()).build();
    }

    /**
     * Collects rows in order; the margins are computed by {@link #build()}.
     *
     * <p>On measured loop gains the analysis estimates the net number of integrators from the low-frequency slope
     * and warns "net integrators estimated ... (state them with withIntegrators if known)". State them here, per
     * loop label (for every load case) with {@link #withIntegrators(String, int)}, or per row with
     * {@link #row(String, String, Frf, int)}. The count is the number of poles at s = 0 of the loop gain: for the
     * loops of a PIV cascade ({@code Cascade.loops()}) around a current-to-velocity plant with friction, one in the
     * velocity loop (the PI), one in the position loop (K<sub>p</sub>/s) and two in the plant-input loop; a plant
     * with a true integrator adds one to each loop it is in. Rows given as models ({@code TransferFunction}) or as
     * computed {@code Margins} are not affected.
     */
    public static final class Builder {
        private record Pending(String loadCase, String loop, Frf frf, Integer integrators, TransferFunction model, Margins margins) {}

        private final List<Pending> rows = new ArrayList<>();
        private final Map<String, Integer> integratorsByLoop = new java.util.HashMap<>();
        private String title = "Margins of every loop on every load case";
        private Spec spec;

        private Builder() {}

        /** A measured (or model-on-a-grid) loop gain; net integrators as stated for its loop label, else estimated. */
        public Builder row(String loadCase, String loop, Frf loopGain) {
            rows.add(new Pending(loadCase, loop, Objects.requireNonNull(loopGain, () -> "loop gain of " + loadCase + " / " + loop), null, null, null));
            return this;
        }

        /**
         * A measured loop gain with its net number of integrators stated (what the analysis otherwise estimates from
         * the low-frequency slope, with a warning): the count anchors the low-frequency phase at -90° per integrator
         * and counts the integrators as poles on the axis for the Nyquist criterion.
         *
         * @param integrators net integrators (poles at s = 0) of the loop gain, -3 .. 4
         */
        public Builder row(String loadCase, String loop, Frf loopGain, int integrators) {
            requirePlausible(integrators);
            rows.add(new Pending(loadCase, loop, Objects.requireNonNull(loopGain, () -> "loop gain of " + loadCase + " / " + loop), integrators, null, null));
            return this;
        }

        /** A model loop gain (crossings found exactly). */
        public Builder row(String loadCase, String loop, TransferFunction loopGain) {
            rows.add(new Pending(loadCase, loop, null, null, Objects.requireNonNull(loopGain, () -> "loop gain of " + loadCase + " / " + loop), null));
            return this;
        }

        /** Margins already computed (e.g. from {@code MeasuredLoop.of(frf).withIntegrators(n)}). */
        public Builder row(String loadCase, String loop, Margins margins) {
            rows.add(new Pending(loadCase, loop, null, null, null, Objects.requireNonNull(margins, "margins")));
            return this;
        }

        /** Every loop of one load case, in the map's order (e.g. a cascade's {@code loops()}). */
        public Builder rows(String loadCase, Map<String, Frf> loops) {
            loops.forEach((loop, l) -> row(loadCase, loop, l));
            return this;
        }

        /**
         * States the net number of integrators of every row given as an {@code Frf} whose loop is labelled {@code loop}, on every
         * load case, added before or after this call; a count given with {@link #row(String, String, Frf, int)}
         * takes precedence. Rows of model loop gains are not affected (their count is known).
         *
         * <pre>{@code
         * MarginsTable.builder().withIntegrators(Cascade.VELOCITY_LOOP, 1).withIntegrators(Cascade.POSITION_LOOP, 1)
         *         .withIntegrators(Cascade.PLANT_INPUT_LOOP, 2).rows("heavy head", cascade.loops()).spec(spec).build()
         * }</pre>
         *
         * @param loop        the loop label, as given to {@code row} or {@code rows}
         * @param integrators net integrators, -3 .. 4
         */
        public Builder withIntegrators(String loop, int integrators) {
            Objects.requireNonNull(loop, "loop label");
            requirePlausible(integrators);
            integratorsByLoop.put(loop, integrators);
            return this;
        }

        private static void requirePlausible(int integrators) {
            if (integrators < -3 || integrators > 4) {
                throw new IllegalArgumentException("net integrator count " + integrators + " is implausible; give a number in -3..4");
            }
        }

        public Builder spec(Spec spec) {
            this.spec = Objects.requireNonNull(spec, "spec");
            return this;
        }

        public Builder title(String title) {
            this.title = Objects.requireNonNull(title, "title");
            return this;
        }

        /** Computes every row's margins and builds the table. */
        public MarginsTable build() {
            List<Row> out = new ArrayList<>(rows.size());
            for (Pending p : rows) {
                Margins m;
                if (p.margins() != null) m = p.margins();
                else if (p.model() != null) m = Margins.of(p.model());
                else {
                    Integer n = p.integrators() != null ? p.integrators() : integratorsByLoop.get(p.loop());
                    m = n == null ? Margins.of(p.frf()) : Margins.of(MeasuredLoop.of(p.frf()).withIntegrators(n));
                }
                out.add(new Row(p.loadCase(), p.loop(), m));
            }
            return new MarginsTable(title, out, spec);
        }
    }
}
