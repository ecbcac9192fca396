package org.loopledger.ident.spectral;

import org.jtransforms.fft.DoubleFFT_1D;

import java.util.Locale;

/**
 * Finds the period of a periodic reference or excitation in a log, as a whole number of samples, so that
 * {@link PeriodicAverage} can use it leakage-free.
 *
 * <p><b>Method.</b> The mean is removed and the autocorrelation a(τ) = Σ x[i]·x[i+τ] computed through a
 * zero-padded FFT (Wiener–Khinchin; common practice), then normalised by the energies of the two overlapping
 * parts, ρ(τ) = a(τ)/√(Σ<sub>i&lt;n-τ</sub> x[i]² · Σ<sub>i≥τ</sub> x[i]²), so ρ = 1 at a lag where the record repeats
 * exactly. Lags from where ρ first falls below 1/2 (past the main lobe) up to n/2 are searched (a period must
 * fit twice); the first local maximum within 0.05 of the highest ρ is the fundamental. Its fractional
 * position comes from a parabola through ρ at the three lags around the peak, refined on the furthest
 * multiple k·P that the record holds (the error shrinks as 1/k). The whole-sample period is the smallest
 * multiple m·P (m = 1 .. {@value #MAX_CYCLES_PER_PERIOD}) within {@value #WHOLE_TOLERANCE_SAMPLES} samples of a whole number
 * (a sine of 100.5 samples repeats after 201).
 *
 * <p><b>Confidence</b> is ρ at the whole-sample period: 1 for an exactly repeating record, lower with noise
 * (for white noise of variance σ² on a signal of variance s², about s²/(s² + σ²)). Below the caller's minimum
 * the detection refuses, saying what it found.
 */
public final class PeriodDetection {
    /** Default minimum confidence. */
    public static final double DEFAULT_MIN_CONFIDENCE = 0.9;
    /** How close to a whole number of samples a (multiple of the) period must lie. */
    public static final double WHOLE_TOLERANCE_SAMPLES = 0.05;
    /** Most cycles of the fundamental that one whole-sample period may hold. */
    public static final int MAX_CYCLES_PER_PERIOD = 4;

    private PeriodDetection() {}

    /**
     * A detected period.
     *
     * @param periodSamples           the whole-sample period P
     * @param sampleRateHz            the record's sample rate
     * @param fractionalPeriodSamples the fundamental's period before rounding, in samples (P/cycles when a period holds several cycles)
     * @param cyclesPerPeriod         how many cycles of the fundamental the whole-sample period holds (usually 1)
     * @param confidence              ρ(P), the normalised autocorrelation at the period (1: repeats exactly)
     * @param wholePeriods            how many whole periods the record holds
     */
    public record Period(int periodSamples, double sampleRateHz, double fractionalPeriodSamples, int cyclesPerPeriod, double confidence, int wholePeriods) {
        public double periodS() { return periodSamples / sampleRateHz; }

        /** Line spacing of a leakage-free analysis over one period, fs/P, in Hz. */
        public double lineSpacingHz() { return sampleRateHz / periodSamples; }

        @Override public String toString() {
            return String.format(Locale.ROOT, "period %d samples (%.6g s, lines every %.6g Hz)%s, confidence %.4f, %d whole period(s) in the record",
                    periodSamples, periodS(), lineSpacingHz(), cyclesPerPeriod == 1 ? "" : String.format(Locale.ROOT, " = %d cycles of %.4f samples", cyclesPerPeriod,
                            fractionalPeriodSamples), confidence, wholePeriods);
        }
    }

    /** Detects with {@link #DEFAULT_MIN_CONFIDENCE}. */
    public static Period detect(double[] x, double sampleRateHz) { return detect(x, sampleRateHz, DEFAULT_MIN_CONFIDENCE); }

