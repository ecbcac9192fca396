package org.loopledger.display;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.Test;
import org.loopledger.analysis.Spec;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.testing.PythonOracle;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The margins table of a loop with a pure delay, L = K e^{-sτ}/(s(sT + 1)), on a measured-like grid, against SciPy:
 * crossings found with {@code scipy.optimize.brentq} on the exact L(jω), Ms by {@code minimize_scalar} around the
 * densest-grid maximum of |1/(1 + L)|. Independent of analysis.Margins (no shared code; only the loop definition).
 */
class MarginsTableVsScipyTest {
    static final double K = 40, T = 0.01, TAU = 0.004;

    static Frf measured() {
        double[] w = FrequencyGrid.logSpacedRadPerS(0.1, 1000, 3000);
        double[] re = new double[w.length], im = new double[w.length];
        for (int i = 0; i < w.length; i++) {
            // K e^{-jωτ} / (jω (1 + jωT)) = K e^{-jωτ} / (-ω²T + jω)
            double dr = -w[i] * w[i] * T, di = w[i], d2 = dr * dr + di * di;
            double gr = K * dr / d2, gi = -K * di / d2;
            double c = Math.cos(w[i] * TAU), s = -Math.sin(w[i] * TAU);
            re[i] = gr * c - gi * s;
            im[i] = gr * s + gi * c;
        }
        return Frf.ofParts(w, re, im);
    }

    static final String SCRIPT = """
            import json, sys
            import numpy as np
            from scipy.optimize import brentq, minimize_scalar
            a = json.load(sys.stdin)
            K, T, tau = a["K"], a["T"], a["tau"]
            L = lambda w: K * np.exp(-1j * w * tau) / (1j * w * (1 + 1j * w * T))
            # unwrapped phase: -90 deg (integrator) - atan(wT) - w tau, exact for this loop
            ph = lambda w: -np.pi / 2 - np.arctan(w * T) - w * tau
            wc = brentq(lambda w: abs(L(w)) - 1, 0.1, 6000)
            w180 = brentq(lambda w: ph(w) + np.pi, 0.1, 6000)
            grid = 2 * np.pi * np.logspace(-1, 3, 200000)
            s = 1 / np.abs(1 + L(grid))
            k = int(np.argmax(s))
            r = minimize_scalar(lambda w: -1 / abs(1 + L(w)), bounds=(grid[k - 1], grid[k + 1]), method="bounded", options={"xatol": 1e-10})
            print(json.dumps({"fcHz": wc / 2 / np.pi, "pmDeg": np.degrees(ph(wc) + np.pi), "gmDb": -20 * np.log10(abs(L(w180))),
                              "ms": -r.fun, "msHz": r.x / 2 / np.pi, "dmS": (ph(wc) + np.pi) / wc}))
            """;

    @Test
    void delayedLoopMatchesScipy() {
        PythonOracle.require("numpy", "scipy");
        JsonObject ref = PythonOracle.run(SCRIPT, Map.of("K", K, "T", T, "tau", TAU)).getAsJsonObject();
        MarginsTable t = MarginsTable.builder().row("case", "loop", measured()).spec(Spec.builder().minPhaseMarginDeg(45).build()).build();
        List<String> row = t.table().toText().lines().skip(2).findFirst().map(l -> List.of(l.strip().split("\\s{2,}"))).orElseThrow();
        // columns: load case, loop, crossover (Hz), PM (deg), GM (dB), Ms, Ms at (Hz), delay margin, bandwidth
        // Tolerances: the cells print 4 significant digits (PM and GM to 2 decimals); data-grid refinement adds below 1e-4.
        double fc = ref.get("fcHz").getAsDouble(), pm = ref.get("pmDeg").getAsDouble(), gm = ref.get("gmDb").getAsDouble();
        double ms = ref.get("ms").getAsDouble(), msHz = ref.get("msHz").getAsDouble(), dm = ref.get("dmS").getAsDouble();
        assertEquals(fc, Double.parseDouble(row.get(2)), 1e-3 * fc, row.toString());
        assertEquals(pm, Double.parseDouble(row.get(3)), 0.02, row.toString());
        assertEquals(gm, Double.parseDouble(row.get(4)), 0.02, row.toString());
        assertEquals(ms, Double.parseDouble(row.get(5)), 1e-3 * ms, row.toString());
        assertEquals(msHz, Double.parseDouble(row.get(6)), 5e-3 * msHz, "Ms is flat at its peak: its frequency is known less well");
        assertEquals(dm * 1e3, Double.parseDouble(row.get(7).replace(" ms", "")), 1e-3 * dm * 1e3, row.toString());
        // and the verdict: PM against 45 deg, by the SciPy figure
        WorstMargin w = t.worstPhaseMargin();
        assertEquals(pm < 45, w.missed(), w.verdict());
    }
}
