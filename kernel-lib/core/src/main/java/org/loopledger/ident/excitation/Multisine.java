package org.loopledger.ident.excitation;

import java.util.Arrays;
import java.util.Locale;

/**
 * Multisine on log-spaced lines with Schroeder phases: one period of P samples,
 * x[k] = Σ<sub>i</sub> a·cos(2π·h<sub>i</sub>·k/P + φ<sub>i</sub>), with h<sub>i</sub> distinct harmonics of
 * fs/P chosen log-spaced between f<sub>min</sub> and f<sub>max</sub>, equal amplitudes, and
 * φ<sub>i</sub> = -2π·Σ<sub>l&lt;i</sub> (h<sub>i</sub> - h<sub>l</sub>)·p<sub>l</sub> with power shares
 * p<sub>l</sub> = 1/F (Schroeder, "Synthesis of low-peak-factor signals and binary sequences with low
 * autocorrelation", IEEE Trans. Information Theory 16(1), 1970, eq. for arbitrary power spectra,
 * written here for non-consecutive harmonics). Scaled to the requested RMS.
 */
public final class Multisine {
    private final ExcitationSignal signal;
    private final int[] harmonics;
    private final double[] phases;
    private final double rms;

    private Multisine(ExcitationSignal signal, int[] harmonics, double[] phases, double rms) {
        this.signal = signal;
        this.harmonics = harmonics;
        this.phases = phases;
        this.rms = rms;
    }

