package org.loopledger.tune;

import org.loopledger.analysis.Margins;
import org.loopledger.control.Cascade;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.LowPass2;
import org.loopledger.control.Piv;
import org.loopledger.control.VelocityPi;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Motion;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;

/**
 * Auto-tune of a PIV cascade directly on measured plant FRFs (no model needed), for the worst case
 * over one or more load cases. Deterministic: a fixed search grid, no random starts, ties broken by a
 * fixed order, so the same data give the same gains on any machine.
 *
 * <p><b>Velocity loop first.</b> C<sub>v</sub> = K<sub>v</sub>(1 + ω<sub>i</sub>/s)·F. For a trial crossover
 * ω<sub>cv</sub> (log grid over the measured band, or the spec's target) and a ratio r = ω<sub>cv</sub>/ω<sub>i</sub>,
 * K<sub>v</sub> follows from |L<sub>v</sub>(jω<sub>cv</sub>)| = 1 on the load case that needs the most gain (so every
 * case crosses over at or above ω<sub>cv</sub>), interpolated on the data and including delay and hold. Each
 * candidate is screened on every load case ({@link LoopScreen}); the highest ω<sub>cv</sub> that meets the phase
 * margin, gain margin and Ms limits on all of them wins, then the smallest r (most integral action), then no
 * extra low-pass.
 *
 * <p><b>Position loop next</b>, inner loop closed: L<sub>p</sub> = K<sub>p</sub>T<sub>v</sub>/s. K<sub>p</sub> goes as high as the
 * position target (or ω<sub>cv</sub>/ratio) allows while L<sub>p</sub> meets the limits and the loop broken at the plant
 * input, L<sub>u</sub> = L<sub>v</sub>(1 + K<sub>p</sub>/s), keeps Ms within the limit (1 + L<sub>u</sub> = (1 + L<sub>v</sub>)(1 + L<sub>p</sub>)).
 *
 * <p>When no candidate meets the spec, the one with the smallest worst relative shortfall is returned with
 * {@code specMet = false} and the failing limit named: never an exception for an unreachable spec.
 * Every returned figure comes from an independent re-analysis of the loops with {@link Margins}.
 */
public final class AutoTune {
    private static final int CROSSOVER_STEPS = 90;
    private static final int POSITION_STEPS = 60;
    private static final double[] LOW_PASS_MULTIPLES = {3, 5, 8};
    private static final double LOW_PASS_DAMPING = 0.7;

    private AutoTune() {}

    /** Tunes on one measured plant (current or torque command to velocity). */
    public static TuningResult onMeasured(Frf plantToVelocity, DriveTiming timing, FilterChain filters, TuningSpec spec) {
        return onMeasured(List.of(PlantCase.of("plant", plantToVelocity)), timing, filters, spec);
    }

