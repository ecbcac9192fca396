package org.loopledger.plot;

import org.loopledger.frf.Frf;
import org.loopledger.frf.Phase;

/**
 * Phase branch for display. {@link #forDisplayDeg} shifts an unwrapped phase by whole turns so the first point
 * lies in (-270°, 90°]. {@link #alongTrendDeg} unwraps noisy measured data along its trend, so that noise never
 * makes the curve step by whole turns and wander off (plain unwrapping reads a noise step of more than 180° as a
 * turn and keeps it for every later point).
 */
final class PlotPhase {
    /** Said under a figure whose phase was unwrapped along its trend. */
    static final String TREND_NOTE = "Phase unwrapped along its trend: noisy points (coherence < 0.5) sit on the branch nearest it.";
    /** Coherence below this marks a point as unreliable (common practice: 0.5 is a usual floor for a usable FRF point). */
    static final double COHERENCE_FLOOR = 0.5;
    /** Half-width in points of the circular mean that gives the trend. */
    private static final int HALF = 3;
    /** Mean resultant length of the unit phasors in the window above which the local phase counts as consistent. */
    private static final double CONSISTENT = 0.8;

    private PlotPhase() {}

    /** A display phase (degrees) and whether it differs from plain unwrapping by at least one turn somewhere. */
    record Branch(double[] phaseDeg, boolean differsFromPlainUnwrap) {}

    static double[] forDisplayDeg(double[] unwrappedDeg) {
        double[] p = unwrappedDeg.clone();
        if (p.length == 0) return p;
        double shift = 0;
        while (p[0] + shift > 90) shift -= 360;
        while (p[0] + shift <= -270) shift += 360;
        for (int i = 0; i < p.length; i++) p[i] += shift;
        return p;
    }

    /**
     * The phase of {@code frf} on the branch that follows its trend. A point is reliable when its coherence (if the FRF
     * has one) is at least {@value #COHERENCE_FLOOR} and the unit phasors of its neighbourhood (±{@value #HALF} points,
     * weighted by coherence) agree (mean resultant length at least {@value #CONSISTENT}; a circular mean, Mardia and
     * Jupp, Directional Statistics, 2000, §2.2, from memory). Reliable points, and short unreliable runs (up to the
     * window's width, e.g. the steep phase drop at a light resonance), are unwrapped point to point as usual; a longer
     * unreliable run (noise) takes, point by point, the branch nearest the phase where the run began, so it scatters
     * around the trend instead of walking away. The result is then shifted as {@link #forDisplayDeg}.
     *
     * <p>An FRF computed from a model ({@link Frf#isComputedFromModel()}) has no noise: its phase is unwrapped point
     * to point as it is (the trend rule would read a delay's fast phase roll as noise and draw a saw-tooth), and it never
     * asks for the coherence note.
     */
    static Branch alongTrendDeg(Frf frf) {
        if (frf.isComputedFromModel()) return new Branch(forDisplayDeg(frf.phaseDegUnwrapped()), false);
        double[] re = frf.real(), im = frf.imag();
        int n = re.length;
        double[] wrapped = Phase.angleRad(re, im);
        double[] plain = Phase.unwrapRad(wrapped);
        double[] coh = frf.coherence().orElse(null);
        boolean[] reliable = new boolean[n];
        double[] c = new double[n], s = new double[n], w = new double[n];
        for (int i = 0; i < n; i++) {
            w[i] = coh == null ? 1 : Math.max(0, Math.min(1, coh[i]));
            c[i] = w[i] * Math.cos(wrapped[i]);
            s[i] = w[i] * Math.sin(wrapped[i]);
        }
        for (int i = 0; i < n; i++) {
            double sc = 0, ss = 0, sw = 0;
            for (int j = Math.max(0, i - HALF); j <= Math.min(n - 1, i + HALF); j++) { sc += c[j]; ss += s[j]; sw += w[j]; }
            boolean coherent = coh == null || coh[i] >= COHERENCE_FLOOR;
            reliable[i] = coherent && sw > 0 && Math.hypot(sc, ss) / sw >= CONSISTENT;
        }
        double[] out = new double[n];
        int i = 0;
        double prev = Double.NaN;
        while (i < n) {
            if (reliable[i]) {
                out[i] = Double.isNaN(prev) ? wrapped[i] : nearest(wrapped[i], prev);
                prev = out[i];
                i++;
                continue;
            }
            int end = i;
            while (end < n && !reliable[end]) end++;
            boolean shortRun = end - i <= 2 * HALF + 1;
            double anchor = prev;
            for (int k = i; k < end; k++) {
                double ref = Double.isNaN(prev) ? wrapped[k] : shortRun ? prev : anchor;
                out[k] = nearest(wrapped[k], ref);
                if (shortRun || Double.isNaN(prev)) prev = out[k];
                if (Double.isNaN(anchor)) anchor = out[k];
            }
            i = end;
        }
        boolean differs = false;
        double offset = n == 0 ? 0 : out[0] - plain[0];
        for (int k = 0; k < n; k++) {
            out[k] = Math.toDegrees(out[k]);
            if (Math.abs(Math.toRadians(out[k]) - plain[k] - offset) > Math.PI) differs = true;
        }
        return new Branch(forDisplayDeg(out), differs);
    }

    /** {@code phase} plus the whole number of turns that brings it nearest {@code ref} (radians). */
    private static double nearest(double phase, double ref) {
        return phase + 2 * Math.PI * Math.rint((ref - phase) / (2 * Math.PI));
    }
}