    /**
     * A Schroeder multisine with about {@code requestedLines} lines log-spaced between {@code fMinHz} and
     * {@code fMaxHz}, each rounded to the nearest harmonic of the frequency resolution fs/P (so every line is
     * periodic in one period and estimation on whole periods is leakage-free), equal amplitudes, scaled to
     * {@code rms}. Example: {@code schroederLogLines(2, 2000, 260, 16000, 0.5, 16000, 4)} gives lines from
     * 2 Hz to 2 kHz at 1 Hz resolution, 0.5 A RMS, 4 periods of 1 s at 16 kHz.
     *
     * @param fMinHz         lowest line in Hz; at least the resolution fs/P
     * @param fMaxHz         highest line in Hz; above {@code fMinHz} and below the Nyquist frequency fs/2
     * @param requestedLines how many log-spaced lines to aim for; fewer remain where rounding to
     *                       harmonics of fs/P merges neighbours (the low end of a wide band)
     * @param periodSamples  P, samples in one period (at least 4); the resolution is fs/P
     * @param rms            RMS of the signal, in the unit of the injected quantity (e.g. A)
     * @param sampleRateHz   fs, the rate the signal is played at, in Hz (e.g. the drive's 16000)
     * @param periods        how many repetitions of the period the signal holds (at least 1)
     * @return the multisine; its {@link #signal()} is the sampled excitation
     * @throws IllegalArgumentException for a band outside fs/P .. fs/2, fewer than 4 samples per period, no line,
     *                                  a non-positive RMS or fewer than one period
     */
    public static Multisine schroederLogLines(double fMinHz, double fMaxHz, int requestedLines, int periodSamples, double rms,
                                              double sampleRateHz, int periods) {
        ExcitationSignal.requireRate(sampleRateHz);
        if (periodSamples < 4) throw new IllegalArgumentException("multisine period must have at least 4 samples, got " + periodSamples);
        double df = sampleRateHz / periodSamples;
        if (!(fMinHz >= df * (1 - 1e-12)) || !(fMaxHz > fMinHz) || !(fMaxHz < sampleRateHz / 2)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "multisine band %.6g .. %.6g Hz must satisfy fs/P = %.6g Hz <= fMin < fMax < fs/2 = %.6g Hz; lengthen the period or narrow the band",
                    fMinHz, fMaxHz, df, sampleRateHz / 2));
        }
        if (requestedLines < 1) throw new IllegalArgumentException("multisine needs at least one line, got " + requestedLines);
        if (!(rms > 0) || Double.isInfinite(rms)) throw new IllegalArgumentException("multisine RMS must be finite and positive, got " + rms);
        int[] h = new int[requestedLines];
        int count = 0;
        for (int i = 0; i < requestedLines; i++) {
            double f = requestedLines == 1 ? fMinHz : fMinHz * Math.pow(fMaxHz / fMinHz, i / (double) (requestedLines - 1));
            int k = (int) Math.max(1, Math.round(f / df));
            if (k >= periodSamples / 2.0) k = (periodSamples - 1) / 2;
            if (count == 0 || k > h[count - 1]) h[count++] = k;
        }
        h = Arrays.copyOf(h, count);
        double[] phase = new double[count];
        for (int i = 1; i < count; i++) {
            double s = 0;
            for (int l = 0; l < i; l++) s += (h[i] - h[l]);
            phase[i] = -2 * Math.PI * s / count;
        }
        String d = String.format(Locale.ROOT, "Schroeder multisine, %d log-spaced lines %.6g .. %.6g Hz, rms %.4g", count, h[0] * df, h[count - 1] * df, rms);
        return new Multisine(ExcitationSignal.ofPeriod(d, sampleRateHz, synthesize(h, phase, periodSamples, rms), periods), h, phase, rms);
    }

    /**
     * Multisine on the given harmonics h of fs/P (distinct, 1 ≤ h &lt; P/2, any order; copied), equal amplitudes,
     * Schroeder phases as above, scaled to {@code rms}. For example an odd multisine (h = 1, 3, 5, ...) leaves
     * its even lines free, so that the noise and nonlinear-distortion floor can be read there
     * ({@code PeriodicAverage.floor}).
     */
    public static Multisine ofHarmonics(int[] harmonics, int periodSamples, double rms, double sampleRateHz, int periods) {
        ExcitationSignal.requireRate(sampleRateHz);
        if (periodSamples < 4) throw new IllegalArgumentException("multisine period must have at least 4 samples, got " + periodSamples);
        if (harmonics.length < 1) throw new IllegalArgumentException("multisine needs at least one line, got none");
        if (!(rms > 0) || Double.isInfinite(rms)) throw new IllegalArgumentException("multisine RMS must be finite and positive, got " + rms);
        int[] h = harmonics.clone();
        Arrays.sort(h);
        for (int i = 0; i < h.length; i++) {
            if (h[i] < 1 || 2 * h[i] >= periodSamples) {
                throw new IllegalArgumentException("harmonic " + h[i] + " is outside 1 .. " + ((periodSamples - 1) / 2) + " for a period of " + periodSamples + " samples");
            }
            if (i > 0 && h[i] == h[i - 1]) throw new IllegalArgumentException("harmonic " + h[i] + " is given twice");
        }
        int count = h.length;
        double[] phase = new double[count];
        for (int i = 1; i < count; i++) {
            double s = 0;
            for (int l = 0; l < i; l++) s += (h[i] - h[l]);
            phase[i] = -2 * Math.PI * s / count;
        }
        double df = sampleRateHz / periodSamples;
        String d = String.format(Locale.ROOT, "Schroeder multisine, %d given lines %.6g .. %.6g Hz, rms %.4g", count, h[0] * df, h[count - 1] * df, rms);
        return new Multisine(ExcitationSignal.ofPeriod(d, sampleRateHz, synthesize(h, phase, periodSamples, rms), periods), h, phase, rms);
    }

    private static double[] synthesize(int[] h, double[] phase, int periodSamples, double rms) {
        double[] x = new double[periodSamples];
        for (int i = 0; i < h.length; i++) {
            for (int k = 0; k < periodSamples; k++) {
                long hk = ((long) h[i] * k) % periodSamples; // exact argument reduction
                x[k] += Math.cos(2 * Math.PI * hk / periodSamples + phase[i]);
            }
        }
        double scale = rms / Math.sqrt(h.length / 2.0); // each unit cosine has mean square 1/2
        for (int k = 0; k < periodSamples; k++) x[k] *= scale;
        return x;
    }

    /**
     * The same lines and amplitudes with phases improved for a lower crest factor: starting from the
     * Schroeder phases, clip the signal at 80 % of its peak, keep the phases of the clipped signal's
     * lines, restore the amplitudes, repeat; the lowest crest factor met is kept (Van der Ouderaa,
     * Schoukens and Renneboog, "Peak factor minimization using a time-frequency domain swapping
     * algorithm", IEEE Trans. Instrum. Meas. 37(1), 1988, from memory). Schroeder's formula assumes dense,
     * consecutive lines; on sparse log-spaced lines it is little better than random phases, so this step pays.
     */
    public Multisine withReducedCrestFactor(int iterations) {
        if (iterations < 1) throw new IllegalArgumentException("iterations must be at least 1, got " + iterations);
        int p = signal.periodSamples();
        double[] ph = phases.clone(), bestPh = phases.clone();
        double[] x = synthesize(harmonics, ph, p, rms);
        double best = crest(x);
        double[] cos = new double[p], sin = new double[p];
        for (int m = 0; m < p; m++) { cos[m] = Math.cos(2 * Math.PI * m / p); sin[m] = Math.sin(2 * Math.PI * m / p); }
        double[] clipped = new double[p];
        for (int it = 0; it < iterations; it++) {
            double peak = 0;
            for (double v : x) peak = Math.max(peak, Math.abs(v));
            double lim = 0.8 * peak;
            for (int k = 0; k < p; k++) clipped[k] = Math.max(-lim, Math.min(lim, x[k]));
            for (int i = 0; i < harmonics.length; i++) {
                double re = 0, im = 0;
                int idx = 0, stepIdx = harmonics[i] % p;
                for (int k = 0; k < p; k++) {
                    re += clipped[k] * cos[idx];
                    im -= clipped[k] * sin[idx];
                    idx += stepIdx;
                    if (idx >= p) idx -= p;
                }
                ph[i] = Math.atan2(im, re);
            }
            x = synthesize(harmonics, ph, p, rms);
            double c = crest(x);
            if (c < best) { best = c; bestPh = ph.clone(); }
        }
        String d = signal.description().replace("Schroeder multisine", "multisine (Schroeder phases, crest factor reduced)");
        return new Multisine(ExcitationSignal.ofPeriod(d, signal.sampleRateHz(), synthesize(harmonics, bestPh, p, rms), signal.periods()), harmonics, bestPh, rms);
    }

    private static double crest(double[] x) {
        double pk = 0, s = 0;
        for (double v : x) { pk = Math.max(pk, Math.abs(v)); s += v * v; }
        return pk / Math.sqrt(s / x.length);
    }

    /** Phase of each line, rad (copy). */
    public double[] phasesRad() { return phases.clone(); }

    public ExcitationSignal signal() { return signal; }

    /** Excited harmonic numbers h of fs/P (copy), increasing. */
    public int[] harmonics() { return harmonics.clone(); }

    /** Excited line frequencies in Hz. */
    public double[] linesHz() {
        double[] f = new double[harmonics.length];
        for (int i = 0; i < f.length; i++) f[i] = harmonics[i] * signal.lineSpacingHz();
        return f;
    }

    @Override public String toString() { return signal.toString(); }
}
