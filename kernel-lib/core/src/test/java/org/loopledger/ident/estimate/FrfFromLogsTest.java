package org.loopledger.ident.estimate;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.ident.demo.DriveLoopSettings;
import org.loopledger.ident.demo.GantryLoadCase;
import org.loopledger.ident.demo.LinearAxisScope;
import org.loopledger.ident.log.ColumnMap;
import org.loopledger.ident.log.LogCheckOptions;
import org.loopledger.ident.log.LogUnit;
import org.loopledger.ident.log.Quantity;
import org.loopledger.lti.Motion;
import org.loopledger.testing.PythonOracle;
import org.loopledger.tune.PlantCase;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Load cases from logs in one call, against numpy (Debian python3-numpy) reading the same files on its own:
 * the synchronous average Ȳ/Ū over whole periods (numpy.fft.rfft of each period, mean over periods), the
 * coherence |Σ conj(R<sub>m</sub>)Y<sub>m</sub>|² / (Σ|R<sub>m</sub>|²·Σ|Y<sub>m</sub>|²), the excited lines and the
 * files' SHA-256 (hashlib). The data are the synthetic demo logs; the period's truth is their generator's design.
 */
class FrfFromLogsTest {
    static final DriveLoopSettings DEMO = DriveLoopSettings.demo();
    /** The PRBS period as the demo generator designs it: (2^order - 1) samples per bit × bits. */
    static final int DEMO_PERIOD = ((1 << DEMO.prbsOrder()) - 1) * DEMO.prbsSamplesPerBit();
    static final ColumnMap SCOPE = ColumnMap.of()
            .column("Pos act [inc]", Quantity.POSITION, LogUnit.countsPerMetre(1e7))
            .column("Vel act [mm/s]", Quantity.VELOCITY, LogUnit.millimetresPerSecond())
            .column("Iq act [mA]", Quantity.CURRENT_MEASURED, LogUnit.milliamperes())
            .column("Iq inj [mA]", Quantity.CURRENT_INJECTED, LogUnit.milliamperes());
    static Path datasets;
    static LoadCases gantry;
    static LoadCaseEstimate scope;
    static JsonArray ref;

    static Path datasets() {
        for (Path p = Path.of("").toAbsolutePath(); p != null; p = p.getParent()) {
            if (Files.isRegularFile(p.resolve("datasets/README.md"))) return p.resolve("datasets");
        }
        throw new IllegalStateException("no datasets/README.md above " + Path.of("").toAbsolutePath());
    }

    @BeforeAll
    static void estimateAndReference() {
        PythonOracle.require("numpy");
        datasets = datasets();
        Map<String, Path> logs = new LinkedHashMap<>();
        logs.put("empty carriage", datasets.resolve(GantryLoadCase.EMPTY_CARRIAGE.fileName()));
        logs.put("heavy head", datasets.resolve(GantryLoadCase.HEAVY_HEAD.fileName()));
        gantry = FrfFromLogs.currentToVelocity().checks(LogCheckOptions.defaults().withSampleRateHz(DEMO.sampleRateHz()))
                .periodSamples(DEMO_PERIOD).bandHz(4, 4000).load(logs);
        scope = FrfFromLogs.currentToVelocity().columns(SCOPE).load("axis Y", datasets.resolve(LinearAxisScope.FILE)); // period detected
        List<Map<String, Object>> cases = new ArrayList<>();
        for (LoadCaseEstimate c : gantry.cases()) cases.add(request(c, false));
        cases.add(request(scope, true));
        // numpy reads the files itself: the demo CSV with loadtxt; the scope export (# lines, a header, ';' and decimal
        // commas, mA and mm/s) by hand, scaled to A and m/s
        String script = """
                import json, sys, hashlib, numpy as np
                out = []
                for c in json.load(sys.stdin):
                    raw = open(c['file'], 'rb').read()
                    if c['scope']:
                        rows = [l.replace(',', '.').split(';') for l in raw.decode().splitlines() if l and not l.startswith('#')][1:]
                        d = np.array(rows, dtype=float)
                        r, u, y = d[:, 3] * 1e-3, d[:, 2] * 1e-3, d[:, 1] * 1e-3
                    else:
                        d = np.loadtxt(c['file'], delimiter=',', skiprows=1)
                        r, u, y = d[:, 1], d[:, 2], d[:, 3]
                    p, s, fs = c['period'], c['skip'], c['fs']
                    m = len(r) // p - s
                    R, U, Y = (np.fft.rfft(x[s * p:(s + m) * p].reshape(m, p), axis=1) for x in (r, u, y))
                    H = Y.mean(0) / U.mean(0)
                    coh = np.abs((np.conj(R) * Y).sum(0))**2 / ((np.abs(R)**2).sum(0) * (np.abs(Y)**2).sum(0))
                    f = np.arange(R.shape[1]) * fs / p
                    pr = np.abs(R.mean(0))**2
                    exc = (pr > 1e-2 * pr.max()) & (f >= c['lo']) & (f <= c['hi'])
                    k = np.nonzero(exc)[0]
                    out.append({'sha256': hashlib.sha256(raw).hexdigest(), 'periods': m, 'f': f[k].tolist(),
                                're': H[k].real.tolist(), 'im': H[k].imag.tolist(), 'coh': coh[k].tolist()})
                print(json.dumps(out))
                """;
        ref = PythonOracle.run(script, cases).getAsJsonArray();
    }