    /** Tunes for the worst case over several load cases. */
    public static TuningResult onMeasured(List<PlantCase> cases, DriveTiming timing, FilterChain filters, TuningSpec spec) {
        if (cases.isEmpty()) throw new IllegalArgumentException("give at least one load case to tune on");
        Motion motion = cases.get(0).motion();
        for (PlantCase pc : cases) {
            if (pc.motion() != motion) {
                throw new IllegalArgumentException("load case '" + pc.label() + "' is " + pc.motion().label() + " but '" + cases.get(0).label() + "' is "
                        + motion.label() + "; tune the load cases of one axis together, all rotary (rad/s) or all linear (m/s)");
            }
        }
        long t0 = System.nanoTime();
        for (PlantCase pc : cases) requireVelocityPlantSign(pc);
        List<CaseArrays> arrays = new ArrayList<>();
        for (PlantCase pc : cases) arrays.add(new CaseArrays(pc, timing, filters));
        Search s = new Search(arrays, timing, spec);
        s.velocity();
        s.positionOverChoices();
        double ms = (System.nanoTime() - t0) / 1e6;
        FilterChain all = s.bestLowPass == null ? filters : filters.then(s.bestLowPass);
        Piv piv = Piv.of(s.bestKp, VelocityPi.ofRadPerS(s.bestKv, s.bestOmegaI));
        List<LoadCaseFigures> figures = new ArrayList<>();
        for (PlantCase pc : cases) figures.add(reanalyse(pc, piv, all, timing));
        List<TargetCheck> targets = TuningResult.targetChecks(spec, figures);
        boolean limitsMet = s.velocityMet && s.positionMet;
        String binding = s.binding;
        List<String> trace = new ArrayList<>(s.trace);
        TuningResult probe = new TuningResult(piv, all, timing, spec, figures, limitsMet, targets, binding, trace, s.evaluations, ms, motion);
        if (limitsMet && !probe.reanalysisMeetsSpec()) {
            // the screen said yes, the refined re-analysis says no: report the truth
            limitsMet = false;
            binding = binding + "; re-analysis misses a limit";
            trace.add("the re-analysis of the chosen loops misses a limit that the screen passed; spec NOT met");
        }
        for (TargetCheck t : targets) {
            if (t.met()) continue;
            if (t.kind() == TargetCheck.Kind.POSITION_BANDWIDTH) {
                binding = binding.replace("position bandwidth target reached", "Kp at the position target, but the re-analysed crossover falls short");
            }
            trace.add("target missed on the re-analysis: " + t.describe());
        }
        trace.add(s.chosenStatement(piv, all));
        return new TuningResult(piv, all, timing, spec, figures, limitsMet, targets, binding, trace, s.evaluations, ms, motion);
    }

    /**
     * Refuses a plant whose low-frequency phase says the sign is inverted. Current (or torque) to velocity
     * starts between 0° (friction-dominated, below b/J) and -90° (inertia-dominated), less a little delay
     * (common practice: a motor accelerates in the direction of its torque); a negative gain puts it near
     * +90° or ±180°, where any positive controller gain makes the loop unstable and the tuner's margins mean
     * nothing. The phase is the mean direction of the points in the lowest octave of the data.
     */
    static void requireVelocityPlantSign(PlantCase pc) {
        Frf p = pc.plantToVelocity();
        double[] w = p.omegaRadPerS(), re = p.real(), im = p.imag();
        double sr = 0, si = 0;
        int k = 0;
        for (int i = 0; i < w.length && (w[i] <= 2 * w[0] || k < 3); i++, k++) {
            double m = Math.hypot(re[i], im[i]);
            if (m > 0) {
                sr += re[i] / m;
                si += im[i] / m;
            }
        }
        double phaseDeg = Math.toDegrees(Math.atan2(si, sr));
        if (phaseDeg >= LOWEST_PLANT_PHASE_DEG && phaseDeg <= HIGHEST_PLANT_PHASE_DEG) return;
        throw new IllegalArgumentException(String.format(java.util.Locale.ROOT,
                "load case '%s': the plant's phase at low frequency (%s .. %s) is %+.0f deg, but current to velocity starts between 0 and -90 deg "
                        + "(a motor accelerates in the direction of its torque): the plant has an inverted sign. Flip the sign of the velocity or "
                        + "the current channel (or use the FRF's negate()) and tune again; if this is a current-to-position FRF, "
                        + "give current to velocity instead", pc.label(), Units.formatHz(Units.radPerSToHz(w[0])),
                Units.formatHz(Units.radPerSToHz(w[Math.max(0, k - 1)])), phaseDeg));
    }

    /** The accepted low-frequency phase band of a current-to-velocity plant: 0 to -90 deg, widened for delay, noise and a lagging current loop. */
    static final double LOWEST_PLANT_PHASE_DEG = -150, HIGHEST_PLANT_PHASE_DEG = 45;

    /**
     * Model-based variant: the plant model (continuous, current to velocity) is evaluated on a dense grid
     * (0.5 Hz to 0.45 of the sample rate, or to 5 kHz for a continuous drive, plus every pole and zero
     * frequency) and tuned like data.
     */
    public static TuningResult onModel(TransferFunction plantToVelocity, DriveTiming timing, FilterChain filters, TuningSpec spec) {
        return onModel(plantToVelocity, Motion.ROTARY, timing, filters, spec);
    }

