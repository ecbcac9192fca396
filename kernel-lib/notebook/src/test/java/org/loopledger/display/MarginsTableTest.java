package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.parser.Parser;
import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Spec;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

class MarginsTableTest {
    /** L = 1/(s(s+1)), the type-1 textbook loop. */
    static final TransferFunction TYPE1 = TransferFunction.continuous(new double[] {1}, new double[] {1, 1, 0});
    static final double[] GRID = FrequencyGrid.logRadPerS(1e-3, 1e3, 4000);

    /** By hand: |L| = 1 where w^2(w^2 + 1) = 1, so w^2 = (sqrt 5 - 1)/2; PM = 180 - 90 - atan(w) deg. */
    static final double TYPE1_WC = Math.sqrt((Math.sqrt(5) - 1) / 2);
    static final double TYPE1_PM = 90 - Math.toDegrees(Math.atan(TYPE1_WC));

    /** max |1/(1 + L(jw))| on a dense grid, computed here from the definition (independent of analysis.Margins). */
    static double[] msByDefinition(TransferFunction l) {
        double best = 0, at = 0;
        for (double w : FrequencyGrid.logRadPerS(1e-3, 1e3, 200_000)) {
            var v = l.response(w); // L(jw) by polynomial evaluation; the peak search below is this test's own
            double s = 1 / v.add(1).abs();
            if (s > best) { best = s; at = w; }
        }
        return new double[] {best, at / (2 * Math.PI)};
    }

    static Map<String, Map<String, Frf>> twoCases() {
        Map<String, Map<String, Frf>> m = new LinkedHashMap<>();
        for (String lc : List.of("empty", "heavy")) {
            Map<String, Frf> loops = new LinkedHashMap<>();
            loops.put("velocity", Frf.ofModel(MarginsRendererTest.CUBIC_LAG, GRID));
            loops.put("position", Frf.ofModel(lc.equals("heavy") ? TYPE1 : MarginsRendererTest.CUBIC_LAG, GRID));
            m.put(lc, loops);
        }
        return m;
    }

    static void wellFormed(String html) {
        Parser p = Parser.xmlParser().setTrackErrors(50);
        Jsoup.parse(html, "", p);
        assertTrue(p.getErrors().isEmpty(), "well-formed HTML: " + p.getErrors());
    }

    static double number(String cell) { return Double.parseDouble(cell.split(" ")[0]); }

    /** The type-1 loop's response at {@code w} as a measurement would give it: the same values, no model behind them. */
    private static Frf measuredType1(double[] w) {
        Frf model = Frf.ofModel(TYPE1, w);
        double[] re = new double[w.length], im = new double[w.length];
        for (int i = 0; i < w.length; i++) { re[i] = model.realAt(i); im[i] = model.imagAt(i); }
        return Frf.ofParts(w, re, im);
    }

    @Test
    void everyLoopOfEveryLoadCaseInOneTableWithItsFigures() {
        MarginsTable t = MarginsTable.of(twoCases());
        MimeBundle b = Bundles.of(t);
        String html = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        wellFormed(html);
        Document d = Jsoup.parse(html);
        var rows = MarginsRendererTest.table(d, "Margins of every loop");
        assertEquals(5, rows.size(), "header and 2 x 2 rows in the maps' order");
        assertEquals(List.of("empty", "velocity"), rows.get(1).subList(0, 2));
        assertEquals(List.of("heavy", "position"), rows.get(4).subList(0, 2));
        // Cubic lag 2/(s+1)^3 by hand (MarginsRendererTest): crossover 0.1220 Hz, PM 67.60 deg, GM 12.04 dB, delay margin 1.539 s.
        List<String> v = rows.get(1);
        assertEquals("0.122", v.get(2));
        assertEquals("67.6", v.get(3));
        assertEquals("12.04", v.get(4));
        assertEquals("1.539 s", v.get(7));
        // Type-1 loop: PM and crossover from the closed form above; no phase crossover, so no gain margin in the band.
        List<String> p = rows.get(4);
        assertEquals(TYPE1_WC / (2 * Math.PI), number(p.get(2)), 5e-4 * TYPE1_WC / (2 * Math.PI), "4 significant digits");
        assertEquals(TYPE1_PM, number(p.get(3)), 0.006, "2 decimals");
        assertEquals("none in band", p.get(4));
        // Delay margin = PM (rad) / wc, by definition; shown in s with 4 digits.
        assertEquals(Math.toRadians(TYPE1_PM) / TYPE1_WC, number(p.get(7)), 1e-3 * Math.toRadians(TYPE1_PM) / TYPE1_WC);
        // Ms and its frequency against the definition on a dense grid.
        double[] ms = msByDefinition(TYPE1);
        assertEquals(ms[0], number(p.get(5)), 1e-3 * ms[0]);
        assertEquals(ms[1], number(p.get(6)), 2e-3 * ms[1]);
        // Without a spec nothing is called met or missed.
        assertFalse(b.plainText().toLowerCase().contains("meet") || b.plainText().contains("MISSED"), b.plainText());
        assertEquals(TYPE1_PM, t.worstPhaseMargin().value(), 0.01);
        assertEquals("heavy / position", t.worstPhaseMargin().where().split(" at ")[0]);
    }

