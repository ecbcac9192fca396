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
