package org.loopledger.frf;

import org.loopledger.lti.Units;

/** Logarithmically spaced frequency grids, returned in rad/s. */
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

    /** {@code n} log-spaced points from {@code loHz} to {@code hiHz}, returned in rad/s. */
    public static double[] logHz(double loHz, double hiHz, int n) {
        return logRadPerS(Units.hzToRadPerS(loHz), Units.hzToRadPerS(hiHz), n);
    }
}
