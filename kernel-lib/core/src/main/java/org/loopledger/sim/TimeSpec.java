package org.loopledger.sim;

import org.loopledger.analysis.SpecReport;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

/**
 * Time-domain requirements with units in their names, checked into the same {@link SpecReport} as the frequency-domain
 * {@link org.loopledger.analysis.Spec}, so the two can be shown and combined alike
 * ({@link SpecReport#combined(String, SpecReport...)}).
 *
 * <pre>{@code
 * TimeSpec spec = TimeSpec.builder().maxOvershootPct(10).maxRiseTimeS(0.005).maxSettlingTimeS(0.02).maxPeakCurrent(8).build();
 * SpecReport r = spec.check(stepResponse, disturbanceResponse);
 * }</pre>
 *
 * Overshoot, rise and settling time come from the step response (a position or velocity step), peak current is the
 * largest over every response given, the disturbance deviation from a torque (force) disturbance step; the figures
 * are those of {@link ResponseMetrics} (2 % settling band). A requirement with no response to judge it on fails and
 * says which response is missing. Rows carry no frequency.
 */
public final class TimeSpec {
    private final double maxOvershootPct;
    private final double maxRiseTimeS;
    private final double maxSettlingTimeS;
    private final double maxPeakCurrent;
    private final double maxDisturbanceDeviation;

    private TimeSpec(Builder b) {
        maxOvershootPct = b.maxOvershootPct;
        maxRiseTimeS = b.maxRiseTimeS;
        maxSettlingTimeS = b.maxSettlingTimeS;
        maxPeakCurrent = b.maxPeakCurrent;
        maxDisturbanceDeviation = b.maxDisturbanceDeviation;
    }

    public static Builder builder() { return new Builder(); }

    /** Builder; each limit may be set once; NaN marks "not required". */
    public static final class Builder {
        private double maxOvershootPct = Double.NaN;
        private double maxRiseTimeS = Double.NaN;
        private double maxSettlingTimeS = Double.NaN;
        private double maxPeakCurrent = Double.NaN;
        private double maxDisturbanceDeviation = Double.NaN;

        private Builder() {}

        private static double limit(double current, double v, String what, String unit, boolean zeroAllowed) {
            if (!Double.isNaN(current)) throw new IllegalArgumentException(what + " is set twice; set each requirement once");
            if (!Double.isFinite(v) || v < 0 || (!zeroAllowed && v == 0)) {
                throw new IllegalArgumentException(what + " must be a finite " + (zeroAllowed ? "non-negative" : "positive") + " number of " + unit + ", got " + v);
            }
            return v;
        }

        /** Step overshoot at most {@code pct} % (0 allowed: no overshoot). */
        public Builder maxOvershootPct(double pct) { maxOvershootPct = limit(maxOvershootPct, pct, "maximum overshoot", "%", true); return this; }

        /** 10-90 % rise time at most {@code seconds}. */
        public Builder maxRiseTimeS(double seconds) { maxRiseTimeS = limit(maxRiseTimeS, seconds, "maximum rise time", "s", false); return this; }

        /** Settling time into the 2 % band at most {@code seconds}. */
        public Builder maxSettlingTimeS(double seconds) { maxSettlingTimeS = limit(maxSettlingTimeS, seconds, "maximum settling time", "s", false); return this; }

        /** Peak |current command| at most {@code current} in plant-input units (e.g. A). */
        public Builder maxPeakCurrent(double current) { maxPeakCurrent = limit(maxPeakCurrent, current, "maximum peak current", "plant-input units (e.g. A)", false); return this; }

        /** Peak position deviation under the disturbance step at most {@code deviation} (rad, or m on a linear axis). */
        public Builder maxDisturbanceDeviation(double deviation) {
            maxDisturbanceDeviation = limit(maxDisturbanceDeviation, deviation, "maximum disturbance deviation", "rad (m on a linear axis)", false);
            return this;
        }

        public TimeSpec build() {
            if (Double.isNaN(maxOvershootPct) && Double.isNaN(maxRiseTimeS) && Double.isNaN(maxSettlingTimeS) && Double.isNaN(maxPeakCurrent)
                    && Double.isNaN(maxDisturbanceDeviation)) {
                throw new IllegalArgumentException("a TimeSpec needs at least one requirement (for example maxOvershootPct(10))");
            }
            return new TimeSpec(this);
        }
    }

