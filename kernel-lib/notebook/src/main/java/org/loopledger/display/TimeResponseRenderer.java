package org.loopledger.display;

import org.loopledger.sim.Excitation;
import org.loopledger.sim.ResponseMetrics;
import org.loopledger.sim.TimeResponse;
import org.loopledger.lti.Motion;

/**
 * A simulated {@link TimeResponse}: what was simulated (excitation, amplitude with its unit, sample rate,
 * duration) and its figures (rise time, overshoot, settling or recovery time, peak following error or
 * peak deviation, peak current) from {@link ResponseMetrics}. Plot the curves with the time plots.
 */
public final class TimeResponseRenderer {
    private TimeResponseRenderer() {}

    static HtmlTable table(TimeResponse r) {
        Motion m = r.motion();
        Excitation x = r.excitation();
        String amplitudeUnit = x == Excitation.TORQUE_DISTURBANCE_STEP ? "plant-input units (e.g. A)"
                : x == Excitation.POSITION_RAMP ? m.velocityUnit() : x.errorUnit(m);
        HtmlTable t = HtmlTable.of("Simulated " + x.label(m) + ", " + m.label() + " axis", "Figure", "Value", "Unit");
        t.row("Amplitude", Figures.num(r.amplitude()), amplitudeUnit);
        t.row("Sample rate", Figures.num(r.sampleRateHz()), "Hz");
        t.row("Duration", Figures.ms(r.durationS()), "ms");
        t.row("Samples", String.valueOf(r.size()), "");
        return t;
    }

    public static MimeBundle render(TimeResponse r) {
        ResponseMetrics metrics = r.metrics();
        HtmlTable t = table(r);
        MimeBundle figures = ResultRenderers.response(metrics);
        String html = "<div class=\"loopledger-time-response\">" + t + figures.get(MimeBundle.TEXT_HTML).orElseThrow() + "</div>";
        return MimeBundle.builder(t.toText() + "  " + metrics).put(MimeBundle.TEXT_HTML, html).build();
    }
}
