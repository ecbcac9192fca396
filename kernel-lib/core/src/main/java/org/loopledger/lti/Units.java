package org.loopledger.lti;

/**
 * The one place that converts between the units used inside the library (rad/s, s, rad, ratio)
 * and the units shown at the edges (Hz, degrees, dB).
 */
public final class Units {
    private Units() {}

    public static double hzToRadPerS(double hz) { return 2.0 * Math.PI * hz; }

    public static double radPerSToHz(double radPerS) { return radPerS / (2.0 * Math.PI); }

    public static double radToDeg(double rad) { return Math.toDegrees(rad); }

    public static double degToRad(double deg) { return Math.toRadians(deg); }

    /** 20·log10 of a magnitude ratio. */
    public static double ratioToDb(double ratio) { return 20.0 * Math.log10(ratio); }

    /** Inverse of {@link #ratioToDb}. */
    public static double dbToRatio(double db) { return Math.pow(10.0, db / 20.0); }

    /** Formats a frequency in Hz with a sensible number of digits and a unit, for display. */
    public static String formatHz(double hz) {
        if (Double.isNaN(hz)) return "n/a";
        if (Double.isInfinite(hz)) return hz > 0 ? "inf Hz" : "-inf Hz";
        double a = Math.abs(hz);
        if (a >= 1e3) return g4(hz / 1e3) + " kHz";
        return g4(hz) + " Hz";
    }

    /**
     * An angular frequency in rad/s shown in Hz (or kHz), as {@link #formatHz}: {@code formatRadPerSAsHz(2π·50)}
     * is "50 Hz". The one formatter for rad/s values in messages and {@code toString} of every domain package.
     */
    public static String formatRadPerSAsHz(double omegaRadPerS) { return formatHz(radPerSToHz(omegaRadPerS)); }

    /** An angle in degrees rounded to 2 decimals, then 4 significant digits: "53.41 deg" (never "-0 deg"). */
    public static String formatDeg(double deg) { return g4(roundDecimals(deg, 2)) + " deg"; }

    /** A level in dB rounded to 2 decimals, then 4 significant digits: "15.56 dB" (never "-0 dB"). */
    public static String formatDb(double db) { return g4(roundDecimals(db, 2)) + " dB"; }

    /** A duration with a prefix: "0 s", "12.5 us" below 1 ms, "759.6 ms" below 1 s, "2 s". */
    public static String formatSeconds(double s) {
        double a = Math.abs(s);
        if (a == 0) return "0 s";
        if (a < 1e-3) return g4(s * 1e6) + " us";
        if (a < 1) return g4(s * 1e3) + " ms";
        return g4(s) + " s";
    }

    /** {@code s} padded with spaces on the right to {@code width} characters (fixed-width plain-text tables). */
    public static String padRight(String s, int width) {
        StringBuilder b = new StringBuilder(s);
        while (b.length() < width) b.append(' ');
        return b.toString();
    }

    private static double roundDecimals(double v, int decimals) {
        double f = Math.pow(10, decimals);
        double r = Math.round(v * f) / f;
        return r == 0 ? 0 : r; // no "-0"
    }

    /** A value with 6 significant digits as a drive's parameter list shows it ({@code %.6g}, locale independent: "9.69600"). */
    public static String digits6(double v) { return String.format(java.util.Locale.ROOT, "%.6g", v); }

    /** A filter coefficient as a drive's table needs it: sign and 15 significant digits ({@code %+.15e}, locale independent). */
    public static String digits15(double v) { return String.format(java.util.Locale.ROOT, "%+.15e", v); }

    /** Formats a plain number with 4 significant digits, locale independent, trailing zeros dropped. */
    public static String g4(double v) {
        if (Double.isNaN(v)) return "NaN";
        if (Double.isInfinite(v)) return v > 0 ? "inf" : "-inf";
        if (v == 0) return "0";
        double a = Math.abs(v);
        String s;
        if (a >= 1e-4 && a < 1e6) {
            s = new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
        } else {
            s = String.format(java.util.Locale.ROOT, "%.3e", v).replaceAll("\\.?0+e", "e");
        }
        return s;
    }
}
