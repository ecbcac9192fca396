package org.loopledger.ident.estimate;

import org.loopledger.frf.Frf;
import org.loopledger.tune.PlantCase;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * The load cases {@link FrfFromLogs} estimated, in the order given. Immutable; each case keeps its file, SHA-256,
 * columns, period, FRF and the log's warnings. Hand them to the tuner with {@link #plantCases()}.
 */
public final class LoadCases {
    private final List<LoadCaseEstimate> cases;

    /** Load cases in this order; labels must be unique. */
    public LoadCases(List<LoadCaseEstimate> cases) {
        if (cases == null || cases.isEmpty()) throw new IllegalArgumentException("no load cases; give at least one");
        Set<String> seen = new HashSet<>();
        for (LoadCaseEstimate c : cases) {
            if (!seen.add(c.label())) throw new IllegalArgumentException("two load cases are labelled '" + c.label() + "'; give each its own label");
        }
        this.cases = List.copyOf(cases);
    }

    public List<LoadCaseEstimate> cases() { return cases; }

    public int size() { return cases.size(); }

    public List<String> labels() { return cases.stream().map(LoadCaseEstimate::label).toList(); }

    /** The FRFs in case order. */
    public List<Frf> frfs() { return cases.stream().map(LoadCaseEstimate::frf).toList(); }

    /** The case with this label; the error lists the labels there are. */
    public LoadCaseEstimate get(String label) {
        for (LoadCaseEstimate c : cases) if (c.label().equals(label)) return c;
        throw new IllegalArgumentException("no load case labelled '" + label + "'; there are " + labels());
    }

    /** Every case as a {@link PlantCase} for {@code AutoTune}; see {@link LoadCaseEstimate#plantCase()}. */
    public List<PlantCase> plantCases() {
        List<PlantCase> p = new ArrayList<>();
        for (LoadCaseEstimate c : cases) p.add(c.plantCase());
        return List.copyOf(p);
    }

    /** Whether any log check raised a warning. */
    public boolean hasWarnings() { return cases.stream().anyMatch(c -> !c.warnings().isEmpty()); }

    @Override public String toString() {
        StringBuilder sb = new StringBuilder("LoadCases[");
        for (int i = 0; i < cases.size(); i++) sb.append(i == 0 ? "" : "; ").append(cases.get(i));
        return sb.append(']').toString();
    }

    @Override public boolean equals(Object o) { return o instanceof LoadCases l && l.cases.equals(cases); }

    @Override public int hashCode() { return cases.hashCode(); }
}
