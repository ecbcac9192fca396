package org.loopledger.display;

import org.loopledger.analysis.GangOfFour;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

/** The plain-text report of a {@link GangOfFour}: its grid and the peak of |S|, |T|, |PS| and |CS| with their frequencies. Deterministic. */
public final class GangOfFourText {
    private GangOfFourText() {}

    public static String of(GangOfFour g) {
        return (g + "\n" + peak("S", g.sensitivity()) + peak("T", g.complementarySensitivity()) + peak("PS", g.loadSensitivity())
                + peak("CS", g.noiseSensitivity())).stripTrailing();
    }

    private static String peak(String name, Frf f) {
        double[] m = f.magnitude();
        int k = 0;
        for (int i = 1; i < m.length; i++) if (m[i] > m[k]) k = i;
        return "  peak |" + name + "| = " + Units.g4(m[k]) + " (" + Units.formatDb(20 * Math.log10(m[k])) + ") at " + Units.formatRadPerSAsHz(f.omegaAt(k)) + "\n";
    }
}
