package org.loopledger.ident.spectral;

import org.jtransforms.fft.DoubleFFT_1D;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.Locale;

/**
 * Synchronous averaging over whole periods of a periodic excitation: each period m of each channel is
 * transformed with a rectangular window (leakage-free, because the record holds whole periods of a
 * steady-state response), X<sub>m</sub>(k), k = 1 .. ⌊P/2⌋ on lines k·fs/P. The mean X̄(k) over M periods
 * and the period-to-period scatter give the noise estimate
 * σ̂²<sub>X̄</sub> = Σ|X<sub>m</sub> - X̄|² / (M(M - 1)) and the covariances likewise (Pintelon and
 * Schoukens, System Identification: A Frequency Domain Approach, 2nd ed., 2012, section 2.4, from memory).
 *
 * <p>The FRF on the excited lines is Ĝ = Ȳ/Ū with the first-order variance
 * σ²<sub>G</sub> = |G|²·(σ̂²<sub>Ȳ</sub>/|Ȳ|² + σ̂²<sub>Ū</sub>/|Ū|² - 2·Re(σ̂²<sub>ȲŪ</sub>/(Ȳ·conj(Ū)))),
 * σ̂²<sub>ȲŪ</sub> = Σ(Y<sub>m</sub> - Ȳ)·conj(U<sub>m</sub> - Ū)/(M(M-1)); it is consistent also in closed
 * loop, since the noise averages out of both Ȳ and Ū. Coherence per line: γ² = |Σ conj(R<sub>m</sub>)Y<sub>m</sub>|²
 * / (Σ|R<sub>m</sub>|²·Σ|Y<sub>m</sub>|²) between the excitation r and the output, i.e. the share of the
 * output power that the excitation explains.
 *
 * <p><b>One period is enough</b> for the FRF: on a steady-state periodic record the DFT of a single period is
 * leakage-free on every line, so Ĝ = Y/U on the excited lines; only the period-to-period noise estimate,
 * the uncertainty and the coherence need two periods or more (with one period the {@link Frf} carries neither).
 * The lines the excitation does not excite hold the noise and nonlinear-distortion floor instead
 * ({@link #floor}).
 *
 * <p><b>Excited lines</b> are detected from the excitation's own spectrum ({@link #excitedLines}): the lines
 * above the first drop of 20 dB or more in its line powers sorted from the strongest down (so an odd
 * multisine read back from a log, with a small quantisation or noise floor on its even lines, excites only
 * its odd lines), and never below {@link #EXCITED_FRACTION} of the strongest line. An excitation designed
 * with a band more than 20 dB below its strongest lines and a gap between them would lose that band; design
 * excitations with levels within 20 dB, as usual.
 *
 * <p>Spectra are kept as unscaled DFT sums (the scale cancels in every ratio).
 */
public final class PeriodicAverage {
    /** Lines whose excitation power is below this fraction of the strongest line count as not excited. */
    public static final double EXCITED_FRACTION = 1e-10;
    /** A drop of at least this power ratio (20 dB) between neighbouring sorted line powers separates excited from quiet lines. */
    public static final double EXCITED_GAP = 100;

    private final double fs;
    private final int period;
    private final int periods;
    private final int skipped;
    private final double[][] meanRe, meanIm; // [channel][line]
    private final double[][][] covRe, covIm; // [i][j][line]: Σ (Xi - X̄i)·conj(Xj - X̄j) / (M(M-1))
    private final double[][][] sumCrossRe, sumCrossIm; // [i][j][line]: Σ conj(Xi_m) Xj_m

    private PeriodicAverage(double fs, int period, int periods, int skipped, double[][] meanRe, double[][] meanIm,
                            double[][][] covRe, double[][][] covIm, double[][][] sumCrossRe, double[][][] sumCrossIm) {
        this.fs = fs;
        this.period = period;
        this.periods = periods;
        this.skipped = skipped;
        this.meanRe = meanRe;
        this.meanIm = meanIm;
        this.covRe = covRe;
        this.covIm = covIm;
        this.sumCrossRe = sumCrossRe;
        this.sumCrossIm = sumCrossIm;
    }

