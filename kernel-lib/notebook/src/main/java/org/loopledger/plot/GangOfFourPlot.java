package org.loopledger.plot;

import org.knowm.xchart.XYChart;
import org.loopledger.analysis.GangOfFour;
import org.loopledger.frf.Frf;

import java.util.List;

/**
 * The Gang of Four (Åström and Murray, Feedback Systems, 2nd ed., §12.1): magnitudes of S, T, PS and CS
 * over frequency on a 2x2 grid.
 */
public final class GangOfFourPlot {
    private GangOfFourPlot() {}

    /** The four magnitudes of an analysed loop in one call: S, T, PS and CS on the analysis's own grid. */
    public static Figure of(String title, GangOfFour gang) {
        java.util.Objects.requireNonNull(gang, "gang (GangOfFour.of(plant, controller))");
        return of(title, gang.sensitivity(), gang.complementarySensitivity(), gang.loadSensitivity(), gang.noiseSensitivity());
    }

    public static Figure of(String title, Frf s, Frf t, Frf ps, Frf cs) {
        String t0 = title == null || title.isEmpty() ? "Gang of Four: S, T, PS and CS" : title;
        // 0 dB: where |S| and |T| cross one; drawn where the data come to it, never widening a panel's range
        return Figure.grid(t0, 2, List.of(
                panel("S = 1/(1+PC)", s), panel("T = PC/(1+PC)", t),
                panel("PS = P/(1+PC)", ps), panel("CS = C/(1+PC)", cs)))
                .withGuides(List.of(new Figure.Guide(0, 0), new Figure.Guide(1, 0), new Figure.Guide(2, 0), new Figure.Guide(3, 0)));
    }

    private static XYChart panel(String name, Frf f) {
        XYChart c = ChartStyle.newChart(380, 240, name, "Frequency (Hz)", "Magnitude (dB)");
        c.getStyler().setXAxisLogarithmic(true);
        c.getStyler().setLegendVisible(false);
        double[][] d = Decimation.forPanel(f.frequencyHz(), f.magnitudeDb(), true, 380, 240);
        ChartStyle.curve(c, name, d[0], d[1], 0);
        return c;
    }
}
