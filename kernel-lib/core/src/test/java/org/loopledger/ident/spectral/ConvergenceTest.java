package org.loopledger.ident.spectral;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * H1 on simulated data from a known discrete system converges to the exact response
 * G(e^{jωT}) as theory says: the error variance is σ² = |G|²(1 - γ²)/(n γ²) (Bendat and Piersol, Random
 * Data, 4th ed., section 9.2.4, from memory), so the RMS error falls as 1/√(averages).
 */
class ConvergenceTest {
    static final double FS = 1000;
    // G(z) = (0.2 + 0.1 z^-1) / (1 - 1.2 z^-1 + 0.5 z^-2): poles at radius 0.71, impulse response ~ 20 samples,
    // short against 256-sample segments, so leakage bias stays far below the random error.
    static final DiscreteFilter G = new DiscreteFilter(new double[] {0.2, 0.1}, new double[] {1, -1.2, 0.5});

    record Run(double rmsRelativeError, double meanNormalisedSquaredError, double averages) {}

    static Run run(int segments, long seed) {
        WelchOptions o = WelchOptions.hann(256);
        int n = (segments - 1) * o.step() + o.segmentLength();
        Random r = new Random(seed);
        double[] x = new double[n + 200], e = new double[n + 200];
        for (int i = 0; i < x.length; i++) { x[i] = r.nextGaussian(); e[i] = 0.3 * r.nextGaussian(); }
        double[] yFull = G.apply(x);
        double[] xs = new double[n], ys = new double[n];
        for (int i = 0; i < n; i++) { xs[i] = x[i + 200]; ys[i] = yFull[i + 200] + e[i + 200]; } // drop start-up transient
        FrfEstimate est = FrfEstimate.welch(xs, ys, FS, o);
        assertEquals(segments, est.spectra().segments());
        Frf h = est.h1();
        TransferFunction g = G.tf(1 / FS);
        double[] w = h.omegaRadPerS(), gr = new double[w.length], gi = new double[w.length];
        g.response(w, gr, gi);
        double[] sig = h.uncertainty().orElseThrow();
        double se = 0, sn = 0;
        for (int k = 0; k < w.length; k++) {
            double dr = h.realAt(k) - gr[k], di = h.imagAt(k) - gi[k];
            double d2 = dr * dr + di * di;
            se += d2 / (gr[k] * gr[k] + gi[k] * gi[k]);
            sn += d2 / (sig[k] * sig[k]);
        }
        return new Run(Math.sqrt(se / w.length), sn / w.length, est.spectra().effectiveAverages());
    }

    @Test
    void errorFallsAsOneOverRootAverages() {
        Run few = run(16, 11), mid = run(64, 12), many = run(256, 13);
        // 16x the averages → 4x smaller RMS error. Each RMS is over 128 bins, so its own scatter is about
        // 1/√128 ≈ 9 %; ±35 % on the ratio covers that for both runs with margin.
        double ratio = few.rmsRelativeError() / many.rmsRelativeError();
        assertEquals(4.0, ratio, 1.4, "error ratio 16 → 256 segments: " + few + " vs " + many);
        assertEquals(2.0, few.rmsRelativeError() / mid.rmsRelativeError(), 0.7);
        // the stated uncertainty matches the actual error: mean |err|²/σ² ≈ 1 (0.6 .. 1.6 allows the
        // scatter of a 128-bin mean and the approximate n_eff for overlapped Hann segments)
        for (Run r : new Run[] {few, mid, many}) assertEquals(1.0, r.meanNormalisedSquaredError(), 0.6, r.toString());
    }
}
