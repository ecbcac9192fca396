package org.loopledger.frf;

/** Phase unwrapping: removes 2π jumps so consecutive samples differ by at most π. */
public final class Phase {
    private Phase() {}

    /**
     * Unwrapped copy of {@code phaseRad} (not modified), anchored at its first value, with the rule of
     * {@code numpy.unwrap} (default discontinuity π): a step d with |d| &lt; π is kept; otherwise it is
     * replaced by d - 2πk in [-π, π), except that a positive step of exactly an odd multiple of π stays +π.
     *
     * @throws IllegalArgumentException for a NaN or infinite phase (no silent NaN downstream)
     */
    public static double[] unwrapRad(double[] phaseRad) {
        double[] out = phaseRad.clone();
        for (int i = 0; i < out.length; i++) {
            if (!Double.isFinite(phaseRad[i])) {
                throw new IllegalArgumentException("phase at index " + i + " is " + phaseRad[i] + "; unwrapping needs finite values (drop that point)");
            }
        }
        final double twoPi = 2 * Math.PI;
        double offset = 0;
        for (int i = 1; i < out.length; i++) {
            double d = phaseRad[i] - phaseRad[i - 1];
            if (Math.abs(d) >= Math.PI) {
                double dm = ((d + Math.PI) % twoPi + twoPi) % twoPi - Math.PI; // floor-mod into [-π, π)
                if (dm == -Math.PI && d > 0) dm = Math.PI;
                offset += dm - d;
            }
            out[i] = phaseRad[i] + offset;
        }
        return out;
    }

    /** Wrapped phase atan2(im, re) per point, in (-π, π]. */
    public static double[] angleRad(double[] re, double[] im) {
        if (re.length != im.length) {
            throw new IllegalArgumentException("real and imaginary parts have different lengths (" + re.length + " and " + im.length + ")");
        }
        double[] out = new double[re.length];
        for (int i = 0; i < out.length; i++) out[i] = Math.atan2(im[i], re[i]);
        return out;
    }
}
