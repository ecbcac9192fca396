package org.loopledger.display;

import org.loopledger.ident.fit.FitResult;
import org.loopledger.ident.fit.ParameterEstimate;
import org.loopledger.ident.fit.RigidBodyFit;
import org.loopledger.ident.fit.RigidBodyParameters;
import org.loopledger.ident.fit.TwoMassFit;
import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.lti.Motion;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Fitted model parameters of one or several fits (load cases) in one table: estimate, 95 % interval and
 * unit of every parameter, and, when the true values are known (synthetic data), the truth and whether
 * the interval covers it (if not, how many standard errors away it lies). One line per fit gives the
 * reduced chi-square and whether the fit's checks found it usable. Delays are shown in µs.
 *
 * <pre>{@code
 * FitTable.builder().row("empty", fitEmpty, truthEmpty).row("heavy", fitHeavy, truthHeavy).build()
 * }</pre>
 */
public final class FitTable implements Displayable {
    private record Entry(String label, FitResult fit, Motion motion, List<OptionalDouble> truth) {}

    private final String title;
    private final List<Entry> entries;
    private final boolean errorAgainstTruth;

    private FitTable(String title, List<Entry> entries, boolean errorAgainstTruth) {
        if (entries.isEmpty()) throw new IllegalArgumentException("a fit table needs at least one fit; add rows with row(label, fit) or row(label, fit, truth)");
        this.title = title;
        this.entries = List.copyOf(entries);
        this.errorAgainstTruth = errorAgainstTruth;
    }

    public static Builder builder() { return new Builder(); }

    /** One two-mass fit without truth. */
    public static FitTable of(TwoMassFit fit) { return builder().row("", fit).build(); }

    /** One two-mass fit beside the true parameters. */
    public static FitTable of(TwoMassFit fit, TwoMassParameters truth) { return builder().row("", fit, truth).build(); }

    /** One rigid-body fit beside the true parameters. */
    public static FitTable of(RigidBodyFit fit, RigidBodyParameters truth) { return builder().row("", fit, truth).build(); }

    /** The true value of a named parameter of the two-mass model (the names {@code ModelFit} gives its estimates). */
    static OptionalDouble truthOf(String name, TwoMassParameters t) {
        if (t == null) return OptionalDouble.empty();
        if (name.equals(t.motion().inertiaName())) return OptionalDouble.of(t.inertiaKgM2());
        if (name.equals(t.motion().inertiaName() + " ratio")) return OptionalDouble.of(t.inertiaRatio());
        return switch (name) {
            case "viscous friction" -> OptionalDouble.of(t.viscousNmsPerRad());
            case "resonance" -> OptionalDouble.of(t.resonanceHz());
            case "resonance damping" -> OptionalDouble.of(t.resonanceDamping());
            case "antiresonance" -> OptionalDouble.of(t.antiresonanceHz());
            case "antiresonance damping" -> OptionalDouble.of(t.antiresonanceDamping());
            case "delay" -> OptionalDouble.of(t.delayS());
            default -> OptionalDouble.empty();
        };
    }

    static OptionalDouble truthOf(String name, RigidBodyParameters t) {
        if (t == null) return OptionalDouble.empty();
        if (name.equals(t.motion().inertiaName())) return OptionalDouble.of(t.inertiaKgM2());
        return switch (name) {
            case "viscous friction" -> OptionalDouble.of(t.viscousNmsPerRad());
            case "delay" -> OptionalDouble.of(t.delayS());
            default -> OptionalDouble.empty();
        };
    }

    private boolean anyTruth() {
        return entries.stream().anyMatch(e -> e.truth().stream().anyMatch(OptionalDouble::isPresent));
    }

