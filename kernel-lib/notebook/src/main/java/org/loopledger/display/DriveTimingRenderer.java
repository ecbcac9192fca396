package org.loopledger.display;

import org.loopledger.control.DriveTiming;

/**
 * A {@link DriveTiming} as the figures that shape the loop's phase: sample rate and time, Nyquist
 * frequency, computation delay (samples and µs) and its phase lag at 100 Hz (360°·f·τ), zero-order hold,
 * current loop. These describe the drive; nothing here is typed into it.
 */
public final class DriveTimingRenderer {
    private DriveTimingRenderer() {}

    static HtmlTable table(DriveTiming d) {
        HtmlTable t = HtmlTable.of(d.isSampled() ? "Drive timing" : "Drive timing (continuous: no sampling, no delay)", "Figure", "Value", "Unit");
        if (d.isSampled()) {
            t.row("Sample rate", Figures.num(d.sampleRateHz()), "Hz");
            t.row("Sample time", Figures.num(d.sampleTimeS() * 1e6), "us");
            t.row("Nyquist frequency", Figures.num(d.sampleRateHz() / 2), "Hz");
            t.row("Computation delay", Figures.num(d.computationDelaySamples()), "samples");
            t.row("Computation delay", Figures.num(d.computationDelayS() * 1e6), "us");
            t.row("Phase lag of the computation delay at 100 Hz", Figures.fixed2(360 * 100 * d.computationDelayS()), "deg");
            t.row("Zero-order hold", d.hasZeroOrderHold() ? "yes (adds half a sample of lag)" : "no", "");
        }
        t.row("Current loop", d.currentLoopBandwidthHz().isPresent() ? Figures.num(d.currentLoopBandwidthHz().getAsDouble()) : "ideal",
                d.currentLoopBandwidthHz().isPresent() ? "Hz (first-order)" : "");
        return t;
    }

    public static MimeBundle render(DriveTiming d) {
        HtmlTable t = table(d);
        return MimeBundle.builder(t.toText().stripTrailing()).put(MimeBundle.TEXT_HTML, t.toString()).build();
    }
}
