package org.loopledger.display;

import org.loopledger.ident.excitation.ExcitationSignal;
import org.loopledger.ident.excitation.Prbs;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A logged excitation compared sample by sample with its definition, regenerated: the period in samples and seconds,
 * the spacing of the excited lines, how many periods the log holds, and the largest difference between the logged
 * and the regenerated signal (in the logged signal's unit). For a PRBS, also its first spectral null (the bit rate)
 * and the -3 dB point of its spectrum, 0.443 times the bit rate (the sinc² envelope of a held maximum-length
 * sequence: common practice). A difference of zero means the log holds the designed signal, aligned to its periods,
 * which is what a synchronous average over whole periods needs; otherwise the verdict says by how much it differs.
 *
 * <pre>{@code
 * ExcitationCheck.of(Prbs.of(11, 1.0, 2, 10, 16000), log.injectedCurrentA())
 * }</pre>
 */
public final class ExcitationCheck implements Displayable {
    /** The -3 dB frequency of a held PRBS's sinc² spectrum, as a fraction of its bit rate (sinc²(x) = 1/2 at x = 0.443). */
    static final double PRBS_HALF_POWER_OF_BIT_RATE = 0.443;

    private final ExcitationSignal designed;
    private final Prbs prbs; // null for another kind of excitation
    private final int compared, logged;
    private final double largestDifference, peak;

    private ExcitationCheck(ExcitationSignal designed, Prbs prbs, double[] loggedSamples) {
        Objects.requireNonNull(loggedSamples, "logged samples");
        if (loggedSamples.length == 0) throw new IllegalArgumentException("the logged excitation is empty; pass the log's excitation column, e.g. log.injectedCurrentA()");
        this.designed = designed;
        this.prbs = prbs;
        double[] expected = designed.samples();
        this.logged = loggedSamples.length;
        this.compared = Math.min(expected.length, loggedSamples.length);
        double worst = 0;
        for (int i = 0; i < compared; i++) worst = Math.max(worst, Math.abs(loggedSamples[i] - expected[i]));
        this.largestDifference = worst;
        this.peak = designed.peak();
    }

    /** A PRBS against the logged samples (from the first sample on). */
    public static ExcitationCheck of(Prbs prbs, double[] loggedSamples) {
        Objects.requireNonNull(prbs, "prbs");
        return new ExcitationCheck(prbs.signal(), prbs, loggedSamples);
    }

    /** Any periodic excitation against the logged samples (from the first sample on). */
    public static ExcitationCheck of(ExcitationSignal designed, double[] loggedSamples) {
        return new ExcitationCheck(Objects.requireNonNull(designed, "designed excitation"), null, loggedSamples);
    }

    /** The largest |logged - designed| over the samples compared, in the logged signal's unit. */
    public double largestDifference() { return largestDifference; }

    /** Logged samples over the period: the periods the log holds (need not be whole). */
    public double periodsInLog() { return logged / (double) designed.periodSamples(); }

    HtmlTable table() {
        HtmlTable t = HtmlTable.of(designed.description(), "Figure", "Value", "Unit");
        int n = designed.periodSamples();
        t.row("period", String.valueOf(n), "samples");
        t.row("period", Figures.num(designed.periodS()), "s");
        t.row("spacing of the excited lines", Figures.num(designed.lineSpacingHz()), "Hz");
        t.row("periods in the log", Figures.num(periodsInLog()), "");
        t.row("largest difference from the definition (" + compared + " samples)", Figures.num(largestDifference), "unit of the logged signal");
        if (prbs != null) {
            t.row("first spectral null (bit rate)", Figures.num(prbs.firstNullHz()), "Hz");
            t.row("-3 dB of the spectrum (0.443 × bit rate)", Figures.num(PRBS_HALF_POWER_OF_BIT_RATE * prbs.firstNullHz()), "Hz");
        }
        return t;
    }

    private List<String> verdicts() {
        List<String> v = new ArrayList<>();
        if (largestDifference == 0) {
            v.add("the log holds the designed signal sample for sample over the " + compared + " samples compared, aligned to its periods");
        } else if (largestDifference <= 1e-6 * peak) {
            v.add("the log holds the designed signal to within " + Units.g4(largestDifference) + " (printing resolution; peak " + Units.g4(peak)
                    + ") over the " + compared + " samples compared, aligned to its periods");
        } else {
            v.add("the log differs from the designed signal by up to " + Units.g4(largestDifference) + " (peak " + Units.g4(peak)
                    + "): check the alignment (a shift of whole samples), the scaling and the definition before averaging over periods");
        }
        if (logged != designed.totalSamples()) {
            v.add("the log holds " + logged + " samples, the definition " + designed.totalSamples() + "; compared over the first " + compared);
        }
        return v;
    }

    @Override public String toString() { return TableWithNotes.text(table(), verdicts()); }

    @Override public MimeBundle toMimeBundle() { return TableWithNotes.bundle("loopledger-excitation-check", table(), verdicts()); }
}
