package org.loopledger.ident.spectral;

import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.Locale;

/**
 * Nonparametric FRF estimates from input x to output y on the Welch bins k·fs/n, k = 1 .. ⌊n/2⌋
 * (DC dropped):
 * <ul>
 *   <li>H1 = S<sub>xy</sub>/S<sub>xx</sub> (unbiased by output noise),</li>
 *   <li>H2 = S<sub>yy</sub>/S<sub>yx</sub> (unbiased by input noise), S<sub>yx</sub> = conj(S<sub>xy</sub>),</li>
 *   <li>coherence γ² = |S<sub>xy</sub>|²/(S<sub>xx</sub>S<sub>yy</sub>), as {@code scipy.signal.coherence},</li>
 *   <li>uncertainty: the standard deviation σ of the complex estimate, E|Ĥ - H|² ≈ σ²,
 *       σ² = (1 - γ²)·S<sub>yy</sub>/(n<sub>eff</sub>·S<sub>xx</sub>) = |H|²(1 - γ²)/(n<sub>eff</sub>γ²)
 *       (Bendat and Piersol, Random Data, 4th ed., 2010, section 9.2.4, from memory: the normalised
 *       error of |H| is √((1-γ²)/(2n))/|γ|, i.e. σ/√2 on the magnitude and as much on the phase).</li>
 * </ul>
 * Uses channel 0 as x and channel 1 as y of a {@link CrossSpectra}.
 */
public final class FrfEstimate {
    private final CrossSpectra spectra;
    private final double[] f, h1r, h1i, h2r, h2i, coh, sigma;

    private FrfEstimate(CrossSpectra s, double[] f, double[] h1r, double[] h1i, double[] h2r, double[] h2i, double[] coh, double[] sigma) {
        this.spectra = s;
        this.f = f;
        this.h1r = h1r;
        this.h1i = h1i;
        this.h2r = h2r;
        this.h2i = h2i;
        this.coh = coh;
        this.sigma = sigma;
    }

    /** Welch H1/H2/coherence from x (input) to y (output), sampled together at {@code sampleRateHz}. */
    public static FrfEstimate welch(double[] x, double[] y, double sampleRateHz, WelchOptions options) {
        return of(CrossSpectra.welch(sampleRateHz, options, x, y), 0, 1);
    }

    /** From channels {@code in} and {@code out} of a spectral matrix. */
    public static FrfEstimate of(CrossSpectra s, int in, int out) {
        int bins = s.bins() - 1;
        double[] fAll = s.frequencyHz();
        double[] f = new double[bins], h1r = new double[bins], h1i = new double[bins], h2r = new double[bins], h2i = new double[bins];
        double[] coh = new double[bins], sig = new double[bins];
        double n = s.effectiveAverages();
        for (int k = 0; k < bins; k++) {
            int b = k + 1;
            f[k] = fAll[b];
            double sxx = s.autoAt(in, b), syy = s.autoAt(out, b), pr = s.crossReAt(in, out, b), pi = s.crossImAt(in, out, b);
            if (!(sxx > 0)) {
                throw new IllegalArgumentException(String.format(Locale.ROOT,
                        "the input has no energy at %s (bin %d): H1 is undefined there; excite that frequency or restrict the band", Units.formatHz(f[k]), b));
            }
            h1r[k] = pr / sxx;
            h1i[k] = pi / sxx;
            double p2 = pr * pr + pi * pi;
            if (p2 > 0) {
                // H2 = Syy / conj(Sxy) = Syy·Sxy/|Sxy|²
                h2r[k] = syy * pr / p2;
                h2i[k] = syy * pi / p2;
            }
            double g = syy > 0 ? p2 / (sxx * syy) : 0;
            coh[k] = Math.min(1.0, g);
            sig[k] = Math.sqrt(Math.max(0, (1 - coh[k])) * syy / (n * sxx));
        }
        return new FrfEstimate(s, f, h1r, h1i, h2r, h2i, coh, sig);
    }

    public CrossSpectra spectra() { return spectra; }

    public int size() { return f.length; }

    public double[] frequencyHz() { return f.clone(); }

    public double[] h1Real() { return h1r.clone(); }

    public double[] h1Imag() { return h1i.clone(); }

    public double[] h2Real() { return h2r.clone(); }

    public double[] h2Imag() { return h2i.clone(); }

    public double[] coherence() { return coh.clone(); }

    /** σ of H1 per bin (see class comment). */
    public double[] uncertainty() { return sigma.clone(); }

    /** H1 as an {@link Frf} with coherence and uncertainty. */
    public Frf h1() {
        return Frf.ofPartsHz(f, h1r, h1i).withCoherence(coh).withUncertainty(sigma);
    }

    /** H2 as an {@link Frf} with coherence and the corresponding uncertainty |H2|·√((1-γ²)/(n γ²)); throws where S<sub>xy</sub> = 0. */
    public Frf h2() {
        double[] u = new double[f.length];
        double n = spectra.effectiveAverages();
        for (int k = 0; k < f.length; k++) {
            if (coh[k] == 0) throw new IllegalArgumentException("cross spectrum is zero at " + Units.formatHz(f[k]) + "; H2 is undefined there");
            u[k] = Math.hypot(h2r[k], h2i[k]) * Math.sqrt((1 - coh[k]) / (n * coh[k]));
        }
        return Frf.ofPartsHz(f, h2r, h2i).withCoherence(coh).withUncertainty(u);
    }

    /**
     * H1 restricted to fLow .. fHigh Hz, after checking that the input carries energy there: throws when
     * the band holds no bin, or when the input's density in the band stays below 1e-6 of its peak (an
     * excitation with no energy in the requested band), naming the band and where the energy is.
     */
    public Frf h1InBand(double fLowHz, double fHighHz) {
        double[] sxx = spectra.auto(0);
        double peak = 0, inBand = 0;
        int peakBin = 1, count = 0;
        for (int k = 0; k < f.length; k++) {
            double v = sxx[k + 1];
            if (v > peak) { peak = v; peakBin = k; }
            if (f[k] >= fLowHz && f[k] <= fHighHz) { inBand = Math.max(inBand, v); count++; }
        }
        if (count == 0) {
            throw new IllegalArgumentException("no frequency bin lies in " + Units.formatHz(fLowHz) + " .. " + Units.formatHz(fHighHz)
                    + "; the estimate covers " + Units.formatHz(f[0]) + " .. " + Units.formatHz(f[f.length - 1]));
        }
        if (!(inBand > 1e-6 * peak)) {
            throw new IllegalArgumentException("the excitation has no energy in " + Units.formatHz(fLowHz) + " .. " + Units.formatHz(fHighHz)
                    + " (input density below 1e-6 of its peak at " + Units.formatHz(f[peakBin]) + "); excite that band or choose another");
        }
        return h1().restrictedToHz(fLowHz, fHighHz);
    }

    @Override public String toString() {
        return String.format(Locale.ROOT, "FrfEstimate[%d bins %s .. %s, %d segments, %.1f effective averages]",
                f.length, Units.formatHz(f[0]), Units.formatHz(f[f.length - 1]), spectra.segments(), spectra.effectiveAverages());
    }
}