    /** As {@link #onModel(TransferFunction, DriveTiming, FilterChain, TuningSpec)}, for a rotary (rad/s) or linear (m/s) axis. */
    public static TuningResult onModel(TransferFunction plantToVelocity, Motion motion, DriveTiming timing, FilterChain filters, TuningSpec spec) {
        if (plantToVelocity.isDiscrete()) throw new IllegalArgumentException("give the continuous plant model; the drive timing adds sampling effects");
        double top = timing.isSampled() ? 0.45 * timing.sampleRateHz() : 5000;
        double[] grid = FrequencyGrid.logSpacedRadPerS(0.5, top, 3000);
        return onMeasured(List.of(PlantCase.of("model", Frf.ofModel(plantToVelocity, grid), motion)), timing, filters, spec);
    }

    static LoadCaseFigures reanalyse(PlantCase pc, Piv piv, FilterChain filters, DriveTiming timing) {
        Cascade loops = Cascade.of(pc.plantToVelocity(), piv, filters, timing);
        return new LoadCaseFigures(pc.label(), Margins.of(loops.velocityLoop()), Margins.of(loops.plantInputLoop()), Margins.of(loops.positionLoop()));
    }

    /** The search state; one per tuning call. */
    private static final class Search {
        final List<CaseArrays> cases;
        final DriveTiming timing;
        final TuningSpec spec;
        final List<String> trace = new ArrayList<>();
        long evaluations;
        double bestOmegaCv = Double.NaN, bestKv, bestOmegaI, bestKp, chosenTrialRadPerS = Double.NaN;
        LowPass2 bestLowPass;
        boolean velocityMet, positionMet;
        String binding = "";
        /** The best velocity candidate at each searched crossover that meets the spec, in ascending crossover. */
        final List<double[]> feasible = new ArrayList<>();
        final List<LowPass2> feasibleLowPass = new ArrayList<>();
        final List<LoopFigures> feasibleFigures = new ArrayList<>();

        Search(List<CaseArrays> cases, DriveTiming timing, TuningSpec spec) {
            this.cases = cases;
            this.timing = timing;
            this.spec = spec;
        }

        double bandLow() {
            double lo = 0;
            for (CaseArrays c : cases) lo = Math.max(lo, c.omega[0]);
            return lo;
        }

        double bandHigh() {
            double hi = Double.POSITIVE_INFINITY;
            for (CaseArrays c : cases) hi = Math.min(hi, c.omega[c.n - 1]);
            return hi;
        }

