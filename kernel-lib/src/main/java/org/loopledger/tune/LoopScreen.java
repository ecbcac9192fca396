package org.loopledger.tune;

/**
 * Screens a loop gain given on a grid as split arrays, in one pass and without allocation: the tuner's
 * hot loop. Everything is read off the complex values, no phase unwrapping:
 * <ul>
 *   <li>gain crossovers where |L| crosses 1 (interpolated in log|L| over log ω), phase margin
 *       arg(L) + 180° wrapped to (-180°, 180°], which does not depend on the phase branch;</li>
 *   <li>phase crossovers where Im L changes sign with Re L &lt; 0; |L| interpolated there gives the
 *       upper (|L| &lt; 1) or lower (|L| &gt; 1) gain margin;</li>
 *   <li>Ms = 1/min|1 + L| over the grid;</li>
 *   <li>stability by the crossing rule for loops whose open-loop poles are stable or on the axis
 *       (Åström and Murray, Feedback Systems, 2nd ed., §10.2, simplified Nyquist criterion, from memory):
 *       crossings of the negative real axis left of -1 must cancel (Im L going from negative to positive
 *       there is a clockwise pass, the reverse a counter-clockwise one), and the loop must not start
 *       beyond -180° with |L| &gt; 1 at the lowest frequency.</li>
 * </ul>
 * The figures are linear interpolations between grid points; the tuner's final answer is re-analysed
 * independently by {@code analysis.Margins}.
 */
final class LoopScreen {
    private LoopScreen() {}

    /**
     * @param re                  Re L, first n entries used (not modified)
     * @param im                  Im L (not modified)
     * @param lowFrequencyPhaseRad the unwrapped phase of L at omega[0], or NaN to skip the stability count
     */
    static LoopFigures screen(double[] omega, double[] re, double[] im, int n, double lowFrequencyPhaseRad) {
        double crossover = Double.NaN, pmMin = Double.POSITIVE_INFINITY;
        double gmUpper = Double.POSITIVE_INFINITY, gmLower = Double.NEGATIVE_INFINITY;
        double minDist2 = Double.POSITIVE_INFINITY;
        int net = 0;
        double pr = re[0], pi = im[0], pm2 = pr * pr + pi * pi;
        boolean stable = !(pm2 > 1 && lowFrequencyPhaseRad <= -Math.PI);
        for (int i = 0; i < n; i++) {
            double r = re[i], m = im[i];
            double m2 = r * r + m * m;
            double d2 = (1 + r) * (1 + r) + m * m;
            if (d2 < minDist2) minDist2 = d2;
            if (i == 0) continue;
            if ((pm2 - 1) * (m2 - 1) <= 0 && pm2 != m2) {
                double a = Math.log(pm2), b = Math.log(m2);
                double t = a / (a - b);
                double cr = pr + t * (r - pr), ci = pi + t * (m - pi);
                double pmDeg = Math.toDegrees(Math.atan2(-ci, -cr));
                if (Double.isNaN(crossover)) crossover = omega[i - 1] * Math.pow(omega[i] / omega[i - 1], t);
                if (pmDeg < pmMin) pmMin = pmDeg;
            }
            if ((pi < 0) != (m < 0) && pi != m) {
                double t = pi / (pi - m);
                double cr = pr + t * (r - pr);
                if (cr < 0) {
                    double mag = -cr;
                    double gmDb = -20 * Math.log10(mag);
                    if (mag < 1) {
                        if (gmDb < gmUpper) gmUpper = gmDb;
                    } else {
                        if (gmDb > gmLower) gmLower = gmDb;
                        net += pi < 0 ? 1 : -1;
                    }
                }
            }
            pr = r;
            pi = m;
            pm2 = m2;
        }
        boolean ok = stable && net == 0 && !(pmMin <= 0);
        return new LoopFigures(crossover, pmMin, gmUpper, gmLower, 1 / Math.sqrt(minDist2), Double.isNaN(lowFrequencyPhaseRad) || ok);
    }
}
