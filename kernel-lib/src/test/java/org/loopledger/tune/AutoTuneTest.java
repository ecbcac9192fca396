package org.loopledger.tune;

import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Margins;
import org.loopledger.control.CascadeLoops;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class AutoTuneTest {
    static final double J = 2e-4, KT = 0.5; // kg·m², N·m/A: a small servo motor (invented, for the check only)

    static TransferFunction rigid(double inertia) {
        return TransferFunction.continuous(new double[] {KT}, new double[] {inertia, 0});
    }

    @Test
    void rigidBodyCrossoverLandsWhereAskedWithTheClosedFormPhaseMargin() {
        // Rigid body P = Kt/(J s) with C = Kv (1 + ωi/s), no delay: at ω_c the phase is -90° - atan(ωi/ω_c), so
        // PM = 90° - atan(1/r) with r = ω_c/ωi, and |L(jω_c)| = 1 gives Kv = J ω_c / (Kt sqrt(1 + 1/r²)) (derivation by hand).
        double fc = 100, r = 4, wc = 2 * Math.PI * fc;
        Frf p = Frf.ofModel(rigid(J), FrequencyGrid.logHz(1, 5000, 2000));
        TuningSpec spec = TuningSpec.builder().velocityCrossoverHz(fc).integralRatios(r).minPhaseMarginDeg(45).build();
        TuningResult t = AutoTune.onMeasured(p, DriveTiming.continuous(), FilterChain.none(), spec);
        assertTrue(t.specMet(), t.toString());
        double pmClosedForm = 90 - Math.toDegrees(Math.atan(1 / r));
        double kvClosedForm = J * wc / (KT * Math.sqrt(1 + 1 / (r * r)));
        // Tolerances: the tuner interpolates |P·PI| in log-log between grid points 0.19 % apart; 1e-4 relative covers it.
        assertEquals(kvClosedForm, t.piv().velocity().velocityGain(), 1e-4 * kvClosedForm);
        assertEquals(wc / r, t.piv().velocity().integralCornerRadPerS(), 1e-9 * wc);
        LoadCaseFigures f = t.cases().get(0);
        assertEquals(fc, f.velocityCrossoverHz(), 1e-3 * fc);
        assertEquals(pmClosedForm, f.velocityLoop().phaseMarginDeg().getAsDouble(), 0.05);
        // Same check on the exact model through the continuous cascade (independent of the FRF grid).
        CascadeLoops exact = CascadeLoops.of(rigid(J), t.piv(), FilterChain.none(), DriveTiming.continuous(), FrequencyGrid.logHz(1, 5000, 400));
        Margins m = Margins.of(exact.transferFunctions().orElseThrow().velocityLoop());
        assertEquals(pmClosedForm, m.phaseMarginDeg().getAsDouble(), 0.05);
    }

    @Test
    void modelVariantAgreesWithTheDataVariant() {
        TuningSpec spec = TuningSpec.builder().velocityCrossoverHz(150).integralRatios(5).build();
        TuningResult onData = AutoTune.onMeasured(Frf.ofModel(rigid(J), FrequencyGrid.logHz(0.5, 7000, 3000)),
                DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1).withZeroOrderHold(true), FilterChain.none(), spec);
        TuningResult onModel = AutoTune.onModel(rigid(J), DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1).withZeroOrderHold(true),
                FilterChain.none(), spec);
        assertEquals(onData.piv().velocity().velocityGain(), onModel.piv().velocity().velocityGain(), 1e-3 * onData.piv().velocity().velocityGain());
    }

    @Test
    void worstCaseOverLoadCasesMeetsTheSpecOnEveryCase() {
        DriveTiming drive = DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1).withZeroOrderHold(true);
        double[] grid = FrequencyGrid.logHz(2, 7000, 2000);
        List<PlantCase> cases = List.of(PlantCase.of("light", Frf.ofModel(rigid(J), grid)),
                PlantCase.of("medium", Frf.ofModel(rigid(2 * J), grid)), PlantCase.of("heavy", Frf.ofModel(rigid(4 * J), grid)));
        TuningSpec spec = TuningSpec.builder().minPhaseMarginDeg(45).minGainMarginDb(8).maxSensitivityPeak(1.8).build();
        TuningResult t = AutoTune.onMeasured(cases, drive, FilterChain.none(), spec);
        assertTrue(t.specMet(), t.toString());
        assertTrue(t.reanalysisMeetsSpec(), "independent re-analysis of each loop agrees: " + t);
        // The heaviest case needs the most gain, so it has the lowest crossover; the lightest the highest (common practice).
        assertTrue(t.cases().get(2).velocityCrossoverHz() < t.cases().get(0).velocityCrossoverHz());
        // Deterministic: the same data give the same gains, bit for bit.
        TuningResult again = AutoTune.onMeasured(cases, drive, FilterChain.none(), spec);
        assertEquals(t.piv(), again.piv());
        assertFalse(t.trace().isEmpty());
        assertTrue(t.bindingConstraint().contains("velocity loop"), t.bindingConstraint());
    }

    @Test
    void unreachableSpecGivesTheBestReachableFiguresAndNamesTheFailingLimit() {
        // A 1-sample delay plus hold cost phase that no PI can give back at 1.5 kHz crossover with PM ≥ 80°.
        TuningSpec spec = TuningSpec.builder().velocityCrossoverHz(1500).minPhaseMarginDeg(80).build();
        TuningResult t = AutoTune.onMeasured(Frf.ofModel(rigid(J), FrequencyGrid.logHz(2, 7900, 1500)),
                DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1).withZeroOrderHold(true), FilterChain.none(), spec);
        assertFalse(t.specMet());
        assertTrue(t.bindingConstraint().contains("fails") && t.bindingConstraint().contains("phase margin"), t.bindingConstraint());
        assertTrue(t.piv().velocity().velocityGain() > 0);
    }

    @Test
    void badInputIsRefusedClearly() {
        Frf p = Frf.ofModel(rigid(J), FrequencyGrid.logHz(10, 1000, 200));
        var e = assertThrows(IllegalArgumentException.class, () -> AutoTune.onMeasured(p, DriveTiming.continuous(), FilterChain.none(),
                TuningSpec.builder().velocityCrossoverHz(5000).build()));
        assertTrue(e.getMessage().contains("not inside the measured band"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> AutoTune.onMeasured(List.of(), DriveTiming.continuous(), FilterChain.none(), TuningSpec.defaults()));
        assertThrows(IllegalArgumentException.class, () -> TuningSpec.builder().minPhaseMarginDeg(-5));
        assertThrows(IllegalArgumentException.class, () -> TuningSpec.builder().maxSensitivityPeak(0.8));
        assertThrows(IllegalArgumentException.class, () -> TuningSpec.builder().integralRatios(0.5));
        // Data above the drive's Nyquist frequency cannot be a sampled loop.
        Frf wide = Frf.ofModel(rigid(J), FrequencyGrid.logHz(1, 12000, 300));
        var e2 = assertThrows(IllegalArgumentException.class, () -> AutoTune.onMeasured(wide, DriveTiming.sampledAtHz(16000), FilterChain.none(), TuningSpec.defaults()));
        assertTrue(e2.getMessage().contains("Nyquist"), e2.getMessage());
    }
}
