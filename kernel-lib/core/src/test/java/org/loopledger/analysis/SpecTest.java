package org.loopledger.analysis;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Spec checks. Reference figures for K/(s(s+1)(s+2)), K = 1, from MarginsModelTest (derivation by hand
 * and numpy): GM = 6 (15.56 dB) at √2 rad/s, PM = 53.41 deg at 0.4457 rad/s; Ms = 1.568 from the
 * brute-force scan there; bandwidth 0.1268 Hz (|T| = 1/√2 checked there).
 */
class SpecTest {

    @Test
    void passingAndFailingRequirementsWithAchievedValues() {
        Spec spec = Spec.builder().minBandwidthHz(0.1).minPhaseMarginDeg(45).minGainMarginDb(8).maxSensitivityPeak(1.6).build();
        SpecReport r = spec.check(MarginsModelTest.third(1));
        assertTrue(r.passed(), r.toString());
        assertEquals(4, r.rows().size());
        SpecReport.Row pm = r.rows().get(1);
        assertEquals("phase margin", pm.requirement());
        assertEquals(53.41, pm.achievedValue(), 0.01);
        assertEquals(45, pm.limitValue());
        assertEquals(Margins.of(MarginsModelTest.third(1)).phaseMarginCrossover().get().frequencyHz(), pm.frequencyHz().getAsDouble(), 1e-15);
        SpecReport.Row gm = r.rows().get(2);
        assertEquals(20 * Math.log10(6), gm.achievedValue(), 1e-9);
        assertEquals(Math.sqrt(2) / (2 * Math.PI), gm.frequencyHz().getAsDouble(), 1e-10);

        // K = 4: GM = 1.5 = 3.52 dB fails 8 dB; bandwidth demand of 1 Hz fails; Ms limit 1.2 fails
        SpecReport bad = Spec.builder().minBandwidthHz(1).minGainMarginDb(8).maxSensitivityPeakDb(1.6).build().check(MarginsModelTest.third(4));
        assertFalse(bad.passed());
        assertEquals(3, bad.failures().size(), bad.toString());
        assertEquals(20 * Math.log10(1.5), bad.rows().get(1).achievedValue(), 1e-9);
    }

    @Test
    void textIsTheVerdictInOneLine() {
        // the table is display.SpecReportText (tested there)
        SpecReport r = Spec.builder().minPhaseMarginDeg(60).minGainMarginDb(6).maxSensitivityPeak(1.6).build().check(MarginsModelTest.third(1));
        assertEquals("Spec check: 1 of 3 requirements FAIL", r.toString());
        assertEquals("Spec check, velocity loop: 1 of 3 requirements FAIL", r.titled("velocity loop").toString());
    }

    /** Nonsense limits are rejected at once, naming the value and the sensible range. */
    @Test
    void nonsenseLimitsRejected() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Spec.builder().minPhaseMarginDeg(-10));
        assertTrue(e.getMessage().contains("-10") && e.getMessage().contains("(0, 90)"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Spec.builder().minPhaseMarginDeg(200));
        e = assertThrows(IllegalArgumentException.class, () -> Spec.builder().minGainMarginDb(0));
        assertTrue(e.getMessage().contains("positive"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Spec.builder().maxSensitivityPeak(0.8));
        assertTrue(e.getMessage().contains("above 1"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Spec.builder().maxSensitivityPeakDb(-1));
        assertThrows(IllegalArgumentException.class, () -> Spec.builder().minBandwidthHz(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> Spec.builder().minBandwidthHz(-80));
        assertThrows(IllegalArgumentException.class, () -> Spec.builder().minDelayMarginS(0));
        e = assertThrows(IllegalArgumentException.class, () -> Spec.builder().minPhaseMarginDeg(45).minPhaseMarginDeg(50));
        assertTrue(e.getMessage().contains("twice"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Spec.builder().build());
    }

    /** On data whose band misses the phase crossover, the gain margin cannot be verified: it fails, saying why. */
    @Test
    void dataWithoutPhaseCrossoverCannotPassGainMargin() {
        Frf f = Frf.ofModel(MarginsModelTest.third(1), FrequencyGrid.logRadPerS(0.01, 1, 300));
        SpecReport r = Spec.builder().minGainMarginDb(6).minPhaseMarginDeg(45).build().check(f);
        // rows come in the Spec's fixed order: bandwidth, phase margin, gain margin, ...
        assertEquals("phase margin", r.rows().get(0).requirement());
        assertTrue(r.rows().get(0).pass(), r.toString());
        assertFalse(r.rows().get(1).pass());
        assertTrue(r.rows().get(1).achieved().contains("none in band"), r.toString());
        assertFalse(r.warnings().isEmpty());
        // structured: the missing phase crossover is named by kind, at the top of the band (1 rad/s), and a combined
        // report keeps kind and frequency while its message says which part it came from
        LoopWarning noPc = r.warnings().stream().filter(w -> w.kind() == LoopWarning.Kind.NO_PHASE_CROSSOVER_IN_BAND).findFirst().orElseThrow();
        assertEquals(1 / (2 * Math.PI), noPc.frequencyHz().getAsDouble(), 1e-12);
        LoopWarning inCombined = SpecReport.combined("both", r.titled("velocity loop")).warnings().stream()
                .filter(w -> w.kind() == LoopWarning.Kind.NO_PHASE_CROSSOVER_IN_BAND).findFirst().orElseThrow();
        assertEquals(noPc.frequencyHz(), inCombined.frequencyHz());
        assertEquals("velocity loop: " + noPc.message(), inCombined.message());
    }

    /** Stability requirement: Routh says K = 7 is unstable; the lower gain margin of the conditionally stable loop. */
    @Test
    void stabilityAndLowerMargin() {
        assertFalse(Spec.builder().requireStable().build().check(MarginsModelTest.third(7)).passed());
        assertTrue(Spec.builder().requireStable().build().check(MarginsModelTest.third(5)).passed());
        // K(s+10)²/s³ at K = 20: the gain may fall by 20·log10(4) = 12.04 dB (by hand: lower GM 5/K)
        TransferFunction l = TransferFunction.continuous(new double[] {20, 400, 2000}, new double[] {1, 0, 0, 0});
        SpecReport r = Spec.builder().minLowerGainMarginDb(6).build().check(l);
        assertTrue(r.passed(), r.toString());
        assertEquals(20 * Math.log10(4), r.rows().get(0).achievedValue(), 1e-9);
    }
}
