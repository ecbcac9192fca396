package org.loopledger.sim;

import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Piv;
import org.loopledger.lti.Motion;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.Objects;

/**
 * Time responses of a PIV cascade on a fitted plant model, with the drive's discrete controller.
 *
 * <p><b>Model.</b> The plant P<sub>v</sub>(s) (continuous, strictly proper, current command to velocity in rad/s)
 * with the current-loop lag of the {@link DriveTiming} in front of it; position is the integral of velocity; a
 * torque disturbance enters at the plant input, after the current loop, in plant-input units (e.g. A of
 * equivalent current).
 *
 * <p><b>Each sample k</b> (t<sub>k</sub> = kT): sample x(t<sub>k</sub>) and v(t<sub>k</sub>); velocity command
 * K<sub>p</sub>(r<sub>k</sub> - x<sub>k</sub>) (or r<sub>k</sub> for a velocity step); velocity PI with backward-Euler
 * integral; the filters as prewarped-Tustin biquads; clamp to ±limit with the chosen {@link AntiWindup} (default
 * conditional integration). The command computed at t<sub>k</sub> reaches the plant at t<sub>k</sub> + τ<sub>c</sub>
 * (τ<sub>c</sub> = computation delay, any fraction of a sample) and is held until the next command arrives.
 *
 * <p><b>Between samples</b> the continuous plant is propagated exactly: the input is piecewise constant, changing
 * only at t<sub>k</sub> + τ<sub>c</sub>, so each sample splits into at most two sub-intervals, each propagated with the
 * matrix-exponential (zero-order-hold) solution. Hence the sampled outputs equal those of the plant's exact
 * zero-order-hold equivalent (with the modified z-transform for a fractional delay); the only approximation is
 * floating point. The hold is always part of a simulated drive, whatever {@link DriveTiming#hasZeroOrderHold()} says.
 *
 * <p>Immutable; each run starts from rest (all states zero).
 */
public final class ServoSimulation {
    private static final long MAX_SAMPLES = 20_000_000L;

    private final TransferFunction plant;
    private final Piv piv;
    private final FilterChain filters;
    private final DriveTiming timing;
    private final double currentLimit;
    private final AntiWindup antiWindup;
    private final Motion motion;

    private ServoSimulation(TransferFunction plant, Piv piv, FilterChain filters, DriveTiming timing, double currentLimit, AntiWindup antiWindup,
                            Motion motion) {
        this.motion = motion;
        this.plant = plant;
        this.piv = piv;
        this.filters = filters;
        this.timing = timing;
        this.currentLimit = currentLimit;
        this.antiWindup = antiWindup;
    }

    /**
     * Without a current limit; set one with {@link #withCurrentLimit}. The plant must be continuous, strictly proper
     * and free of a pure delay: a fitted model's delay goes into the timing's computation delay (the model
     * {@code withoutDelay()}, and τ·f<sub>s</sub> - 0.5 samples for a continuous fit, since the simulator adds the hold
     * itself; see {@link DriveTiming}).
     */
    public static ServoSimulation of(TransferFunction plantToVelocity, Piv piv, FilterChain filters, DriveTiming timing) {
        Objects.requireNonNull(plantToVelocity, "plant");
        Objects.requireNonNull(piv, "piv");
        Objects.requireNonNull(filters, "filters");
        Objects.requireNonNull(timing, "timing");
        if (plantToVelocity.isDiscrete()) {
            throw new IllegalArgumentException("simulate a continuous plant model (current to velocity in s), got a sampled one: " + plantToVelocity);
        }
        if (plantToVelocity.hasDelay()) {
            throw new IllegalArgumentException("the plant has a pure delay of " + Units.g4(plantToVelocity.delayS()) + " s; add it to the drive's "
                    + "computation delay (DriveTiming.withComputationDelaySamples) and simulate the rational part");
        }
        if (!plantToVelocity.isStrictlyProper()) {
            throw new IllegalArgumentException("the plant " + plantToVelocity + " passes current straight to velocity (not strictly proper); "
                    + "a physical axis has at least one integration from torque to velocity");
        }
        if (!timing.isSampled()) {
            throw new IllegalArgumentException("the simulation runs the discrete controller: give the drive's sample rate (DriveTiming.sampledAtHz)");
        }
        filters.requireBelowNyquist(timing.sampleRateHz());
        return new ServoSimulation(plantToVelocity, piv, filters, timing, Double.POSITIVE_INFINITY, AntiWindup.CONDITIONAL_INTEGRATION, Motion.ROTARY);
    }

    /** Clamp the current command to ±{@code limit} (plant-input units, e.g. A; positive). */
    public ServoSimulation withCurrentLimit(double limit) {
        if (!(limit > 0)) throw new IllegalArgumentException("current limit must be positive (e.g. 10 A), got " + limit);
        return new ServoSimulation(plant, piv, filters, timing, limit, antiWindup, motion);
    }

    public ServoSimulation withAntiWindup(AntiWindup a) {
        return new ServoSimulation(plant, piv, filters, timing, currentLimit, Objects.requireNonNull(a, "anti-windup"), motion);
    }

