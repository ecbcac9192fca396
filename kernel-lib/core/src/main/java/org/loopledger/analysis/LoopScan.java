package org.loopledger.analysis;

import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.optim.univariate.UnivariatePointValuePair;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The one code path over a {@link LoopResponse}: scan the grid on primitive arrays for sign changes
 * and extrema, then refine each through the loop's hook: Brent (Commons Math {@code BrentSolver},
 * {@code BrentOptimizer}) in log ω on {@link LoopResponse#valueAt} for models; for data, the closed-form
 * crossing of the log-linear interpolant (the same interpolant {@code valueAt} uses), and Brent on the
 * interpolant for extrema.
 */
final class LoopScan {
    private LoopScan() {}

    /** A crossing: its frequency, the grid bracket it lies in. */
    record Crossing(double omegaRadPerS, int bracket) {}

    /** A located extremum of a closed-loop magnitude squared. */
    record Extremum(double value, double omegaRadPerS, boolean atEdge) {}

    private static final int MAX_EVAL = 200;
    /** |ln|L|| below which a sign change is round-off on a flat |L| = 1, not a crossing. */
    private static final double FLAT = 1e-11;

    /** Bracket index i with ω<sub>i</sub> &le; ω &le; ω<sub>i+1</sub>, clamped to the grid. */
    static int bracketOf(LoopResponse l, double omega) {
        int lo = 0, hi = l.size() - 1;
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (l.omegaRadPerS(mid) <= omega) lo = mid; else hi = mid;
        }
        return lo;
    }

    static double logMag(LoopResponse l, int i) {
        double r = l.re(i), m = l.im(i);
        return 0.5 * Math.log(r * r + m * m);
    }

    /** Every gain crossover found by sign changes of |L|² - 1 on the grid (no logarithms in the scan), refined. */
    static List<Crossing> gainCrossings(LoopResponse l) {
        List<Crossing> out = new ArrayList<>();
        int n = l.size();
        double g0 = magSq(l, 0) - 1;
        if (g0 == 0) out.add(new Crossing(l.omegaRadPerS(0), 0));
        for (int i = 0; i + 1 < n; i++) {
            double g1 = magSq(l, i + 1) - 1;
            if (g1 == 0) {
                out.add(new Crossing(l.omegaRadPerS(i + 1), Math.min(i + 1, n - 2)));
            } else if (g0 != 0 && (g0 < 0) != (g1 < 0)) {
                double h0 = logMag(l, i), h1 = logMag(l, i + 1);
                if (Math.max(Math.abs(h0), Math.abs(h1)) > FLAT) out.add(new Crossing(refine(l, i, h0, h1, true, 0), i));
            }
            g0 = g1;
        }
        return out;
    }

    private static double magSq(LoopResponse l, int i) {
        double r = l.re(i), m = l.im(i);
        return r * r + m * m;
    }

    /**
     * Every crossing of phase = -180° + k·360° on the grid, refined. The scan looks for crossings of the
     * negative real axis on primitive values (no atan2 per point); the level k comes from the canonical
     * phase at the two ends of each bracket.
     */
    static List<Crossing> phaseCrossings(LoopResponse l) {
        List<Crossing> out = new ArrayList<>();
        int n = l.size();
        double twoPi = 2 * Math.PI;
        double r0 = l.re(0), i0 = l.im(0);
        for (int i = 0; i + 1 < n; i++) {
            double r1 = l.re(i + 1), i1 = l.im(i + 1);
            if (MeasuredLoop.negativeAxisCrossing(r0, i0, r1, i1) != 0) {
                double p0 = l.phaseRad(i), p1 = l.phaseRad(i + 1);
                double a = Math.floor((p0 + Math.PI) / twoPi), b = Math.floor((p1 + Math.PI) / twoPi);
                double lo = Math.min(a, b) + 1, hi = Math.max(a, b);
                for (double m = lo; m <= hi; m++) {
                    double target = twoPi * m - Math.PI;
                    out.add(new Crossing(refine(l, i, p0 - target, p1 - target, false, target), i));
                }
            }
            r0 = r1;
            i0 = i1;
        }
        return dedupe(out);
    }

    /** Root of f in [ω<sub>i</sub>, ω<sub>i+1</sub>] with f(ω<sub>i</sub>) = f0, f(ω<sub>i+1</sub>) = f1 of opposite signs. */
    private static double refine(LoopResponse l, int i, double f0, double f1, boolean gain, double target) {
        double x0 = Math.log(l.omegaRadPerS(i)), x1 = Math.log(l.omegaRadPerS(i + 1));
        if (f1 == 0) return l.omegaRadPerS(i + 1);
        if (f0 == 0) return l.omegaRadPerS(i);
        if (!l.isExact()) {
            // the interpolant is linear in log ω for both log|L| and phase: closed form
            double t = f0 / (f0 - f1);
            return Math.exp(x0 + t * (x1 - x0));
        }
        double[] v = new double[3];
        UnivariateFunction f = x -> {
            l.valueAt(Math.exp(x), i, v);
            return gain ? 0.5 * Math.log(v[0] * v[0] + v[1] * v[1]) : v[2] - target;
        };
        try {
            return Math.exp(new BrentSolver(1e-15, 1e-15, 0).solve(MAX_EVAL, f, x0, x1));
        } catch (RuntimeException e) {
            double t = f0 / (f0 - f1);
            return Math.exp(x0 + t * (x1 - x0));
        }
    }

    /** Kind of closed-loop magnitude for the extremum search. */
    enum Closed { SENSITIVITY, COMPLEMENTARY }

    /** |S|² = 1/|1+L|², |T|² = |L|²/|1+L|² at a point. */
    static double closedSq(Closed kind, double re, double im) {
        double d = (1 + re) * (1 + re) + im * im;
        return kind == Closed.SENSITIVITY ? 1 / d : (re * re + im * im) / d;
    }

    /** Global maximum of |S|² or |T|² over the band, refined around the best grid point. */
    static Extremum peak(LoopResponse l, Closed kind) {
        int n = l.size(), bi = 0;
        double bestV = -1;
        for (int i = 0; i < n; i++) {
            double v = closedSq(kind, l.re(i), l.im(i));
            if (v > bestV || Double.isInfinite(v)) { bestV = v; bi = i; if (Double.isInfinite(v)) break; }
        }
        final int best = bi;
        if (Double.isInfinite(bestV)) return new Extremum(bestV, l.omegaRadPerS(best), best == 0 || best == n - 1);
        int a = Math.max(0, best - 1), b = Math.min(n - 1, best + 1);
        double[] v = new double[3];
        double wb = l.omegaRadPerS(best);
        UnivariateFunction f = x -> {
            double w = Math.exp(x);
            l.valueAt(w, w < wb ? Math.max(0, best - 1) : Math.min(best, n - 2), v);
            return closedSq(kind, v[0], v[1]);
        };
        double value = bestV, omega = wb;
        if (!l.isExact()) {
            // data: the vertex of the parabola through the three points around the best one (in ln ω), on the interpolant
            if (best > 0 && best < n - 1) {
                double x0 = Math.log(l.omegaRadPerS(best - 1)), x1 = Math.log(wb), x2 = Math.log(l.omegaRadPerS(best + 1));
                double f0 = closedSq(kind, l.re(best - 1), l.im(best - 1)), f2 = closedSq(kind, l.re(best + 1), l.im(best + 1));
                double num = (x1 - x0) * (x1 - x0) * (bestV - f2) - (x1 - x2) * (x1 - x2) * (bestV - f0);
                double den = (x1 - x0) * (bestV - f2) - (x1 - x2) * (bestV - f0);
                if (den != 0) {
                    double x = Math.max(x0, Math.min(x2, x1 - 0.5 * num / den));
                    double w = Math.exp(x);
                    l.valueAt(w, w < wb ? best - 1 : best, v);
                    double fv = closedSq(kind, v[0], v[1]);
                    if (fv > value) { value = fv; omega = w; }
                }
            }
            return new Extremum(value, omega, best == 0 || best == n - 1);
        }
        try {
            UnivariatePointValuePair p = new BrentOptimizer(1e-12, 1e-14).optimize(new MaxEval(MAX_EVAL), new UnivariateObjectiveFunction(f),
                    GoalType.MAXIMIZE, new SearchInterval(Math.log(l.omegaRadPerS(a)), Math.log(l.omegaRadPerS(b)), Math.log(wb)));
            if (p.getValue() > value) { value = p.getValue(); omega = Math.exp(p.getPoint()); }
        } catch (RuntimeException e) {
            // keep the grid value
        }
        boolean edge = best == 0 || best == n - 1;
        return new Extremum(value, omega, edge);
    }

    /**
     * First frequency where |T| falls below {@code threshold}, refined; -1 when |T| is already below it at
     * the first grid point, NaN when it never falls below in the band.
     */
    static double firstBelow(LoopResponse l, double threshold) {
        int n = l.size();
        double thrSq = threshold * threshold;
        if (closedSq(Closed.COMPLEMENTARY, l.re(0), l.im(0)) < thrSq) return -1;
        for (int i = 1; i < n; i++) {
            if (closedSq(Closed.COMPLEMENTARY, l.re(i), l.im(i)) < thrSq) {
                int k = i - 1;
                double[] v = new double[3];
                UnivariateFunction f = x -> {
                    l.valueAt(Math.exp(x), k, v);
                    return 0.5 * Math.log(closedSq(Closed.COMPLEMENTARY, v[0], v[1]) / thrSq);
                };
                double x0 = Math.log(l.omegaRadPerS(k)), x1 = Math.log(l.omegaRadPerS(i));
                if (!l.isExact()) return illinois(f, x0, x1);
                try {
                    return Math.exp(new BrentSolver(1e-15, 1e-15, 0).solve(MAX_EVAL, f, x0, x1));
                } catch (RuntimeException e) {
                    return l.omegaRadPerS(i);
                }
            }
        }
        return Double.NaN;
    }

    /** Regula falsi with the Illinois modification, a few steps: cheap root of a smooth interpolant in ln ω. */
    private static double illinois(UnivariateFunction f, double a, double b) {
        double fa = f.value(a), fb = f.value(b);
        if (fa == 0) return Math.exp(a);
        if (fb == 0 || (fa > 0) == (fb > 0)) return Math.exp(b);
        int side = 0;
        for (int it = 0; it < 12 && Math.abs(b - a) > 1e-13; it++) {
            double c = (a * fb - b * fa) / (fb - fa);
            double fc = f.value(c);
            if (fc == 0) return Math.exp(c);
            if ((fc > 0) == (fb > 0)) {
                b = c; fb = fc;
                if (side == -1) fa /= 2;
                side = -1;
            } else {
                a = c; fa = fc;
                if (side == 1) fb /= 2;
                side = 1;
            }
            if (Math.abs(fc) < 1e-14) return Math.exp(c);
        }
        return Math.exp((a * fb - b * fa) / (fb - fa));
    }

    /** Sorted union of {@code exact} and {@code scanned}, dropping scanned crossings within 1e-7 relative of an exact one. */
    static List<Crossing> merge(LoopResponse l, double[] exact, List<Crossing> scanned) {
        List<Crossing> out = new ArrayList<>();
        double lo = l.lowRadPerS(), hi = l.highRadPerS();
        for (double w : exact) if (w >= lo && w <= hi) out.add(new Crossing(w, bracketOf(l, w)));
        for (Crossing c : scanned) {
            boolean dup = false;
            for (double w : exact) if (Math.abs(w - c.omegaRadPerS()) <= 1e-7 * w) dup = true;
            if (!dup) out.add(c);
        }
        out.sort((p, q) -> Double.compare(p.omegaRadPerS(), q.omegaRadPerS()));
        return dedupe(out);
    }

    static List<Crossing> dedupe(List<Crossing> in) {
        List<Crossing> out = new ArrayList<>();
        for (Crossing c : in) {
            if (!out.isEmpty() && Math.abs(c.omegaRadPerS() - out.get(out.size() - 1).omegaRadPerS()) <= 1e-9 * c.omegaRadPerS()) continue;
            out.add(c);
        }
        return out;
    }

    static double[] sorted(double[] a) { double[] b = a.clone(); Arrays.sort(b); return b; }
}
