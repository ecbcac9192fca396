package org.loopledger.ident.spectral;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Closed-loop plant extraction on a simulated loop with a known discrete plant and PI controller.
 * Reference: the closed forms of {@link ClosedLoopEstimate} (u = S r - S C v, y = P S r + S v), derived
 * by hand; the naive ratio S_uy/S_uu tends to -1/C where the noise v dominates (Ljung, System
 * Identification, 2nd ed., section 13.4, from memory), so it is biased far beyond its own error bar.
 */
class ClosedLoopTest {
    static final double FS = 1000;
    static final DiscreteFilter P = new DiscreteFilter(new double[] {0, 0.1}, new double[] {1, -0.9});

    @Test
    void extractionRecoversThePlantWhereTheNaiveRatioIsBiased() {
        int n = 1 << 17;
        Random rnd = new Random(42);
        double[] r = new double[n], u = new double[n], y = new double[n], v = new double[n];
        double vf = 0;
        for (int k = 0; k < n; k++) {
            r[k] = rnd.nextGaussian();
            vf = 0.95 * vf + 0.3 * rnd.nextGaussian(); // low-pass output disturbance
            v[k] = vf;
        }
        // plant state yp[k] = 0.9 yp[k-1] + 0.1 u[k-1]; PI: c = 2 y + integral(0.2 y)
        double yp = 0, integ = 0, uPrev = 0;
        for (int k = 0; k < n; k++) {
            yp = 0.9 * yp + 0.1 * uPrev;
            y[k] = yp + v[k];
            integ += 0.2 * y[k];
            u[k] = r[k] - (2 * y[k] + integ);
            uPrev = u[k];
        }
        for (int k = 0; k < n; k++) assertTrue(Double.isFinite(u[k]), "loop must be stable");
        ClosedLoopEstimate est = ClosedLoopEstimate.welch(r, u, y, FS, WelchOptions.hann(512));
        Frf plant = est.plant(), naive = est.naive();
        double[] w = plant.omegaRadPerS(), gr = new double[w.length], gi = new double[w.length];
        P.tf(1 / FS).response(w, gr, gi);
        double[] sp = plant.uncertainty().orElseThrow(), sn = naive.uncertainty().orElseThrow();
        int within2 = 0, naiveBeyond3 = 0, bins = 0;
        for (int k = 0; k < w.length; k++) {
            if (w[k] > 2 * Math.PI * 50) continue; // the band where the disturbance dominates the loop
            bins++;
            double ep = Math.hypot(plant.realAt(k) - gr[k], plant.imagAt(k) - gi[k]);
            double en = Math.hypot(naive.realAt(k) - gr[k], naive.imagAt(k) - gi[k]);
            if (ep <= 2 * sp[k]) within2++;
            if (en > 3 * sn[k]) naiveBeyond3++;
        }
        // complex Gaussian error with E|e|² = σ²: P(|e| > 2σ) = e^-4 ≈ 2 %; require 90 % within 2σ
        assertTrue(within2 >= 0.9 * bins, "extracted plant within 2σ at " + within2 + " of " + bins + " bins");
        // the naive ratio misses the plant by more than 3 of its own σ almost everywhere in that band
        assertTrue(naiveBeyond3 >= 0.8 * bins, "naive ratio beyond 3σ at " + naiveBeyond3 + " of " + bins + " bins");
        // S and PS: S_ru/S_rr ≈ S and S_ry/S_rr ≈ P·S, so PS/S reproduces the plant estimate exactly
        Frf ratio = est.processSensitivity().dividedBy(est.sensitivity());
        for (int k = 0; k < w.length; k++) {
            assertEquals(plant.realAt(k), ratio.realAt(k), 1e-9 * Math.hypot(plant.realAt(k), plant.imagAt(k)));
        }
    }

    /**
     * A position cascade driven by a position reference only (no injected current): plant velocity
     * v[k] = 0.9 v[k-1] + 0.1 u[k-1] + torque noise, position x[k] = x[k-1] + T v[k], measured velocity with
     * sensor noise, velocity PI and position P. The indirect estimate S_ry/S_ru with r the position reference
     * recovers the current-to-velocity plant (S_rv = 0 for any external r; ClosedLoopEstimate, derivation by
     * hand), and the naive ratio does not.
     */
    @Test
    void thePositionReferenceServesAsTheExternalSignal() {
        int n = 1 << 17;
        double t = 1 / FS, kp = 40, kv = 3, ki = 0.02;
        Random rnd = new Random(43);
        double[] ref = new double[n], u = new double[n], y = new double[n];
        double rf = 0, vel = 0, pos = 0, integ = 0, uPrev = 0, dist = 0;
        for (int k = 0; k < n; k++) {
            rf = 0.5 * rf + 0.02 * rnd.nextGaussian();   // position reference, low-passed
            ref[k] = rf;
            dist = 0.97 * dist + 0.05 * rnd.nextGaussian(); // low-frequency torque disturbance
            vel = 0.9 * vel + 0.1 * (uPrev + dist);
            pos += t * vel;
            y[k] = vel + 0.01 * rnd.nextGaussian();       // measured velocity
            double vcmd = kp * (ref[k] - pos);
            double e = vcmd - y[k];
            integ += ki * e;
            u[k] = kv * e + integ;
            uPrev = u[k];
        }
        for (int k = 0; k < n; k++) assertTrue(Double.isFinite(u[k]) && Math.abs(u[k]) < 1e6, "loop must be stable");
        ClosedLoopEstimate est = ClosedLoopEstimate.welch(ref, u, y, FS, WelchOptions.hann(512));
        Frf plant = est.plant(), naive = est.naive();
        double[] w = plant.omegaRadPerS(), gr = new double[w.length], gi = new double[w.length];
        P.tf(1 / FS).response(w, gr, gi);
        double[] sp = plant.uncertainty().orElseThrow(), sn = naive.uncertainty().orElseThrow();
        int within2 = 0, naiveBeyond3 = 0, bins = 0;
        java.util.List<Double> rel = new java.util.ArrayList<>();
        for (int k = 0; k < w.length; k++) {
            if (w[k] > 2 * Math.PI * 20) continue; // where the disturbance dominates the loop
            bins++;
            double ep = Math.hypot(plant.realAt(k) - gr[k], plant.imagAt(k) - gi[k]);
            double en = Math.hypot(naive.realAt(k) - gr[k], naive.imagAt(k) - gi[k]);
            rel.add(ep / Math.hypot(gr[k], gi[k]));
            if (ep <= 2 * sp[k]) within2++;
            if (en > 3 * sn[k]) naiveBeyond3++;
        }
        // as above: 90 % within 2σ of a complex Gaussian error; the naive ratio beyond 3σ almost everywhere
        assertTrue(within2 >= 0.9 * bins, "extracted plant within 2σ at " + within2 + " of " + bins + " bins");
        assertTrue(naiveBeyond3 >= 0.8 * bins, "naive ratio beyond 3σ at " + naiveBeyond3 + " of " + bins + " bins");
        // and close in absolute terms: half the bins within 5 % (the lowest bins, where the disturbance peaks, scatter most)
        rel.sort(null);
        assertTrue(rel.get(rel.size() / 2) < 0.05, "median relative error below 20 Hz " + rel.get(rel.size() / 2));
    }
}
