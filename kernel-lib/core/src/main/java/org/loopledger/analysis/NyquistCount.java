package org.loopledger.analysis;

import org.loopledger.lti.Units;
import java.util.ArrayList;
import java.util.List;

/**
 * The Nyquist criterion on a grid: Z = P + N, with N the clockwise encirclements of -1 by L along the
 * Nyquist contour (up the imaginary axis, or anticlockwise round the unit circle, indented round the
 * integrators so that they count as stable poles, and closed at infinity or at z = -1).
 *
 * <p>By conjugate symmetry the contour's change of arg(1 + L) is twice that over 0 &lt; ω &lt; ∞ (or up to
 * π/T), minus nπ for the indentation round n integrators (L ≈ K/s<sup>n</sup> turns clockwise by n half
 * turns there). The end values are fixed on the branch they must have: at ω → 0 the asymptote
 * arg K - n·90°, at the top 1 + L(∞) (real) or 1 + L(e<sup>jπ</sup>) (real at Nyquist). So
 * N = (nπ - 2(θ<sub>end</sub> - θ<sub>0</sub>))/(2π). Reference: Åström and Murray, Feedback Systems,
 * 2nd ed., §10.2 (Nyquist criterion, Theorem 10.3 for the general case), and Franklin, Powell and
 * Emami-Naeini, Feedback Control of Dynamic Systems, §6.3 (Z = N + P).
 */
final class NyquistCount {
    private NyquistCount() {}

    /** Result: clockwise encirclements, the raw (unrounded) value, and notes on its reliability. */
    record Count(int clockwise, double raw, List<LoopWarning> notes) {}

    /**
     * @param l            the loop response on its grid
     * @param highEndArg   at the top: 0 when 1 + L(∞) &gt; 0 is assumed, π when 1 + L(∞) &lt; 0, NaN when the
     *                     top point is the Nyquist point of a sampled loop (any multiple of π)
     */
    static Count count(LoopResponse l, double highEndArg) {
        List<LoopWarning> notes = new ArrayList<>();
        int n = l.size();
        double[] v = new double[3];
        double prev = Math.atan2(l.im(0), 1 + l.re(0));
        double theta0raw = prev;
        double theta = prev;
        boolean coarse = false;
        for (int i = 1; i < n; i++) {
            double a = Math.atan2(l.im(i), 1 + l.re(i));
            double d = ModelLoop.principal(a - prev);
            if (Math.abs(d) > Math.PI / 4 && l.isExact()) {
                // refine this interval on the exact model: arg(1 + L) can turn fast where L passes close to -1
                d = 0;
                double p = prev;
                int sub = 64;
                double x0 = Math.log(l.omegaRadPerS(i - 1)), x1 = Math.log(l.omegaRadPerS(i));
                for (int k = 1; k <= sub; k++) {
                    l.valueAt(Math.exp(x0 + (x1 - x0) * k / sub), i - 1, v);
                    double q = Math.atan2(v[1], 1 + v[0]);
                    double dd = ModelLoop.principal(q - p);
                    if (Math.abs(dd) > 0.9 * Math.PI) coarse = true;
                    d += dd;
                    p = q;
                }
            } else if (Math.abs(d) > 0.9 * Math.PI) {
                coarse = true;
            }
            theta += d;
            prev = a;
        }
        int integrators = l.netIntegrators();
        // low end: arg(1 + L(0+)) is arg K - n·90° (n ≥ 1), a multiple of π (n = 0), or 0 (n < 0)
        double theta0;
        if (integrators >= 0) {
            double base = -integrators * Math.PI / 2;
            theta0 = base + Math.PI * Math.round((theta0raw - base) / Math.PI);
        } else {
            theta0 = 2 * Math.PI * Math.round(theta0raw / (2 * Math.PI));
        }
        if (Math.abs(theta0 - theta0raw) > Math.PI / 4) {
            notes.add(LoopWarning.atRadPerS(LoopWarning.Kind.NYQUIST_END_UNCERTAIN, l.omegaRadPerS(0), "at the lowest frequency L is far from its low-frequency asymptote (arg(1+L) off by "
                    + Units.formatDeg(Math.toDegrees(theta0raw - theta0)) + "): the count assumes nothing happens below the band"));
        }
        double thetaEnd;
        if (Double.isNaN(highEndArg)) thetaEnd = Math.PI * Math.round(theta / Math.PI);
        else thetaEnd = highEndArg + 2 * Math.PI * Math.round((theta - highEndArg) / (2 * Math.PI));
        if (Math.abs(thetaEnd - theta) > Math.PI / 4) {
            notes.add(LoopWarning.atRadPerS(LoopWarning.Kind.NYQUIST_END_UNCERTAIN, l.omegaRadPerS(n - 1), "at the highest frequency 1 + L is far from its limit (arg off by "
                    + Units.formatDeg(Math.toDegrees(theta - thetaEnd)) + "): the count assumes |L| stays below 1 above the band"));
        }
        double total = 2 * (thetaEnd - theta0) - Math.max(0, integrators) * Math.PI;
        double raw = -total / (2 * Math.PI);
        long r = Math.round(raw);
        if (Math.abs(raw - r) > 1e-6) {
            notes.add(LoopWarning.of(LoopWarning.Kind.NYQUIST_GRID_TOO_COARSE, "winding number " + Units.g4(raw) + " is not an integer: the grid is too coarse or the band incomplete"));
        }
        if (coarse) notes.add(LoopWarning.of(LoopWarning.Kind.NYQUIST_GRID_TOO_COARSE, "L passes -1 closer than the grid resolves: the encirclement count may be off"));
        return new Count((int) r, raw, notes);
    }
}
