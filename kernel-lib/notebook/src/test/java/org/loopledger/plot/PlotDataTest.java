package org.loopledger.plot;

import org.junit.jupiter.api.Test;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.awt.image.BufferedImage;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** Checks what the plots draw through the data series they hold, not through pixels. */
class PlotDataTest {

    private static double[] xs(XYSeries s) { return s.getXData(); }

    private static double[] ys(XYSeries s) { return s.getYData(); }

    /** Linear interpolation of the plotted curve at x (log x), to read values back off a chart. */
    private static double readAt(XYSeries s, double x) {
        double[] xd = xs(s), yd = ys(s);
        for (int i = 1; i < xd.length; i++) {
            if (xd[i] >= x) {
                double t = (Math.log(x) - Math.log(xd[i - 1])) / (Math.log(xd[i]) - Math.log(xd[i - 1]));
                return yd[i - 1] + t * (yd[i] - yd[i - 1]);
            }
        }
        throw new AssertionError("x outside the plotted range");
    }

    @Test
    void bodeOfFirstOrderLagShowsMinus3dbAndMinus45degAtItsCorner() {
        // 1/(s+1): |G| = 1/sqrt(2) (-3.01 dB) and phase -45 deg at 1 rad/s = 0.159 Hz (common practice, textbook identity).
        Frf f = Frf.ofModel(TransferFunction.continuous(new double[] {1}, new double[] {1, 1}), FrequencyGrid.logSpacedRadPerS(0.001, 100, 500));
        Figure fig = BodePlot.of("1/(s+1)", f);
        XYChart mag = fig.panels().get(0), ph = fig.panels().get(1);
        XYSeries m = mag.getSeriesMap().get("1/(s+1)");
        XYSeries p = ph.getSeriesMap().get("1/(s+1)");
        double cornerHz = 1 / (2 * Math.PI);
        // Tolerance: decimation keeps the polyline within 0.25 px of the data; one pixel here is about 0.5 dB, so 0.15 dB is generous.
        assertEquals(-10 * Math.log10(2), readAt(m, cornerHz), 0.15);
        assertEquals(-45, readAt(p, cornerHz), 0.5);
        assertTrue(mag.getStyler().isXAxisLogarithmic());
        assertTrue(xs(m).length < f.size(), "smooth curves are decimated");
    }

    @Test
    void decimationKeepsEveryVisibleFeature() {
        // A lightly damped resonance must survive decimation: its peak is kept exactly.
        TransferFunction res = TransferFunction.continuous(new double[] {1e4}, new double[] {1, 2 * 0.01 * 100, 1e4});
        Frf f = Frf.ofModel(res, FrequencyGrid.logRadPerS(1, 1e4, 4000));
        double[] db = f.magnitudeDb();
        double peak = -1e9;
        for (double v : db) peak = Math.max(peak, v);
        XYSeries m = BodePlot.of("res", f).panels().get(0).getSeriesMap().get("res");
        double plottedPeak = -1e9;
        for (double v : ys(m)) plottedPeak = Math.max(plottedPeak, v);
        assertEquals(peak, plottedPeak, 1e-12);
    }

    @Test
    void nicholsZeroDbContourIsTheMinusHalfLine() {
        // |T| = 1 <=> |L| = |1 + L| <=> Re L = -1/2, so |L| = 1/(2|cos phi|) (derivation by hand): at -120 deg, |L| = 1 (0 dB).
        Frf l = Frf.ofModel(TransferFunction.continuous(new double[] {1}, new double[] {1, 1, 0}), FrequencyGrid.logRadPerS(0.01, 100, 200));
        XYChart c = NicholsPlot.of("L", l).panels().get(0);
        XYSeries zero = c.getSeriesMap().get("|T| = 0 dB");
        assertNotNull(zero);
        double best = Double.POSITIVE_INFINITY, at = Double.NaN;
        for (int i = 0; i < xs(zero).length; i++) {
            if (Math.abs(xs(zero)[i] + 120) < best) { best = Math.abs(xs(zero)[i] + 120); at = ys(zero)[i]; }
        }
        assertEquals(0.0, at, 0.1);
    }

    @Test
    void nyquistSensitivityCircleHasRadiusOneOverMs() {
        Frf l = Frf.ofModel(TransferFunction.continuous(new double[] {2}, new double[] {1, 1}), FrequencyGrid.logRadPerS(0.01, 100, 100));
        XYChart c = NyquistPlot.create().add("L", l).sensitivityLimit(2.0).figure().panels().get(0);
        XYSeries circle = c.getSeriesMap().get("Ms limit");
        for (int i = 0; i < xs(circle).length; i++) {
            assertEquals(0.5, Math.hypot(xs(circle)[i] + 1, ys(circle)[i]), 1e-12);
        }
    }

    @Test
    void figuresPaintToNonBlankImages() {
        Frf f = Frf.ofModel(TransferFunction.continuous(new double[] {1}, new double[] {1, 1}), FrequencyGrid.logSpacedRadPerS(0.01, 10, 50));
        BufferedImage img = GangOfFourPlot.of("GoF", f, f, f, f).toImage(1);
        assertEquals(760, img.getWidth());
        int distinct = (int) java.util.stream.IntStream.range(0, img.getWidth()).map(x -> img.getRGB(x, img.getHeight() / 3)).distinct().count();
        assertTrue(distinct > 3, "the image shows more than background");
    }

    @Test
    void badInputIsRefusedWithAClearMessage() {
        var e = assertThrows(IllegalArgumentException.class, () -> BodePlot.create().figure());
        assertTrue(e.getMessage().contains("add("));
        Frf noCoh = Frf.ofModel(TransferFunction.gain(1), FrequencyGrid.logSpacedRadPerS(1, 10, 5));
        var e2 = assertThrows(IllegalArgumentException.class, () -> CoherencePlot.of("x", noCoh));
        assertTrue(e2.getMessage().contains("no coherence"));
        assertThrows(IllegalArgumentException.class, () -> TimePlot.over(new double[] {0, 1}).signal("x", new double[] {1}));
        assertThrows(IllegalArgumentException.class, () -> Figure.grid("x", 0, List.of()));
    }
}
