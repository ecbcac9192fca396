package org.loopledger.plot;

import org.junit.jupiter.api.Test;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/**
 * What a reader sees, measured on the layout objects ({@link FigureDrawing#layout}) and the plotted series: aligned
 * panels, legends off the data, reference lines only where they mean something, a phase that does not wander on
 * noisy data, titles, legend entries for markers, tick labels and scaled time panels.
 */
class FigureLayoutTest {
    private static final double[] W = FrequencyGrid.logSpacedRadPerS(5, 2000, 600); // 5 Hz .. 2 kHz, in rad/s

    private static List<FigureDrawing.PanelLayout> layout(Figure f) {
        return FigureDrawing.layout(f, new SvgCanvas(f.widthPx(), f.heightPx()));
    }

    /** A plant far below 0 dB: 0.1 / s² (-80 to -184 dB over 5 Hz .. 2 kHz). */
    private static Frf quietPlant() {
        return Frf.ofModel(TransferFunction.continuous(new double[] {0.1}, new double[] {1, 0, 0}), W);
    }

    @Test
    void bodePanelsShareTheirPlotAreaEdgesAlthoughTheirTickLabelsDifferInWidth() {
        // common practice: panels over one frequency axis line up, so a feature sits at one x in both
        // 1e-4/s: magnitude -110 .. -158 dB (four-character labels), phase -90 deg (three-character labels)
        Figure f = BodePlot.of("plant", Frf.ofModel(TransferFunction.continuous(new double[] {1e-4}, new double[] {1, 0}), W));
        List<FigureDrawing.PanelLayout> l = layout(f);
        SvgCanvas c = new SvgCanvas(1, 1);
        Canvas.Type tick = new Canvas.Type(10, false);
        double magLabels = Arrays.stream(l.get(0).yAxis().labels()).mapToDouble(s -> c.textWidth(s, tick)).max().orElseThrow();
        double phLabels = Arrays.stream(l.get(1).yAxis().labels()).mapToDouble(s -> c.textWidth(s, tick)).max().orElseThrow();
        assertTrue(Math.abs(magLabels - phLabels) > 2, "precondition: the two panels' widest tick labels differ (" + magLabels + " vs " + phLabels + ")");
        assertEquals(l.get(0).left(), l.get(1).left(), 1e-9);
        assertEquals(l.get(0).right(), l.get(1).right(), 1e-9);
    }

    @Test
    void gangOfFourPanelsAlignByColumnAndRow() {
        TransferFunction p = TransferFunction.continuous(new double[] {1}, new double[] {1, 0});
        Frf s = Frf.ofModel(p, W), t = Frf.ofModel(p.times(1e-6), W);
        List<FigureDrawing.PanelLayout> l = layout(GangOfFourPlot.of("", s, t, t, s));
        assertEquals(l.get(0).left() - l.get(0).ox(), l.get(2).left() - l.get(2).ox(), 1e-9);
        assertEquals(l.get(1).left() - l.get(1).ox(), l.get(3).left() - l.get(3).ox(), 1e-9);
        assertEquals(l.get(0).top(), l.get(1).top(), 1e-9);
        assertEquals(l.get(2).top(), l.get(3).top(), 1e-9);
    }

    /** A panel whose one series runs along its top edge from left to right: the north corners are covered. */
    private static Figure withSeries(double[][]... xy) {
        XYChart c = ChartStyle.newChart(500, 300, null, "x", "y");
        for (int i = 0; i < xy.length; i++) ChartStyle.curve(c, "series " + i, xy[i][0], xy[i][1], i);
        return Figure.single(c);
    }