    @Test
    void aMissedLimitSaysByHowMuchAndWhere() {
        Spec spec = Spec.builder().minPhaseMarginDeg(60).minGainMarginDb(6).maxSensitivityPeak(1.2).build();
        MarginsTable t = MarginsTable.of(twoCases(), spec);
        WorstMargin pm = t.worstPhaseMargin();
        assertTrue(pm.missed());
        assertTrue(pm.verdict().startsWith("MISSED by "), pm.verdict());
        // Shortfall = 60 - PM of the type-1 loop (closed form), printed to 2 decimals.
        assertEquals(60 - TYPE1_PM, number(pm.verdict().substring("MISSED by ".length())), 0.006);
        assertEquals("heavy", pm.loadCase());
        // GM: only the cubic lag has a phase crossover (12.04 dB > 6 dB: 6.04 dB to spare); the type-1 loop has none and is a
        // model on a grid, so the verdict still covers every row where a gain margin exists.
        WorstMargin gm = t.worstGainMargin();
        assertFalse(gm.missed());
        assertEquals(12.04, gm.value(), 0.005);
        // The worst Ms is the larger of the two loops' Ms by definition (the cubic lag's), which exceeds 1.2.
        WorstMargin ms = t.worstSensitivityPeak();
        double worst = Math.max(msByDefinition(TYPE1)[0], msByDefinition(MarginsRendererTest.CUBIC_LAG)[0]);
        assertTrue(worst > 1.2);
        assertTrue(ms.missed() && ms.verdict().startsWith("MISSED by "), ms.verdict());
        assertEquals(worst - 1.2, number(ms.verdict().substring("MISSED by ".length())), 2e-3);
        String html = Bundles.of(t).get(MimeBundle.TEXT_HTML).orElseThrow();
        wellFormed(html);
        assertEquals(4, Jsoup.parse(html).select("table").get(0).select("tr.fail").size(), "every row misses Ms 1.2 (cubic lag 1.67, type-1 1.47)");
    }

    @Test
    void measuredDataWithoutACrossingInBandIsNeverCalledMet() {
        // The type-1 loop measured only between 1 and 10 rad/s: |L| < 1 there, so its crossover (0.786 rad/s) is out of band.
        Frf measured = measuredType1(FrequencyGrid.logRadPerS(1, 10, 200));
        MarginsTable t = MarginsTable.builder().row("case", "loop", measured).spec(Spec.builder().minPhaseMarginDeg(45).build()).build();
        assertEquals("none in band", t.worstPhaseMargin().valueText());
        assertTrue(t.worstPhaseMargin().verdict().contains("not checked"), t.worstPhaseMargin().verdict());
        assertFalse(t.toString().contains("meets"), t.toString());
        assertTrue(t.toString().contains("none in band"), t.toString());
    }

    @Test
    void aWarningSharedByRowsIsWrittenOnceNamingEveryRow() {
        // The same measured type-1 loop (1/(s(s+1)), 0.1 to 10 rad/s) as two load cases: the analysis estimates its
        // integrator from the slope on both rows, with the same message; the table says it once for both.
        Frf measured = measuredType1(FrequencyGrid.logRadPerS(0.1, 10, 300));
        MarginsTable t = MarginsTable.builder().row("first", "loop", measured).row("second", "loop", measured).build();
        String text = t.toString();
        List<String> lines = text.lines().filter(l -> l.contains("net integrators estimated")).toList();
        assertEquals(1, lines.size(), text);
        assertTrue(lines.get(0).contains("first / loop, second / loop: "), text);
    }

    @Test
    void anMsPeakAtTheEdgeOfTheMeasuredBandIsNotCalledMet() {
        // |S| of the type-1 loop rises with frequency below its peak (|S| ~ w at low w, peak near 1 rad/s by the definition
        // search above), so measured from 0.05 to 0.4 rad/s its largest value sits at the upper band edge.
        Frf measured = measuredType1(FrequencyGrid.logRadPerS(0.05, 0.4, 100));
        assertTrue(msByDefinition(TYPE1)[1] * 2 * Math.PI > 0.4, "the true peak lies above the band");
        MarginsTable t = MarginsTable.builder().row("case", "loop", measured).spec(Spec.builder().maxSensitivityPeak(2).build()).build();
        String v = t.worstSensitivityPeak().verdict();
        assertFalse(v.startsWith("meets"), v);
        assertTrue(v.contains("edge of the analysed band"), v);
    }

    @Test
    void otherLimitsOfTheSpecAreNamedAsNotChecked() {
        Spec spec = Spec.builder().minPhaseMarginDeg(45).minBandwidthHz(20).build();
        String text = MarginsTable.of(twoCases(), spec).toString();
        assertTrue(text.contains("not checked by this table: minimum bandwidth 20 Hz"), text);
    }