    HtmlTable table() {
        boolean truth = anyTruth();
        List<String> header = new ArrayList<>(List.of("Fit", "Parameter", "Estimate", "95 % low", "95 % high", "Unit"));
        if (truth) header.add("Truth");
        if (truth && errorAgainstTruth) header.add("Error against truth (%)");
        if (truth) header.add("Truth inside the 95 % interval");
        HtmlTable t = HtmlTable.of(title, header.toArray(String[]::new));
        for (Entry e : entries) {
            List<ParameterEstimate> ps = e.fit().parameters();
            for (int i = 0; i < ps.size(); i++) {
                ParameterEstimate p = ps.get(i);
                boolean delay = p.unit().equals("s");
                double scale = delay ? 1e6 : 1;
                List<String> cells = new ArrayList<>(List.of(e.label(), p.name(), Figures.num(p.value() * scale), Figures.num(p.low95() * scale),
                        Figures.num(p.high95() * scale), delay ? "us" : p.unit()));
                boolean outside = false;
                if (truth) {
                    OptionalDouble x = e.truth().get(i);
                    if (x.isPresent()) {
                        double v = x.getAsDouble();
                        outside = !p.covers(v);
                        cells.add(Figures.num(v * scale));
                        if (errorAgainstTruth) cells.add(v == 0 ? Figures.NONE : Figures.num(100 * (p.value() / v - 1)));
                        cells.add(!outside ? "yes" : p.standardError() > 0
                                ? "NO: " + Figures.num(p.standardErrorsFrom(v)) + " standard errors away" : "NO (no standard error)");
                    } else {
                        cells.add(Figures.NONE);
                        if (errorAgainstTruth) cells.add(Figures.NONE);
                        cells.add("not known");
                    }
                }
                t.rowWithClass(outside ? "fail" : "", cells.toArray(String[]::new));
            }
        }
        return t;
    }

    private List<String> verdicts() {
        List<String> v = new ArrayList<>();
        for (Entry e : entries) {
            FitResult f = e.fit();
            String who = e.label().isEmpty() ? "fit" : e.label();
            v.add(who + ": " + f.points() + " points, reduced chi-square " + Figures.num(f.reducedChiSquare()) + ", "
                    + (f.isUsable() ? "usable (no warning from the fit's checks)" : "NOT usable: " + String.join("; ", f.warnings().stream().map(w -> w.message()).toList())));
        }
        return v;
    }

    @Override public String toString() { return TableWithNotes.text(table(), verdicts()); }

    @Override public MimeBundle toMimeBundle() { return TableWithNotes.bundle("loopledger-fit", table(), verdicts()); }

    /** Collects fits in order. */
    public static final class Builder {
        private final List<Entry> entries = new ArrayList<>();
        private String title = "Fitted parameters";
        private boolean errorAgainstTruth;

        private Builder() {}

        public Builder row(String label, TwoMassFit fit) { return row(label, fit, null); }

        /** A two-mass fit and the true parameters ({@code null} when unknown). */
        public Builder row(String label, TwoMassFit fit, TwoMassParameters truth) {
            Objects.requireNonNull(fit, "fit");
            return add(label, fit.fit(), fit.estimate().motion(), truth == null ? null : truth.motion(), name -> truthOf(name, truth));
        }

        public Builder row(String label, RigidBodyFit fit) { return row(label, fit, null); }

        /** A rigid-body fit and the true parameters ({@code null} when unknown). */
        public Builder row(String label, RigidBodyFit fit, RigidBodyParameters truth) {
            Objects.requireNonNull(fit, "fit");
            return add(label, fit.fit(), fit.estimate().motion(), truth == null ? null : truth.motion(), name -> truthOf(name, truth));
        }

        private Builder add(String label, FitResult fit, Motion motion, Motion truthMotion, java.util.function.Function<String, OptionalDouble> truthOf) {
            if (truthMotion != null && truthMotion != motion) {
                throw new IllegalArgumentException("the truth is for a " + truthMotion.label() + " axis but the fit for a " + motion.label() + " one");
            }
            entries.add(new Entry(Objects.requireNonNull(label, "label"), fit, motion, fit.parameters().stream().map(p -> truthOf.apply(p.name())).toList()));
            return this;
        }

        public Builder title(String title) {
            this.title = Objects.requireNonNull(title, "title");
            return this;
        }

        /** Adds a column with each estimate's error against the truth, 100·(estimate/truth − 1) %, where the truth is known and not 0. */
        public Builder errorAgainstTruth() {
            this.errorAgainstTruth = true;
            return this;
        }

        public FitTable build() { return new FitTable(title, entries, errorAgainstTruth); }
    }
}
