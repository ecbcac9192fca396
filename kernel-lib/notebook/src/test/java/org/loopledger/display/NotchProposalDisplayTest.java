package org.loopledger.display;

import org.jsoup.Jsoup;
import org.junit.jupiter.api.Test;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;
import org.loopledger.tune.NotchProposal;
import org.loopledger.tune.PlantCase;
import org.loopledger.tune.TuningSpec;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** A cell ending with a notch proposal shows its whole report (a new user found only one line), with the caution. */
class NotchProposalDisplayTest {
    /**
     * Two-mass axis, current to motor velocity: Kt (J_L s² + c s + k) / (s (J_M J_L s² + (J_M + J_L)(c s + k))), from
     * the equations of motion (derivation by hand); resonance at sqrt(k (J_M + J_L) / (J_M J_L)) (common practice).
     */
    static TransferFunction twoMass(double jm, double jl, double k, double c) {
        return TransferFunction.continuous(new double[] {jl, c, k}, new double[] {jm * jl, (jm + jl) * c, (jm + jl) * k, 0});
    }

    @Test
    void showsTheWholeReportWithTheCautionAndTheSameTextTwice() throws Exception {
        double jm = 5e-4, jl = 5e-4, resonanceHz = 1200;
        double k = Math.pow(2 * Math.PI * resonanceHz, 2) * jm * jl / (jm + jl);
        Frf plant = Frf.ofModel(twoMass(jm, jl, k, 0.02), FrequencyGrid.logSpacedRadPerS(5, 3000, 2000));
        NotchProposal p = NotchProposal.propose(List.of(PlantCase.of("axis", plant)), DriveTiming.sampledAtHz(16000),
                FilterChain.none(), TuningSpec.builder().build(), 6);

        MimeBundle b = RendererRegistry.global().render(p).orElseThrow();
        String text = b.plainText();
        assertTrue(text.contains("proposed " + p.notch()), text);
        assertTrue(text.contains(p.pays() ? "the notch pays" : "the notch does not pay"), text);
        assertTrue(text.contains("re-tuned with the notch"), text);
        assertTrue(text.endsWith(DriveCaution.TEXT), text);
        // the resonance the proposal found is the one the axis has (within the grid's resolution)
        assertEquals(resonanceHz, p.notch().centreHz(), 0.01 * resonanceHz, text);
        assertTrue(text.contains(Units.formatHz(p.resonances().get(0).frequencyHz())) || text.contains(p.resonances().get(0).toString()), text);

        String html = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        assertEquals(text, Jsoup.parse(html).selectFirst("pre").wholeText(), "the HTML shows the same report, preformatted");
        assertEquals(text, RendererRegistry.global().render(p).orElseThrow().plainText(), "deterministic");
    }
}
