package org.loopledger.tune;

/**
 * Screens a loop gain given on a grid as split arrays, in one pass and without allocation: the tuner's
 * hot loop. No arc tangent per point: the phase branch is tracked by counting crossings of the negative
 * real axis (where atan2 jumps by 2π), starting from the unwrapped phase at the lowest frequency,
 * which the caller knows analytically.
 * <ul>
 *   <li>gain crossovers where |L| crosses 1 (interpolated in log|L|); phase margin = unwrapped phase
 *       + 180° (the canonical definition, negative when the crossover lies beyond -180°);</li>
 *   <li>phase crossovers where Im L changes sign with Re L &lt; 0; |L| there gives the upper
 *       (|L| &lt; 1) or lower (|L| &gt; 1) gain margin;</li>
 *   <li>Ms = 1/min|1 + L| over the grid;</li>
 *   <li>stability, when asked, by the crossing rule for loops whose open-loop poles are stable or on
 *       the axis (Åström and Murray, Feedback Systems, 2nd ed., §10.2, simplified Nyquist criterion,
 *       from memory): passes of the negative real axis left of -1 must cancel, the loop must not start
 *       beyond -180° with |L| &gt; 1, and every gain crossover needs a positive phase margin.</li>
 * </ul>
 * The figures are linear interpolations between grid points; the tuner's final answer is re-analysed
 * independently by {@code analysis.Margins}.
 */
final class LoopScreen {
    private static final double TWO_PI = 2 * Math.PI;

    private LoopScreen() {}

    /**
     * @param re             Re L, first n entries used (not modified)
     * @param im             Im L (not modified)
     * @param phase0Rad      the unwrapped phase of L at omega[0]
     * @param countStability whether to apply the crossing rule (false for a loop whose stability follows from others)
     */
    static LoopFigures screen(double[] omega, double[] re, double[] im, int n, double phase0Rad, boolean countStability) {
        double crossover = Double.NaN, pmMin = Double.POSITIVE_INFINITY;
        double gmUpper = Double.POSITIVE_INFINITY, gmLower = Double.NEGATIVE_INFINITY;
        double minDist2 = (1 + re[0]) * (1 + re[0]) + im[0] * im[0];
        double turns = Math.rint((phase0Rad - Math.atan2(im[0], re[0])) / TWO_PI);
        int net = 0;
        double pr = re[0], pi = im[0], pm2 = pr * pr + pi * pi;
        boolean stable = !(pm2 > 1 && phase0Rad <= -Math.PI);
        for (int i = 1; i < n; i++) {
            double r = re[i], m = im[i];
            double m2 = r * r + m * m;
            double d2 = (1 + r) * (1 + r) + m * m;
            if (d2 < minDist2) minDist2 = d2;
            // crossing of the negative real axis in this interval, at fraction ta (or none)
            double ta = 2, dTurns = 0;
            if ((pi < 0) != (m < 0)) {
                double t = pi / (pi - m);
                double cr = pr + t * (r - pr);
                if (cr < 0) {
                    ta = t;
                    dTurns = pi < 0 ? -1 : 1; // -π → +π: the phase went down through -180° (mod 360°)
                    double mag = -cr, gmDb = -20 * Math.log10(mag);
                    if (mag < 1) {
                        if (gmDb < gmUpper) gmUpper = gmDb;
                    } else {
                        if (gmDb > gmLower) gmLower = gmDb;
                        net += pi < 0 ? 1 : -1;
                    }
                }
            }
            if ((pm2 - 1) * (m2 - 1) <= 0 && pm2 != m2) {
                double a = Math.log(pm2), b = Math.log(m2);
                double t = a / (a - b);
                double cr = pr + t * (r - pr), ci = pi + t * (m - pi);
                double k = t > ta ? turns + dTurns : turns;
                double pmDeg = Math.toDegrees(Math.atan2(ci, cr) + TWO_PI * k + Math.PI);
                if (Double.isNaN(crossover)) crossover = omega[i - 1] * Math.pow(omega[i] / omega[i - 1], t);
                if (pmDeg < pmMin) pmMin = pmDeg;
            }
            turns += dTurns;
            pr = r;
            pi = m;
            pm2 = m2;
        }
        boolean ok = !countStability || (stable && net == 0 && !(pmMin <= 0));
        return new LoopFigures(crossover, pmMin, gmUpper, gmLower, 1 / Math.sqrt(minDist2), ok);
    }
}