    /**
     * Averages channels (not modified; same length) over whole periods of {@code periodSamples}, after
     * dropping {@code skipPeriods} leading periods (transient). Samples past the last whole period are ignored.
     * One period suffices for the FRF and the floor; the noise estimate, uncertainty and coherence need two.
     */
    public static PeriodicAverage of(double sampleRateHz, int periodSamples, int skipPeriods, double[]... x) {
        if (!(sampleRateHz > 0) || Double.isInfinite(sampleRateHz)) throw new IllegalArgumentException("sample rate must be finite and positive, got " + sampleRateHz + " Hz");
        if (periodSamples < 4) throw new IllegalArgumentException("period must be at least 4 samples, got " + periodSamples);
        if (skipPeriods < 0) throw new IllegalArgumentException("periods to skip must be non-negative, got " + skipPeriods);
        if (x.length < 1) throw new IllegalArgumentException("give at least one channel");
        int n = x[0].length;
        for (int c = 0; c < x.length; c++) {
            if (x[c].length != n) throw new IllegalArgumentException("channel " + c + " has " + x[c].length + " samples but channel 0 has " + n);
            for (int i = 0; i < n; i++) {
                if (!Double.isFinite(x[c][i])) throw new IllegalArgumentException("channel " + c + " sample " + i + " is " + x[c][i] + "; repair non-finite samples first");
            }
        }
        int m = n / periodSamples - skipPeriods;
        if (m < 1) {
            throw new IllegalArgumentException("record of " + n + " samples holds " + (n / periodSamples) + " whole period(s) of " + periodSamples
                    + " samples; after skipping " + skipPeriods + " at least 1 must remain; record longer or skip fewer periods");
        }
        int ch = x.length, lines = periodSamples / 2;
        DoubleFFT_1D fft = new DoubleFFT_1D(periodSamples);
        double[] buf = new double[periodSamples];
        // spectra of every period: m × ch × lines, kept because the scatter needs the mean first.
        // Memory ~ the input itself (one period's DFT per period), not more.
        double[][][] re = new double[ch][m][lines + 1], im = new double[ch][m][lines + 1];
        for (int c = 0; c < ch; c++) {
            for (int p = 0; p < m; p++) {
                System.arraycopy(x[c], (p + skipPeriods) * periodSamples, buf, 0, periodSamples);
                fft.realForward(buf);
                CrossSpectra.unpack(buf, periodSamples, re[c][p], im[c][p]);
            }
        }
        double[][] mr = new double[ch][lines], mi = new double[ch][lines];
        for (int c = 0; c < ch; c++) {
            for (int k = 0; k < lines; k++) {
                double a = 0, b = 0;
                for (int p = 0; p < m; p++) { a += re[c][p][k + 1]; b += im[c][p][k + 1]; }
                mr[c][k] = a / m;
                mi[c][k] = b / m;
            }
        }
        double[][][] cr = new double[ch][ch][lines], ci = new double[ch][ch][lines], sr = new double[ch][ch][lines], si = new double[ch][ch][lines];
        double norm = m >= 2 ? 1.0 / ((double) m * (m - 1)) : Double.NaN; // one period: no scatter to estimate
        for (int i = 0; i < ch; i++) {
            for (int j = 0; j < ch; j++) {
                for (int k = 0; k < lines; k++) {
                    double a = 0, b = 0, s1 = 0, s2 = 0;
                    for (int p = 0; p < m; p++) {
                        double xr = re[i][p][k + 1] - mr[i][k], xi = im[i][p][k + 1] - mi[i][k];
                        double yr = re[j][p][k + 1] - mr[j][k], yi = im[j][p][k + 1] - mi[j][k];
                        a += xr * yr + xi * yi;      // (Xi - X̄i)·conj(Xj - X̄j)
                        b += xi * yr - xr * yi;
                        double ur = re[i][p][k + 1], ui = im[i][p][k + 1], vr = re[j][p][k + 1], vi = im[j][p][k + 1];
                        s1 += ur * vr + ui * vi;     // conj(Xi)·Xj
                        s2 += ur * vi - ui * vr;
                    }
                    cr[i][j][k] = a * norm;
                    ci[i][j][k] = b * norm;
                    sr[i][j][k] = s1;
                    si[i][j][k] = s2;
                }
            }
        }
        return new PeriodicAverage(sampleRateHz, periodSamples, m, skipPeriods, mr, mi, cr, ci, sr, si);
    }

    public int averagedPeriods() { return periods; }

    /** Whether two or more periods were averaged, so that period-to-period noise, uncertainty and coherence exist. */
    public boolean hasNoiseEstimate() { return periods >= 2; }

    public int skippedPeriods() { return skipped; }

    public int periodSamples() { return period; }

    public double lineSpacingHz() { return fs / period; }

    /** Line frequencies k·fs/P, k = 1 .. ⌊P/2⌋ (new array). */
    public double[] frequencyHz() {
        double[] f = new double[meanRe[0].length];
        for (int k = 0; k < f.length; k++) f[k] = (k + 1) * fs / period;
        return f;
    }