    /**
     * Detects the period of {@code x} (not modified), or throws an {@link IllegalArgumentException} that says
     * why not: too short, constant, not periodic (best confidence below {@code minConfidence}, with its lag),
     * or a period that no small multiple makes a whole number of samples.
     */
    public static Period detect(double[] x, double sampleRateHz, double minConfidence) {
        if (!(sampleRateHz > 0) || Double.isInfinite(sampleRateHz)) throw new IllegalArgumentException("sample rate must be finite and positive, got " + sampleRateHz + " Hz");
        if (!(minConfidence > 0 && minConfidence < 1)) throw new IllegalArgumentException("minimum confidence must lie in (0, 1), got " + minConfidence);
        int n = x.length;
        if (n < 16) throw new IllegalArgumentException("a record of " + n + " samples is too short to detect a period in; give at least two periods");
        double mean = 0;
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i])) throw new IllegalArgumentException("sample " + i + " is " + x[i] + "; repair non-finite samples first");
            mean += x[i];
        }
        mean /= n;
        double[] x0 = new double[n];
        double[] cum = new double[n + 1]; // cum[i] = Σ_{j<i} x0[j]²
        for (int i = 0; i < n; i++) {
            x0[i] = x[i] - mean;
            cum[i + 1] = cum[i] + x0[i] * x0[i];
        }
        if (!(cum[n] > 0)) throw new IllegalArgumentException("the signal is constant (" + x[0] + "); it has no period to detect");
        double[] rho = normalisedAutocorrelation(x0, cum);
        int half = n / 2;
        int start = 1;
        while (start <= half && rho[start] >= 0.5) start++;
        if (start > half) {
            throw new IllegalArgumentException("the signal does not decorrelate within half the record (" + half + " samples): it is not periodic, "
                    + "or its period is longer than half the record; a period must fit at least twice");
        }
        int best = start;
        for (int t = start; t <= half; t++) if (rho[t] > rho[best]) best = t;
        if (rho[best] < minConfidence) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "not periodic: the best normalised autocorrelation between %d and %d samples is %.3f at %d samples"
                    + " (%.6g s), below the required %.3f; check that this column holds the periodic reference or excitation, or that the record holds "
                    + "two periods or more", start, half, rho[best], best, best / sampleRateHz, minConfidence));
        }
        int first = best;
        for (int t = start + 1; t < best; t++) {
            if (rho[t] >= rho[best] - 0.05 && rho[t] >= rho[t - 1] && rho[t] >= rho[t + 1]) { first = t; break; }
        }
        double p = first + parabolicOffset(rho, first);
        // refine on the furthest multiple the record holds
        int kMax = (int) Math.floor((n - 2 - p) / p);
        if (kMax >= 2) {
            int c = (int) Math.round(kMax * p);
            int t = c;
            for (int d = -2; d <= 2; d++) if (c + d >= 1 && c + d < n - 1 && rho[c + d] > rho[t]) t = c + d;
            if (t >= 1 && t < n - 1) p = (t + parabolicOffset(rho, t)) / kMax;
        }
        for (int m = 1; m <= MAX_CYCLES_PER_PERIOD; m++) {
            double mp = m * p;
            long whole = Math.round(mp);
            if (Math.abs(mp - whole) <= WHOLE_TOLERANCE_SAMPLES && whole <= half) {
                int period = (int) whole;
                double conf = rho[period];
                if (conf < minConfidence) {
                    throw new IllegalArgumentException(String.format(Locale.ROOT, "not periodic enough: the autocorrelation at the period of %d samples is %.3f, "
                            + "below the required %.3f", period, conf, minConfidence));
                }
                return new Period(period, sampleRateHz, p, m, conf, n / period);
            }
        }
        throw new IllegalArgumentException(String.format(Locale.ROOT, "the signal repeats every %.4f samples (%.6g s), and no multiple up to %d cycles is a whole number "
                + "of samples; a leakage-free analysis needs a whole-sample period: resample the log, or make the excitation's period a whole number "
                + "of drive samples, or use Welch averaging instead", p, p / sampleRateHz, MAX_CYCLES_PER_PERIOD));
    }

    /** ρ(τ) for τ = 0 .. n-1 through a zero-padded FFT. */
    static double[] normalisedAutocorrelation(double[] x0, double[] cum) {
        int n = x0.length;
        int nfft = Integer.highestOneBit(2 * n - 1);
        if (nfft < 2 * n - 1) nfft <<= 1;
        double[] b = new double[nfft];
        System.arraycopy(x0, 0, b, 0, n);
        DoubleFFT_1D fft = new DoubleFFT_1D(nfft);
        fft.realForward(b);
        // packed layout: b[0] = Re X0, b[1] = Re X(n/2), then (Re, Im) pairs; |X|² in place, imaginary parts zero
        b[0] = b[0] * b[0];
        b[1] = b[1] * b[1];
        for (int k = 1; k < nfft / 2; k++) {
            double re = b[2 * k], im = b[2 * k + 1];
            b[2 * k] = re * re + im * im;
            b[2 * k + 1] = 0;
        }
        fft.realInverse(b, true);
        double[] rho = new double[n];
        for (int t = 0; t < n; t++) {
            double e1 = cum[n - t], e2 = cum[n] - cum[t];
            rho[t] = e1 > 0 && e2 > 0 ? b[t] / Math.sqrt(e1 * e2) : 0;
        }
        return rho;
    }

    /** Offset in (-0.5, 0.5) of the vertex of the parabola through ρ at t-1, t, t+1. */
    private static double parabolicOffset(double[] r, int t) {
        if (t < 1 || t >= r.length - 1) return 0;
        double a = r[t - 1], b = r[t], c = r[t + 1];
        double den = a - 2 * b + c;
        if (!(den < 0)) return 0;
        double d = 0.5 * (a - c) / den;
        return Math.max(-0.5, Math.min(0.5, d));
    }
}
