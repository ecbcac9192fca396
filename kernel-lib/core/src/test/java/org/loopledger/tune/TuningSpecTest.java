package org.loopledger.tune;

import org.loopledger.analysis.Spec;
import org.loopledger.analysis.SpecReport;
import org.loopledger.lti.TransferFunction;
import org.junit.jupiter.api.Test;

import java.util.function.DoubleConsumer;

import static org.junit.jupiter.api.Assertions.*;

/** The tuner's limits are an analysis {@link Spec}: one set of validation rules, stated once. */
class TuningSpecTest {

    private static boolean accepts(DoubleConsumer set, double v) {
        try {
            set.accept(v);
            return true;
        } catch (IllegalArgumentException e) {
            return false;
        }
    }

    /** Every value is accepted or rejected alike by the analysis spec and the tuning spec (the old rules differed at 120 deg, 45 dB, Ms 12). */
    @Test
    void oneRuleSetForLimits() {
        for (double pm : new double[] {-5, 0, 1, 45, 89.9, 90, 120, 179, 200, Double.NaN}) {
            assertEquals(accepts(v -> Spec.builder().minPhaseMarginDeg(v), pm), accepts(v -> TuningSpec.builder().minPhaseMarginDeg(v), pm), "PM " + pm);
        }
        for (double gm : new double[] {-1, 0, 0.5, 8, 39, 45, Double.POSITIVE_INFINITY}) {
            assertEquals(accepts(v -> Spec.builder().minGainMarginDb(v), gm), accepts(v -> TuningSpec.builder().minGainMarginDb(v), gm), "GM " + gm);
        }
        for (double ms : new double[] {0.8, 1, 1.3, 1.8, 9, 12, Double.NaN}) {
            assertEquals(accepts(v -> Spec.builder().maxSensitivityPeak(v), ms), accepts(v -> TuningSpec.builder().maxSensitivityPeak(v), ms), "Ms " + ms);
        }
        // the decided rule: PM in (0, 90) deg, GM above 0 dB, Ms above 1 (see Spec.Builder.minPhaseMarginDeg)
        assertFalse(accepts(v -> Spec.builder().minPhaseMarginDeg(v), 120));
        assertTrue(accepts(v -> TuningSpec.builder().minGainMarginDb(v), 45));
    }

    /** The tuning spec holds the analysis spec: the notebook states 45 deg / 8 dB / 1.8 once and checks loops with it. */
    @Test
    void holdsAnAnalysisSpec() {
        Spec limits = Spec.builder().minPhaseMarginDeg(50).minGainMarginDb(10).maxSensitivityPeak(1.6).build();
        TuningSpec t = TuningSpec.builder().limits(limits).positionBandwidthHz(40).build();
        assertSame(limits, t.limits());
        assertEquals(50, t.minPhaseMarginDeg());
        assertEquals(10, t.minGainMarginDb());
        assertEquals(1.6, t.maxSensitivityPeak());
        TuningSpec d = TuningSpec.defaults();
        assertEquals(45, d.limits().minPhaseMarginDeg().getAsDouble());
        assertEquals(8, d.limits().minGainMarginDb().getAsDouble());
        assertEquals(1.8, d.limits().maxSensitivityPeak().getAsDouble());
        // a setter after limits(...) changes that one limit only
        assertEquals(10, TuningSpec.builder().limits(limits).minPhaseMarginDeg(40).build().minGainMarginDb());
        // checks through the held spec: K/(s(s+1)(s+2)), K = 1 has PM 53.4 deg, GM 15.6 dB, Ms 1.57 (by hand / numpy, see MarginsModelTest)
        TransferFunction third = TransferFunction.continuous(new double[] {1}, new double[] {1, 3, 2, 0});
        SpecReport r = d.limits().check(third);
        assertTrue(r.passed(), r.toString());
        // the position loop's spec: the same limits plus the bandwidth
        Spec pos = t.limits().toBuilder().minBandwidthHz(40).build();
        assertEquals(40, pos.minBandwidthHz().getAsDouble(), 1e-12);
        assertEquals(50, pos.minPhaseMarginDeg().getAsDouble());
    }

    /** A limits spec missing a limit, or carrying one the tuner cannot aim at, is refused with the fix. */
    @Test
    void limitsSpecRefusedWhenIncompleteOrForeign() {
        var e = assertThrows(IllegalArgumentException.class, () -> TuningSpec.builder().limits(Spec.builder().minPhaseMarginDeg(45).build()));
        assertTrue(e.getMessage().contains("need a phase margin, a gain margin and Ms"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> TuningSpec.builder().limits(
                Spec.builder().minPhaseMarginDeg(45).minGainMarginDb(8).maxSensitivityPeak(1.8).minBandwidthHz(40).build()));
        assertTrue(e.getMessage().contains("positionBandwidthHz"), e.getMessage());
    }
}