        void velocity() {
            double lo = bandLow() * 4, hi = bandHigh() / 2;
            if (timing.isSampled()) hi = Math.min(hi, timing.nyquistRadPerS() / 4);
            hi = Math.min(hi, Units.hzToRadPerS(spec.maxVelocityCrossoverHz()));
            double[] grid;
            if (spec.hasVelocityCrossoverTarget()) {
                double w = Units.hzToRadPerS(spec.velocityCrossoverHz());
                if (w < bandLow() * 1.5 || w > bandHigh() / 1.5) {
                    throw new IllegalArgumentException("velocity crossover target " + Units.formatHz(spec.velocityCrossoverHz())
                            + " is not inside the measured band with room around it (" + Units.formatHz(Units.radPerSToHz(bandLow() * 1.5)) + " .. "
                            + Units.formatHz(Units.radPerSToHz(bandHigh() / 1.5)) + "); measure a wider band or choose another target");
                }
                grid = new double[] {w};
            } else {
                if (!(hi > lo)) {
                    throw new IllegalArgumentException("the measured band " + Units.formatHz(Units.radPerSToHz(bandLow())) + " .. "
                            + Units.formatHz(Units.radPerSToHz(bandHigh())) + " is too narrow to search a crossover in (it needs a decade or more)");
                }
                grid = FrequencyGrid.logRadPerS(lo, hi, CROSSOVER_STEPS);
            }
            double[] ratios = spec.integralRatios();
            double bestShortfall = Double.POSITIVE_INFINITY;
            double fallbackW = Double.NaN, fallbackKv = 0, fallbackWi = 0;
            LowPass2 fallbackLp = null;
            LoopFigures fallbackFig = null, bestFig = null;
            // per trial crossover: the candidate the ranking below prefers among those that meet the limits
            java.util.TreeMap<Integer, String> trialLines = new java.util.TreeMap<>();
            for (int gi = 0; gi < grid.length; gi++) {
                double wc = grid[gi];
                int metHere = 0, triedHere = 0;
                int bestHere = -1;
                for (LowPass2 lp : lowPassOptions(wc)) {
                    for (CaseArrays c : cases) c.setLowPass(lp, timing);
                    for (double r : ratios) {
                        double wi = wc / r;
                        double kv = 0;
                        for (CaseArrays c : cases) kv = Math.max(kv, 1.0 / (c.baseMagnitudeAt(wc) * c.piMagnitudeAt(wc, wi)));
                        LoopFigures worst = worstVelocity(kv, wi);
                        triedHere++;
                        if (spec.meets(worst)) {
                            feasible.add(new double[] {wc, kv, wi, worst.crossoverRadPerS(), r, gi});
                            feasibleLowPass.add(lp);
                            feasibleFigures.add(worst);
                            metHere++;
                            int idx = feasible.size() - 1;
                            if (bestHere < 0 || ranksBefore(idx, bestHere)) bestHere = idx;
                        } else {
                            double sf = spec.shortfall(worst);
                            if (sf < bestShortfall) {
                                bestShortfall = sf;
                                fallbackW = wc;
                                fallbackKv = kv;
                                fallbackWi = wi;
                                fallbackLp = lp;
                                fallbackFig = worst;
                            }
                        }
                    }
                    if (metHere > 0) break; // prefer no extra low-pass, then the lowest one that works
                }
                if (bestHere >= 0) {
                    double[] b = feasible.get(bestHere);
                    LowPass2 lp = feasibleLowPass.get(bestHere);
                    trialLines.put(gi, String.format(java.util.Locale.ROOT, "trial crossover %s: %d of %d candidates meet the limits; best ranked ω_cv/ω_i = %s%s (%s)",
                            Units.formatHz(Units.radPerSToHz(wc)), metHere, triedHere, Units.g4(b[4]),
                            lp == null ? ", no low-pass" : ", low-pass at " + Units.formatHz(lp.naturalHz()), feasibleFigures.get(bestHere)));
                }
            }
            sortFeasible();
            // the trace samples the trials (about one in ten that meet the limits, and the last one) and always shows the chosen one
            int lastTraced = -100;
            int chosenTrial = feasible.isEmpty() ? -1 : (int) feasible.get(0)[5];
            Integer lastKey = trialLines.isEmpty() ? null : trialLines.lastKey();
            for (var e : trialLines.entrySet()) {
                int gi = e.getKey();
                if (gi - lastTraced >= 10 || gi == chosenTrial || e.getKey().equals(lastKey)) {
                    trace.add(e.getValue());
                    lastTraced = gi;
                }
            }
            if (!feasible.isEmpty()) {
                useChoice(0);
                bestFig = feasibleFigures.get(0);
                velocityMet = true;
                binding = "velocity loop: " + spec.bindingConstraint(bestFig);
                if (feasible.get(0)[0] >= grid[grid.length - 1] * (1 - 1e-12) && grid.length > 1) {
                    binding = "velocity loop: top of the searched band (" + Units.formatHz(Units.radPerSToHz(grid[grid.length - 1])) + ")";
                }
                trace.add("velocity loop ranked best (highest worst-case crossover, then most integral action, then no low-pass): " + describeChoice(0)
                        + "; binding: " + binding);
            } else {
                velocityMet = false;
                bestOmegaCv = fallbackW;
                chosenTrialRadPerS = fallbackW;
                bestKv = fallbackKv;
                bestOmegaI = fallbackWi;
                bestLowPass = fallbackLp;
                binding = "velocity loop fails " + spec.bindingConstraint(fallbackFig) + " (best reachable: " + fallbackFig + ")";
                trace.add("no velocity candidate meets the spec; closest: trial crossover " + Units.formatHz(Units.radPerSToHz(fallbackW)) + ", ω_cv/ω_i = "
                        + Units.g4(fallbackW / fallbackWi) + ", " + fallbackFig);
            }
            for (CaseArrays c : cases) c.setLowPass(bestLowPass, timing);
        }

