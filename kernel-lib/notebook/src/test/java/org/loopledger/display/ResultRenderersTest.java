package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Margins;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.LowPass1;
import org.loopledger.control.Piv;
import org.loopledger.ident.fit.BandQuality;
import org.loopledger.ident.fit.FitResult;
import org.loopledger.ident.fit.FitWarning;
import org.loopledger.ident.fit.TwoMassFit;
import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.ident.fit.ParameterEstimate;
import org.loopledger.sim.Excitation;
import org.loopledger.sim.ResponseMetrics;
import org.loopledger.tune.LoadCaseFigures;
import org.loopledger.tune.Resonance;
import org.loopledger.tune.ResonanceWarning;
import org.loopledger.tune.TuningResult;
import org.loopledger.tune.TuningSpec;

import java.util.List;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.*;

class ResultRenderersTest {

    private static List<String> row(Document d, String first) {
        for (var tr : d.select("tr")) {
            List<String> cells = tr.select("th, td").eachText();
            if (!cells.isEmpty() && cells.get(0).equals(first)) return cells;
        }
        throw new AssertionError("no row " + first);
    }

    @Test
    void filterCoefficientsKeep15DigitsAndMatchTheTustinClosedForm() {
        var table = FilterChain.of(LowPass1.ofHz(1000)).coefficientTable(16000);
        MimeBundle b = Bundles.of(table);
        assertTrue(b.plainText().startsWith("Filter coefficients at 16 kHz"), b.plainText());
        assertTrue(b.plainText().endsWith("Caution: " + DriveCaution.TEXT), "coefficients go into a drive: " + b.plainText());
        Document d = Jsoup.parse(b.get(MimeBundle.TEXT_HTML).orElseThrow());
        List<String> r = row(d, "1");
        // Derivation by hand: Tustin prewarped at the corner, K = tan(pi·fc/fs) = tan(pi/16); b0 = b1 = K/(1+K), a1 = (K-1)/(K+1), b2 = a2 = 0.
        double k = Math.tan(Math.PI / 16);
        // Tolerance: 15 significant digits printed, so 1e-13 relative covers the last digit and the rounding of tan.
        assertEquals(k / (1 + k), Double.parseDouble(r.get(2)), 1e-13);
        assertEquals(k / (1 + k), Double.parseDouble(r.get(3)), 1e-13);
        assertEquals(0, Double.parseDouble(r.get(4)), 0);
        assertEquals((k - 1) / (k + 1), Double.parseDouble(r.get(5)), 1e-13);
        assertEquals(16, r.get(2).replaceAll("[^0-9]", "").length() - 2, "15 significant digits plus a two-digit exponent: " + r.get(2));
        assertTrue(d.select("caption").text().contains("16 kHz"));
    }

    @Test
    void fitParametersShowValueUnitAndIntervalEscaped() {
        FitResult f = new FitResult(MarginsRendererTest.CUBIC_LAG,
                List.of(new ParameterEstimate("inertia <J>", "kg m^2", 2.5e-4, 1.0e-6, 2.48e-4, 2.52e-4)),
                List.of(new BandQuality("below resonance", 5, 150, 120, 0.21, 1.3, 2.4, 1.1)), 1.05, 400, 17, List.of());
        MimeBundle b = Bundles.of(f);
        String html = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        assertTrue(html.contains("inertia &lt;J&gt;"), "names escaped");
        Document d = Jsoup.parse(html);
        assertEquals(List.of("inertia <J>", "0.00025", "kg m^2", "1e-06", "0.000248", "0.000252"), row(d, "inertia <J>"));
        assertEquals(List.of("below resonance", "5", "150", "120", "0.21", "1.3", "2.4", "1.1"), row(d, "below resonance"));
        assertTrue(d.select("caption").first().text().contains("400 points, 17 iterations, reduced chi-square 1.05"));
        assertEquals(f.toString(), b.plainText());
    }

