package org.loopledger.display;

import org.loopledger.control.Pid;
import org.loopledger.control.Piv;
import org.loopledger.control.VelocityPi;
import org.loopledger.lti.Motion;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A controller's gains as a drive's parameter list, in the drive's units, with the one-line caution:
 * a {@link Piv} (K<sub>p</sub> in 1/s and (m/min)/mm; K<sub>v</sub> in A/(rad/s) and A/rpm on a rotary axis,
 * A/(m/s) and A/(mm/s) on a linear one or at the carriage of a screw axis), a {@link VelocityPi} alone, or a
 * parallel {@link Pid}. The plant input is taken to be a current in A (a current-commanded drive); say
 * otherwise with {@link #inputUnit}.
 *
 * <p>Conversions (common practice): K<sub>p</sub>·60/1000 in (m/min)/mm; K<sub>v</sub>·2π/60 per rpm;
 * K<sub>v</sub>/1000 per mm/s on a linear axis; on a rotary motor driving a screw of lead h (m per turn)
 * the carriage moves v = ω·h/2π, so K<sub>v</sub> per mm/s of carriage is K<sub>v</sub>·2π/h/1000.
 * Values carry 6 significant digits (what a drive parameter needs). Immutable.
 */
public final class DriveGains implements Displayable {
    private enum Kind { PIV, VELOCITY_PI, PID }

    /** One parameter as the drive lists it. */
    public record Row(String parameter, double value, String unit) {}

    private final Kind kind;
    private final Piv piv;
    private final VelocityPi velocity;
    private final Pid pid;
    private final Motion motion;
    private final double screwLeadM;
    private final String inputUnit;

    private DriveGains(Kind kind, Piv piv, VelocityPi velocity, Pid pid, Motion motion, double screwLeadM, String inputUnit) {
        this.kind = kind;
        this.piv = piv;
        this.velocity = velocity;
        this.pid = pid;
        this.motion = Objects.requireNonNull(motion, "motion (Motion.ROTARY or Motion.LINEAR)");
        this.screwLeadM = screwLeadM;
        this.inputUnit = inputUnit;
    }

    /** PIV gains on a rotary axis (the library's default); {@link #linear()} or {@link #withScrewLeadM} for more. */
    public static DriveGains of(Piv piv) { return new DriveGains(Kind.PIV, Objects.requireNonNull(piv, "piv"), piv.velocity(), null, Motion.ROTARY, Double.NaN, "A"); }

    /** PIV gains on an axis of the given kind. */
    public static DriveGains of(Piv piv, Motion motion) { return of(piv).withMotion(motion); }

    /** A velocity PI alone (rotary unless said otherwise). */
    public static DriveGains of(VelocityPi velocity) {
        return new DriveGains(Kind.VELOCITY_PI, null, Objects.requireNonNull(velocity, "velocity"), null, Motion.ROTARY, Double.NaN, "A");
    }

    /** A parallel PID on the position error (rotary unless said otherwise). */
    public static DriveGains of(Pid pid) { return new DriveGains(Kind.PID, null, null, Objects.requireNonNull(pid, "pid"), Motion.ROTARY, Double.NaN, "A"); }

    public DriveGains withMotion(Motion motion) {
        if (motion == Motion.LINEAR && !Double.isNaN(screwLeadM)) throw new IllegalArgumentException("a screw lead belongs to a rotary motor; drop withScrewLeadM for a linear axis");
        return new DriveGains(kind, piv, velocity, pid, motion, screwLeadM, inputUnit);
    }

    /** A linear axis (gains per m, m/s of the moving part). */
    public DriveGains linear() { return withMotion(Motion.LINEAR); }

    /** A rotary motor driving a screw of {@code leadM} metres per turn: adds the gains at the carriage (per mm/s). */
    public DriveGains withScrewLeadM(double leadM) {
        if (!(leadM > 0) || !Double.isFinite(leadM)) throw new IllegalArgumentException("screw lead must be a positive number of metres per turn, got " + leadM + " (e.g. 0.01 for 10 mm)");
        if (motion != Motion.ROTARY) throw new IllegalArgumentException("a screw lead belongs to a rotary motor; the gains are on a linear axis already");
        return new DriveGains(kind, piv, velocity, pid, motion, leadM, inputUnit);
    }

    /** The plant input's unit, "A" unless said otherwise (e.g. "N·m" for a torque-commanded drive, "%" for a normalised command). */
    public DriveGains inputUnit(String unit) {
        if (unit == null || unit.isBlank()) throw new IllegalArgumentException("input unit must be a unit such as \"A\" or \"N·m\"");
        return new DriveGains(kind, piv, velocity, pid, motion, screwLeadM, unit.strip());
    }

    /** The rows, in the order a drive lists them. */
    public List<Row> rows() {
        List<Row> r = new ArrayList<>();
        String u = inputUnit;
        boolean screw = !Double.isNaN(screwLeadM);
        if (kind == Kind.PID) {
            String x = motion.positionUnit();
            r.add(new Row("proportional gain KP", pid.proportionalGain(), u + "/" + x));
            r.add(new Row("integral gain KI", pid.integralGain(), u + "/(" + x + "·s)"));
            r.add(new Row("derivative gain KD", pid.derivativeGain(), u + "/(" + motion.velocityUnit() + ")"));
            if (pid.hasDerivativeFilter()) {
                r.add(new Row("derivative filter corner", Units.radPerSToHz(1 / pid.derivativeFilterTimeConstantS()), "Hz"));
                r.add(new Row("derivative filter time constant", pid.derivativeFilterTimeConstantS() * 1e3, "ms"));
            } else {
                r.add(new Row("derivative filter corner", 0, "Hz (no filter)"));
            }
            return List.copyOf(r);
        }
        if (kind == Kind.PIV) {
            double kp = piv.positionGainPerS();
            r.add(new Row("position gain Kp", kp, "1/s"));
            if (motion == Motion.LINEAR || screw) r.add(new Row("position gain Kp", Motion.metresPerMinutePerMm(kp), "(m/min)/mm"));
        }
        double kv = velocity.velocityGain();
        r.add(new Row("velocity gain Kv", kv, u + "/(" + motion.velocityUnit() + ")"));
        if (motion == Motion.ROTARY) r.add(new Row("velocity gain Kv", kv * 2 * Math.PI / 60, u + "/rpm"));
        if (motion == Motion.LINEAR) r.add(new Row("velocity gain Kv", Motion.perMmPerS(kv), u + "/(mm/s)"));
        if (screw) r.add(new Row("velocity gain Kv at the carriage", Motion.perMmPerS(kv * 2 * Math.PI / screwLeadM), u + "/(mm/s)"));
        if (velocity.hasIntegral()) {
            r.add(new Row("velocity-integral corner", velocity.integralCornerHz(), "Hz"));
            r.add(new Row("velocity-integral time Ti", 1e3 / velocity.integralCornerRadPerS(), "ms"));
        } else {
            r.add(new Row("velocity-integral corner", 0, "Hz (no integral action)"));
        }
        return List.copyOf(r);
    }

    private String caption() {
        String what = switch (kind) {
            case PIV -> "PIV gains";
            case VELOCITY_PI -> "Velocity PI gains";
            case PID -> "PID gains on the position error";
        };
        String axis = motion == Motion.LINEAR ? "linear axis" : !Double.isNaN(screwLeadM)
                ? "rotary motor on a screw, lead " + Units.g4(screwLeadM * 1e3) + " mm" : "rotary axis";
        return what + ", " + axis + ", plant input " + (inputUnit.equals("A") ? "taken as a current in A" : "in " + inputUnit);
    }

    HtmlTable table() {
        HtmlTable t = HtmlTable.of(caption(), "Parameter", "Value", "Unit");
        for (Row r : rows()) t.row(r.parameter(), Units.digits6(r.value()), r.unit());
        return t;
    }

    /** The fixed-width parameter list and the caution (deterministic). */
    @Override public String toString() { return table().toText() + "Caution: " + DriveCaution.TEXT; }

    @Override public MimeBundle toMimeBundle() {
        return MimeBundle.builder(toString()).put(MimeBundle.TEXT_HTML, "<div class=\"loopledger-drive-parameters\">" + table()
                + "<p><strong>Caution.</strong> " + HtmlEscape.escape(DriveCaution.TEXT) + "</p></div>").build();
    }
}