        List<LowPass2> lowPassOptions(double wc) {
            List<LowPass2> r = new ArrayList<>();
            r.add(null);
            if (!spec.allowLowPass()) return r;
            for (double k : LOW_PASS_MULTIPLES) {
                double w = k * wc;
                if (timing.isSampled() && w >= 0.45 * timing.nyquistRadPerS() * 2 / Math.PI * Math.PI / 2) continue;
                if (timing.isSampled() && Units.radPerSToHz(w) >= 0.4 * timing.sampleRateHz()) continue;
                r.add(new LowPass2(w, LOW_PASS_DAMPING));
            }
            return r;
        }

        /** Screens the velocity loop on every case and returns the worst figures. */
        LoopFigures worstVelocity(double kv, double wi) {
            double cross = Double.POSITIVE_INFINITY, pm = Double.POSITIVE_INFINITY, gm = Double.POSITIVE_INFINITY, gl = Double.NEGATIVE_INFINITY, msMax = 0;
            boolean stable = true;
            for (CaseArrays c : cases) {
                double ph0 = c.velocityLoop(kv, wi);
                LoopFigures f = LoopScreen.screen(c.omega, c.lRe, c.lIm, c.n, ph0, true);
                evaluations++;
                if (!(f.crossoverRadPerS() >= cross)) cross = Double.isNaN(f.crossoverRadPerS()) ? cross : f.crossoverRadPerS();
                pm = Math.min(pm, f.phaseMarginDeg());
                gm = Math.min(gm, f.gainMarginDb());
                gl = Math.max(gl, f.lowerGainMarginDb());
                msMax = Math.max(msMax, f.sensitivityPeak());
                stable &= f.stable();
            }
            return new LoopFigures(cross, pm, gm, gl, msMax, stable);
        }

