package org.loopledger.frf;

/** Phase unwrapping: removes 2π jumps so consecutive samples differ by less than π. */
public final class Phase {
    private Phase() {}

    /** Unwrapped copy of {@code phaseRad} (not modified), anchored at its first value (as numpy.unwrap). */
    public static double[] unwrapRad(double[] phaseRad) {
        double[] out = phaseRad.clone();
        double offset = 0;
        for (int i = 1; i < out.length; i++) {
            double d = phaseRad[i] - phaseRad[i - 1];
            offset -= 2 * Math.PI * Math.round(d / (2 * Math.PI));
            out[i] = phaseRad[i] + offset;
        }
        return out;
    }

    /** Wrapped phase atan2(im, re) per point. */
    public static double[] angleRad(double[] re, double[] im) {
        double[] out = new double[re.length];
        for (int i = 0; i < out.length; i++) out[i] = Math.atan2(im[i], re[i]);
        return out;
    }
}
