package org.loopledger.plot;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Long records are decimated to the pixel: per one-pixel column the lowest and the highest sample survive
 * (min/max aggregation, Jugel et al., PVLDB 7(10), 2014), so each column's vertical extent is drawn as in
 * the full record.
 */
class DecimationTest {
    @Test
    void a40940SampleNoisyLogKeepsAtMostTwoPointsPerColumnAndEveryColumnsExtremes() {
        int n = 40_940, width = 640, height = 220;
        double[] t = new double[n], y = new double[n];
        SplittableRandom r = new SplittableRandom(3);
        for (int i = 0; i < n; i++) { t[i] = i / 16000.0; y[i] = Math.sin(i / 700.0) + 0.5 * (r.nextDouble() - 0.5); }
        double[][] d = Decimation.forPanel(t, y, false, width, height);
        assertTrue(d[0].length <= 2 * (width + 1) + 2, "kept " + d[0].length + " of " + n);
        assertEquals(t[0], d[0][0]);
        assertEquals(t[n - 1], d[0][d[0].length - 1]);
        // The aggregation step keeps exactly each column's lowest and highest sample (the line simplification
        // after it may then drop a point lying within a quarter pixel of the drawn line).
        double span = t[n - 1] - t[0];
        double[] sx = new double[n], sy = new double[n];
        for (int i = 0; i < n; i++) { sx[i] = t[i] / span * width; sy[i] = y[i]; }
        int[] kept = Decimation.perColumn(sx, sy);
        double[] min = new double[width + 1], max = new double[width + 1], kMin = new double[width + 1], kMax = new double[width + 1];
        java.util.Arrays.fill(min, 9); java.util.Arrays.fill(max, -9); java.util.Arrays.fill(kMin, 9); java.util.Arrays.fill(kMax, -9);
        for (int i = 0; i < n; i++) { int c = (int) Math.floor(sx[i]); min[c] = Math.min(min[c], y[i]); max[c] = Math.max(max[c], y[i]); }
        for (int i : kept) { int c = (int) Math.floor(sx[i]); kMin[c] = Math.min(kMin[c], y[i]); kMax[c] = Math.max(kMax[c], y[i]); }
        assertArrayEquals(max, kMax, "each column's maximum is kept");
        assertArrayEquals(min, kMin, "each column's minimum is kept");
        assertTrue(kept.length <= 2 * (width + 1) + 2, "two per column: " + kept.length);
    }

    @Test
    void shortRecordsAreNotAggregated() {
        double[] x = {0, 1, 2, 3, 4}, y = {0, 5, 0, 5, 0};
        double[][] d = Decimation.forPanel(x, y, false, 640, 220);
        assertArrayEquals(x, d[0]);
        assertArrayEquals(y, d[1]);
    }

    @Test
    void aNyquistCurveReachingFarOutIsDrawnToAQuarterPixelInsideItsWindow() {
        // L = 4/(s(s+1)(0.1s+1)): the integrator sends the curve to Im L -> -inf at low frequency, far outside the ±2.5 window.
        org.loopledger.frf.Frf l = org.loopledger.frf.Frf.ofModel(org.loopledger.lti.TransferFunction.continuous(new double[] {4}, new double[] {0.1, 1.1, 1, 0}),
                org.loopledger.frf.FrequencyGrid.logRadPerS(1e-3, 1e3, 2000));
        org.knowm.xchart.XYSeries s = NyquistPlot.of("L", l).panels().get(0).getSeriesMap().get("L");
        double[] px = s.getXData(), py = s.getYData(), re = l.real(), im = l.imag();
        double pixel = 5.0 / 520; // the window is 5 units wide on 520 px
        for (int i = 0; i < re.length; i++) {
            if (Math.abs(re[i] + 0.5) > 2.5 || Math.abs(im[i]) > 2.5) continue;
            double best = Double.POSITIVE_INFINITY;
            for (int k = 1; k < px.length; k++) best = Math.min(best, segmentDistance(re[i], im[i], px[k - 1], py[k - 1], px[k], py[k]));
            assertTrue(best <= 0.26 * pixel, "point " + i + " (" + re[i] + ", " + im[i] + ") is " + best / pixel + " px off the drawn curve");
        }
    }

    private static double segmentDistance(double x, double y, double x0, double y0, double x1, double y1) {
        double dx = x1 - x0, dy = y1 - y0, len2 = dx * dx + dy * dy;
        double t = len2 == 0 ? 0 : Math.max(0, Math.min(1, ((x - x0) * dx + (y - y0) * dy) / len2));
        return Math.hypot(x - (x0 + t * dx), y - (y0 + t * dy));
    }
}
