package org.loopledger.display;

import org.loopledger.tune.LoadCaseFigures;
import org.loopledger.tune.TuningResult;

/**
 * The plain-text report of a {@link TuningResult}: verdict and binding constraint, the gains in the axis' units, the
 * filters, the re-analysed figures of every load case and the number of loop evaluations. Deterministic: never the
 * search's wall time, so a re-run notebook reproduces it.
 */
public final class TuningReportText {
    private TuningReportText() {}

    public static String of(TuningResult r) {
        StringBuilder sb = new StringBuilder();
        sb.append(r).append('\n');
        sb.append("  ").append(r.piv().describe(r.motion())).append('\n');
        sb.append("  filters: ").append(r.filters().isEmpty() ? "none" : r.filters().toString()).append('\n');
        for (LoadCaseFigures c : r.cases()) sb.append("  ").append(c).append('\n');
        sb.append("  ").append(r.evaluations()).append(" loop evaluations");
        return sb.toString();
    }
}