        /**
         * Without a position target: the highest velocity crossover and the best Kp it allows. With one: the
         * highest velocity crossover whose loops let Kp reach the target (a stiffer position loop is worth a
         * slightly lower velocity crossover), else the choice with the highest Kp. The trace says which of the
         * two happened, and never claims a target that was not reached.
         */
        void positionOverChoices() {
            if (!spec.hasPositionBandwidthTarget() || feasible.size() < 2) {
                position();
                return;
            }
            double targetKp = Units.hzToRadPerS(spec.positionBandwidthHz());
            double bestFoundKp = -1;
            int bestIdx = 0;
            boolean reached = false;
            List<String> savedTrace = new ArrayList<>(trace);
            String savedBinding = binding;
            double lastCrossover = Double.NaN;
            int tried = 0;
            double highestTried = Double.NaN, lowestTried = Double.NaN, kpAtBest = Double.NaN;
            for (int k = 0; k < feasible.size() && tried < 40; k++) {
                if (feasible.get(k)[3] == lastCrossover) continue; // one candidate per crossover: the best-ranked
                lastCrossover = feasible.get(k)[3];
                tried++;
                if (tried == 1) highestTried = lastCrossover;
                lowestTried = lastCrossover;
                useChoice(k);
                trace.clear();
                position();
                if (k == 0) kpAtBest = positionMet ? bestKp : Double.NaN;
                if (positionMet && bestKp >= targetKp * (1 - 1e-9)) {
                    bestIdx = k;
                    bestFoundKp = bestKp;
                    reached = true;
                    break;
                }
                if (positionMet && bestKp > bestFoundKp) {
                    bestFoundKp = bestKp;
                    bestIdx = k;
                }
            }
            useChoice(bestIdx);
            trace.clear();
            trace.addAll(savedTrace);
            binding = savedBinding;
            String target = Units.formatHz(spec.positionBandwidthHz());
            if (reached && bestIdx == 0) {
                trace.add("position target " + target + ": Kp reaches it with the best-ranked velocity loop");
            } else if (reached) {
                trace.add("position target " + target + ": with the best-ranked velocity loop "
                        + (Double.isNaN(kpAtBest) ? "no position gain meets the limits" : "Kp stops at " + Units.g4(kpAtBest) + " 1/s (" + Units.formatHz(Units.radPerSToHz(kpAtBest)) + ")")
                        + "; velocity crossover lowered to " + Units.formatHz(Units.radPerSToHz(bestOmegaCv)) + ", the highest that lets Kp reach " + target
                        + " (" + describeChoice(bestIdx) + ")");
                binding = "velocity loop: lowered for the position target (" + spec.bindingConstraint(feasibleFigures.get(bestIdx)) + " at the higher crossovers)";
            } else if (bestFoundKp < 0) {
                trace.add("position target " + target + ": no velocity candidate (" + tried + " tried, worst-case crossovers "
                        + Units.formatHz(Units.radPerSToHz(lowestTried)) + " .. " + Units.formatHz(Units.radPerSToHz(highestTried))
                        + ") lets a position gain meet the limits; keeping the best-ranked velocity loop");
            } else {
                trace.add("position target " + target + " NOT reachable: over " + tried + " velocity candidates (worst-case crossovers "
                        + Units.formatHz(Units.radPerSToHz(lowestTried)) + " .. " + Units.formatHz(Units.radPerSToHz(highestTried))
                        + ") the highest Kp that meets the limits is " + Units.g4(bestFoundKp) + " 1/s (" + Units.formatHz(Units.radPerSToHz(bestFoundKp))
                        + "), with velocity crossover " + Units.formatHz(Units.radPerSToHz(bestOmegaCv))
                        + (bestIdx == 0 ? " (the best-ranked velocity loop)" : ", lowered from " + Units.formatHz(Units.radPerSToHz(highestTried)) + " for it"));
                if (bestIdx != 0) {
                    binding = "velocity loop: lowered for the highest reachable position gain (" + spec.bindingConstraint(feasibleFigures.get(bestIdx))
                            + " at the higher crossovers)";
                }
            }
            position();
        }

        /** Whether feasible candidate i ranks before j (the order of {@link #sortFeasible}). */
        private boolean ranksBefore(int i, int j) {
            double ci = feasible.get(i)[3], cj = feasible.get(j)[3];
            if (ci != cj) return ci > cj;
            double ri = feasible.get(i)[4], rj = feasible.get(j)[4];
            if (ri != rj) return ri < rj;
            return feasibleLowPass.get(i) == null && feasibleLowPass.get(j) != null;
        }

        /** One feasible velocity candidate in words: trial crossover, ratio, low-pass, gains and screened figures. */
        private String describeChoice(int k) {
            double[] c = feasible.get(k);
            LowPass2 lp = feasibleLowPass.get(k);
            return "trial crossover " + Units.formatHz(Units.radPerSToHz(c[0])) + ", ω_cv/ω_i = " + Units.g4(c[4])
                    + (lp == null ? ", no low-pass" : ", low-pass at " + Units.formatHz(lp.naturalHz())) + ", Kv " + Units.g4(c[1])
                    + ", integral corner " + Units.formatHz(Units.radPerSToHz(c[2])) + ": worst-case " + feasibleFigures.get(k);
        }

        /** The trace's last line: the parameters the result carries, in the units a drive takes. */
        String chosenStatement(Piv piv, FilterChain all) {
            String ratio = bestOmegaI > 0 ? ", ω_cv/ω_i = " + Units.g4(chosenTrialRadPerS / bestOmegaI) + " at trial crossover "
                    + Units.formatHz(Units.radPerSToHz(chosenTrialRadPerS)) : "";
            return "chosen: Kp " + Units.g4(piv.positionGainPerS()) + " 1/s, Kv " + Units.g4(piv.velocity().velocityGain()) + ", integral corner "
                    + Units.formatHz(piv.velocity().integralCornerHz()) + ratio + "; filters: " + (all.isEmpty() ? "none" : all.toString());
        }

