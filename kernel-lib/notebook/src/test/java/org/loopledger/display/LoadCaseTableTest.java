package org.loopledger.display;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.ident.estimate.FrfFromLogs;
import org.loopledger.ident.estimate.LoadCaseEstimate;
import org.loopledger.ident.estimate.LoadCases;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The load-case summary: one row per case in the order given, the file, the start of its SHA-256, the band and the
 * lowest coherence as the estimate states them, and each log warning listed under the table (escaped in HTML).
 * Two small synthetic logs (seeded random periodic excitation through a first-order lag); one has a time step
 * 5 % long, which the log checks flag (jitter above 1 %, LogCheckOptions.defaults()).
 */
class LoadCaseTableTest {
    static Path log(Path dir, String name, boolean jitter) throws Exception {
        double fs = 1000;
        int p = 512, periods = 9;
        double[] one = new double[p];
        Random rnd = new Random(42);
        for (int i = 0; i < p; i++) one[i] = rnd.nextBoolean() ? 1 : -1;
        StringBuilder sb = new StringBuilder("time_s,current_injected_A,current_measured_A,velocity_rad_s\n");
        double y = 0, t = 0;
        Random noise = new Random(7);
        for (int i = 0; i < p * periods; i++) {
            double r = one[i % p];
            y = 0.9 * y + 0.1 * r;
            sb.append(String.format(Locale.ROOT, "%.7f,%.1f,%.9f,%.9f%n", t, r, r, y + 1e-3 * noise.nextGaussian()));
            t += (jitter && i == 1000 ? 1.05 : 1.0) / fs;
        }
        Path f = dir.resolve(name);
        Files.writeString(f, sb);
        return f;
    }

    @Test
    void rowsInOrderWithDigestBandCoherenceAndWarnings(@TempDir Path dir) throws Exception {
        Map<String, Path> logs = new LinkedHashMap<>();
        logs.put("b <second>", log(dir, "b.csv", true));
        logs.put("a first", log(dir, "a.csv", false));
        LoadCases cases = FrfFromLogs.currentToVelocity().periodSamples(512).load(logs);
        LoadCaseEstimate b = cases.get("b <second>"), a = cases.get("a first");
        assertFalse(b.warnings().isEmpty(), "the long time step is flagged");
        assertTrue(a.warnings().isEmpty());

        MimeBundle m = LoadCaseTable.render(cases);
        String text = m.plainText(), html = m.get(MimeBundle.TEXT_HTML).orElseThrow();
        String[] lines = text.split("\n");
        assertTrue(lines[3].startsWith("b <second>") && lines[4].startsWith("a first"), text); // caption, header, rule, rows in order
        assertTrue(lines[3].contains(b.sha256().substring(0, LoadCaseTable.SHA_DIGITS)) && lines[3].contains("b.csv"), text);
        assertTrue(lines[3].contains(Figures.num(b.bandLowHz())) && lines[3].contains(Figures.num(b.bandHighHz())), text);
        assertTrue(lines[4].contains(String.format(Locale.ROOT, "%.3f", a.minCoherence().getAsDouble())), text);
        assertTrue(text.contains("b <second>: " + b.warnings().get(0)), text);
        assertTrue(html.contains("<td>b &lt;second&gt;</td>") && !html.contains("<second>"), html);
        assertTrue(html.contains("loopledger-warnings"), html);
        assertEquals(html.split("<tr>").length - 1, 3, "a header row and one row per case: " + html);
    }
}