    static Map<String, Object> request(LoadCaseEstimate c, boolean scope) {
        Map<String, Object> m = new HashMap<>();
        m.put("file", c.file().toString());
        m.put("scope", scope);
        m.put("period", c.periodSamples());
        m.put("skip", 1);
        m.put("fs", c.sampleRateHz());
        m.put("lo", scope ? 0 : 4);
        m.put("hi", scope ? 1e9 : 4000);
        return m;
    }

    static void assertMatchesNumpy(LoadCaseEstimate c, JsonObject r) {
        Frf g = c.frf();
        assertEquals(r.get("sha256").getAsString(), c.sha256(), c.label() + ": SHA-256 as hashlib");
        assertEquals(r.get("periods").getAsInt(), c.averagedPeriods(), c.label() + ": periods averaged");
        double[] f = PythonOracle.doubles(r.get("f")), re = PythonOracle.doubles(r.get("re")), im = PythonOracle.doubles(r.get("im")),
                coh = PythonOracle.doubles(r.get("coh"));
        // excited lines: numpy keeps lines with at least 1 % of the strongest line's excitation power (common practice;
        // a PRBS's sinc² envelope is 0.41 at half its bit rate, a multisine's quiet lines hold only noise)
        assertArrayEquals(f, g.frequencyHz(), 1e-9, c.label() + ": the excited lines in the band");
        double[] gr = g.real(), gi = g.imag(), gc = g.coherence().orElseThrow();
        for (int i = 0; i < f.length; i++) {
            // both divide means of double-precision FFTs of the same decimal numbers: agreement to rounding (1e-9 relative)
            double err = Math.hypot(gr[i] - re[i], gi[i] - im[i]) / Math.hypot(re[i], im[i]);
            assertTrue(err < 1e-9, c.label() + " at " + f[i] + " Hz: relative difference " + err + " from numpy");
            assertEquals(coh[i], gc[i], 1e-9, c.label() + ": coherence at " + f[i] + " Hz");
        }
        assertEquals(java.util.Arrays.stream(coh).min().getAsDouble(), c.minCoherence().getAsDouble(), 1e-9, c.label() + ": min coherence");
    }

    @Test
    void gantryCasesMatchNumpysSynchronousAverage() {
        assertEquals(List.of("empty carriage", "heavy head"), gantry.labels());
        for (int k = 0; k < gantry.size(); k++) assertMatchesNumpy(gantry.cases().get(k), ref.get(k).getAsJsonObject());
        LoadCaseEstimate heavy = gantry.get("heavy head");
        assertEquals("current_measured_A", heavy.inputColumn());
        assertEquals("velocity_rad_s", heavy.outputColumn());
        assertEquals("current_injected_A", heavy.excitationColumn());
        assertFalse(heavy.periodDetected());
        assertEquals(Motion.ROTARY, heavy.motion());
        assertTrue(heavy.bandLowHz() >= 4 && heavy.bandHighHz() <= 4000);
    }

