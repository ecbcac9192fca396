package org.loopledger.display;

import org.junit.jupiter.api.Test;
import org.loopledger.analysis.ClosedLoopStability;
import org.loopledger.analysis.GangOfFour;
import org.loopledger.analysis.Margins;
import org.loopledger.analysis.Spec;
import org.loopledger.analysis.SpecReport;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Piv;
import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;
import org.loopledger.tune.LoadCaseFigures;
import org.loopledger.tune.TuningResult;
import org.loopledger.tune.TuningSpec;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** The plain-text reports that used to be the values' toString: complete, with units, deterministic. */
class ReportTextTest {
    /** L = K(s² + 20s + 100)/(s³(s²/40000 + s/100 + 1)), conditionally stable at K = 20 (MarginsModelTest, derivation by hand). */
    static TransferFunction conditional(double k) {
        return TransferFunction.continuous(new double[] {k, 20 * k, 100 * k}, new double[] {1.0 / 40000, 1.0 / 100, 1, 0, 0, 0});
    }

    static final TransferFunction THIRD = TransferFunction.continuous(new double[] {1}, new double[] {1, 3, 2, 0}); // 1/(s(s+1)(s+2))

    @Test void marginsReportListsEveryFigureAndEveryCrossingWithUnits() {
        // by hand (MarginsModelTest): two phase crossovers, at 95 ∓ √7025 rad/s, so gain margins both ways
        Margins m = Margins.of(conditional(20));
        String s = MarginsReportText.of(m);
        assertTrue(s.startsWith("Margins (model"), s);
        assertTrue(s.contains("gain margin (increase)") && s.contains("gain margin (decrease)") && s.contains("Ms = max|S|"), s);
        assertTrue(s.contains("Hz") && s.contains("dB") && s.contains("deg"), s);
        assertFalse(s.contains("NaN"), s);
        assertEquals(2, s.lines().filter(x -> x.contains("-180 deg") && x.contains("Hz")).count(), s);
        assertEquals(s, MarginsReportText.of(Margins.of(conditional(20))), "deterministic");
        // data whose band misses the gain crossover (1/(s(s+1)(s+2)) crosses near 0.45 rad/s): "none in band", warned
        Margins d = Margins.of(Frf.ofModel(THIRD, FrequencyGrid.logRadPerS(1, 100, 500)));
        String t = MarginsReportText.of(d);
        assertTrue(t.contains("phase margin:           none in band"), t);
        assertTrue(t.lines().anyMatch(l -> l.startsWith("  note: ") && l.contains("bottom of the band")), t);
    }

    @Test void specReportTableIsReadable() {
        SpecReport r = Spec.builder().minPhaseMarginDeg(60).minGainMarginDb(6).maxSensitivityPeak(1.6).build().check(THIRD);
        String s = SpecReportText.of(r);
        assertTrue(s.startsWith("Spec check: 1 of 3 requirements FAIL\n"), s);
        assertTrue(s.contains("requirement") && s.contains("limit") && s.contains("achieved") && s.contains("result"), s);
        assertTrue(s.contains("deg") && s.contains("dB") && s.contains("Hz"), s);
        // PM of 1/(s(s+1)(s+2)) is 53.4 deg (common textbook example), below 60 deg
        assertTrue(s.lines().anyMatch(l -> l.startsWith("phase margin") && l.endsWith("FAIL")), s);
        assertFalse(s.contains("NaN"), s);
    }

    @Test void gangOfFourReportGivesEachPeakWithItsFrequency() {
        TransferFunction p = TransferFunction.continuous(new double[] {1}, new double[] {1, 1}).withDelay(0.1);
        TransferFunction c = TransferFunction.continuous(new double[] {2, 1}, new double[] {1, 0});
        GangOfFour g = GangOfFour.of(p, c);
        String s = GangOfFourText.of(g);
        for (String f : List.of("S", "T", "PS", "CS")) assertTrue(s.contains("peak |" + f + "| = "), s);
        assertEquals(5, s.lines().count(), s);
        assertTrue(s.contains("Hz") && s.contains("dB"), s);
    }

    @Test void closedLoopStabilityReportGivesCountsAndPoles() {
        // K = 7 on 1/(s(s+1)(s+2)): unstable (Routh: stable for K < 6), two closed-loop poles in the right half plane
        ClosedLoopStability st = ClosedLoopStability.of(THIRD.times(7));
        String s = ClosedLoopStabilityText.of(st);
        assertTrue(s.startsWith("Closed loop UNSTABLE (closed-loop poles)"), s);
        assertTrue(s.contains("Z = 2") && s.contains("closed-loop poles:"), s);
        assertEquals(1, st.toString().lines().count(), st.toString());
    }

    @Test void tuningReportDoesNotDependOnTheWallTime() {
        // a notebook shows the result's text, and `verify` must find it as stored: the search's wall time varies from
        // run to run, so it stays out of the text (as it stays out of the HTML)
        Margins m = Margins.of(TransferFunction.continuous(new double[] {1}, new double[] {1, 1, 0}));
        List<LoadCaseFigures> cases = List.of(new LoadCaseFigures("only", m, m, m));
        TuningResult fast = new TuningResult(Piv.of(1, 1, 0), FilterChain.none(), DriveTiming.continuous(), TuningSpec.defaults(), cases, true,
                List.of(), "x", List.of(), 1310, 166.8);
        TuningResult slow = new TuningResult(fast.piv(), fast.filters(), fast.timing(), fast.spec(), cases, true, List.of(), "x", List.of(), 1310, 670.4);
        assertEquals(TuningReportText.of(fast), TuningReportText.of(slow));
        assertTrue(TuningReportText.of(fast).startsWith(fast + "\n  PIV: Kp = 1 1/s"), TuningReportText.of(fast));
        assertTrue(TuningReportText.of(fast).endsWith("1310 loop evaluations"), TuningReportText.of(fast));
        assertFalse(TuningReportText.of(fast).contains("166.8") || TuningReportText.of(slow).contains("670.4"));
    }
}
