package org.loopledger.tune;

import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Piv;
import org.loopledger.lti.Motion;

import java.util.List;

/**
 * What an auto-tune found: the PIV gains and filters, the achieved figures on every load case (from
 * an independent re-analysis), whether the spec is met, which constraint binds (or fails), and a short
 * trace of the search for the record.
 *
 * @param piv               the gains (Kp in 1/s, Kv, integral corner)
 * @param filters           the filters on the current command: the user's, plus a low-pass if the tuner placed one
 * @param timing            the drive timing the tuning assumed
 * @param cases             achieved figures per load case
 * @param specMet           every limit met on every load case, by the screen and by the independent re-analysis
 * @param bindingConstraint the limit with the least headroom, or the one that fails
 * @param trace             search steps, one line each
 * @param evaluations       loop-gain evaluations screened
 * @param elapsedMs         wall time of the search in ms
 * @param motion            rotary or linear axis, as the load cases said: the units the gains are shown in
 */
public record TuningResult(Piv piv, FilterChain filters, DriveTiming timing, TuningSpec spec, List<LoadCaseFigures> cases, boolean specMet,
                           String bindingConstraint, List<String> trace, long evaluations, double elapsedMs, Motion motion) {
    public TuningResult {
        cases = List.copyOf(cases);
        trace = List.copyOf(trace);
        if (motion == null) throw new IllegalArgumentException("say whether the axis is Motion.ROTARY or Motion.LINEAR");
    }

    /** A rotary axis. */
    public TuningResult(Piv piv, FilterChain filters, DriveTiming timing, TuningSpec spec, List<LoadCaseFigures> cases, boolean specMet,
                        String bindingConstraint, List<String> trace, long evaluations, double elapsedMs) {
        this(piv, filters, timing, spec, cases, specMet, bindingConstraint, trace, evaluations, elapsedMs, Motion.ROTARY);
    }

    /** Whether the independent re-analysis agrees that every load case meets the spec's limits. */
    public boolean reanalysisMeetsSpec() {
        for (LoadCaseFigures c : cases) {
            if (!meets(c.velocityLoop()) || !meets(c.positionLoop()) || !meets(c.plantInput())) return false;
        }
        return true;
    }

    private boolean meets(org.loopledger.analysis.Margins m) {
        double tol = 1e-3; // the screen interpolates linearly between grid points; the re-analysis refines
        boolean pm = m.phaseMarginDeg().isEmpty() || m.phaseMarginDeg().getAsDouble() >= spec.minPhaseMarginDeg() * (1 - tol);
        boolean gm = m.gainMarginDb().isEmpty() || m.gainMarginDb().getAsDouble() >= spec.minGainMarginDb() * (1 - tol);
        boolean ms = m.sensitivityPeak().magnitude() <= spec.maxSensitivityPeak() * (1 + tol);
        return pm && gm && ms;
    }

    @Override public String toString() {
        StringBuilder sb = new StringBuilder();
        sb.append(specMet ? "Spec met" : "Spec NOT met").append(" — binding: ").append(bindingConstraint).append('\n');
        sb.append("  ").append(piv.describe(motion)).append('\n');
        sb.append("  filters: ").append(filters.isEmpty() ? "none" : filters.toString()).append('\n');
        for (LoadCaseFigures c : cases) sb.append("  ").append(c).append('\n');
        sb.append(String.format(java.util.Locale.ROOT, "  %d loop evaluations in %.1f ms", evaluations, elapsedMs));
        return sb.toString();
    }

    /** The gains as a drive's parameter list in the axis' own units (rotary or linear). */
    public org.loopledger.control.PivParameters driveParameters() { return org.loopledger.control.PivParameters.of(piv, motion); }

    /** The velocity crossover the tuning achieved on its worst (lowest) load case, in Hz. */
    public double worstVelocityCrossoverHz() {
        return cases.stream().mapToDouble(LoadCaseFigures::velocityCrossoverHz).min().orElse(Double.NaN);
    }
}
