package org.loopledger.display;

import org.loopledger.lti.Units;

import java.util.OptionalDouble;

/**
 * Numbers for table cells: four significant digits (the library's {@code Units.g4}), no "-0", an
 * en dash for a value that does not exist. The unit sits in the column header, never in the cell.
 */
final class Figures {
    static final String NONE = "–";

    private Figures() {}

    static String num(double v) {
        String s = Units.g4(v);
        return s.equals("-0") ? "0" : s;
    }

    /** Rounded to two decimals first (degrees, dB), then four significant digits. */
    static String fixed2(double v) {
        if (!Double.isFinite(v)) return num(v);
        double r = Math.round(v * 100.0) / 100.0;
        return num(r == 0 ? 0 : r);
    }

    static String hz(double omegaRadPerS) { return num(Units.radPerSToHz(omegaRadPerS)); }

    static String ms(double seconds) { return num(seconds * 1e3); }

    static String opt(OptionalDouble v) { return v.isPresent() ? num(v.getAsDouble()) : NONE; }
}
