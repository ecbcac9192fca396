package org.loopledger.analysis;

import org.loopledger.lti.Units;

/** Display helpers for analysis results (units on every figure). */
final class Fmt {
    private Fmt() {}

    static String hz(double omegaRadPerS) { return Units.formatHz(Units.radPerSToHz(omegaRadPerS)); }

    static String deg(double deg) { return Units.g4(round(deg, 2)) + " deg"; }

    static String db(double db) { return Units.g4(round(db, 2)) + " dB"; }

    static String num(double v) { return Units.g4(v); }

    /** Seconds with a prefix (s, ms, us). */
    static String seconds(double s) {
        double a = Math.abs(s);
        if (a == 0) return "0 s";
        if (a < 1e-3) return Units.g4(s * 1e6) + " us";
        if (a < 1) return Units.g4(s * 1e3) + " ms";
        return Units.g4(s) + " s";
    }

    private static double round(double v, int decimals) {
        double f = Math.pow(10, decimals);
        double r = Math.round(v * f) / f;
        return r == 0 ? 0 : r; // no "-0"
    }

    static String pad(String s, int width) {
        StringBuilder b = new StringBuilder(s);
        while (b.length() < width) b.append(' ');
        return b.toString();
    }
}