    @Test
    void theLegendMovesToACornerWithoutDataAndTheBoxCoversNone() {
        // a series that fills the top-right (the default corner): the curve climbs steeply to the right
        double[] x = new double[200], y = new double[200];
        for (int i = 0; i < x.length; i++) { x[i] = i; y[i] = Math.pow(i / 199.0, 8) * 100; }
        double[] x2 = {150, 199}, y2 = {60, 100};
        FigureDrawing.PanelLayout l = layout(withSeries(new double[][] {x, y}, new double[][] {x2, y2})).get(0);
        FigureDrawing.LegendBox b = l.legend();
        assertFalse(b.outside());
        assertTrue(b.x() + b.w() / 2 < l.left() + l.plotWidth() / 2 || b.y() > l.top() + l.plotHeight() / 2, "not the top-right corner: " + b);
        assertEquals(0, FigureDrawing.dataUnder(l.series(), l.seriesPx(), b.x(), b.y(), b.w(), b.h()));
        // and the top-right corner, where the legend would have gone, does hold data (the test can fail)
        double bx = l.left() + l.plotWidth() - 8 - b.w(), by = l.top() + 8;
        assertTrue(FigureDrawing.dataUnder(l.series(), l.seriesPx(), bx, by, b.w(), b.h()) > 0);
    }

    @Test
    void aLegendGoesBelowThePlotWhenEveryCornerHoldsData() {
        // a zigzag over the whole area passes through all four corners
        double[] x = new double[41], y = new double[41];
        for (int i = 0; i < x.length; i++) { x[i] = i; y[i] = i % 2 == 0 ? 0 : 1; }
        FigureDrawing.PanelLayout l = layout(withSeries(new double[][] {x, y})).get(0);
        assertTrue(l.legend().outside());
        assertTrue(l.legend().y() > l.bottom(), "legend below the plot area: " + l.legend() + ", plot bottom " + l.bottom());
        assertTrue(l.legend().y() + l.legend().h() <= l.oy() + l.h(), "legend inside the panel");
    }

    @Test
    void zeroDbIsNeitherDrawnNorAllowedToStretchTheAxisOfAQuietPlant() {
        // the case: a plant at -60 to -150 dB must not get a 0 to -160 dB axis
        Figure f = BodePlot.of("plant", quietPlant());
        FigureDrawing.PanelLayout mag = layout(f).get(0);
        double[] m = quietPlant().magnitudeDb();
        double lo = Arrays.stream(m).min().orElseThrow(), hi = Arrays.stream(m).max().orElseThrow();
        assertTrue(mag.yAxis().hi() < hi + 0.1 * (hi - lo), "axis top " + mag.yAxis().hi() + " near the data's top " + hi);
        assertTrue(mag.yAxis().fraction(0) > 1, "0 dB outside the axis");
        for (XYSeries s : f.panels().get(0).getSeriesMap().values()) assertFalse(s.getName().contains("0 dB"), "no 0 dB series in the data");
    }

    @Test
    void aLoopGainThatCrossesZeroDbGetsItsReferenceLine() {
        // L = 4e5/s² crosses 0 dB at 632 rad/s (100.7 Hz), inside the band: the guide lies inside the range
        Frf l = Frf.ofModel(TransferFunction.continuous(new double[] {4e5}, new double[] {1, 0, 0}), W);
        Figure f = BodePlot.of("L", l);
        double fr = layout(f).get(0).yAxis().fraction(0);
        assertTrue(fr > 0 && fr < 1, "0 dB inside the magnitude axis: " + fr);
        assertTrue(f.guides().contains(new Figure.Guide(0, 0)));
        assertTrue(f.svg().contains("stroke-dasharray"), "the guide is drawn dashed");
    }