    @Test
    void stepFiguresCarryTheirUnits() {
        ResponseMetrics m = new ResponseMetrics(Excitation.POSITION_STEP, OptionalDouble.of(0.0123), OptionalDouble.of(4.5), OptionalDouble.empty(),
                0.01, 0.0, 3.2, 0.2);
        Document d = Jsoup.parse(Bundles.of(m).get(MimeBundle.TEXT_HTML).orElseThrow());
        assertEquals(List.of("Rise time (10-90 %)", "12.3", "ms"), row(d, "Rise time (10-90 %)"));
        assertEquals(List.of("Overshoot", "4.5", "%"), row(d, "Overshoot"));
        assertEquals("not settled within 0.2 s", row(d, "Settling time (2 % band)").get(1));
        assertEquals(List.of("Peak following error", "0.01", "rad"), row(d, "Peak following error"));
        assertTrue(d.select("tr").eachText().stream().noneMatch(t -> t.startsWith("Final following error")), "only for ramps");
    }

    @Test
    void tuningResultListsGainsAndEveryLoadCase() {
        Margins v = Margins.of(MarginsRendererTest.CUBIC_LAG), p = Margins.of(MarginsRendererTest.CONDITIONAL);
        TuningResult r = new TuningResult(Piv.of(50, 0.3, 20), FilterChain.of(LowPass1.ofHz(1000)), DriveTiming.continuous(), TuningSpec.defaults(),
                List.of(new LoadCaseFigures("empty <carriage>", v, v, p)), true, List.of(), "phase margin", List.of("step <1>"), 1234, 5.0);
        MimeBundle b = Bundles.of(r);
        String html = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        assertTrue(html.contains("empty &lt;carriage&gt;") && html.contains("step &lt;1&gt;"), "escaped");
        Document d = Jsoup.parse(html);
        assertEquals(List.of("position gain Kp", "50.0000", "1/s"), row(d, "position gain Kp"));
        assertEquals(List.of("velocity-integral corner", "20.0000", "Hz"), row(d, "velocity-integral corner"));
        // Velocity loop 2/(s+1)^3: crossover 0.1220 Hz, PM 67.60 deg, GM 12.04 dB (by hand, MarginsRendererTest); position loop
        // 2(s+1)^2/s^3: crossover 0.3755 Hz, PM 44.06 deg.
        List<String> c = row(d, "empty <carriage>");
        assertEquals(List.of("0.122", "67.6", "12.04"), c.subList(1, 4));
        assertEquals(List.of("0.3755", "44.06"), c.subList(7, 9));
        assertTrue(b.plainText().startsWith(TuningReportText.of(r)), b.plainText());
        assertTrue(b.plainText().contains("  step <1>\n") && b.plainText().endsWith(DriveCaution.TEXT), b.plainText());
    }

