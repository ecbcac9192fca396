package org.loopledger.plot;

import java.util.ArrayDeque;


/**
 * Drops points of a curve that a reader cannot see. Long records whose x only grows (time logs) first
 * keep, per pixel column, the lowest and the highest point in their order (min/max aggregation, as
 * compared with M4 in Jugel et al., "M4: A Visualization-Oriented Time Series Data Aggregation",
 * PVLDB 7(10), 2014: the column's vertical extent is drawn exactly; only the joins between neighbouring
 * columns may differ by a pixel), plus the record's first and last point. Then iterative end-point-fit polyline simplification in
 * screen coordinates (U. Ramer, "An iterative procedure for the polygonal approximation of plane curves",
 * Computer Graphics and Image Processing 1(3), 1972): keep the point farthest from the chord while it
 * is farther than the tolerance, and recurse on both halves. Keeps plots small where curves are smooth
 * and keeps every point where they are not (resonances).
 */
final class Decimation {
    private Decimation() {}

    /**
     * Indices of the points to keep (ascending, first and last always kept), such that no dropped point
     * lies farther than {@code tolerance} from the simplified polyline, in the units of {@code x}, {@code y}.
     */
    static int[] keep(double[] x, double[] y, double tolerance) {
        int n = x.length;
        if (n <= 2) {
            int[] all = new int[n];
            for (int i = 0; i < n; i++) all[i] = i;
            return all;
        }
        boolean[] kept = new boolean[n];
        kept[0] = kept[n - 1] = true;
        ArrayDeque<int[]> stack = new ArrayDeque<>();
        stack.push(new int[] {0, n - 1});
        while (!stack.isEmpty()) {
            int[] seg = stack.pop();
            int a = seg[0], b = seg[1];
            double dx = x[b] - x[a], dy = y[b] - y[a];
            double len = Math.hypot(dx, dy);
            double worst = -1;
            int idx = -1;
            for (int i = a + 1; i < b; i++) {
                double d = len == 0 ? Math.hypot(x[i] - x[a], y[i] - y[a]) : Math.abs(dy * (x[i] - x[a]) - dx * (y[i] - y[a])) / len;
                if (!Double.isFinite(d)) d = Double.MAX_VALUE;
                if (d > worst) { worst = d; idx = i; }
            }
            if (idx >= 0 && worst > tolerance) {
                kept[idx] = true;
                stack.push(new int[] {a, idx});
                stack.push(new int[] {idx, b});
            }
        }
        int count = 0;
        for (boolean k : kept) if (k) count++;
        int[] r = new int[count];
        for (int i = 0, j = 0; i < n; i++) if (kept[i]) r[j++] = i;
        return r;
    }

    /** The values at the given indices. */
    static double[] pick(double[] v, int[] idx) {
        double[] r = new double[idx.length];
        for (int i = 0; i < idx.length; i++) r[i] = v[idx[i]];
        return r;
    }

    /**
     * Simplifies (x, y) for a panel of the given pixel size and data ranges; log x when {@code logX}.
     * Tolerance 0.25 px: below what anti-aliased rendering shows. Records with more than two points
     * per pixel column and non-decreasing x go through {@link #perColumn} first.
     */
    static double[][] forPanel(double[] x, double[] y, boolean logX, double widthPx, double heightPx) {
        return forPanel(x, y, logX, widthPx, heightPx, range(x, logX), range(y, false));
    }

    /**
     * As {@link #forPanel(double[], double[], boolean, double, double)} for a panel whose axes show
     * {@code xRange} (log10 of it when {@code logX}) and {@code yRange}, not the data's own ranges: a
     * Nyquist curve reaching 1e6 must still be drawn to a quarter pixel inside a window of ±2.5.
     */
    static double[][] forPanel(double[] x, double[] y, boolean logX, double widthPx, double heightPx, double[] xRange, double[] yRange) {
        double[] sx = new double[x.length], sy = new double[y.length];
        double[] xr = xRange, yr = yRange;
        for (int i = 0; i < x.length; i++) {
            double xv = logX ? Math.log10(x[i]) : x[i];
            sx[i] = (xv - xr[0]) / (xr[1] - xr[0]) * widthPx;
            sy[i] = (y[i] - yr[0]) / (yr[1] - yr[0]) * heightPx;
        }
        if (x.length > 2 * widthPx && nonDecreasing(sx)) {
            int[] cols = perColumn(sx, sy);
            int[] idx = keep(pick(sx, cols), pick(sy, cols), 0.25);
            int[] both = new int[idx.length];
            for (int i = 0; i < idx.length; i++) both[i] = cols[idx[i]];
            return new double[][] {pick(x, both), pick(y, both)};
        }
        int[] idx = keep(sx, sy, 0.25);
        return new double[][] {pick(x, idx), pick(y, idx)};
    }

    /**
     * Indices (ascending) of the lowest and highest point of every one-pixel column of screen x
     * {@code sx} (non-decreasing), and of the first and last point; points with non-finite coordinates
     * are kept as they break the line.
     */
    static int[] perColumn(double[] sx, double[] sy) {
        int n = sx.length;
        boolean[] kept = new boolean[n];
        int start = 0;
        while (start < n) {
            if (!Double.isFinite(sx[start]) || !Double.isFinite(sy[start])) { kept[start++] = true; continue; }
            long col = (long) Math.floor(sx[start]);
            int end = start, lo = start, hi = start;
            while (end + 1 < n && Double.isFinite(sx[end + 1]) && Double.isFinite(sy[end + 1]) && (long) Math.floor(sx[end + 1]) == col) {
                end++;
                if (sy[end] < sy[lo]) lo = end;
                if (sy[end] > sy[hi]) hi = end;
            }
            kept[lo] = kept[hi] = true;
            start = end + 1;
        }
        if (n > 0) kept[0] = kept[n - 1] = true;
        int count = 0;
        for (boolean k : kept) if (k) count++;
        int[] r = new int[count];
        for (int i = 0, j = 0; i < n; i++) if (kept[i]) r[j++] = i;
        return r;
    }

    private static boolean nonDecreasing(double[] v) {
        for (int i = 1; i < v.length; i++) if (v[i] < v[i - 1]) return false;
        return true;
    }

    private static double[] range(double[] v, boolean log) {
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (double d : v) {
            double t = log ? Math.log10(d) : d;
            if (Double.isFinite(t)) { lo = Math.min(lo, t); hi = Math.max(hi, t); }
        }
        if (!(hi > lo)) { lo -= 1; hi += 1; }
        return new double[] {lo, hi};
    }

}