    /** A two-mass plant (resonance 230 Hz) with a 100 µs delay; above 700 Hz pure noise (random phase, coherence 0.1). */
    private static Frf[] noisyAndTrue() {
        double wa = 2 * Math.PI * 150, wr = 2 * Math.PI * 230;
        TransferFunction p = TransferFunction.continuous(new double[] {1}, new double[] {2e-4, 0})
                .times(TransferFunction.continuous(new double[] {1, 2 * 0.03 * wa, wa * wa}, new double[] {1, 2 * 0.02 * wr, wr * wr}))
                .times(wr * wr / (wa * wa));
        Frf truth = Frf.ofModel(p, W);
        double[] re = truth.real(), im = truth.imag(), coh = new double[W.length];
        SplittableRandom rnd = new SplittableRandom(7);
        for (int i = 0; i < W.length; i++) {
            double d = -W[i] * 1e-4; // 100 µs delay
            boolean noise = W[i] > 2 * Math.PI * 700;
            double ph = d + (noise ? Math.PI * (2 * rnd.nextDouble() - 1) : 0.05 * (rnd.nextDouble() - 0.5));
            coh[i] = noise ? 0.1 : 0.97;
            double x = re[i], y = im[i];
            re[i] = x * Math.cos(ph) - y * Math.sin(ph);
            im[i] = x * Math.sin(ph) + y * Math.cos(ph);
        }
        double[] tr = truth.real().clone(), ti = truth.imag().clone();
        for (int i = 0; i < W.length; i++) {
            double d = -W[i] * 1e-4, x = tr[i], y = ti[i];
            tr[i] = x * Math.cos(d) - y * Math.sin(d);
            ti[i] = x * Math.sin(d) + y * Math.cos(d);
        }
        return new Frf[] {Frf.ofParts(W, re, im).withCoherence(coh), Frf.ofParts(W, tr, ti)};
    }

    @Test
    void noisyPhaseFollowsItsTrendAndTheFigureSaysSo() {
        Frf[] d = noisyAndTrue();
        Frf noisy = d[0];
        double[] plain = PlotPhase.forDisplayDeg(noisy.phaseDegUnwrapped());
        double plainSpan = Arrays.stream(plain).max().orElseThrow() - Arrays.stream(plain).min().orElseThrow();
        assertTrue(plainSpan > 1000, "precondition: plain unwrapping wanders on this data (span " + plainSpan + " deg)");

        PlotPhase.Branch b = PlotPhase.alongTrendDeg(noisy);
        assertTrue(b.differsFromPlainUnwrap());
        double[] truth = PlotPhase.forDisplayDeg(d[1].phaseDegUnwrapped());
        double[] hz = noisy.frequencyHz();
        double lastGood = Double.NaN;
        for (int i = 0; i < hz.length; i++) {
            if (hz[i] <= 700) {
                // good coherence: on the true branch within the added noise (±1.5 deg) and the grid's resolution
                assertEquals(truth[i], b.phaseDeg()[i], 5, "at " + hz[i] + " Hz");
                lastGood = truth[i];
            } else {
                // noise: within half a turn of where the trend was left (plus the ±1.5 deg noise of the anchoring point
                // and the 100 µs delay's slope over the last few good points), never a whole turn away
                assertTrue(Math.abs(b.phaseDeg()[i] - lastGood) <= 180 + 5, "at " + hz[i] + " Hz: " + b.phaseDeg()[i]);
            }
        }
        Figure f = BodePlot.of("measured", noisy);
        assertEquals(PlotPhase.TREND_NOTE, f.note());
        assertTrue(org.loopledger.display.FigureRenderer.plotData(f).contains("\"note\""));
    }

    @Test
    void cleanModelPhaseIsThePlainUnwrapAndCarriesNoNote() {
        Frf model = noisyAndTrue()[1];
        PlotPhase.Branch b = PlotPhase.alongTrendDeg(model);
        assertFalse(b.differsFromPlainUnwrap());
        assertArrayEquals(PlotPhase.forDisplayDeg(model.phaseDegUnwrapped()), b.phaseDeg(), 1e-9);
        assertEquals("", BodePlot.of("model", model).note());
    }

