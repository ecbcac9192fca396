package org.loopledger.control;

import org.loopledger.lti.Units;

/** Argument checks shared by the control values; every message names the bad value and the fix. */
final class Checks {
    private Checks() {}

    static double positive(double v, String what, String unit) {
        if (!(v > 0) || Double.isInfinite(v)) {
            throw new IllegalArgumentException(what + " must be a finite positive number of " + unit + ", got " + v
                    + (v == 0 ? "; a zero " + what + " disables the term, leave the element out instead" : ""));
        }
        return v;
    }

    static double nonNegative(double v, String what, String unit) {
        if (!(v >= 0) || Double.isInfinite(v)) {
            throw new IllegalArgumentException(what + " must be a finite non-negative number of " + unit + ", got " + v);
        }
        return v;
    }

    static double sampleRateHz(double fs) {
        if (!(fs > 0) || Double.isInfinite(fs)) {
            throw new IllegalArgumentException("sample rate must be a finite positive number of Hz (e.g. 16000), got " + fs);
        }
        return fs;
    }

    /** Throws unless 0 &lt; ω &lt; π·fs. */
    static void belowNyquist(double omegaRadPerS, double sampleRateHz, String what) {
        double nyq = Math.PI * sampleRateHz;
        if (!(omegaRadPerS < nyq)) {
            throw new IllegalArgumentException(what + " at " + Units.formatHz(Units.radPerSToHz(omegaRadPerS))
                    + " is at or above the Nyquist frequency " + Units.formatHz(sampleRateHz / 2)
                    + " of a drive sampling at " + Units.formatHz(sampleRateHz) + "; lower it or raise the sample rate");
        }
    }
}
