package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.analysis.GangOfFour;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.LowPass1;
import org.loopledger.control.Piv;
import org.loopledger.ident.fit.FitResult;
import org.loopledger.ident.fit.ParameterEstimate;
import org.loopledger.ident.fit.TwoMassFit;
import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.lti.TransferFunction;
import org.loopledger.sim.Excitation;
import org.loopledger.sim.ResponseMetrics;
import org.loopledger.sim.TimeResponse;
import org.loopledger.analysis.Margins;
import org.loopledger.tune.LoadCaseFigures;
import org.loopledger.tune.TuningResult;
import org.loopledger.tune.TuningSpec;

import java.util.List;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.*;

/** Gang of Four peaks, fits with truth, response tables, drive timing and tuning results: numbers against independent values. */
class ResultTablesTest {
    static List<String> row(Document d, String first) {
        for (var tr : d.select("tr")) {
            List<String> c = tr.select("th, td").eachText();
            if (!c.isEmpty() && c.get(0).equals(first)) return c;
        }
        throw new AssertionError("no row " + first + " in " + d.select("tr").eachText());
    }

    static Document html(MimeBundle b) {
        String h = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        MarginsTableTest.wellFormed(h);
        return Jsoup.parse(h);
    }

    @Test
    void gangOfFourPeaksMatchTheSecondOrderResonantPeak() {
        // P = 1/(s(s+1)), C = 1: T = 1/(s^2 + s + 1), zeta = 0.5, wn = 1. Resonant peak (Ogata, Modern Control Engineering, 5th ed.,
        // section 7-2): Mr = 1/(2 zeta sqrt(1 - zeta^2)) = 1.1547 at wr = wn sqrt(1 - 2 zeta^2) = 0.7071 rad/s = 0.1125 Hz.
        TransferFunction p = MarginsTableTest.TYPE1, c = TransferFunction.gain(1);
        GangOfFour g = GangOfFour.of(p, c, MarginsTableTest.GRID);
        Document d = html(Bundles.of(g));
        List<String> t = row(d, "|T|");
        assertEquals(1 / (2 * 0.5 * Math.sqrt(0.75)), Double.parseDouble(t.get(2)), 2e-3);
        assertEquals(Math.sqrt(0.5) / (2 * Math.PI), Double.parseDouble(t.get(4)), 3e-3 * 0.1125, "grid of 4000 points over 6 decades");
        // |S| peak against its definition on a dense grid (MarginsTableTest).
        double[] ms = MarginsTableTest.msByDefinition(p);
        assertEquals(ms[0], Double.parseDouble(row(d, "|S| = Ms").get(2)), 2e-3 * ms[0]);
        // With C = 1, CS = C·S = S and PS = P·S = P/(1 + P) = T: same peaks at the same frequencies.
        assertEquals(row(d, "|S| = Ms").subList(2, 5), row(d, "|CS|").subList(2, 5));
        assertEquals(row(d, "|T|").subList(2, 5), row(d, "|PS|").subList(2, 5));
        assertEquals(Bundles.of(g).plainText(), Bundles.of(GangOfFour.of(p, c, MarginsTableTest.GRID)).plainText());
    }

    @Test
    void aPeakAtTheEdgeOfTheGridIsMarked() {
        // P = 1/(s(s+1)), C = 0.1: PS = 1/(s^2 + s + 0.1), overdamped (zeta = 1/(2 sqrt 0.1) = 1.58), so |PS| falls from 10 at DC
        // and its largest value on the grid is at the lowest point, 1e-3 rad/s: 1/|0.1 + 0.001j - 1e-6| = 9.9995.
        GangOfFour g = GangOfFour.of(MarginsTableTest.TYPE1, TransferFunction.gain(0.1), MarginsTableTest.GRID);
        List<String> ps = row(html(Bundles.of(g)), "|PS|");
        assertEquals(1 / Math.hypot(0.1 - 1e-6, 1e-3), Double.parseDouble(ps.get(2)), 1e-3);
        assertTrue(ps.get(4).endsWith("(band edge)"), ps.toString());
    }

    @Test
    void fitsShowTheTruthAndWhetherTheIntervalCoversIt() {
        TwoMassParameters truth = new TwoMassParameters(2.0e-4, 1e-3, 400, 0.02, 250, 0.03, 60e-6);
        List<ParameterEstimate> est = List.of(new ParameterEstimate("inertia", "kg·m²", 2.02e-4, 1e-6, 2.0e-4, 2.04e-4),
                new ParameterEstimate("resonance", "Hz", 405, 1, 403, 407), new ParameterEstimate("delay", "s", 61e-6, 2e-6, 57e-6, 65e-6));
        FitResult f = new FitResult(MarginsRendererTest.CUBIC_LAG, est, List.of(), 1.1, 300, 12, List.of());
        TwoMassParameters estimate = new TwoMassParameters(2.02e-4, 1e-3, 405, 0.02, 250, 0.03, 61e-6);
        MimeBundle b = FitTable.builder().row("heavy", new TwoMassFit(estimate, f), truth).build().toMimeBundle();
        Document d = html(b);
        List<String> inertia = d.select("tbody tr").get(0).select("td").eachText();
        assertEquals(List.of("heavy", "inertia", "0.000202", "0.0002", "0.000204", "kg·m²", "0.0002", "yes"), inertia);
        // 405 Hz +- 1 Hz (1 standard error) against 400 Hz: |405 - 400| / 1 = 5 standard errors, outside [403, 407].
        List<String> res = d.select("tbody tr").get(1).select("td").eachText();
        assertEquals("NO: 5 standard errors away", res.get(7));
        assertEquals(1, d.select("tbody tr.fail").size());
        List<String> delay = d.select("tbody tr").get(2).select("td").eachText();
        assertEquals(List.of("61", "57", "65", "us", "60", "yes"), delay.subList(2, 8), "delays in µs");
        assertTrue(b.plainText().contains("heavy: 300 points, reduced chi-square 1.1, usable"), b.plainText());
    }

