package org.loopledger.ident.spectral;

import org.jtransforms.fft.DoubleFFT_1D;

import java.util.Locale;
import java.util.stream.IntStream;

/**
 * Welch estimates of all auto- and cross-spectral densities among a few channels sampled together:
 * S<sub>ij</sub>(f) = scale · mean over segments of conj(X<sub>i</sub>)·X<sub>j</sub>, which is
 * {@code scipy.signal.csd(x_i, x_j, ...)} (note the conjugate on the first argument; S<sub>ji</sub> =
 * conj(S<sub>ij</sub>)), one-sided, density scaling 1/(fs·Σw²), doubled except at DC and Nyquist.
 *
 * <p>Frequencies are k·fs/n, k = 0 .. ⌊n/2⌋, n the segment length (DC included here; FRFs drop it).
 *
 * <p>Streaming: the segments are read straight from the input arrays into a few reused buffers, so
 * memory beyond the inputs does not grow with the record length. The segments are split into a fixed
 * number of contiguous chunks (a function of the segment count only, never of the core count), the chunks
 * run in parallel and their sums are added in chunk order, so results are identical on any machine.
 *
 * <p>Also carries the effective number of independent averages of the overlapped estimate,
 * n<sub>eff</sub> = K² / (K + 2·Σ<sub>j=1..K-1</sub>(K - j)·ρ²(j·step)), ρ(m) = Σ w[k]w[k+m] / Σ w²
 * (Percival and Walden, Spectral Analysis for Physical Applications, 1993, eq. (292b), from memory:
 * ν = 2·n<sub>eff</sub> equivalent degrees of freedom).
 */
public final class CrossSpectra {
    /** Chunks when there are many segments (fixed, for determinism); fewer segments run as one chunk. */
    static final int CHUNKS = 8;
    static final int MIN_SEGMENTS_PER_CHUNK = 8;

    private final double sampleRateHz;
    private final WelchOptions options;
    private final int channels;
    private final int segments;
    private final double effectiveAverages;
    private final double[][] re; // [pair][bin]
    private final double[][] im;

    private CrossSpectra(double fs, WelchOptions o, int channels, int segments, double nEff, double[][] re, double[][] im) {
        this.sampleRateHz = fs;
        this.options = o;
        this.channels = channels;
        this.segments = segments;
        this.effectiveAverages = nEff;
        this.re = re;
        this.im = im;
    }

    /**
     * Estimates the spectral matrix of the given channels (not modified; all the same length).
     * Throws when the record is shorter than one segment or holds a non-finite sample.
     */
    public static CrossSpectra welch(double sampleRateHz, WelchOptions o, double[]... x) {
        if (!(sampleRateHz > 0) || Double.isInfinite(sampleRateHz)) throw new IllegalArgumentException("sample rate must be finite and positive, got " + sampleRateHz + " Hz");
        if (x.length < 1) throw new IllegalArgumentException("give at least one channel");
        int n = x[0].length;
        for (int c = 0; c < x.length; c++) {
            if (x[c].length != n) throw new IllegalArgumentException("channel " + c + " has " + x[c].length + " samples but channel 0 has " + n + "; channels must be sampled together");
            for (int i = 0; i < n; i++) {
                if (!Double.isFinite(x[c][i])) throw new IllegalArgumentException("channel " + c + " sample " + i + " is " + x[c][i] + "; remove or repair non-finite samples before estimating spectra");
            }
        }
        int k = o.segmentsIn(n);
        if (k < 1) {
            throw new IllegalArgumentException("record of " + n + " samples is shorter than one segment of " + o.segmentLength()
                    + " samples; record longer or use shorter segments");
        }
        int pairs = x.length * (x.length + 1) / 2;
        int bins = o.segmentLength() / 2 + 1;
        double[] w = o.window().periodic(o.segmentLength());
        int chunks = k >= CHUNKS * MIN_SEGMENTS_PER_CHUNK ? CHUNKS : 1;
        double[][][] pr = new double[chunks][][], pi = new double[chunks][][];
        IntStream.range(0, chunks).parallel().forEach(c -> {
            int from = (int) ((long) k * c / chunks), to = (int) ((long) k * (c + 1) / chunks);
            double[][] ar = new double[pairs][bins], ai = new double[pairs][bins];
            accumulate(x, o, w, from, to, ar, ai);
            pr[c] = ar;
            pi[c] = ai;
        });
        double[][] re = pr[0], im = pi[0];
        for (int c = 1; c < chunks; c++) {
            for (int p = 0; p < pairs; p++) {
                double[] r = re[p], m = im[p], r2 = pr[c][p], m2 = pi[c][p];
                for (int b = 0; b < bins; b++) {
                    r[b] += r2[b];
                    m[b] += m2[b];
                }
            }
        }
        double sw2 = 0;
        for (double v : w) sw2 += v * v;
        double scale = 1.0 / (sampleRateHz * sw2) / k;
        int nseg = o.segmentLength();
        for (int p = 0; p < pairs; p++) {
            for (int b = 0; b < bins; b++) {
                boolean doubled = b > 0 && !(nseg % 2 == 0 && b == nseg / 2);
                double s = doubled ? 2 * scale : scale;
                re[p][b] *= s;
                im[p][b] *= s;
            }
        }
        // auto spectra are real by construction; clear rounding in the imaginary part
        for (int c = 0; c < x.length; c++) java.util.Arrays.fill(im[pairIndex(c, c, x.length)], 0.0);
        return new CrossSpectra(sampleRateHz, o, x.length, k, effectiveAverages(w, o.step(), k), re, im);
    }

