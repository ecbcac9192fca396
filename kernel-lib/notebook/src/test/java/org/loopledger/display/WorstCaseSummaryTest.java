package org.loopledger.display;

import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Spec;
import org.loopledger.analysis.SpecReport;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/** {@link WorstCaseSummary}: worst figures as the margins table finds them, crossover ranges, spec-check count. */
class WorstCaseSummaryTest {
    static final double[] GRID = FrequencyGrid.logSpacedRadPerS(0.1, 1000, 2000);

    /** L = 2π·f/s crosses 0 dB at exactly f (|L(j2πf)| = 1 by definition) with PM = 90 deg. */
    static Frf integrator(double crossoverHz) {
        return Frf.ofModel(TransferFunction.continuous(new double[] {2 * Math.PI * crossoverHz}, new double[] {1, 0}), GRID);
    }

    static Map<String, Map<String, Frf>> cases() {
        Map<String, Map<String, Frf>> m = new LinkedHashMap<>();
        m.put("empty", new LinkedHashMap<>(Map.of("velocity", integrator(20))));
        m.put("heavy", new LinkedHashMap<>(Map.of("velocity", integrator(10))));
        m.put("light", new LinkedHashMap<>(Map.of("velocity", integrator(15))));
        return m;
    }

    @Test
    void crossoverRangeNamesTheLowestAndHighestLoadCase() {
        WorstCaseSummary s = WorstCaseSummary.of(MarginsTable.of(cases()));
        WorstCaseSummary.CrossoverRange r = s.crossovers().get(0);
        assertEquals("velocity", r.loop());
        assertEquals(10, r.lowestHz(), 1e-3 * 10, "|L| = 1 at 10 Hz by definition; grid crossing refined");
        assertEquals("heavy", r.lowestCase());
        assertEquals(20, r.highestHz(), 1e-3 * 20);
        assertEquals("empty", r.highestCase());
        assertEquals(3, r.loadCases());
        assertEquals("10 Hz (heavy) to 20 Hz (empty)", r.text());
        assertTrue(s.toString().contains("velocity, first gain crossover: 10 Hz (heavy) to 20 Hz (empty)"), s.toString());
    }

    @Test
    void worstFiguresAreTheTablesAndSpecChecksAreCounted() {
        Spec spec = Spec.builder().minPhaseMarginDeg(45).maxSensitivityPeak(1.8).build();
        MarginsTable t = MarginsTable.of(cases(), spec);
        SpecReport pass = spec.check(integrator(10)).titled("heavy: velocity");
        // T = k/(s + k) has its -3 dB bandwidth at the crossover, 20 Hz (first-order lag, by definition): a 100 Hz minimum fails
        SpecReport fail = Spec.builder().minBandwidthHz(100).build().check(integrator(20)).titled("empty: velocity");
        WorstCaseSummary s = WorstCaseSummary.of(t).withSpecChecks(List.of(pass, fail));
        assertEquals(t.worstPhaseMargin(), s.worst().get(0));
        assertEquals(90, s.worst().get(0).value(), 0.01, "PM of an integrator loop is 90 deg");
        assertFalse(s.worst().get(0).missed());
        assertTrue(pass.passed());
        assertFalse(fail.passed(), fail.toString());
        assertEquals("1 of 2 spec checks pass; FAIL: empty: velocity", s.specChecks());
        String html = Bundles.of(s).get(MimeBundle.TEXT_HTML).orElseThrow();
        MarginsTableTest.wellFormed(html);
        assertTrue(html.contains("class=\"fail\""), html);
        assertThrows(IllegalArgumentException.class, () -> WorstCaseSummary.of(t).withSpecChecks(List.of()));
    }
}
