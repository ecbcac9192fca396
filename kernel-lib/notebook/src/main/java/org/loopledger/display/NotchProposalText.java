package org.loopledger.display;

import org.loopledger.tune.LoadCaseFigures;
import org.loopledger.tune.NotchProposal;
import org.loopledger.tune.Resonance;

/**
 * The plain-text report of a {@link NotchProposal}: the resonances found, the notch, the tuning without it, the same
 * gains with it on every load case, the re-tuning with it ({@link TuningReportText}) and whether it pays. Deterministic.
 */
public final class NotchProposalText {
    private NotchProposalText() {}

    public static String of(NotchProposal p) {
        StringBuilder sb = new StringBuilder();
        for (Resonance r : p.resonances()) sb.append(r).append('\n');
        sb.append("proposed ").append(p.notch()).append('\n');
        sb.append("tuned without the notch: ").append(TuningReportText.of(p.without()).replace("\n", "\n  ")).append('\n');
        sb.append("same gains, notch added:\n");
        for (LoadCaseFigures f : p.sameGainsWithNotch()) sb.append("    ").append(f).append('\n');
        sb.append("re-tuned with the notch: ").append(TuningReportText.of(p.with()).replace("\n", "\n  ")).append('\n');
        sb.append(p.pays() ? "the notch pays: higher worst-case velocity crossover" : "the notch does not pay here: re-tuning with it gives no higher crossover");
        return sb.toString();
    }
}