    @Test
    void scopeExportThroughAColumnMapMatchesNumpyAndIsLinear() {
        assertMatchesNumpy(scope, ref.get(gantry.size()).getAsJsonObject());
        assertTrue(scope.periodDetected());
        // truth from the generator: 4000-sample periods (LinearAxisScope's header line "5 periods of 4000 samples")
        assertEquals(4000, scope.periodSamples());
        assertEquals("velocity_m_s", scope.outputColumn());
        assertEquals(Motion.LINEAR, scope.motion(), "the output column is in m/s, so the axis is linear");
        assertEquals(Motion.LINEAR, scope.plantCase().motion());
    }

    @Test
    void detectedPeriodIsTheGeneratorsDesign() {
        // synthetic demo data, truth from its generator: a PRBS of order n with b samples per bit repeats every (2^n - 1)·b samples
        LoadCaseEstimate d = FrfFromLogs.currentToVelocity().bandHz(4, 4000).load("light head", datasets.resolve(GantryLoadCase.LIGHT_HEAD.fileName()));
        assertTrue(d.periodDetected());
        assertEquals(DEMO_PERIOD, d.periodSamples());
    }

    @Test
    void plantCasesCarryLabelFrfAndMotion() {
        List<PlantCase> p = gantry.plantCases();
        assertEquals(gantry.labels(), p.stream().map(PlantCase::label).toList());
        for (int k = 0; k < p.size(); k++) assertSame(gantry.cases().get(k).frf(), p.get(k).plantToVelocity());
    }

    @Test
    void missingFileNamesTheFileAndTheFixBeforeReadingAny() {
        Map<String, Path> logs = new LinkedHashMap<>();
        logs.put("empty", datasets.resolve(GantryLoadCase.EMPTY_CARRIAGE.fileName()));
        logs.put("typo", datasets.resolve("gantry-x-hevy-head.csv"));
        var e = assertThrows(IllegalArgumentException.class, () -> FrfFromLogs.currentToVelocity().load(logs));
        assertTrue(e.getMessage().contains("'typo'") && e.getMessage().contains("gantry-x-hevy-head.csv") && e.getMessage().contains("does not exist"), e.getMessage());
        assertTrue(e.getMessage().contains("check the file names"), e.getMessage());
    }

    @Test
    void missingColumnNamesTheQuantityTheColumnsThereAreAndTheFix() {
        var e = assertThrows(IllegalArgumentException.class, () -> FrfFromLogs.of(Quantity.CURRENT_MEASURED, Quantity.VELOCITY, Quantity.CURRENT_COMMAND)
                .periodSamples(DEMO_PERIOD).load("empty", datasets.resolve(GantryLoadCase.EMPTY_CARRIAGE.fileName())));
        String m = e.getMessage();
        assertTrue(m.contains("'empty'") && m.contains("current_command_A") && m.contains("current_injected_A") && m.contains("ColumnMap"), m);
        // the scope export read by its own header has no SI column names at all
        var s = assertThrows(IllegalArgumentException.class, () -> FrfFromLogs.currentToVelocity().load("scope", datasets.resolve(LinearAxisScope.FILE)));
        assertTrue(s.getMessage().contains("ColumnMap"), s.getMessage());
    }

    @Test
    void tooFewPeriodsAndUnorderedMapsAreRefusedWithTheFix() {
        var e = assertThrows(IllegalArgumentException.class, () -> FrfFromLogs.currentToVelocity().periodSamples(DEMO_PERIOD).skipPeriods(10)
                .load("empty", datasets.resolve(GantryLoadCase.EMPTY_CARRIAGE.fileName())));
        assertTrue(e.getMessage().contains("10 whole period(s)") && e.getMessage().contains("skip fewer"), e.getMessage());
        var o = assertThrows(IllegalArgumentException.class, () -> FrfFromLogs.currentToVelocity()
                .load(Map.of("a", datasets.resolve("a.csv"), "b", datasets.resolve("b.csv"))));
        assertTrue(o.getMessage().contains("LinkedHashMap"), o.getMessage());
    }
}
