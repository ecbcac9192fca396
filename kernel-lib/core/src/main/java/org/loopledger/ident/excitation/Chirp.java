package org.loopledger.ident.excitation;

import java.util.Locale;

/**
 * Swept sines (chirps) from f0 to f1 over one period T, repeated; x(t) = A·cos(φ(t)) as
 * {@code scipy.signal.chirp} defines them (phase offset 0):
 * <ul>
 *   <li>linear: φ(t) = 2π(f0·t + (f1 - f0)·t²/(2T))</li>
 *   <li>logarithmic: φ(t) = 2π·f0·T/ln(f1/f0)·((f1/f0)<sup>t/T</sup> - 1)</li>
 * </ul>
 * sampled at t = k/fs, k = 0 .. round(T·fs) - 1. A chirp is periodic only if it starts and ends at the
 * same phase; use synchronous averaging with it only on repeated sweeps, and Welch otherwise.
 */
public final class Chirp {
    private Chirp() {}

    /** Linear sweep f0 → f1 Hz in {@code sweepS} seconds. */
    public static ExcitationSignal linear(double f0Hz, double f1Hz, double sweepS, double amplitude, double sampleRateHz, int periods) {
        int n = check(f0Hz, f1Hz, sweepS, amplitude, sampleRateHz, false);
        double[] x = new double[n];
        double k = (f1Hz - f0Hz) / sweepS;
        for (int i = 0; i < n; i++) {
            double t = i / sampleRateHz;
            x[i] = amplitude * Math.cos(2 * Math.PI * (f0Hz * t + 0.5 * k * t * t));
        }
        return ExcitationSignal.ofPeriod(String.format(Locale.ROOT, "linear chirp %.6g Hz to %.6g Hz in %.6g s, amplitude %.4g", f0Hz, f1Hz, sweepS, amplitude),
                sampleRateHz, x, periods);
    }

    /** Logarithmic (exponential) sweep f0 → f1 Hz in {@code sweepS} seconds; f0, f1 &gt; 0, f0 ≠ f1. */
    public static ExcitationSignal logarithmic(double f0Hz, double f1Hz, double sweepS, double amplitude, double sampleRateHz, int periods) {
        int n = check(f0Hz, f1Hz, sweepS, amplitude, sampleRateHz, true);
        double[] x = new double[n];
        double beta = sweepS / Math.log(f1Hz / f0Hz);
        for (int i = 0; i < n; i++) {
            double t = i / sampleRateHz;
            x[i] = amplitude * Math.cos(2 * Math.PI * beta * f0Hz * (Math.pow(f1Hz / f0Hz, t / sweepS) - 1.0));
        }
        return ExcitationSignal.ofPeriod(String.format(Locale.ROOT, "logarithmic chirp %.6g Hz to %.6g Hz in %.6g s, amplitude %.4g", f0Hz, f1Hz, sweepS, amplitude),
                sampleRateHz, x, periods);
    }

    private static int check(double f0, double f1, double sweepS, double a, double fs, boolean log) {
        ExcitationSignal.requireRate(fs);
        if (!(a > 0) || Double.isInfinite(a)) throw new IllegalArgumentException("chirp amplitude must be finite and positive, got " + a);
        if (!(sweepS > 0) || Double.isInfinite(sweepS)) throw new IllegalArgumentException("sweep time must be finite and positive, got " + sweepS + " s");
        double nyq = fs / 2;
        for (double f : new double[] {f0, f1}) {
            if (!(f >= 0) || f > nyq) {
                throw new IllegalArgumentException("chirp frequency " + f + " Hz must lie in [0, " + nyq + "] Hz (the Nyquist frequency at " + fs + " Hz)");
            }
        }
        if (log && (f0 <= 0 || f1 <= 0 || f0 == f1)) {
            throw new IllegalArgumentException("a logarithmic chirp needs distinct positive start and end frequencies, got " + f0 + " Hz and " + f1 + " Hz");
        }
        long n = Math.round(sweepS * fs);
        if (n < 2 || n > Integer.MAX_VALUE - 8) throw new IllegalArgumentException("sweep of " + sweepS + " s at " + fs + " Hz gives " + n + " samples; need 2 .. 2^31");
        return (int) n;
    }
}
