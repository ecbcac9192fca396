package org.loopledger.ident.spectral;

import org.loopledger.frf.Frf;

import java.util.Arrays;

/**
 * Log-frequency decimation of a finely (linearly) spaced FRF for plotting and tuning: the points are
 * grouped into bins of equal width in log ω, {@code pointsPerDecade} per decade, and each non-empty bin
 * becomes one point at the geometric mean of its frequencies with the inverse-variance weighted mean of
 * its complex values (weights 1/σ² when the FRF has uncertainty, γ²/(1 - γ²) when it has only coherence,
 * equal otherwise). The combined σ is (Σ 1/σ²)<sup>-1/2</sup>; coherence is the bin's mean.
 *
 * <p>Averaging complex values across a bin smooths a resonance narrower than the bin: choose enough
 * points per decade to resolve the sharpest peak (e.g. 50 to 100 around a lightly damped mode).
 */
public final class LogDecimation {
    private LogDecimation() {}

    public static Frf decimate(Frf frf, int pointsPerDecade) {
        if (pointsPerDecade < 1) throw new IllegalArgumentException("points per decade must be at least 1, got " + pointsPerDecade);
        int n = frf.size();
        double[] w = frf.omegaRadPerS(), re = frf.real(), im = frf.imag();
        double[] coh = frf.coherence().orElse(null), sig = frf.uncertainty().orElse(null);
        double l0 = Math.log10(w[0]);
        double[] ow = new double[n], or = new double[n], oi = new double[n], oc = new double[n], os = new double[n];
        int out = 0, i = 0;
        while (i < n) {
            long bin = (long) Math.floor((Math.log10(w[i]) - l0) * pointsPerDecade + 1e-9);
            double sw = 0, sr = 0, si = 0, slw = 0, sc = 0, cnt = 0;
            boolean infinite = false;
            int j = i;
            while (j < n && (long) Math.floor((Math.log10(w[j]) - l0) * pointsPerDecade + 1e-9) == bin) {
                double weight;
                if (sig != null) weight = sig[j] > 0 ? 1.0 / (sig[j] * sig[j]) : Double.POSITIVE_INFINITY;
                else if (coh != null) weight = coh[j] < 1 ? coh[j] / (1 - coh[j]) : Double.POSITIVE_INFINITY;
                else weight = 1;
                if (Double.isInfinite(weight)) {
                    // an exact point dominates: restart the bin's sums with exact points only
                    if (!infinite) { sw = 0; sr = 0; si = 0; infinite = true; }
                    sw += 1; sr += re[j]; si += im[j];
                } else if (!infinite) {
                    sw += weight; sr += weight * re[j]; si += weight * im[j];
                }
                slw += Math.log(w[j]);
                if (coh != null) sc += coh[j];
                cnt++;
                j++;
            }
            if (sw == 0) { sw = cnt; sr = 0; si = 0; for (int k = i; k < j; k++) { sr += re[k]; si += im[k]; } } // all weights zero: plain mean
            ow[out] = Math.exp(slw / cnt);
            or[out] = sr / sw;
            oi[out] = si / sw;
            oc[out] = sc / cnt;
            os[out] = infinite || sig == null ? 0 : Math.sqrt(1.0 / sw);
            out++;
            i = j;
        }
        Frf r = Frf.ofParts(Arrays.copyOf(ow, out), Arrays.copyOf(or, out), Arrays.copyOf(oi, out));
        if (coh != null) r = r.withCoherence(Arrays.copyOf(oc, out));
        if (sig != null) r = r.withUncertainty(Arrays.copyOf(os, out));
        return r;
    }
}
