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

    private Multisine(ExcitationSignal signal, int[] harmonics) {
        this.signal = signal;
        this.harmonics = harmonics;
    }

    /**
     * @param fMinHz, fMaxHz band of the lines (fs/P ≤ fMin &lt; fMax &lt; fs/2)
     * @param requestedLines how many log-spaced lines to aim for; fewer remain where rounding to
     *                       harmonics of fs/P merges neighbours
     * @param periodSamples  P
     * @param rms            RMS of the signal, unit of the injected quantity
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
        double[] x = new double[periodSamples];
        for (int i = 0; i < count; i++) {
            for (int k = 0; k < periodSamples; k++) {
                long hk = ((long) h[i] * k) % periodSamples; // exact argument reduction
                x[k] += Math.cos(2 * Math.PI * hk / periodSamples + phase[i]);
            }
        }
        double scale = rms / Math.sqrt(count / 2.0); // each unit cosine has mean square 1/2
        for (int k = 0; k < periodSamples; k++) x[k] *= scale;
        String d = String.format(Locale.ROOT, "Schroeder multisine, %d log-spaced lines %.6g .. %.6g Hz, rms %.4g", count, h[0] * df, h[count - 1] * df, rms);
        return new Multisine(ExcitationSignal.ofPeriod(d, sampleRateHz, x, periods), h);
    }

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