    @Test
    void responseTableScalesPositionsAndKeepsEveryFigure() {
        ResponseMetrics step = new ResponseMetrics(Excitation.POSITION_STEP, OptionalDouble.of(0.0123), OptionalDouble.of(4.5), OptionalDouble.of(0.031),
                0.01, 0.0, 3.2, 0.2);
        ResponseMetrics dist = new ResponseMetrics(Excitation.TORQUE_DISTURBANCE_STEP, OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                2e-4, 0.0, 1.0, 0.08);
        // A 10 mm lead: 1 rad of motor is 10/(2π) mm = 10000/(2π) µm of carriage.
        double umPerRad = 10_000 / (2 * Math.PI);
        ResponseTable t = ResponseTable.builder().row("heavy", "step", step).row("heavy", "1 A disturbance", dist).positionUnit("um", umPerRad).build();
        Document d = html(t.toMimeBundle());
        List<String> s = d.select("tbody tr").get(0).select("td").eachText();
        assertEquals(List.of("heavy", "step", "12.3", "4.5", "31", Units4.of(0.01 * umPerRad), "um", "3.2"), s);
        List<String> x = d.select("tbody tr").get(1).select("td").eachText();
        assertEquals("not settled within 80 ms", x.get(4));
        assertEquals(Units4.of(2e-4 * umPerRad), x.get(5));
        assertEquals(t.toString(), ResponseTable.builder().row("heavy", "step", step).row("heavy", "1 A disturbance", dist).positionUnit("um", umPerRad).build().toString());
    }

    /** 4 significant digits as the tables print them (lti.Units.g4). */
    static final class Units4 {
        static String of(double v) { return org.loopledger.lti.Units.g4(v); }
    }

    @Test
    void timeResponseShowsWhatWasSimulatedAndItsFigures() {
        double[] time = {0, 0.001, 0.002, 0.003}, ref = {1, 1, 1, 1}, pos = {0, 0.5, 1.0, 1.0}, zero = new double[4], cur = {2, 1, -0.5, 0};
        double[] err = {1, 0.5, 0, 0};
        TimeResponse r = new TimeResponse(Excitation.POSITION_STEP, 1, 1000, time, ref, pos, zero, cur, err);
        MimeBundle b = Bundles.of(r);
        Document d = html(b);
        assertEquals(List.of("Duration", "3", "ms"), row(d, "Duration"));
        assertEquals(List.of("Samples", "4"), row(d, "Samples"));
        assertEquals("2", row(d, "Peak current").get(1), "peak |current| read off the samples");
        assertEquals(b.plainText(), Bundles.of(new TimeResponse(Excitation.POSITION_STEP, 1, 1000, time, ref, pos, zero, cur, err)).plainText());
    }

    @Test
    void driveTimingShowsTheDelayAndItsPhaseLag() {
        Document d = html(Bundles.of(DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1)));
        assertEquals(List.of("Sample time", "62.5", "us"), row(d, "Sample time"));
        // One sample at 16 kHz is 62.5 µs; its lag at 100 Hz is 360·100·62.5e-6 = 2.25 deg (definition of a pure delay).
        assertEquals(List.of("Phase lag of the computation delay at 100 Hz", "2.25", "deg"), row(d, "Phase lag of the computation delay at 100 Hz"));
        assertEquals(List.of("Nyquist frequency", "8000", "Hz"), row(d, "Nyquist frequency"));
    }

    @Test
    void tuningResultTextReproducesAndCarriesTheCoefficientsAndTheCaution() {
        Margins v = Margins.of(MarginsRendererTest.CUBIC_LAG), p = Margins.of(MarginsRendererTest.CONDITIONAL);
        TuningResult a = new TuningResult(Piv.of(50, 0.3, 20), FilterChain.of(LowPass1.ofHz(1000)), DriveTiming.sampledAtHz(16000), TuningSpec.defaults(),
                List.of(new LoadCaseFigures("empty", v, v, p)), true, List.of(), "phase margin", List.of("trial 1"), 10, 34.9);
        TuningResult b = new TuningResult(Piv.of(50, 0.3, 20), FilterChain.of(LowPass1.ofHz(1000)), DriveTiming.sampledAtHz(16000), TuningSpec.defaults(),
                List.of(new LoadCaseFigures("empty", v, v, p)), true, List.of(), "phase margin", List.of("trial 1"), 10, 81.2);
        String ta = Bundles.of(a).plainText();
        assertEquals(ta, Bundles.of(b).plainText(), "wall time never shows");
        assertFalse(ta.contains("34.9"));
        assertTrue(ta.contains("Filter coefficients at 16 kHz") && ta.endsWith(DriveCaution.TEXT), ta);
        Document d = html(Bundles.of(a));
        // Low-pass 1 kHz at 16 kHz, Tustin prewarped: b0 = K/(1+K), K = tan(π/16) (ResultRenderersTest).
        double k = Math.tan(Math.PI / 16);
        assertEquals(k / (1 + k), Double.parseDouble(row(d, "1").get(2)), 1e-13);
        assertTrue(d.text().contains(DriveCaution.TEXT));
    }
}
