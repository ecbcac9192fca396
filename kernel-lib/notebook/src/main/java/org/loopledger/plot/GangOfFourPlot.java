package org.loopledger.plot;

import org.knowm.xchart.XYChart;
import org.loopledger.analysis.GangOfFour;
import org.loopledger.frf.Frf;

import java.util.List;

/**
 * The Gang of Four (Åström and Murray, Feedback Systems, 2nd ed., §12.1): magnitudes of S, T, PS and CS
 * over frequency on a 2x2 grid.
 *
 * <p><b>Units on the axes.</b> |S| and |T| are ratios, shown in dB (dimensionless). |PS| (plant input
 * disturbance to plant output) and |CS| (output noise to plant input) carry the plant's units: with them stated
 * ({@link #of(String, GangOfFour, String, String)}) the axes read "|PS| (dB re 1 rad/A)" and "|CS| (dB re 1 A/rad)";
 * without, they say which way the ratio goes ("plant output per input"), since a CS of +110 dB means nothing
 * without its unit. For the loops of a {@code Cascade} ({@code cascade.gangOfFour()}: position per current
 * command) the units are rad (m on a linear axis) and A.
 */
public final class GangOfFourPlot {
    private GangOfFourPlot() {}

    /** The four magnitudes of an analysed loop in one call: S, T, PS and CS on the analysis's own grid; units of PS and CS not stated. */
    public static Figure of(String title, GangOfFour gang) {
        java.util.Objects.requireNonNull(gang, "gang (GangOfFour.of(plant, controller))");
        return of(title, gang.sensitivity(), gang.complementarySensitivity(), gang.loadSensitivity(), gang.noiseSensitivity());
    }

    /**
     * As {@link #of(String, GangOfFour)}, with the plant's units on the |PS| and |CS| axes.
     *
     * @param outputUnit the plant output's unit, e.g. "rad", "m" or "rad/s"
     * @param inputUnit  the plant input's unit, e.g. "A" or "N·m"
     */
    public static Figure of(String title, GangOfFour gang, String outputUnit, String inputUnit) {
        java.util.Objects.requireNonNull(gang, "gang (GangOfFour.of(plant, controller))");
        return of(title, gang.sensitivity(), gang.complementarySensitivity(), gang.loadSensitivity(), gang.noiseSensitivity(), outputUnit, inputUnit);
    }

    /** The four magnitudes from their FRFs; units of PS and CS not stated. */
    public static Figure of(String title, Frf s, Frf t, Frf ps, Frf cs) {
        return figure(title, s, t, ps, cs, "|PS| (dB, plant output per input)", "|CS| (dB, plant input per output)");
    }

    /** The four magnitudes from their FRFs, with the plant's output and input units on the |PS| and |CS| axes. */
    public static Figure of(String title, Frf s, Frf t, Frf ps, Frf cs, String outputUnit, String inputUnit) {
        String out = requireUnit(outputUnit, "outputUnit (the plant output's unit, e.g. \"rad\")");
        String in = requireUnit(inputUnit, "inputUnit (the plant input's unit, e.g. \"A\")");
        return figure(title, s, t, ps, cs, "|PS| (dB re 1 " + ratio(out, in) + ")", "|CS| (dB re 1 " + ratio(in, out) + ")");
    }

    private static String requireUnit(String unit, String what) {
        if (unit == null || unit.isBlank()) throw new IllegalArgumentException(what + " must be given; use of(title, gang) when the units are not known");
        return unit.strip();
    }

    /** "a/b", with a compound unit in parentheses: "(rad/s)/A". */
    private static String ratio(String num, String den) {
        return wrap(num) + "/" + wrap(den);
    }

    private static String wrap(String unit) {
        return unit.contains("/") || unit.contains(" ") || unit.contains("·") ? "(" + unit + ")" : unit;
    }

    private static Figure figure(String title, Frf s, Frf t, Frf ps, Frf cs, String psAxis, String csAxis) {
        String t0 = title == null || title.isEmpty() ? "Gang of Four: S, T, PS and CS" : title;
        // 0 dB: where |S| and |T| cross one; drawn where the data come to it, never widening a panel's range
        return Figure.grid(t0, 2, List.of(
                panel("S = 1/(1+PC)", "|S| (dB, dimensionless)", s), panel("T = PC/(1+PC)", "|T| (dB, dimensionless)", t),
                panel("PS = P/(1+PC)", psAxis, ps), panel("CS = C/(1+PC)", csAxis, cs)))
                .withGuides(List.of(new Figure.Guide(0, 0), new Figure.Guide(1, 0), new Figure.Guide(2, 0), new Figure.Guide(3, 0)));
    }

    private static XYChart panel(String name, String yAxis, Frf f) {
        XYChart c = ChartStyle.newChart(380, 240, name, "Frequency (Hz)", yAxis);
        c.getStyler().setXAxisLogarithmic(true);
        c.getStyler().setLegendVisible(false);
        double[][] d = Decimation.forPanel(f.frequencyHz(), f.magnitudeDb(), true, 380, 240);
        ChartStyle.curve(c, name, d[0], d[1], 0);
        return c;
    }
}
