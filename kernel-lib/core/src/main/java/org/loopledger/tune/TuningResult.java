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
 * @param limitsMet         every robustness limit (PM, GM, Ms, stability) met on every loop and load case, by the screen
 *                          and by the independent re-analysis
 * @param targets           every bandwidth target the spec states, checked on the re-analysis ({@link #targetChecks})
 * @param bindingConstraint the limit with the least headroom, or the one that fails
 * @param trace             search steps, one line each
 * @param evaluations       loop-gain evaluations screened
 * @param elapsedMs         wall time of the search in ms (left out of {@link #toString()} and the display, which must reproduce)
 * @param motion            rotary or linear axis, as the load cases said: the units the gains are shown in
 */
public record TuningResult(Piv piv, FilterChain filters, DriveTiming timing, TuningSpec spec, List<LoadCaseFigures> cases, boolean limitsMet,
                           List<TargetCheck> targets, String bindingConstraint, List<String> trace, long evaluations, double elapsedMs,
                           Motion motion) {
    public TuningResult {
        cases = List.copyOf(cases);
        targets = List.copyOf(targets);
        trace = List.copyOf(trace);
        if (motion == null) throw new IllegalArgumentException("say whether the axis is Motion.ROTARY or Motion.LINEAR");
    }

    /** A rotary axis. */
    public TuningResult(Piv piv, FilterChain filters, DriveTiming timing, TuningSpec spec, List<LoadCaseFigures> cases, boolean limitsMet,
                        List<TargetCheck> targets, String bindingConstraint, List<String> trace, long evaluations, double elapsedMs) {
        this(piv, filters, timing, spec, cases, limitsMet, targets, bindingConstraint, trace, evaluations, elapsedMs, Motion.ROTARY);
    }

    /**
     * The gains found. What the printouts call Kp is {@code piv().positionGainPerS()} (1/s), Kv is
     * {@code piv().velocity().velocityGain()} (plant-input units per rad/s, or per m/s on a linear axis) and the
     * integral corner {@code piv().velocity().integralCornerRadPerS()}; the notebook side's {@code display.DriveGains.of(piv(), motion())}
     * lists them in a drive's units. See {@link Piv} and {@link org.loopledger.control.VelocityPi}.
     */
    @Override public Piv piv() { return piv; }

    /**
     * The robustness half of the verdict: true when every limit of {@code spec.limits()} (phase margin, gain margin,
     * Ms, closed-loop stability) is met on every loop the tuner closes (velocity loop, position loop, loop broken at
     * the plant input) on every load case, both by the tuner's screen and by the independent re-analysis with
     * {@code analysis.Margins} ({@link #reanalysisMeetsSpec()}). It says nothing about bandwidth targets: a tuning
     * can meet every limit and still miss the stated velocity-crossover or position-bandwidth target, in which
     * case {@code limitsMet()} is true and {@link #specMet()} is false. Report {@link #specMet()} as the verdict.
     */
    @Override public boolean limitsMet() { return limitsMet; }

    /**
     * In words, the limit with the least headroom on the chosen tuning (what stopped a higher crossover), or the
     * limit or target that fails; "; re-analysis misses a limit" is appended when the screen passed a loop the
     * re-analysis rejects.
     */
    @Override public String bindingConstraint() { return bindingConstraint; }

    /**
     * The verdict: {@link #limitsMet()} (every robustness limit, screen and re-analysis) and every bandwidth target
     * the user stated reached on the re-analysis ({@link #targets()}, {@link #missedTargets()}). A target the user
     * stated is part of the spec: missing it makes this false even when every limit is met.
     */
    public boolean specMet() {
        return limitsMet && targets.stream().allMatch(TargetCheck::met);
    }

    /** The targets that were missed (empty when all are met or none was stated). */
    public List<TargetCheck> missedTargets() {
        return targets.stream().filter(t -> !t.met()).toList();
    }

    /** Checks every bandwidth target {@code spec} states against the re-analysed figures (worst load case). */
    public static List<TargetCheck> targetChecks(TuningSpec spec, List<LoadCaseFigures> cases) {
        List<TargetCheck> out = new java.util.ArrayList<>();
        if (spec.hasVelocityCrossoverTarget()) out.add(worst(TargetCheck.Kind.VELOCITY_CROSSOVER, spec.velocityCrossoverHz(), cases, false));
        else if (Double.isFinite(spec.maxVelocityCrossoverHz())) {
            out.add(worst(TargetCheck.Kind.VELOCITY_CROSSOVER_CEILING, spec.maxVelocityCrossoverHz(), cases, false));
        }
        if (spec.hasPositionBandwidthTarget()) out.add(worst(TargetCheck.Kind.POSITION_BANDWIDTH, spec.positionBandwidthHz(), cases, true));
        return out;
    }

    private static TargetCheck worst(TargetCheck.Kind kind, double askedHz, List<LoadCaseFigures> cases, boolean position) {
        double lowest = Double.POSITIVE_INFINITY;
        String where = "";
        for (LoadCaseFigures c : cases) {
            double f = position ? c.positionCrossoverHz() : c.velocityCrossoverHz();
            if (Double.isNaN(f)) return new TargetCheck(kind, askedHz, Double.NaN, c.label());
            if (f < lowest) {
                lowest = f;
                where = c.label();
            }
        }
        return new TargetCheck(kind, askedHz, lowest, cases.size() > 1 ? where : "");
    }

    /** The first line of the record: the verdict, and for a missed target by how much. */
    public String headline() {
        StringBuilder sb = new StringBuilder();
        if (specMet()) {
            sb.append("Spec met");
            if (!targets.isEmpty()) sb.append(" (").append(String.join("; ", targets.stream().map(TargetCheck::describe).toList())).append(')');
        } else {
            sb.append("Spec NOT met");
            List<String> why = new java.util.ArrayList<>();
            for (TargetCheck t : missedTargets()) why.add(t.describe());
            if (!limitsMet) why.add("a robustness limit is missed (see the binding constraint)");
            sb.append(": ").append(String.join("; ", why));
        }
        return sb.toString();
    }

    /**
     * Whether the independent re-analysis alone finds every loop of every load case within the spec's phase-margin,
     * gain-margin and Ms limits (compared strictly, without the screen's guard bands); bandwidth targets are not
     * part of it. {@link #limitsMet()} implies it for a result from {@link AutoTune}.
     */
    public boolean reanalysisMeetsSpec() {
        for (LoadCaseFigures c : cases) {
            if (!meets(c.velocityLoop()) || !meets(c.positionLoop()) || !meets(c.plantInput())) return false;
        }
        return true;
    }

    private boolean meets(org.loopledger.analysis.Margins m) {
        // strict: the re-analysis is the refined figure the user sees, so 44.96 deg does not meet "PM >= 45 deg"
        // (the screen's guard bands, TuningSpec.GUARD_*, keep the chosen loops clear of the limits)
        boolean pm = m.phaseMarginDeg().isEmpty() || m.phaseMarginDeg().getAsDouble() >= spec.minPhaseMarginDeg();
        boolean gm = m.gainMarginDb().isEmpty() || m.gainMarginDb().getAsDouble() >= spec.minGainMarginDb();
        boolean ms = m.sensitivityPeak().magnitude() <= spec.maxSensitivityPeak();
        return pm && gm && ms;
    }

    /** One line: the verdict and the binding constraint (the full report: {@code display.TuningReportText}). */
    @Override public String toString() { return headline() + " — binding: " + bindingConstraint; }

    /** The velocity crossover the tuning achieved on its worst (lowest) load case, in Hz. */
    public double worstVelocityCrossoverHz() {
        return cases.stream().mapToDouble(LoadCaseFigures::velocityCrossoverHz).min().orElse(Double.NaN);
    }
}
