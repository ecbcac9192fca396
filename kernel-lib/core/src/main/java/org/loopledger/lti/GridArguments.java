package org.loopledger.lti;

/**
 * The checks every frequency-response evaluation on a grid makes (transfer functions and state-space
 * models alike): output arrays long enough, every frequency finite, and at most the Nyquist frequency
 * on a sampled time base.
 */
final class GridArguments {
    private GridArguments() {}

    /** Throws unless {@code re} and {@code im} hold one entry per frequency. */
    static void requireOutputs(double[] omegaRadPerS, double[] re, double[] im) {
        if (re.length < omegaRadPerS.length || im.length < omegaRadPerS.length) {
            throw new IllegalArgumentException("output arrays (" + re.length + " and " + im.length + " entries) are shorter than the frequency grid ("
                    + omegaRadPerS.length + " points); allocate one entry per frequency");
        }
    }

    /** The sample time in s, or 0 for a continuous time base. */
    static double sampleTimeS(TimeBase timeBase) {
        return timeBase instanceof TimeBase.Sampled sm ? sm.sampleTimeS() : 0;
    }

    /** Throws unless ω (grid index i) is finite and, for sample time {@code ts} &gt; 0, within π/T. */
    static void requireFrequency(double w, int i, double ts) {
        if (!Double.isFinite(w)) throw new IllegalArgumentException("frequency " + w + " at index " + i + " is not finite; give finite rad/s values");
        if (ts > 0) {
            double nyq = Math.PI / ts;
            if (Math.abs(w) > nyq * (1 + 1e-12)) {
                throw new IllegalArgumentException("frequency " + Units.formatHz(Units.radPerSToHz(w)) + " (index " + i + ") lies above the Nyquist frequency "
                        + Units.formatHz(Units.radPerSToHz(nyq)) + " of this sampled system; restrict the grid to [0, π/T]");
            }
        }
    }
}
