package org.loopledger.ident.spectral;

import java.util.Locale;

/**
 * Settings of Welch's averaged, modified periodogram (Welch, IEEE Trans. Audio Electroacoust. 15(2),
 * 1967): segments of {@code segmentLength} samples overlapping by {@code overlapSamples}, each detrended
 * and windowed, FFT length equal to the segment length, one-sided density scaling, mean averaging.
 * These match {@code scipy.signal.csd/welch/coherence(..., nperseg, noverlap, window, detrend)} with
 * their other defaults (nfft = nperseg, return_onesided=True, scaling='density', average='mean').
 */
public record WelchOptions(int segmentLength, int overlapSamples, WindowType window, Detrend detrend) {
    public WelchOptions {
        if (segmentLength < 2) throw new IllegalArgumentException("segment length must be at least 2 samples, got " + segmentLength);
        if (overlapSamples < 0 || overlapSamples >= segmentLength) {
            throw new IllegalArgumentException("overlap must be in [0, segment length - 1] = [0, " + (segmentLength - 1) + "], got " + overlapSamples);
        }
        if (window == null || detrend == null) throw new IllegalArgumentException("window and detrend must be given (e.g. WindowType.HANN, Detrend.CONSTANT)");
    }

    /** Hann window, 50 % overlap, mean removed: SciPy's defaults for a given nperseg. */
    public static WelchOptions hann(int segmentLength) {
        return new WelchOptions(segmentLength, segmentLength / 2, WindowType.HANN, Detrend.CONSTANT);
    }

    public int step() { return segmentLength - overlapSamples; }

    /** Number of whole segments in n samples (SciPy's (n - noverlap) // step), 0 when n &lt; segment length. */
    public int segmentsIn(long n) {
        if (n < segmentLength) return 0;
        long k = (n - overlapSamples) / step();
        if (k > Integer.MAX_VALUE) throw new IllegalArgumentException("too many segments: " + k);
        return (int) k;
    }

    @Override public String toString() {
        return String.format(Locale.ROOT, "Welch: %d-sample segments, %d overlap (%.0f %%), %s window, detrend %s",
                segmentLength, overlapSamples, 100.0 * overlapSamples / segmentLength, window.name().toLowerCase(Locale.ROOT), detrend.name().toLowerCase(Locale.ROOT));
    }
}