    /** Mean spectrum of a channel, real part (unscaled DFT sum over one period; copy). */
    public double[] meanReal(int c) { return meanRe[c].clone(); }

    public double[] meanImag(int c) { return meanIm[c].clone(); }

    /** Period-to-period noise estimate: the standard deviation of the mean spectrum of a channel (copy). */
    public double[] noiseStd(int c) {
        requireNoiseEstimate("a period-to-period noise estimate");
        double[] s = new double[meanRe[c].length];
        for (int k = 0; k < s.length; k++) s[k] = Math.sqrt(Math.max(0, covRe[c][c][k]));
        return s;
    }

    /** Which lines the excitation channel excites (power above {@link #EXCITED_FRACTION} of its strongest line). */
    public boolean[] excitedLines(int excitation) {
        int lines = meanRe[excitation].length;
        double[] p = new double[lines];
        for (int k = 0; k < lines; k++) p[k] = power(excitation, k);
        return excited(p);
    }

    /** The rule of the class comment on line powers (not modified). */
    static boolean[] excited(double[] power) {
        int lines = power.length;
        double peak = 0;
        for (double v : power) peak = Math.max(peak, v);
        boolean[] e = new boolean[lines];
        if (!(peak > 0)) return e;
        double[] sorted = power.clone();
        java.util.Arrays.sort(sorted);
        double threshold = EXCITED_FRACTION * peak;
        for (int i = sorted.length - 1; i > 0; i--) {
            if (!(sorted[i - 1] > threshold)) break;
            if (sorted[i] > EXCITED_GAP * sorted[i - 1]) { threshold = sorted[i - 1]; break; }
        }
        for (int k = 0; k < lines; k++) e[k] = power[k] > threshold;
        return e;
    }

    private void requireNoiseEstimate(String what) {
        if (periods < 2) {
            throw new IllegalArgumentException(what + " needs at least 2 averaged periods, this record has " + periods
                    + "; record more periods (or skip fewer), or use the floor of the non-excited lines (floor(...)) as the noise level");
        }
    }

    private double power(int c, int k) { return meanRe[c][k] * meanRe[c][k] + meanIm[c][k] * meanIm[c][k]; }

    /**
     * Ȳ/Ū from channel {@code in} to {@code out} on all lines excited by {@code excitation}, with uncertainty and
     * coherence when two or more periods were averaged (without them for a single period).
     */
    public Frf frf(int in, int out, int excitation) {
        return frf(in, out, excitation, 0, Double.POSITIVE_INFINITY);
    }

    /**
     * As {@link #frf(int, int, int)}, only on excited lines within fLow .. fHigh Hz; throws when the
     * excitation has no line there.
     */
    public Frf frf(int in, int out, int excitation, double fLowHz, double fHighHz) {
        boolean[] exc = excitedLines(excitation);
        double[] fAll = frequencyHz();
        int count = 0, first = -1, last = -1;
        for (int k = 0; k < exc.length; k++) {
            if (exc[k]) { if (first < 0) first = k; last = k; }
            if (exc[k] && fAll[k] >= fLowHz && fAll[k] <= fHighHz) count++;
        }
        if (count == 0) {
            throw new IllegalArgumentException("the excitation has no energy in " + Units.formatHz(fLowHz) + " .. " + Units.formatHz(fHighHz)
                    + (first < 0 ? " (it excites no line at all)" : " (its lines span " + Units.formatHz(fAll[first]) + " .. " + Units.formatHz(fAll[last]) + ")")
                    + "; choose a band it excites or change the excitation");
        }
        double[] f = new double[count], gr = new double[count], gi = new double[count], coh = new double[count], sig = new double[count];
        int j = 0;
        for (int k = 0; k < exc.length; k++) {
            if (!exc[k] || fAll[k] < fLowHz || fAll[k] > fHighHz) continue;
            double ur = meanRe[in][k], ui = meanIm[in][k], yr = meanRe[out][k], yi = meanIm[out][k];
            double u2 = ur * ur + ui * ui;
            if (!(u2 > 0)) throw new IllegalArgumentException("the input channel " + in + " is zero at " + Units.formatHz(fAll[k]) + "; the FRF is undefined there");
            double hr = (yr * ur + yi * ui) / u2, hi = (yi * ur - yr * ui) / u2;
            double y2 = yr * yr + yi * yi;
            double vy = covRe[out][out][k], vu = covRe[in][in][k];
            // σ²_YU / (Ȳ conj(Ū)): σ²_YU = cov[out][in] = Σ (Y - Ȳ) conj(U - Ū)/(M(M-1))
            double cyr = covRe[out][in][k], cyi = covIm[out][in][k];
            double dr = yr * ur + yi * ui, di = yi * ur - yr * ui; // Ȳ·conj(Ū)
            double d2 = dr * dr + di * di;
            double cross = d2 > 0 ? (cyr * dr + cyi * di) / d2 : 0;
            double rel = (y2 > 0 ? vy / y2 : 0) + vu / u2 - 2 * cross;
            f[j] = fAll[k];
            gr[j] = hr;
            gi[j] = hi;
            sig[j] = Math.hypot(hr, hi) * Math.sqrt(Math.max(0, rel));
            double srr = sumCrossRe[excitation][excitation][k], syy = sumCrossRe[out][out][k];
            double sxr = sumCrossRe[excitation][out][k], sxi = sumCrossIm[excitation][out][k];
            coh[j] = srr > 0 && syy > 0 ? Math.min(1, (sxr * sxr + sxi * sxi) / (srr * syy)) : 0;
            j++;
        }
        Frf g = Frf.ofPartsHz(f, gr, gi);
        return periods >= 2 ? g.withCoherence(coh).withUncertainty(sig) : g;
    }

