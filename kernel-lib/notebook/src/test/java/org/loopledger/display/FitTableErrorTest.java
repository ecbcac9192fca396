package org.loopledger.display;

import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.ident.fit.FitResult;
import org.loopledger.ident.fit.ParameterEstimate;
import org.loopledger.ident.fit.TwoMassFit;
import org.loopledger.ident.fit.TwoMassParameters;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** The optional error column of a fit table against the truth: 100·(estimate/truth − 1), by hand below. */
class FitTableErrorTest {
    static final TwoMassParameters TRUTH = new TwoMassParameters(2.0e-4, 1e-3, 400, 0.02, 250, 0.03, 60e-6);

    static TwoMassFit fit() {
        List<ParameterEstimate> est = List.of(new ParameterEstimate("inertia", "kg·m²", 2.02e-4, 1e-6, 2.0e-4, 2.04e-4),
                new ParameterEstimate("resonance", "Hz", 405, 1, 403, 407), new ParameterEstimate("delay", "s", 61e-6, 2e-6, 57e-6, 65e-6),
                new ParameterEstimate("offset", "A", 0.1, 0.01, 0.08, 0.12));
        FitResult f = new FitResult(MarginsRendererTest.CUBIC_LAG, est, List.of(), 1.1, 300, 12, List.of());
        return new TwoMassFit(new TwoMassParameters(2.02e-4, 1e-3, 405, 0.02, 250, 0.03, 61e-6), f);
    }

    @Test
    void errorsAgainstTheTruthByHand() {
        Document d = ResultTablesTest.html(FitTable.builder().row("heavy", fit(), TRUTH).errorAgainstTruth().build().toMimeBundle());
        assertTrue(d.select("thead th").eachText().contains("Error against truth (%)"));
        // 2.02e-4 / 2.0e-4 - 1 = +1 %; 405/400 - 1 = +1.25 %; 61 µs / 60 µs - 1 = +1.667 % (4 significant digits)
        assertEquals(List.of("0.0002", "1", "yes"), ResultTablesTest.row(d, "heavy").subList(6, 9));
        assertEquals("1.25", d.select("tbody tr").get(1).select("td").eachText().get(7));
        assertEquals("1.667", d.select("tbody tr").get(2).select("td").eachText().get(7));
        // a parameter without a known truth: no error either
        assertEquals(List.of("–", "–", "not known"), d.select("tbody tr").get(3).select("td").eachText().subList(6, 9));
    }

    @Test
    void withoutTheOptionTheTableIsUnchanged() {
        Document d = ResultTablesTest.html(FitTable.builder().row("heavy", fit(), TRUTH).build().toMimeBundle());
        assertFalse(d.select("thead th").eachText().contains("Error against truth (%)"));
        assertEquals(8, d.select("thead th").size());
    }
}
