package org.loopledger.display;

import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.ident.excitation.Prbs;
import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.lti.TransferFunction;
import org.loopledger.tune.Resonance;
import org.loopledger.tune.ResonanceWarning;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** The tables notebooks 01 and 03 show: responses at chosen frequencies, resonances per load case, signal levels, the excitation check. */
class IdentificationTablesTest {
    @Test
    void frfTableReadsMeasuredLinesWithoutInterpolationAndModelsExactly() {
        // A measured response on lines 1, 2, 4, 8 Hz: values 1, 1j, -1, -1j (0, +90, +180, +270 deg unwrapped), coherence and sigma given.
        double[] f = {1, 2, 4, 8};
        Frf g = Frf.ofPartsHz(f, new double[] {1, 0, -2, 0}, new double[] {0, 1, 0, -0.5})
                .withCoherence(new double[] {0.99, 0.95, 0.5, 0.97}).withUncertainty(new double[] {0.01, 0.02, 0.1, 0.05});
        // G = 1/(s + 1) at w = 1 rad/s: |G| = 1/sqrt(2) = -3.0103 dB, phase -45 deg (first-order lag, textbook definition).
        TransferFunction lag = TransferFunction.continuous(new double[] {1}, new double[] {1, 1});
        FrfTable t = FrfTable.atHz(1 / (2 * Math.PI), 3.1).add("measured", g).add("lag", lag).withCoherenceAndError();
        Document d = ResultTablesTest.html(t.toMimeBundle());
        List<String> header = d.select("thead th").eachText();
        assertEquals(List.of("Frequency (Hz)", "measured: line (Hz)", "measured: |G| (dB)", "measured: phase (deg)", "measured: coherence",
                "measured: rel. std. error (%)", "lag: |G| (dB)", "lag: phase (deg)"), header);
        List<String> low = d.select("tbody tr").get(0).select("td").eachText();
        // 0.159 Hz: nearest line 1 Hz (below the band by less than one line spacing): |1| = 0 dB, 0 deg, coherence 0.99, 0.01/1 = 1 %.
        assertEquals(List.of("0.1592", "1", "0", "0", "0.99", "1"), low.subList(0, 6));
        assertEquals(-3.0103, Double.parseDouble(low.get(6)), 0.005);
        assertEquals(-45, Double.parseDouble(low.get(7)), 0.005);
        // 3.1 Hz: nearest line 4 Hz (0.9 Hz away against 1.1 Hz to the 2 Hz line): |-2| = 6.0206 dB, phase 180 deg on the unwrapped
        // branch, sigma/|G| = 0.1/2 = 5 %; no interpolation (the line value itself).
        List<String> mid = d.select("tbody tr").get(1).select("td").eachText();
        assertEquals(List.of("3.1", "4", "6.02", "180", "0.5", "5"), mid.subList(0, 6));
        // lag at 3.1 Hz: w = 19.478 rad/s, |G| = -20 log10 sqrt(1 + w^2), phase -atan(w).
        double w = 2 * Math.PI * 3.1;
        assertEquals(-10 * Math.log10(1 + w * w), Double.parseDouble(mid.get(6)), 0.005);
        assertEquals(-Math.toDegrees(Math.atan(w)), Double.parseDouble(mid.get(7)), 0.005);
        // by default magnitude and phase only, and no line column when the lines are the frequencies asked
        Document plain = ResultTablesTest.html(FrfTable.atHz(2, 8).add("measured", g).toMimeBundle());
        assertEquals(List.of("Frequency (Hz)", "measured: |G| (dB)", "measured: phase (deg)"), plain.select("thead th").eachText());
        String text = t.toString();
        assertTrue(text.contains("measured: 4 lines, 1 Hz .. 8 Hz; read at the nearest line, at most 0.9 Hz away; lowest coherence 0.5 at 4 Hz"), text);
        assertEquals(text, FrfTable.atHz(1 / (2 * Math.PI), 3.1).add("measured", g).add("lag", lag).withCoherenceAndError().toString(), "deterministic");
    }

    @Test
    void frfTableRefusesFrequenciesOutsideTheBandAndEmptyRequests() {
        Frf g = Frf.ofPartsHz(new double[] {10, 20, 30}, new double[] {1, 1, 1}, new double[] {0, 0, 0});
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> FrfTable.atHz(5, 100).add("g", g));
        assertTrue(e.getMessage().contains("outside the response's band"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> FrfTable.atHz());
        assertThrows(IllegalArgumentException.class, () -> FrfTable.atHz(-1));
        assertEquals(0, FrfTable.nearest(new double[] {10, 20, 30}, 14.9));
        assertEquals(1, FrfTable.nearest(new double[] {10, 20, 30}, 15.1));
        assertEquals(2, FrfTable.nearest(new double[] {10, 20, 30}, 99));
    }