        /**
         * Orders the feasible velocity candidates best first: highest worst-case actual crossover, then most
         * integral action (smallest ω_cv/ω_i), then no extra low-pass; stable sort, so ties keep search order.
         */
        private void sortFeasible() {
            Integer[] idx = new Integer[feasible.size()];
            for (int i = 0; i < idx.length; i++) idx[i] = i;
            java.util.Arrays.sort(idx, java.util.Comparator.<Integer>comparingDouble(i -> -feasible.get(i)[3])
                    .thenComparingDouble(i -> feasible.get(i)[4])
                    .thenComparingInt(i -> feasibleLowPass.get(i) == null ? 0 : 1));
            List<double[]> f = new ArrayList<>();
            List<LowPass2> l = new ArrayList<>();
            List<LoopFigures> g = new ArrayList<>();
            for (Integer i : idx) {
                f.add(feasible.get(i));
                l.add(feasibleLowPass.get(i));
                g.add(feasibleFigures.get(i));
            }
            feasible.clear();
            feasible.addAll(f);
            feasibleLowPass.clear();
            feasibleLowPass.addAll(l);
            feasibleFigures.clear();
            feasibleFigures.addAll(g);
        }

        private void useChoice(int k) {
            double[] c = feasible.get(k);
            chosenTrialRadPerS = c[0];
            bestOmegaCv = c[3];
            bestKv = c[1];
            bestOmegaI = c[2];
            bestLowPass = feasibleLowPass.get(k);
            for (CaseArrays a : cases) a.setLowPass(bestLowPass, timing);
        }

        void position() {
            double top = bestOmegaCv / spec.maxPositionToVelocityRatio();
            if (spec.hasPositionBandwidthTarget()) top = Math.min(top, Units.hzToRadPerS(spec.positionBandwidthHz()));
            double bottom = Math.max(bandLow() * 1.2, bestOmegaCv / 200);
            if (!(top > bottom)) top = bottom * 1.0001;
            double[] kps = FrequencyGrid.logRadPerS(bottom, top, POSITION_STEPS);
            // inner loop with the chosen controller, closed: Tv = Lv/(1+Lv) kept in l2
            for (CaseArrays c : cases) {
                c.velocityLoop(bestKv, bestOmegaI);
                for (int i = 0; i < c.n; i++) {
                    double dr = 1 + c.lRe[i], di = c.lIm[i], d = dr * dr + di * di;
                    c.l2Re[i] = (c.lRe[i] * dr + c.lIm[i] * di) / d;
                    c.l2Im[i] = (c.lIm[i] * dr - c.lRe[i] * di) / d;
                }
            }
            double bestShort = Double.POSITIVE_INFINITY, fallback = kps[0];
            LoopFigures fallbackFig = null;
            String fallbackWhere = "";
            bestKp = Double.NaN;
            LoopFigures chosenP = null, chosenU = null;
            for (int k = kps.length - 1; k >= 0; k--) {
                double kp = kps[k];
                LoopFigures worstP = null, worstU = null;
                for (CaseArrays c : cases) {
                    LoopFigures p = screenPosition(c, kp);
                    LoopFigures u = screenPlantInput(c, kp, p.stable());
                    worstP = worse(worstP, p);
                    worstU = worse(worstU, u);
                }
                boolean ok = spec.meets(worstP) && spec.meets(worstU);
                if (ok) {
                    bestKp = kp;
                    chosenP = worstP;
                    chosenU = worstU;
                    break;
                }
                double sf = Math.max(spec.shortfall(worstP), spec.shortfall(worstU));
                if (sf < bestShort) {
                    bestShort = sf;
                    fallback = kp;
                    fallbackFig = spec.shortfall(worstP) >= sf ? worstP : worstU;
                    fallbackWhere = spec.shortfall(worstP) >= sf ? "position loop" : "plant-input loop";
                }
            }
            if (!Double.isNaN(bestKp)) {
                positionMet = true;
                String why;
                if (bestKp >= kps[kps.length - 1] * (1 - 1e-12)) {
                    why = spec.hasPositionBandwidthTarget() && Units.hzToRadPerS(spec.positionBandwidthHz()) <= bestOmegaCv / spec.maxPositionToVelocityRatio()
                            ? "position bandwidth target reached" : "Kp ≤ ω_cv/" + Units.g4(spec.maxPositionToVelocityRatio());
                } else {
                    why = headroom(chosenU) < headroom(chosenP) ? "plant-input loop " + spec.bindingConstraint(chosenU) : "position loop " + spec.bindingConstraint(chosenP);
                }
                trace.add("position loop chosen: Kp " + Units.g4(bestKp) + " 1/s (" + Units.formatHz(Units.radPerSToHz(bestKp)) + "); limited by " + why
                        + "; position " + chosenP + "; plant input Ms " + Units.g4(chosenU.sensitivityPeak()));
                if (!velocityMet) return;
                binding = binding.replaceAll("; position loop: .*$", "") + "; position loop: " + why;
            } else {
                positionMet = false;
                bestKp = fallback;
                binding = binding + "; " + fallbackWhere + " fails " + spec.bindingConstraint(fallbackFig);
                trace.add("no position gain meets the spec; closest Kp " + Units.g4(fallback) + " 1/s, " + fallbackWhere + ": " + fallbackFig);
            }
        }