    private static void accumulate(double[][] x, WelchOptions o, double[] w, int from, int to, double[][] ar, double[][] ai) {
        int n = o.segmentLength(), step = o.step(), ch = x.length, bins = n / 2 + 1;
        DoubleFFT_1D fft = new DoubleFFT_1D(n);
        double[] buf = new double[n];
        double[][] xr = new double[ch][bins], xi = new double[ch][bins];
        for (int s = from; s < to; s++) {
            int start = s * step;
            for (int c = 0; c < ch; c++) {
                System.arraycopy(x[c], start, buf, 0, n);
                o.detrend().apply(buf, n);
                for (int i = 0; i < n; i++) buf[i] *= w[i];
                fft.realForward(buf);
                unpack(buf, n, xr[c], xi[c]);
            }
            int p = 0;
            for (int i = 0; i < ch; i++) {
                double[] ir = xr[i], ii = xi[i];
                for (int j = i; j < ch; j++, p++) {
                    double[] jr = xr[j], ji = xi[j], r = ar[p], m = ai[p];
                    for (int b = 0; b < bins; b++) {
                        // conj(Xi)·Xj
                        r[b] += ir[b] * jr[b] + ii[b] * ji[b];
                        m[b] += ir[b] * ji[b] - ii[b] * jr[b];
                    }
                }
            }
        }
    }

    /** JTransforms' packed real-FFT layout to bins 0..⌊n/2⌋. */
    static void unpack(double[] a, int n, double[] re, double[] im) {
        re[0] = a[0];
        im[0] = 0;
        if (n % 2 == 0) {
            for (int k = 1; k < n / 2; k++) {
                re[k] = a[2 * k];
                im[k] = a[2 * k + 1];
            }
            re[n / 2] = a[1];
            im[n / 2] = 0;
        } else {
            int h = (n - 1) / 2;
            for (int k = 1; k < h; k++) {
                re[k] = a[2 * k];
                im[k] = a[2 * k + 1];
            }
            if (h >= 1) {
                re[h] = a[n - 1];
                im[h] = a[1];
            }
        }
    }

    static double effectiveAverages(double[] w, int step, int k) {
        double sw2 = 0;
        for (double v : w) sw2 += v * v;
        double denom = k;
        for (int j = 1; j < k; j++) {
            int lag = j * step;
            if (lag >= w.length) break;
            double r = 0;
            for (int i = 0; i + lag < w.length; i++) r += w[i] * w[i + lag];
            r /= sw2;
            denom += 2.0 * (k - j) * r * r;
        }
        return (double) k * k / denom;
    }

    static int pairIndex(int i, int j, int ch) {
        return i * ch - i * (i - 1) / 2 + (j - i);
    }

    private int pair(int i, int j) {
        if (i < 0 || j < 0 || i >= channels || j >= channels) {
            throw new IllegalArgumentException("channel index (" + i + ", " + j + ") outside 0.." + (channels - 1));
        }
        return pairIndex(Math.min(i, j), Math.max(i, j), channels);
    }

    public int channels() { return channels; }

    public int segments() { return segments; }

    /** Effective number of independent averages, n<sub>eff</sub> ≤ segments (equal without overlap). */
    public double effectiveAverages() { return effectiveAverages; }

    public WelchOptions options() { return options; }

    public double sampleRateHz() { return sampleRateHz; }

    public int bins() { return re[0].length; }

    /** k·fs/n, k = 0 .. ⌊n/2⌋ (new array). */
    public double[] frequencyHz() {
        double[] f = new double[bins()];
        for (int k = 0; k < f.length; k++) f[k] = k * sampleRateHz / options.segmentLength();
        return f;
    }

    /** S<sub>ii</sub>, real, in unit²/Hz (copy). */
    public double[] auto(int i) { return re[pair(i, i)].clone(); }

    /** Re S<sub>ij</sub> = Re E[conj(X<sub>i</sub>)X<sub>j</sub>] (copy). */
    public double[] crossRe(int i, int j) { return re[pair(i, j)].clone(); }

    /** Im S<sub>ij</sub>; S<sub>ji</sub> = conj(S<sub>ij</sub>) (copy). */
    public double[] crossIm(int i, int j) {
        double[] m = im[pair(i, j)].clone();
        if (i > j) for (int b = 0; b < m.length; b++) m[b] = -m[b];
        return m;
    }

    double autoAt(int i, int b) { return re[pair(i, i)][b]; }

    double crossReAt(int i, int j, int b) { return re[pair(i, j)][b]; }

    double crossImAt(int i, int j, int b) { return i > j ? -im[pair(i, j)][b] : im[pair(i, j)][b]; }

    @Override public String toString() {
        return String.format(Locale.ROOT, "CrossSpectra[%d channel(s), %d bins 0 .. %.6g Hz, %d segments (%.1f effective), %s]",
                channels, bins(), (bins() - 1) * sampleRateHz / options.segmentLength(), segments, effectiveAverages, options);
    }
}