    /** Checks simulated servo responses (a step for overshoot, rise and settling; a disturbance step for the deviation). */
    public SpecReport check(TimeResponse... responses) {
        TimeResponse step = null, disturbance = null;
        double peakCurrent = Double.NaN;
        for (TimeResponse r : responses) {
            if (step == null && (r.excitation() == Excitation.POSITION_STEP || r.excitation() == Excitation.VELOCITY_STEP)) step = r;
            if (disturbance == null && r.excitation() == Excitation.TORQUE_DISTURBANCE_STEP) disturbance = r;
            double p = r.metrics().peakCurrent();
            peakCurrent = Double.isNaN(peakCurrent) ? p : Math.max(peakCurrent, p);
        }
        List<SpecReport.Row> rows = new ArrayList<>();
        ResponseMetrics sm = step == null ? null : step.metrics();
        stepRows(rows, sm == null ? null : new double[] {opt(sm.overshootPct()), opt(sm.riseTimeS()), opt(sm.settlingTimeS())},
                "no step response given (simulate a position or velocity step)", sm == null ? 0 : sm.recordLengthS());
        if (!Double.isNaN(maxPeakCurrent)) {
            if (Double.isNaN(peakCurrent)) rows.add(missing("peak current", "<= " + Units.g4(maxPeakCurrent), maxPeakCurrent, "no response given"));
            else rows.add(row("peak current", "<= " + Units.g4(maxPeakCurrent), Units.g4(peakCurrent), peakCurrent <= maxPeakCurrent, peakCurrent, maxPeakCurrent));
        }
        if (!Double.isNaN(maxDisturbanceDeviation)) {
            String unit = disturbance == null ? "" : " " + disturbance.motion().positionUnit();
            if (disturbance == null) {
                rows.add(missing("disturbance deviation", "<= " + Units.g4(maxDisturbanceDeviation), maxDisturbanceDeviation,
                        "no disturbance response given (simulate a torque or force disturbance step)"));
            } else {
                double dev = disturbance.metrics().peakFollowingError();
                rows.add(row("disturbance deviation", "<= " + Units.g4(maxDisturbanceDeviation) + unit, Units.g4(dev) + unit,
                        dev <= maxDisturbanceDeviation, dev, maxDisturbanceDeviation));
            }
        }
        return new SpecReport(rows, List.of());
    }

    /** Checks the step figures of any step response ({@link StepMetrics}); peak current and disturbance rows fail as not applicable. */
    public SpecReport check(StepMetrics m) {
        List<SpecReport.Row> rows = new ArrayList<>();
        stepRows(rows, new double[] {m.overshootPct(), opt(m.riseTimeS()), opt(m.settlingTimeS())}, "", Double.NaN);
        if (!Double.isNaN(maxPeakCurrent)) {
            rows.add(missing("peak current", "<= " + Units.g4(maxPeakCurrent), maxPeakCurrent, "not in a plain step response (check a ServoSimulation response)"));
        }
        if (!Double.isNaN(maxDisturbanceDeviation)) {
            rows.add(missing("disturbance deviation", "<= " + Units.g4(maxDisturbanceDeviation), maxDisturbanceDeviation,
                    "not in a plain step response (check a ServoSimulation disturbance response)"));
        }
        return new SpecReport(rows, List.of());
    }

    private static double opt(OptionalDouble v) { return v.isPresent() ? v.getAsDouble() : Double.NaN; }

    /** figures = {overshoot %, rise s, settling s} (NaN: not reached), or null when there is no step response. */
    private void stepRows(List<SpecReport.Row> rows, double[] figures, String whyMissing, double recordS) {
        if (!Double.isNaN(maxOvershootPct)) {
            String lim = "<= " + Units.g4(maxOvershootPct) + " %";
            if (figures == null) rows.add(missing("overshoot", lim, maxOvershootPct, whyMissing));
            else rows.add(row("overshoot", lim, Units.g4(figures[0]) + " %", figures[0] <= maxOvershootPct, figures[0], maxOvershootPct));
        }
        if (!Double.isNaN(maxRiseTimeS)) {
            String lim = "<= " + ms(maxRiseTimeS);
            if (figures == null) rows.add(missing("rise time (10-90 %)", lim, maxRiseTimeS, whyMissing));
            else if (Double.isNaN(figures[1])) rows.add(missing("rise time (10-90 %)", lim, maxRiseTimeS, "90 % not reached in the record"));
            else rows.add(row("rise time (10-90 %)", lim, ms(figures[1]), figures[1] <= maxRiseTimeS, figures[1], maxRiseTimeS));
        }
        if (!Double.isNaN(maxSettlingTimeS)) {
            String lim = "<= " + ms(maxSettlingTimeS);
            if (figures == null) rows.add(missing("settling time (2 % band)", lim, maxSettlingTimeS, whyMissing));
            else if (Double.isNaN(figures[2])) {
                rows.add(missing("settling time (2 % band)", lim, maxSettlingTimeS,
                        Double.isNaN(recordS) ? "not settled within the record" : "not settled within " + Units.g4(recordS) + " s"));
            } else rows.add(row("settling time (2 % band)", lim, ms(figures[2]), figures[2] <= maxSettlingTimeS, figures[2], maxSettlingTimeS));
        }
    }

    private static String ms(double s) { return Units.g4(s * 1e3) + " ms"; }

    private static SpecReport.Row row(String req, String limit, String achieved, boolean pass, double value, double limitValue) {
        return new SpecReport.Row(req, limit, achieved, OptionalDouble.empty(), pass, value, limitValue);
    }

    private static SpecReport.Row missing(String req, String limit, double limitValue, String why) {
        return new SpecReport.Row(req, limit, why, OptionalDouble.empty(), false, Double.NaN, limitValue);
    }

    @Override public String toString() {
        List<String> r = new ArrayList<>();
        if (!Double.isNaN(maxOvershootPct)) r.add("overshoot <= " + Units.g4(maxOvershootPct) + " %");
        if (!Double.isNaN(maxRiseTimeS)) r.add("rise time <= " + ms(maxRiseTimeS));
        if (!Double.isNaN(maxSettlingTimeS)) r.add("settling time <= " + ms(maxSettlingTimeS));
        if (!Double.isNaN(maxPeakCurrent)) r.add("peak current <= " + Units.g4(maxPeakCurrent));
        if (!Double.isNaN(maxDisturbanceDeviation)) r.add("disturbance deviation <= " + Units.g4(maxDisturbanceDeviation));
        return "TimeSpec[" + String.join(", ", r) + "]";
    }
}
