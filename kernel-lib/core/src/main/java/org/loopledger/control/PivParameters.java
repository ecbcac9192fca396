package org.loopledger.control;

import org.loopledger.lti.Motion;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * The PIV gains as a drive's parameter list, in the axis' own units: K<sub>p</sub> in 1/s, K<sub>v</sub> in
 * plant-input units (A for a current-commanded drive) per rad/s and per rpm (K<sub>v</sub>·2π/60) on a rotary
 * axis, per m/s and per mm/s (K<sub>v</sub>/1000) with K<sub>p</sub> also in (m/min)/mm (K<sub>p</sub>·60/1000) on a
 * linear one (common practice), and the velocity-integral corner in Hz with its time constant
 * T<sub>i</sub> = 1/ω<sub>i</sub> in ms. Values carry 6 significant digits. Filters have their own table
 * ({@link FilterChain#coefficientTable}).
 */
public record PivParameters(Piv piv, Motion motion) {
    /** Printed with every parameter list: these numbers go into a drive that moves real machinery. */
    public static final String CAUTION = "Try new gains first with reduced current and speed limits, with guarding and an emergency stop in place.";

    /** One parameter. */
    public record Row(String parameter, double value, String unit) {}

    public PivParameters {
        Objects.requireNonNull(piv, "piv");
        Objects.requireNonNull(motion, "motion (Motion.ROTARY or Motion.LINEAR)");
    }

    public static PivParameters of(Piv piv, Motion motion) { return new PivParameters(piv, motion); }

    /** The rows, in the order a drive lists them. */
    public List<Row> rows() {
        double kp = piv.positionGainPerS(), kv = piv.velocity().velocityGain();
        List<Row> r = new ArrayList<>();
        r.add(new Row("position gain Kp", kp, "1/s"));
        if (motion == Motion.LINEAR) r.add(new Row("position gain Kp", Motion.metresPerMinutePerMm(kp), "(m/min)/mm"));
        r.add(new Row("velocity gain Kv", kv, motion.velocityGainUnit()));
        if (motion == Motion.LINEAR) r.add(new Row("velocity gain Kv", Motion.perMmPerS(kv), "per mm/s"));
        else r.add(new Row("velocity gain Kv", kv * 2 * Math.PI / 60, "per rpm"));
        if (piv.velocity().hasIntegral()) {
            r.add(new Row("velocity-integral corner", piv.velocity().integralCornerHz(), "Hz"));
            r.add(new Row("velocity-integral time Ti", 1e3 / piv.velocity().integralCornerRadPerS(), "ms"));
        } else {
            r.add(new Row("velocity-integral corner", 0, "Hz (no integral action)"));
        }
        return List.copyOf(r);
    }

    /** A value with 6 significant digits, as the table shows it. */
    public static String digits6(double v) { return String.format(Locale.ROOT, "%.6g", v); }

    @Override public String toString() {
        StringBuilder sb = new StringBuilder("PIV parameters, " + motion.label() + " axis (velocity gains in plant-input units, e.g. A)\n");
        int w = 0;
        for (Row r : rows()) w = Math.max(w, r.parameter().length());
        for (Row r : rows()) sb.append(String.format(Locale.ROOT, "  %-" + w + "s %14s %s%n", r.parameter(), digits6(r.value()), r.unit()));
        sb.append(CAUTION);
        return sb.toString();
    }
}