    @Test
    void plainTextIsDeterministicAndUseful() {
        Spec spec = Spec.builder().minPhaseMarginDeg(45).build();
        String a = Bundles.of(MarginsTable.of(twoCases(), spec)).plainText();
        String b = Bundles.of(MarginsTable.of(twoCases(), spec)).plainText();
        assertEquals(a, b);
        assertFalse(a.contains("@"), "no identity hash codes");
        assertTrue(a.lines().anyMatch(l -> l.startsWith("  load case  loop")), a);
        assertTrue(a.contains("worst phase margin: "), a);
    }

    @Test
    void tablesAndVerdictsSurviveTheRecordSanitiser() {
        MimeBundle b = Bundles.of(MarginsTable.of(twoCases(), Spec.builder().minPhaseMarginDeg(60).build()));
        var nb = new org.loopledger.notebook.Notebook(5, "{}", List.of(new org.loopledger.notebook.Cell.Code("m", "MarginsTable.of(cases, spec)", 1,
                List.of(new org.loopledger.notebook.Output.ExecuteResult(1, b.data(), Map.of())), "{}")));
        Document d = Jsoup.parse(org.loopledger.notebook.RecordRenderer.render(nb,
                new org.loopledger.notebook.RecordInfo("m.ipynb", "2026-01-01", "0", "17", List.of())));
        assertEquals("67.6", MarginsRendererTest.row(MarginsRendererTest.table(d, "Margins of every loop"), "empty").get(3));
        var worst = MarginsRendererTest.table(d, "Worst case over the rows");
        assertTrue(MarginsRendererTest.row(worst, "phase margin").get(3).startsWith("MISSED by "), worst.toString());
        assertFalse(d.select("tr.fail").isEmpty(), "the record keeps the fail class on a missed row");
    }

    @Test
    void emptyTableIsRefusedWithTheFix() {
        var e = assertThrows(IllegalArgumentException.class, () -> MarginsTable.builder().build());
        assertTrue(e.getMessage().contains("row(loadCase, loop, loopGain)"));
    }

    /**
     * L = 2(s + 1)/(s²(0.1s + 1)) (two poles at s = 0 by construction) measured on 2 .. 200 rad/s, above the zero at
     * 1 rad/s: the low-frequency slope there is about -20 dB/decade, so the analysis estimates one integrator and warns
     * "state them with withIntegrators". The builder must take the stated count, per loop label and per row.
     */
    static Frf measuredType2() {
        TransferFunction l = TransferFunction.continuous(new double[] {2, 2}, new double[] {0.1, 1, 0, 0});
        double[] w = FrequencyGrid.logRadPerS(2, 200, 300);
        Frf model = Frf.ofModel(l, w);
        return Frf.ofParts(w, model.real(), model.imag()); // as measured data (no model origin)
    }

    static boolean estimated(MarginsTable.Row r) {
        return r.margins().warnings().stream().anyMatch(x -> x.kind() == org.loopledger.analysis.LoopWarning.Kind.INTEGRATORS_ESTIMATED);
    }

    @Test
    void statedIntegratorsReplaceTheSlopeEstimateAndItsWarning() {
        Frf l = measuredType2();
        MarginsTable plain = MarginsTable.builder().row("A", "plant-input loop", l).build();
        MarginsTable.Row guessed = plain.rows().get(0);
        assertTrue(estimated(guessed), "unstated on measured data: warned");
        assertEquals(1, guessed.margins().netIntegrators(), "the slope above the zero reads as one integrator");
        assertTrue(plain.toString().contains("withIntegrators"), "the warning names the builder method that now exists");

        // by label, stated before one row and after another; a per-row count wins over the label's
        MarginsTable t = MarginsTable.builder().row("A", "plant-input loop", l)
                .withIntegrators("plant-input loop", 2)
                .row("B", "plant-input loop", l)
                .row("C", "plant-input loop", l, 1)
                .row("A", "other loop", l)
                .build();
        assertEquals(2, t.rows().get(0).margins().netIntegrators(), "stated after the row was added");
        assertEquals(2, t.rows().get(1).margins().netIntegrators(), "stated before the row was added");
        assertFalse(estimated(t.rows().get(0)) || estimated(t.rows().get(1)), "no estimate warning once stated");
        assertEquals(1, t.rows().get(2).margins().netIntegrators(), "the row's own count wins");
        assertFalse(estimated(t.rows().get(2)));
        assertTrue(estimated(t.rows().get(3)), "another label stays estimated");
        // the stated count does not move the crossover figures of this loop (both anchors pick the same branch):
        // PM from the model itself, exact (crossings as polynomial roots)
        double pmModel = org.loopledger.analysis.Margins.of(TransferFunction.continuous(new double[] {2, 2}, new double[] {0.1, 1, 0, 0}))
                .phaseMarginDeg().getAsDouble();
        assertEquals(pmModel, t.rows().get(0).margins().phaseMarginDeg().getAsDouble(), 0.05);
    }

    @Test
    void implausibleIntegratorCountIsRefusedWhereItIsGiven() {
        var e = assertThrows(IllegalArgumentException.class, () -> MarginsTable.builder().withIntegrators("velocity loop", 7));
        assertTrue(e.getMessage().contains("-3..4"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> MarginsTable.builder().row("A", "v", measuredType2(), -4));
    }
}
