package org.loopledger.sim;

import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Margins;
import org.loopledger.control.Cascade;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Piv;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.ident.fit.FitOptions;
import org.loopledger.ident.fit.ModelFit;
import org.loopledger.ident.fit.TwoMassFit;
import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.lti.Discretization;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The recipes of {@link DriveTiming}'s class comment, checked on a known plant: "measured" data are the exact
 * zero-order-hold equivalent of a two-mass plant (Discretization.zoh) times a computation delay of one sample, i.e.
 * what a drive sees from its held current command to its sampled velocity. The reference is the simulation of the
 * true plant itself; the derivation (the hold's phase is exactly -ωT/2 below fs, so a continuous fit's delay
 * absorbs half a sample) is by hand, Franklin, Powell and Workman, Digital Control of Dynamic Systems, 3rd ed., ZOH.
 */
class FittedDelayTimingTest {
    static final double FS = 8000, T = 1 / FS, KT = 0.5;
    static final TwoMassParameters TRUTH = new TwoMassParameters(2e-4, 1e-3, 400, 0.03, 250, 0.03, 0);
    static final Piv PIV = Piv.of(60, 0.2, 15);

    /** The drive's own measurement: held current command to sampled velocity, one sample of computation delay. */
    static Frf measured() {
        double[] w = FrequencyGrid.logSpacedRadPerS(5, 2000, 400);
        TransferFunction sampled = Discretization.zoh(TRUTH.model(KT, false), T).withDelay(T);
        return Frf.ofModel(sampled, w);
    }

    static double maxStepDifference(TimeResponse a, TimeResponse b) {
        double d = 0;
        for (int k = 0; k < a.size(); k++) d = Math.max(d, Math.abs(a.positionRad()[k] - b.positionRad()[k]));
        return d;
    }

    @Test void continuousFitDelayMinusHalfSampleIsTheComputationDelay() {
        TwoMassFit fit = ModelFit.twoMass(measured(), FitOptions.velocity(KT).withDelay());
        double samples = fit.estimate().delayS() * FS;
        System.out.printf("continuous fit: delay %.4f samples (truth: 1 computation + 0.5 hold)%n", samples);
        // the hold's phase is -ωT/2 exactly; its sinc droop (-0.5 dB at fs/8) is what the fit must bend around
        assertEquals(1.5, samples, 0.05);
        DriveTiming truthTiming = DriveTiming.sampledAtHz(FS).withComputationDelaySamples(1);
        TimeResponse truth = ServoSimulation.of(TRUTH.model(KT, false), PIV, FilterChain.none(), truthTiming).positionStep(1, 0.1);
        TimeResponse recipe = ServoSimulation.of(fit.estimate().withoutDelay().model(KT, false), PIV, FilterChain.none(),
                DriveTiming.sampledAtHz(FS).withComputationDelaySamples(samples - 0.5)).positionStep(1, 0.1);
        TimeResponse doubled = ServoSimulation.of(fit.estimate().withoutDelay().model(KT, false), PIV, FilterChain.none(),
                DriveTiming.sampledAtHz(FS).withComputationDelaySamples(samples)).positionStep(1, 0.1);
        double dRecipe = maxStepDifference(truth, recipe), dDoubled = maxStepDifference(truth, doubled);
        System.out.printf("unit position step, max |difference| to the truth: recipe %.2e, hold counted twice %.2e%n", dRecipe, dDoubled);
        // measured: recipe 6.5e-4, hold counted twice 1.6e-3 (the fitted J, b, ζ also bend around the hold's droop,
        // which no timing can undo, so the recipe is not exact); 1e-3 is 0.1 % of the step
        assertTrue(dRecipe < 1e-3 && dRecipe < 0.5 * dDoubled, dRecipe + " vs " + dDoubled);
    }

    @Test void sampledFitDelayIsTheComputationDelay() {
        TwoMassFit fit = ModelFit.twoMass(measured(), FitOptions.velocity(KT).sampledAt(T).withDelay());
        double samples = fit.estimate().delayS() * FS;
        System.out.printf("sampled-data fit: delay %.4f samples (truth: 1 computation)%n", samples);
        assertEquals(1.0, samples, 0.02);
        TimeResponse truth = ServoSimulation.of(TRUTH.model(KT, false), PIV, FilterChain.none(),
                DriveTiming.sampledAtHz(FS).withComputationDelaySamples(1)).positionStep(1, 0.1);
        TimeResponse recipe = ServoSimulation.of(fit.estimate().withoutDelay().model(KT, false), PIV, FilterChain.none(),
                DriveTiming.sampledAtHz(FS).withComputationDelaySamples(samples)).positionStep(1, 0.1);
        double d = maxStepDifference(truth, recipe);
        System.out.printf("sampled-data fit, unit position step, max |difference| to the truth: %.2e%n", d);
        // the sampled-data fit sees exactly the data's model class, so only the fit's convergence remains
        assertTrue(d < 1e-4, "difference " + d);
    }

    @Test void aModelWithoutHoldKeepsTheHoldOnAndMeasuredDataTurnItOff() {
        double[] w = FrequencyGrid.logSpacedRadPerS(5, 2000, 400);
        DriveTiming drive = DriveTiming.sampledAtHz(FS).withComputationDelaySamples(1);
        double onModel = Margins.of(Cascade.of(TRUTH.model(KT, false), PIV, FilterChain.none(), drive, w).plantInputLoop())
                .phaseMarginDeg().getAsDouble();
        double onData = Margins.of(Cascade.of(measured(), PIV, FilterChain.none(),
                DriveTiming.sampledAtHz(FS).withZeroOrderHold(false)).plantInputLoop()).phaseMarginDeg().getAsDouble();
        double holdForgotten = Margins.of(Cascade.of(TRUTH.model(KT, false), PIV, FilterChain.none(),
                drive.withZeroOrderHold(false), w).plantInputLoop()).phaseMarginDeg().getAsDouble();
        System.out.printf("plant-input PM: model + hold %.2f deg, data without hold %.2f deg, model without hold %.2f deg%n",
                onModel, onData, holdForgotten);
        assertEquals(onData, onModel, 0.5);
        assertTrue(holdForgotten > onData + 1, "forgetting the hold must look optimistic");
    }
}
