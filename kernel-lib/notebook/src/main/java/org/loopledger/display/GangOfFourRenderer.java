package org.loopledger.display;

import org.loopledger.analysis.GangOfFour;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

/**
 * A {@link GangOfFour} as the peak of each of its four functions and the frequency of the peak, read off
 * the grid it was computed on: |S| (Ms, the modulus-margin figure), |T|, |PS| (load disturbance at the plant
 * input to the output, in output units per input unit, e.g. rad/A) and |CS| (measurement noise to the
 * control signal, e.g. A/rad). A peak at the first or last grid point is marked: the true peak may lie outside.
 * Plain text is the same table in fixed width. For the curves, plot it with {@code GangOfFourPlot}.
 */
public final class GangOfFourRenderer {
    private GangOfFourRenderer() {}

    /** The table of peaks. */
    static HtmlTable table(GangOfFour g) {
        Frf s = g.sensitivity();
        HtmlTable t = HtmlTable.of("Gang of Four: peaks on the grid (" + s.size() + " points, " + Units.formatHz(s.frequencyHz()[0]) + " to "
                + Units.formatHz(s.frequencyHz()[s.size() - 1]) + ")", "Function", "From / to", "Peak", "Peak (dB)", "At (Hz)");
        row(t, "|S| = Ms", "output disturbance to output", s);
        row(t, "|T|", "reference to output", g.complementarySensitivity());
        row(t, "|PS|", "load disturbance (plant input) to output, output units per input unit", g.loadSensitivity());
        row(t, "|CS|", "measurement noise to control signal, input units per output unit", g.noiseSensitivity());
        return t;
    }

    private static void row(HtmlTable t, String name, String path, Frf f) {
        double[] mag = f.magnitude();
        double[] hz = f.frequencyHz();
        int k = 0;
        for (int i = 1; i < mag.length; i++) if (mag[i] > mag[k]) k = i;
        boolean edge = mag.length > 1 && (k == 0 || k == mag.length - 1);
        t.row(name, path, Figures.num(mag[k]), Figures.fixed2(Units.ratioToDb(mag[k])), Figures.num(hz[k]) + (edge ? " (band edge)" : ""));
    }

    public static MimeBundle render(GangOfFour g) {
        HtmlTable t = table(g);
        return MimeBundle.builder(t.toText().stripTrailing()).put(MimeBundle.TEXT_HTML, t.toString()).build();
    }
}