    /**
     * A linear axis (plant to velocity in m/s, positions in m) or rotary (the default, rad/s and rad): the
     * numbers are computed alike, the responses say which units they are in.
     */
    public ServoSimulation withMotion(Motion m) {
        return new ServoSimulation(plant, piv, filters, timing, currentLimit, antiWindup, Objects.requireNonNull(m, "motion"));
    }

    public double currentLimit() { return currentLimit; }

    /** Position reference step of {@code amplitudeRad} at t = 0, both loops closed. */
    public TimeResponse positionStep(double amplitudeRad, double durationS) { return run(Excitation.POSITION_STEP, amplitudeRad, durationS); }

    /** Position reference ramp r(t) = {@code rateRadPerS}·t from t = 0. */
    public TimeResponse positionRamp(double rateRadPerS, double durationS) { return run(Excitation.POSITION_RAMP, rateRadPerS, durationS); }

    /** Velocity command step of {@code amplitudeRadPerS}, position loop open. */
    public TimeResponse velocityStep(double amplitudeRadPerS, double durationS) { return run(Excitation.VELOCITY_STEP, amplitudeRadPerS, durationS); }

    /** Torque-disturbance step of {@code amplitude} (plant-input units, e.g. A) at the plant input from t = 0, reference 0. */
    public TimeResponse torqueDisturbanceStep(double amplitude, double durationS) {
        return run(Excitation.TORQUE_DISTURBANCE_STEP, amplitude, durationS);
    }

    private TimeResponse run(Excitation kind, double amplitude, double durationS) {
        if (!Double.isFinite(amplitude) || amplitude == 0) {
            throw new IllegalArgumentException(kind.label() + " amplitude must be finite and non-zero, got " + amplitude);
        }
        double fs = timing.sampleRateHz(), ts = 1 / fs;
        if (!(durationS > 0) || Double.isInfinite(durationS)) {
            throw new IllegalArgumentException("duration must be a finite positive number of seconds, got " + durationS);
        }
        long nl = (long) Math.floor(durationS * fs + 1e-9) + 1;
        if (nl > MAX_SAMPLES || nl < 2) {
            throw new IllegalArgumentException("a " + Units.g4(durationS) + " s run at " + Units.formatHz(fs) + " has " + nl
                    + " samples; keep it between 2 and " + MAX_SAMPLES);
        }
        int n = (int) nl;
        double cl = timing.currentLoopBandwidthHz().isPresent() ? Units.hzToRadPerS(timing.currentLoopBandwidthHz().getAsDouble()) : Double.POSITIVE_INFINITY;
        PlantPropagator p = new PlantPropagator(plant, cl);
        double delay = timing.computationDelaySamples();
        int m = (int) Math.floor(delay + 1e-12);
        double f = delay - m;
        if (f < 1e-12) f = 0;
        PlantPropagator.Step whole = f == 0 ? p.step(ts) : null;
        PlantPropagator.Step first = f > 0 ? p.step(f * ts) : null;
        PlantPropagator.Step rest = f > 0 ? p.step((1 - f) * ts) : null;
        DriveController c = new DriveController(piv, filters, fs, currentLimit, antiWindup);
        double kp = c.positionGain();
        double[] x = new double[p.n], scratch = new double[p.n];
        int hl = m + 2;
        double[] hist = new double[hl];
        double[] t = new double[n], ref = new double[n], pos = new double[n], vel = new double[n], cur = new double[n], fe = new double[n];
        double dist = kind == Excitation.TORQUE_DISTURBANCE_STEP ? amplitude : 0;
        for (int k = 0; k < n; k++) {
            double tk = k * ts;
            double xk = p.position(x), vk = p.velocity(x);
            double r = switch (kind) {
                case POSITION_STEP, VELOCITY_STEP -> amplitude;
                case POSITION_RAMP -> amplitude * tk;
                case TORQUE_DISTURBANCE_STEP -> 0;
            };
            double ev = kind == Excitation.VELOCITY_STEP ? r - vk : kp * (r - xk) - vk;
            double u = c.update(ev);
            hist[k % hl] = u;
            t[k] = tk;
            ref[k] = r;
            pos[k] = xk;
            vel[k] = vk;
            cur[k] = u;
            fe[k] = kind == Excitation.VELOCITY_STEP ? r - vk : r - xk;
            double ub = k - m < 0 ? 0 : hist[(k - m) % hl];
            if (f == 0) {
                whole.apply(x, ub, dist, scratch);
            } else {
                double ua = k - m - 1 < 0 ? 0 : hist[(k - m - 1) % hl];
                first.apply(x, ua, dist, scratch);
                rest.apply(x, ub, dist, scratch);
            }
        }
        return new TimeResponse(kind, amplitude, fs, t, ref, pos, vel, cur, fe, motion);
    }

    @Override public String toString() {
        return "servo simulation: " + piv + "; " + filters + "; " + timing + "; plant " + plant
                + (Double.isInfinite(currentLimit) ? "; no current limit" : "; current limit ±" + Units.g4(currentLimit) + ", anti-windup " + antiWindup);
    }
}