        /** Smallest relative headroom of the three limits (negative when one fails). */
        private double headroom(LoopFigures f) {
            double a = (f.phaseMarginDeg() - spec.minPhaseMarginDeg()) / spec.minPhaseMarginDeg();
            double b = (f.gainMarginDb() - spec.minGainMarginDb()) / spec.minGainMarginDb();
            double c = (spec.maxSensitivityPeak() - f.sensitivityPeak()) / spec.maxSensitivityPeak();
            return Math.min(a, Math.min(b, c));
        }

        private static LoopFigures worse(LoopFigures a, LoopFigures b) {
            if (a == null) return b;
            return new LoopFigures(Math.min(a.crossoverRadPerS(), b.crossoverRadPerS()), Math.min(a.phaseMarginDeg(), b.phaseMarginDeg()),
                    Math.min(a.gainMarginDb(), b.gainMarginDb()), Math.max(a.lowerGainMarginDb(), b.lowerGainMarginDb()),
                    Math.max(a.sensitivityPeak(), b.sensitivityPeak()), a.stable() && b.stable());
        }

        /** Lp = Kp·Tv/(jω) into l (Tv in l2); phase at low frequency -90° (Tv → 1). */
        LoopFigures screenPosition(CaseArrays c, double kp) {
            for (int i = 0; i < c.n; i++) {
                double w = c.omega[i];
                c.lRe[i] = kp * c.l2Im[i] / w;
                c.lIm[i] = -kp * c.l2Re[i] / w;
            }
            evaluations++;
            double ph0 = Math.atan2(c.l2Im[0], c.l2Re[0]) - Math.PI / 2;
            return LoopScreen.screen(c.omega, c.lRe, c.lIm, c.n, ph0, true);
        }

        /** Lu = Lv·(1 + Kp/(jω)); stability comes from the nested loops (1 + Lu = (1 + Lv)(1 + Lp)). */
        LoopFigures screenPlantInput(CaseArrays c, double kp, boolean positionStable) {
            double ph0 = c.velocityLoop(bestKv, bestOmegaI) + Math.atan2(-kp / c.omega[0], 1);
            for (int i = 0; i < c.n; i++) {
                double fr = 1, fi = -kp / c.omega[i];
                double r = c.lRe[i] * fr - c.lIm[i] * fi;
                c.lIm[i] = c.lRe[i] * fi + c.lIm[i] * fr;
                c.lRe[i] = r;
            }
            evaluations++;
            LoopFigures f = LoopScreen.screen(c.omega, c.lRe, c.lIm, c.n, ph0, false);
            return new LoopFigures(f.crossoverRadPerS(), f.phaseMarginDeg(), f.gainMarginDb(), f.lowerGainMarginDb(), f.sensitivityPeak(),
                    positionStable && velocityMet);
        }
    }
}
