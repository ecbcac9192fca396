package org.loopledger.tune;

import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Notch;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;

/**
 * A notch proposed against a resonance, with the figures before and after: the loops with the tuning
 * found without a notch, the same gains with the notch added (what the notch alone does to the
 * margins), and a fresh tuning with the notch (what it buys in bandwidth).
 *
 * <p>Placement (common practice): centre on the resonance (across load cases, the geometric mean of the
 * resonance frequencies), depth the largest prominence plus 6 dB (at most 40 dB), width covering the
 * spread of the resonance over the load cases plus k times the widest half-power bandwidth, with k
 * from {1/2, 1, 2}: the width whose re-tuning reaches the highest worst-case velocity crossover wins
 * (a wide notch adds phase lag below its centre, a narrow one misses a shifting resonance).
 * {@link #pays()} says whether the notch improved anything.
 */
public record NotchProposal(List<Resonance> resonances, Notch notch, TuningResult without, List<LoadCaseFigures> sameGainsWithNotch,
                            TuningResult with) {
    private static final double[] WIDTH_FACTORS = {0.5, 1, 2};

    public NotchProposal {
        resonances = List.copyOf(resonances);
        sameGainsWithNotch = List.copyOf(sameGainsWithNotch);
    }

    /** Whether re-tuning with the notch gives a higher worst-case velocity crossover than without it (both meeting the spec). */
    public boolean pays() {
        return with.specMet() && (!without.specMet() || with.worstVelocityCrossoverHz() > without.worstVelocityCrossoverHz());
    }

    /** Finds the strongest resonance in each load case, places one notch over them, and tunes without and with it. */
    public static NotchProposal propose(List<PlantCase> cases, DriveTiming timing, FilterChain filters, TuningSpec spec, double minProminenceDb) {
        List<Resonance> found = new ArrayList<>();
        for (PlantCase c : cases) {
            List<Resonance> r = Resonances.find(c.plantToVelocity(), minProminenceDb);
            if (!r.isEmpty()) found.add(r.get(0));
        }
        if (found.isEmpty()) {
            throw new IllegalArgumentException("no resonance stands " + Units.g4(minProminenceDb) + " dB above the rigid-body trend in any load case; "
                    + "no notch is needed (or lower the prominence threshold)");
        }
        double logSum = 0, lo = Double.POSITIVE_INFINITY, hi = 0, widest = 0, prom = 0;
        for (Resonance r : found) {
            logSum += Math.log(r.frequencyHz());
            lo = Math.min(lo, r.frequencyHz());
            hi = Math.max(hi, r.frequencyHz());
            widest = Math.max(widest, r.halfPowerWidthHz());
            prom = Math.max(prom, r.prominenceDb());
        }
        double centre = Math.exp(logSum / found.size());
        double depth = Math.min(40, prom + 6);
        TuningResult without = AutoTune.onMeasured(cases, timing, filters, spec);
        Notch bestNotch = null;
        TuningResult best = null;
        for (double k : WIDTH_FACTORS) {
            Notch notch = Notch.ofHz(centre, depth, (hi - lo) + k * widest);
            TuningResult t = AutoTune.onMeasured(cases, timing, filters.then(notch), spec);
            if (best == null || better(t, best)) {
                best = t;
                bestNotch = notch;
            }
        }
        List<LoadCaseFigures> same = new ArrayList<>();
        for (PlantCase c : cases) same.add(AutoTune.reanalyse(c, without.piv(), without.filters().then(bestNotch), timing));
        return new NotchProposal(found, bestNotch, without, same, best);
    }

    private static boolean better(TuningResult a, TuningResult b) {
        if (a.specMet() != b.specMet()) return a.specMet();
        return a.worstVelocityCrossoverHz() > b.worstVelocityCrossoverHz();
    }

    /** One line: the notch and whether it pays (the full report: {@code display.NotchProposalText}). */
    @Override public String toString() {
        return "proposed " + notch + ": " + (pays() ? "the notch pays: higher worst-case velocity crossover" : "the notch does not pay here: re-tuning with it gives no higher crossover");
    }
}