    /**
     * The floor of channel {@code channel} on the lines that {@code excitation} does not excite, per decade band
     * (edges at the powers of ten between the first line and fs/2); see {@link LineFloor}.
     */
    public LineFloor floor(int excitation, int channel) {
        double lo = fs / period, hi = (meanRe[0].length) * fs / period;
        java.util.List<Double> edges = new java.util.ArrayList<>();
        edges.add(lo);
        for (double e = Math.pow(10, Math.floor(Math.log10(lo)) + 1); e < hi; e *= 10) edges.add(e);
        edges.add(hi);
        return floor(excitation, channel, edges.stream().mapToDouble(Double::doubleValue).toArray());
    }

    /**
     * As {@link #floor(int, int)}, in the bands between consecutive {@code bandEdgesHz} (increasing; not modified);
     * bands without both excited and non-excited lines are left out.
     */
    public LineFloor floor(int excitation, int channel, double... bandEdgesHz) {
        if (bandEdgesHz.length < 2) throw new IllegalArgumentException("give at least two band edges in Hz, got " + bandEdgesHz.length);
        for (int i = 1; i < bandEdgesHz.length; i++) {
            if (!(bandEdgesHz[i] > bandEdgesHz[i - 1])) {
                throw new IllegalArgumentException("band edges must increase: edge " + i + " (" + bandEdgesHz[i] + " Hz) is not above edge " + (i - 1)
                        + " (" + bandEdgesHz[i - 1] + " Hz)");
            }
        }
        boolean[] exc = excitedLines(excitation);
        double[] f = frequencyHz();
        int top = f.length;
        if (period % 2 == 0) top--; // the Nyquist line of an even period is real-only: leave it out
        java.util.List<LineFloor.Band> bands = new java.util.ArrayList<>();
        for (int b = 0; b + 1 < bandEdgesHz.length; b++) {
            double lo = bandEdgesHz[b], hi = bandEdgesHz[b + 1];
            boolean last = b + 2 == bandEdgesHz.length;
            int ne = 0, nq = 0, nAll = 0;
            double pe = 0, pq = 0, var = 0;
            for (int k = 0; k < top; k++) {
                if (f[k] < lo || (last ? f[k] > hi * (1 + 1e-12) : f[k] >= hi)) continue;
                double pw = power(channel, k);
                if (exc[k]) { ne++; pe += pw; } else { nq++; pq += pw; }
                nAll++;
                if (periods >= 2) var += covRe[channel][channel][k];
            }
            if (ne == 0 || nq == 0 || !(pe > 0)) continue;
            double ref = pe / ne;
            double floorDb = 10 * Math.log10(Math.max(pq / nq, Double.MIN_NORMAL) / ref);
            double noiseDb = periods >= 2 ? 10 * Math.log10(Math.max(var / nAll, Double.MIN_NORMAL) / ref) : Double.NaN;
            bands.add(new LineFloor.Band(lo, hi, ne, nq, floorDb, noiseDb));
        }
        return new LineFloor(channel, periods, bands);
    }

    @Override public String toString() {
        return String.format(Locale.ROOT, "PeriodicAverage[%d channel(s), %d periods of %d samples averaged (%d skipped), lines every %.6g Hz]",
                meanRe.length, periods, period, skipped, lineSpacingHz());
    }
}
