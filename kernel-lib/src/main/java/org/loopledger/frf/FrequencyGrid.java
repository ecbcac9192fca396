package org.loopledger.frf;

import org.loopledger.lti.Units;

/**
 * Logarithmically spaced frequency grids; each name says the unit it returns. {@link #logRadPerS} and
 * {@link #logSpacedRadPerS} return rad/s (what {@code TransferFunction.response} and {@code Frf} take);
 * {@link #logSpacedHz} returns Hz (for labels, tables and Hz-based APIs).
 */
public final class FrequencyGrid {
    private FrequencyGrid() {}

    /** {@code n} points from {@code loRadPerS} to {@code hiRadPerS} inclusive, equally spaced in log ω. */
    public static double[] logRadPerS(double loRadPerS, double hiRadPerS, int n) {
        if (!(loRadPerS > 0) || !(hiRadPerS > loRadPerS) || Double.isInfinite(hiRadPerS)) {
            throw new IllegalArgumentException("a log grid needs 0 < low < high < inf, got " + loRadPerS + " .. " + hiRadPerS + " rad/s");
        }
        if (n < 2) throw new IllegalArgumentException("a log grid needs at least 2 points, got " + n);
        double a = Math.log10(loRadPerS), b = Math.log10(hiRadPerS);
        double[] w = new double[n];
        for (int i = 0; i < n; i++) w[i] = Math.pow(10, a + (b - a) * i / (n - 1));
        w[0] = loRadPerS;
        w[n - 1] = hiRadPerS;
        return w;
    }

    /**
     * {@code n} log-spaced points from {@code fromHz} to {@code toHz} (limits in Hz), returned in rad/s
     * (2π·f), ready for {@code TransferFunction.response} and {@code Frf.ofModel}:
     * {@code logSpacedRadPerS(1, 1000, n)[0]} is 6.283. For the same grid in Hz use {@link #logSpacedHz}.
     */
    public static double[] logSpacedRadPerS(double fromHz, double toHz, int n) {
        return logRadPerS(Units.hzToRadPerS(fromHz), Units.hzToRadPerS(toHz), n);
    }

    /** The top of {@link #logSpacedRadPerSBelowNyquist}, as a fraction of the Nyquist frequency. */
    public static final double BELOW_NYQUIST = 0.999;

    /**
     * A grid for a sampled loop: {@code n} log-spaced points from {@code loHz} up to just below the Nyquist frequency
     * 1/(2T), at {@value #BELOW_NYQUIST} of it, <b>returned in rad/s</b>. Stopping short of Nyquist matters: a Tustin
     * low-pass (or any filter with zeros at z = -1) is exactly zero there, and a measured-loop analysis refuses a
     * curve with an exactly zero point; at 0.999 of Nyquist a double zero at z = -1 still leaves
     * |1 + e<sup>jωT</sup>|² = 4cos²(0.999π/2) ≈ 1e-5 of the curve (-100 dB), finite and non-zero.
     */
    public static double[] logSpacedRadPerSBelowNyquist(double loHz, double sampleTimeS, int n) {
        if (!(sampleTimeS > 0) || Double.isInfinite(sampleTimeS)) {
            throw new IllegalArgumentException("sample time must be a finite positive number of seconds, got " + sampleTimeS);
        }
        double top = BELOW_NYQUIST * 0.5 / sampleTimeS;
        if (!(loHz < top)) {
            throw new IllegalArgumentException("the grid's low end " + loHz + " Hz must lie below " + Units.formatHz(top)
                    + " (just below the Nyquist frequency " + Units.formatHz(0.5 / sampleTimeS) + ")");
        }
        return logSpacedRadPerS(loHz, top, n);
    }

    /**
     * {@code n} points from {@code loHz} to {@code hiHz} inclusive, equally spaced in log f, <b>returned
     * in Hz</b> (the same grid as {@link #logSpacedRadPerS}, divided by 2π; end points exact).
     */
    public static double[] logSpacedHz(double loHz, double hiHz, int n) {
        if (!(loHz > 0) || !(hiHz > loHz) || Double.isInfinite(hiHz)) {
            throw new IllegalArgumentException("a log grid needs 0 < low < high < inf, got " + loHz + " .. " + hiHz + " Hz");
        }
        if (n < 2) throw new IllegalArgumentException("a log grid needs at least 2 points, got " + n);
        double a = Math.log10(loHz), b = Math.log10(hiHz);
        double[] f = new double[n];
        for (int i = 0; i < n; i++) f[i] = Math.pow(10, a + (b - a) * i / (n - 1));
        f[0] = loHz;
        f[n - 1] = hiHz;
        return f;
    }
}