    @Test
    void everyFigureHasATitleAndMarkersAreNamedInTheLegend() {
        Frf l = Frf.ofModel(TransferFunction.continuous(new double[] {4e5}, new double[] {1, 0, 0}), W);
        Figure bode = BodePlot.create().add("L", l).mark("crossover", 100, 0, -180).figure();
        assertEquals("Bode plot: L", bode.title());
        XYSeries marker = bode.panels().get(0).getSeriesMap().get("crossover");
        assertTrue(marker.isShowInLegend());
        // a marker without values sits on the first curve: |4e5/(j2π·100)²| = 4e5/(2π·100)² = 1.013 → 0.11 dB (by hand)
        Figure onCurve = BodePlot.create().add("L", l).mark("crossover", 100, Double.NaN, Double.NaN).figure();
        assertEquals(20 * Math.log10(4e5 / Math.pow(2 * Math.PI * 100, 2)), onCurve.panels().get(0).getSeriesMap().get("crossover").getYData()[0], 0.01);
        assertEquals(-180, onCurve.panels().get(1).getSeriesMap().get("crossover").getYData()[0], 1e-6);
        assertTrue(NicholsPlot.of("L", l).title().contains("Nichols"));
        assertTrue(NyquistPlot.of("L", l).title().contains("Nyquist"));
        assertTrue(GangOfFourPlot.of("", l, l, l, l).title().contains("Gang of Four"));
        assertTrue(CoherencePlot.of("L", l.withCoherence(new double[W.length])).title().contains("Coherence"));
        assertEquals("Time response: Position (µm)", TimePlot.over(new double[] {0, 1}).panel("Position (µm)").signal("x", new double[] {0, 1}).figure().title());
        assertEquals("mine", BodePlot.create().title("mine").add("L", l).figure().title());
    }

    @Test
    void tickLabelsHaveALeadingZero() {
        // common practice (and ISO 80000-1, 7.3.2, from memory): a decimal sign is never the first character
        Axis lin = Axis.of(0, 0.05, false, 400, 64);
        assertTrue(Arrays.asList(lin.labels()).contains("0.01"), Arrays.toString(lin.labels()));
        Axis neg = Axis.of(-0.05, 0, false, 400, 64);
        assertTrue(Arrays.asList(neg.labels()).contains("-0.01"), Arrays.toString(neg.labels()));
        Axis log = Axis.of(0.005, 2, true, 400, 64);
        assertEquals(List.of("0.01", "0.1", "1"), Arrays.asList(log.labels()));
        for (Axis a : List.of(lin, neg, log)) for (String s : a.labels()) assertFalse(s.startsWith(".") || s.startsWith("-."), s);
    }

    @Test
    void aScaledPanelShowsSiSignalsInItsUnit() {
        // 1 m = 1e6 µm (definition of the SI prefix micro); values that bend, so the decimation keeps every point
        double[] t = {0, 0.001, 0.002};
        Figure f = TimePlot.over(t).panel("Position (µm)", 1e6).signal("x", new double[] {0, 2e-6, 5e-6}).level("target", 5e-6)
                .panel("Current (A)").signal("i", new double[] {1, 3, 2}).figure();
        assertArrayEquals(new double[] {0, 2, 5}, f.panels().get(0).getSeriesMap().get("x").getYData(), 1e-12);
        for (double v : f.panels().get(0).getSeriesMap().get("target").getYData()) assertEquals(5, v, 1e-12); // a constant keeps its ends only
        assertArrayEquals(new double[] {1, 3, 2}, f.panels().get(1).getSeriesMap().get("i").getYData(), 1e-12);
        assertThrows(IllegalArgumentException.class, () -> TimePlot.over(t).panel("x", 0));
        Figure many = TimePlot.over(t).panel("Position (mm)", 1e3)
                .signals(new String[] {"a", "b"}, List.of(new double[] {0, 1e-3, 2e-3}, new double[] {0, 2e-3, 1e-3}), v -> v).figure();
        assertArrayEquals(new double[] {0, 2, 1}, many.panels().get(0).getSeriesMap().get("b").getYData(), 1e-12);
    }
}