    @Test
    void aMissedTargetAndAnUnresolvedResonanceShowInTheirDisplays() {
        Margins v = Margins.of(MarginsRendererTest.CUBIC_LAG), p = Margins.of(MarginsRendererTest.CONDITIONAL);
        List<LoadCaseFigures> cases = List.of(new LoadCaseFigures("heavy", v, v, p));
        // position loop 2(s+1)^2/s^3 crosses at 0.3755 Hz (by hand, see above); 20 Hz was asked
        TuningSpec spec = TuningSpec.builder().positionBandwidthHz(20).build();
        TuningResult r = new TuningResult(Piv.of(50, 0.3, 20), FilterChain.none(), DriveTiming.continuous(), spec, cases, true,
                TuningResult.targetChecks(spec, cases), "phase margin", List.of(), 1, 1.0);
        MimeBundle b = Bundles.of(r);
        assertTrue(b.plainText().startsWith("Spec NOT met: position bandwidth 0.3755 Hz of the 20 Hz asked (98.1 % short)"), b.plainText());
        Document d = Jsoup.parse(b.get(MimeBundle.TEXT_HTML).orElseThrow());
        assertTrue(d.select("p").first().text().startsWith("Spec NOT met"), d.text());
        List<String> row = row(d, "position bandwidth");
        assertEquals(List.of("position bandwidth", "20", "0.3755"), row.subList(0, 3)); // (eachText skips the empty load-case cell)
        assertTrue(row.get(row.size() - 1).startsWith("MISSED: position bandwidth 0.3755 Hz of the 20 Hz asked"), row.toString());

        Resonance res = new Resonance(400, 12, 0.8, 0.001, List.of(new ResonanceWarning(ResonanceWarning.Kind.DAMPING_NOT_RESOLVED, java.util.OptionalDouble.of(400), "damping <not> resolved")));
        MimeBundle rb = Bundles.of(res);
        assertTrue(rb.plainText().contains("warning: damping <not> resolved"), rb.plainText());
        String html = rb.get(MimeBundle.TEXT_HTML).orElseThrow();
        assertTrue(html.contains("damping &lt;not&gt; resolved") && html.contains("DAMPING_NOT_RESOLVED"), html);
        assertEquals(List.of("400", "12", "0.8", "0.001 (not resolved)"), Jsoup.parse(html).select("tr").get(1).select("td").eachText());
    }

    @Test
    void anUnusableFitSaysSoWithEveryWarning() {
        FitWarning out = new FitWarning(FitWarning.Kind.OUTSIDE_BAND, java.util.Optional.of("antiresonance"), OptionalDouble.of(0.0003),
                "the antiresonance lies at 0.0003 Hz, outside <5 .. 2000 Hz>");
        FitWarning ill = new FitWarning(FitWarning.Kind.ILL_CONDITIONED, java.util.Optional.empty(), OptionalDouble.empty(), "near singular");
        FitResult f = new FitResult(MarginsRendererTest.CUBIC_LAG, List.of(new ParameterEstimate("inertia", "kg·m²", 5.2e7, 0, 5.2e7, 5.2e7)),
                List.of(), 1.9, 400, 35, List.of(out, ill));
        assertFalse(f.isUsable());
        MimeBundle b = Bundles.of(f);
        assertTrue(b.plainText().contains("fit NOT usable: 2 warnings"), b.plainText());
        assertTrue(b.plainText().contains("warning: OUTSIDE_BAND (antiresonance) at 0.0003 Hz: the antiresonance lies at 0.0003 Hz"), b.plainText());
        String html = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        assertTrue(html.contains("outside &lt;5 .. 2000 Hz&gt;"), "escaped");
        Document d = Jsoup.parse(html);
        assertTrue(d.select("p").first().text().startsWith("Fit NOT usable: 2 warnings"), d.text());
        assertEquals(List.of("OUTSIDE_BAND", "antiresonance", "0.0003", "the antiresonance lies at 0.0003 Hz, outside <5 .. 2000 Hz>"), row(d, "OUTSIDE_BAND"));
        assertEquals("near singular", row(d, "ILL_CONDITIONED").get(row(d, "ILL_CONDITIONED").size() - 1));
        // a usable fit says what was checked
        FitResult ok = new FitResult(MarginsRendererTest.CUBIC_LAG, List.of(), List.of(), 1.0, 400, 5, List.of());
        assertTrue(Jsoup.parse(Bundles.of(ok).get(MimeBundle.TEXT_HTML).orElseThrow()).select("p").first().text().startsWith("Usable: no warning"));
        // the fit values a user ends a cell with render through the same tables
        TwoMassFit tm = new TwoMassFit(new TwoMassParameters(3e-4, 2e-3, 420, 0.04, 310, 0.03, 0), f);
        String tmHtml = Bundles.of(tm).get(MimeBundle.TEXT_HTML).orElseThrow();
        assertTrue(tmHtml.contains("two-mass: J = ") && tmHtml.contains("Fit NOT usable"), tmHtml);
        assertEquals(tm.toString(), Bundles.of(tm).plainText());
    }
}
