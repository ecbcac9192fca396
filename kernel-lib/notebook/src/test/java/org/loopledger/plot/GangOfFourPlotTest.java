package org.loopledger.plot;

import org.junit.jupiter.api.Test;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.loopledger.analysis.GangOfFour;
import org.loopledger.lti.TransferFunction;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@link GangOfFourPlot#of(String, GangOfFour)}: the four panels straight from an analysed loop. */
class GangOfFourPlotTest {

    @Test
    void oneCallFromAGangOfFourDrawsTheFourMagnitudes() {
        // P = 1/s, C = 1: S = s/(s+1), T = 1/(s+1), PS = 1/(s+1), CS = s/(s+1) (Åström and Murray, Feedback Systems,
        // 2nd ed., §12.1 definitions, worked by hand): at 1 rad/s every one of them has |.| = 1/sqrt(2) = -3.01 dB,
        // at low frequency |T| -> 0 dB and |S| falls 20 dB/decade.
        GangOfFour g = GangOfFour.of(TransferFunction.continuous(new double[] {1}, new double[] {1, 0}), TransferFunction.gain(1));
        Figure fig = GangOfFourPlot.of("P = 1/s, C = 1", g);
        assertEquals("P = 1/s, C = 1", fig.title());
        assertEquals(2, fig.columns());
        List<XYChart> panels = fig.panels();
        assertEquals(4, panels.size());
        String[] names = {"S = 1/(1+PC)", "T = PC/(1+PC)", "PS = P/(1+PC)", "CS = C/(1+PC)"};
        double cornerHz = 1 / (2 * Math.PI);
        for (int i = 0; i < 4; i++) {
            XYSeries s = panels.get(i).getSeriesMap().get(names[i]);
            assertTrue(s != null, "panel " + i + " holds " + names[i]);
            // the same curve the four-Frf factory draws from the same values
            XYSeries same = GangOfFourPlot.of("", g.sensitivity(), g.complementarySensitivity(), g.loadSensitivity(), g.noiseSensitivity())
                    .panels().get(i).getSeriesMap().get(names[i]);
            assertEquals(List.of(same.getXData().length), List.of(s.getXData().length));
            // read |.| at the 1 rad/s corner off the plotted curve (decimation keeps it within 0.25 px, well under 0.1 dB here)
            double[] x = s.getXData(), y = s.getYData();
            int k = 1;
            while (x[k] < cornerHz) k++;
            double t = (Math.log(cornerHz) - Math.log(x[k - 1])) / (Math.log(x[k]) - Math.log(x[k - 1]));
            assertEquals(-10 * Math.log10(2), y[k - 1] + t * (y[k] - y[k - 1]), 0.1, names[i] + " at 1 rad/s");
        }
    }

    @Test
    void nullIsRefusedWithAHint() {
        NullPointerException e = assertThrows(NullPointerException.class, () -> GangOfFourPlot.of("x", (GangOfFour) null));
        assertTrue(e.getMessage().contains("GangOfFour.of"), e.getMessage());
    }

    static List<String> yAxes(Figure fig) {
        return fig.panels().stream().map(XYChart::getYAxisTitle).toList();
    }

    /** The y-axis titles as the notebook output's plot data carries them (what verify compares and a reader sees). */
    static List<String> yAxesInPlotData(Figure fig) {
        String json = org.loopledger.display.Bundles.of(fig).get(org.loopledger.display.FigureRenderer.PLOT_DATA_MIME).orElseThrow();
        var panels = com.google.gson.JsonParser.parseString(json).getAsJsonObject().getAsJsonArray("panels");
        List<String> out = new java.util.ArrayList<>();
        for (var p : panels) out.add(p.getAsJsonObject().get("y_axis").getAsString());
        return out;
    }

    @Test
    void magnitudeAxesSayWhatTheDecibelsAreOf() {
        // |S| and |T| are ratios (dimensionless); PS = P/(1+PC) has the plant's units (output per input), CS = C/(1+PC)
        // the controller's (input per output): Åström and Murray, Feedback Systems, 2nd ed., §12.1 definitions.
        GangOfFour g = GangOfFour.of(TransferFunction.continuous(new double[] {1}, new double[] {1, 0}), TransferFunction.gain(1));
        List<String> stated = List.of("|S| (dB, dimensionless)", "|T| (dB, dimensionless)", "|PS| (dB re 1 rad/A)", "|CS| (dB re 1 A/rad)");
        Figure withUnits = GangOfFourPlot.of("units", g, "rad", "A");
        assertEquals(stated, yAxes(withUnits));
        assertEquals(stated, yAxesInPlotData(withUnits));
        // compound units are parenthesised so the ratio reads one way only
        assertEquals(List.of("|PS| (dB re 1 (rad/s)/(N·m))", "|CS| (dB re 1 (N·m)/(rad/s))"),
                yAxes(GangOfFourPlot.of("", g, "rad/s", "N·m")).subList(2, 4));
        // without units: no bare "Magnitude (dB)"; the direction of PS and CS is named
        List<String> bare = yAxesInPlotData(GangOfFourPlot.of("no units", g));
        assertEquals(List.of("|S| (dB, dimensionless)", "|T| (dB, dimensionless)", "|PS| (dB, plant output per input)",
                "|CS| (dB, plant input per output)"), bare);
        var e = assertThrows(IllegalArgumentException.class, () -> GangOfFourPlot.of("", g, " ", "A"));
        assertTrue(e.getMessage().contains("outputUnit"), e.getMessage());
    }
}