    @Test
    void resonanceTableComparesWithTheTruth() {
        TwoMassParameters truth = new TwoMassParameters(2.0e-4, 1e-3, 400, 0.02, 250, 0.03, 60e-6);
        Resonance main = new Resonance(404, 9.5, 17.0, 0.021), other = new Resonance(1500, 7, 50, 0.017);
        Resonance coarse = new Resonance(396, 8, 30, 0.038, List.of(new ResonanceWarning(ResonanceWarning.Kind.DAMPING_NOT_RESOLVED, java.util.OptionalDouble.of(396), "too few lines")));
        ResonanceTable t = ResonanceTable.builder().row("empty", List.of(main, other), truth).row("heavy", List.of(coarse), truth)
                .row("none", List.of()).build();
        Document d = ResultTablesTest.html(t.toMimeBundle());
        // 404 Hz against 400 Hz: +1 %; 396 Hz: -1 % (relative error, definition).
        assertEquals(List.of("empty", "404", "400", "+1.00", "9.5", "17", "0.021", "0.02", "1"), ResultTablesTest.row(d, "empty"));
        assertEquals(List.of("heavy", "396", "400", "-1.00", "8", "30", "0.038 (not resolved)", "0.02", "0"), ResultTablesTest.row(d, "heavy"));
        assertEquals("none found", ResultTablesTest.row(d, "none").get(1));
        assertEquals(1, d.select("tbody tr.fail").size());
        assertTrue(t.toString().contains("warning: heavy: too few lines"), t.toString());
        assertTrue(t.toString().contains("warning: none: no resonance found"), t.toString());
        assertThrows(IllegalArgumentException.class, () -> ResonanceTable.builder().build());
    }

    @Test
    void signalLevelsGiveEveryColumnsRangeAndRms() {
        StringBuilder text = new StringBuilder("time_s,current_measured_A\n");
        double[] u = {1, -3, 2, 0};   // repeated to the 4096 rows the log checks ask for
        for (int i = 0; i < 4096; i++) text.append(i / 1000.0).append(',').append(u[i % 4]).append('\n');
        SignalLevels s = SignalLevels.of(org.loopledger.ident.log.DriveLogReader.readString("small.csv", text.toString(),
                org.loopledger.ident.log.LogCheckOptions.defaults()));
        Document d = ResultTablesTest.html(s.toMimeBundle());
        // min -3, max 2, peak |x| 3, RMS sqrt((1 + 9 + 4 + 0)/4) = sqrt(3.5) = 1.871 (definition).
        assertEquals(List.of("current_measured_A", "-3", "2", "3", "1.871"), ResultTablesTest.row(d, "current_measured_A"));
        assertTrue(s.toString().startsWith("small.csv: 4096 rows at 1 kHz"), s.toString());
        String fromFolder = SignalLevels.of(org.loopledger.ident.log.DriveLogReader.readString("../data/small.csv", text.toString(),
                org.loopledger.ident.log.LogCheckOptions.defaults())).toString();
        assertEquals(s.toString(), fromFolder, "the caption names the file, not the folder it was read from");
        assertTrue(s.toString().contains("log checks: no warnings"), s.toString());
    }

    @Test
    void excitationCheckComparesTheLogWithTheRegeneratedPrbs() {
        // PRBS7, one sample per bit at 1 kHz: 2^7 - 1 = 127 samples per period (maximum-length sequence), 0.127 s, lines every
        // 1000/127 = 7.874 Hz; first null at the bit rate 1 kHz, -3 dB of sinc^2 at 0.443 of it (common practice).
        Prbs prbs = Prbs.of(7, 1.0, 1, 2, 1000);
        double[] logged = prbs.signal().samples();
        ExcitationCheck same = ExcitationCheck.of(prbs, logged);
        Document d = ResultTablesTest.html(same.toMimeBundle());
        List<List<String>> rows = d.select("tbody tr").stream().map(r -> r.select("td").eachText()).toList();
        assertEquals(List.of("period", "127", "samples"), rows.get(0));
        assertEquals(List.of("0.127", "7.874", "2"), List.of(rows.get(1).get(1), rows.get(2).get(1), rows.get(3).get(1)));
        assertEquals("0", rows.get(4).get(1));
        assertEquals(List.of("1000", "443"), List.of(rows.get(5).get(1), rows.get(6).get(1)));
        assertTrue(same.toString().contains("sample for sample over the 254 samples"), same.toString());
        // shifted by one sample: a +-1 sequence differs somewhere by 2; one sample changed by 0.5 differs by 0.5
        double[] shifted = new double[logged.length];
        System.arraycopy(logged, 0, shifted, 1, logged.length - 1);
        shifted[0] = logged[logged.length - 1];
        assertEquals(2, ExcitationCheck.of(prbs, shifted).largestDifference());
        double[] bumped = logged.clone();
        bumped[40] += 0.5;
        ExcitationCheck b = ExcitationCheck.of(prbs, java.util.Arrays.copyOf(bumped, 190));
        assertEquals(0.5, b.largestDifference());
        assertEquals(190 / 127.0, b.periodsInLog(), 1e-12);
        assertTrue(b.toString().contains("differs from the designed signal by up to 0.5"), b.toString());
        assertTrue(b.toString().contains("compared over the first 190"), b.toString());
        assertThrows(IllegalArgumentException.class, () -> ExcitationCheck.of(prbs, new double[0]));
    }
}
