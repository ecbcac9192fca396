package org.loopledger.control;

import org.loopledger.analysis.GangOfFour;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Discretization;
import org.loopledger.lti.Polynomial;
import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * A PIV cascade around one plant: the controller, the plant and the loop gains at every break point, on the
 * plant's frequency grid. Built from a measured plant {@link Frf} or a continuous plant model
 * {@link TransferFunction} (evaluated on a grid), the same way, so both give the same numbers:
 * <pre>
 *   velocity loop (broken at the velocity feedback, position loop open)          L_v = C_v·F·D·P_v
 *   velocity closed loop                                                          T_v = L_v/(1 + L_v)
 *   position loop (broken at the position feedback, velocity loop closed)         L_p = K_p·T_v/(jω)
 *   position closed loop                                                          T_p = L_p/(1 + L_p)
 *   plant-input loop (broken at the current/torque command, both loops closed)    L_u = L_v·(1 + K_p/(jω)) = P·C
 *   controller on the position error                                              C = C_v·F·D·(jω + K_p)
 *   plant to position                                                             P = P_v/(jω)
 * </pre>
 * with P<sub>v</sub> the plant from current (or torque) command to velocity, C<sub>v</sub> the velocity PI, F the
 * filters on the current command, D the drive effects ({@link DriveTiming}: computation delay, hold, current loop).
 * Position is the integral of velocity (x = v/(jω)); velocity is taken as measured directly. C and F are evaluated in
 * continuous time for a continuous timing and at z = e<sup>jωT</sup> for a sampled one, so the grid must end at or
 * below the drive's Nyquist frequency.
 *
 * <p>D is counted in the controller C (it is the digital side of the loop: what reaches the plant is the filtered,
 * delayed, held current), so P·C = L<sub>u</sub> and the {@link #gangOfFour() Gang of Four} at the plant input has
 * PS = P/(1 + PC) from a torque disturbance to position and CS = C/(1 + PC) from position noise to the current.
 * 1 + L<sub>u</sub> = (1 + L<sub>v</sub>)(1 + L<sub>p</sub>) (algebra), so the plant-input loop, where torque
 * disturbances enter, is stable exactly when both nested loops are. C equals {@link Piv#equivalentSingleLoop()}·F·D.
 *
 * <p>Coherence of the plant data is carried to the loop gains and to P (they are functions of the plant point by
 * point); uncertainty is dropped. Loops around a model plant are marked {@link Frf#isComputedFromModel() computed}.
 * For a model plant without delay {@link #models()} gives exact transfer functions. Immutable.
 */
public final class Cascade {
    /** Names of {@link #loops()}, in its order. */
    public static final String VELOCITY_LOOP = "velocity loop", POSITION_LOOP = "position loop", PLANT_INPUT_LOOP = "plant-input loop";

    private final Frf plant;
    private final TransferFunction plantModel; // null for measured data
    private final Piv piv;
    private final FilterChain filters;
    private final DriveTiming timing;
    private final Frf velocityLoop, velocityClosedLoop, positionLoop, positionClosedLoop, plantInputLoop, controller, plantToPosition;

    private Cascade(Frf plant, TransferFunction plantModel, Piv piv, FilterChain filters, DriveTiming timing) {
        this.plant = Objects.requireNonNull(plant, "plant");
        this.plantModel = plantModel;
        this.piv = Objects.requireNonNull(piv, "piv");
        this.filters = Objects.requireNonNull(filters, "filters");
        this.timing = Objects.requireNonNull(timing, "timing");
        double[] w = plant.omegaRadPerS();
        timing.requireWithinNyquist(w);
        if (timing.isSampled()) filters.requireBelowNyquist(timing.sampleRateHz());
        int n = w.length;
        double kp = piv.positionGainPerS();
        double[] lvr = plant.real(), lvi = plant.imag();
        multiplyByVelocityPath(piv.velocity(), filters, timing, w, lvr, lvi);
        double[] cr = ComplexArrays.ones(n), ci = new double[n];
        multiplyByVelocityPath(piv.velocity(), filters, timing, w, cr, ci);
        double[] tvr = new double[n], tvi = new double[n], lpr = new double[n], lpi = new double[n], tpr = new double[n], tpi = new double[n];
        double[] lur = new double[n], lui = new double[n], pxr = new double[n], pxi = new double[n];
        for (int i = 0; i < n; i++) {
            complementary(lvr[i], lvi[i], tvr, tvi, i);
            double k = kp / w[i];
            // Kp/(jω)·T_v = -j·(Kp/ω)·T_v
            lpr[i] = k * tvi[i];
            lpi[i] = -k * tvr[i];
            complementary(lpr[i], lpi[i], tpr, tpi, i);
            // L_v·(1 - j·Kp/ω)
            lur[i] = lvr[i] + k * lvi[i];
            lui[i] = lvi[i] - k * lvr[i];
            // C_v·F·D·(Kp + jω)
            double a = cr[i], b = ci[i];
            cr[i] = kp * a - w[i] * b;
            ci[i] = kp * b + w[i] * a;
            // P_v/(jω) = -j·P_v/ω
            pxr[i] = plant.imagAt(i) / w[i];
            pxi[i] = -plant.realAt(i) / w[i];
        }
        this.velocityLoop = fromPlant(w, lvr, lvi);
        this.velocityClosedLoop = fromPlant(w, tvr, tvi);
        this.positionLoop = fromPlant(w, lpr, lpi);
        this.positionClosedLoop = fromPlant(w, tpr, tpi);
        this.plantInputLoop = fromPlant(w, lur, lui);
        this.plantToPosition = fromPlant(w, pxr, pxi);
        this.controller = Frf.ofParts(w, cr, ci).asComputedFromModel();
    }

    /** A measured plant, current (or torque) command to velocity (rad/s or m/s); the loops are on its grid. */
    public static Cascade of(Frf plantToVelocity, Piv piv, FilterChain filters, DriveTiming timing) {
        return new Cascade(plantToVelocity, null, piv, filters, timing);
    }

    /**
     * A continuous plant model, current (or torque) command to velocity, evaluated on {@code omegaRadPerS} (rad/s,
     * strictly increasing; not modified). The drive's sampling belongs in {@code timing}, not in the model.
     */
    public static Cascade of(TransferFunction plantToVelocity, Piv piv, FilterChain filters, DriveTiming timing, double[] omegaRadPerS) {
        Objects.requireNonNull(plantToVelocity, "plantToVelocity");
        if (plantToVelocity.isDiscrete()) {
            throw new IllegalArgumentException("the plant model must be continuous (current to velocity in s); got a sampled one " + plantToVelocity
                    + ". The drive's sampling is described by DriveTiming");
        }
        return new Cascade(Frf.ofModel(plantToVelocity, omegaRadPerS), plantToVelocity, piv, filters, timing);
    }

    /**
     * A drive running a parallel PID on the position error, through the PID's exact PIV form ({@link Pid#toPiv},
     * {@link Pid#toPivNearestPositionGain}): the PIV, with the PID's derivative-filter low-pass appended to
     * {@code filters}. {@link #controller()}, {@link #plantInputLoop()} and {@link #gangOfFour()} are the PID's own (its
     * single-loop transfer function does not depend on which zero became K<sub>p</sub>); {@link #velocityLoop()} and
     * {@link #positionLoop()} are those of the PIV form chosen (read {@link PidAsPiv#warnings()}). Exact for a continuous
     * timing; for a sampled one the PIV's discrete form (backward-Euler integral) is evaluated, which is a drive running
     * this PIV, not necessarily one running the PID with its own discretisation.
     */
    public static Cascade of(Frf plantToVelocity, PidAsPiv pid, FilterChain filters, DriveTiming timing) {
        return of(plantToVelocity, pid.piv(), withLowPass(filters, pid), timing);
    }

    /** As {@link #of(Frf, PidAsPiv, FilterChain, DriveTiming)} for a continuous plant model evaluated on {@code omegaRadPerS}. */
    public static Cascade of(TransferFunction plantToVelocity, PidAsPiv pid, FilterChain filters, DriveTiming timing, double[] omegaRadPerS) {
        return of(plantToVelocity, pid.piv(), withLowPass(filters, pid), timing, omegaRadPerS);
    }

    private static FilterChain withLowPass(FilterChain filters, PidAsPiv pid) {
        Objects.requireNonNull(filters, "filters");
        return pid.lowPass().map(filters::then).orElse(filters);
    }

    /** The same plant, filters and timing with other gains. */
    public Cascade withPiv(Piv other) { return new Cascade(plant, plantModel, other, filters, timing); }

    /** The same plant, gains and timing with other filters. */
    public Cascade withFilters(FilterChain other) { return new Cascade(plant, plantModel, piv, other, timing); }

    /**
     * (re + j·im) ← (re + j·im)·C<sub>v</sub>·F·D: velocity controller, filters and drive effects as the loop sees them
     * (discrete forms at z = e<sup>jωT</sup> when {@code timing} is sampled), on primitive arrays without allocation per
     * point: the kernel of {@link #velocityLoop()} for screening many candidates (the tuner). {@code omegaRadPerS} not modified.
     */
    public static void multiplyByVelocityPath(VelocityPi controller, FilterChain filters, DriveTiming timing, double[] omegaRadPerS, double[] re, double[] im) {
        if (timing.isSampled()) {
            ComplexArrays.multiplyBy(controller.discrete(timing.sampleTimeS()), omegaRadPerS, re, im);
            filters.multiplyDiscrete(timing.sampleRateHz(), omegaRadPerS, re, im);
        } else {
            ComplexArrays.multiplyBy(controller.continuous(), omegaRadPerS, re, im);
            filters.multiplyContinuous(omegaRadPerS, re, im);
        }
        timing.multiplyFactor(omegaRadPerS, re, im);
    }

    /** x/(1 + x) into out[i]. */
    private static void complementary(double xr, double xi, double[] outRe, double[] outIm, int i) {
        double dr = 1 + xr, di = xi;
        double d = dr * dr + di * di;
        if (d == 0) throw new IllegalArgumentException("the loop gain is exactly -1 at index " + i + ": the closed loop is marginally stable there");
        outRe[i] = (xr * dr + xi * di) / d;
        outIm[i] = (xi * dr - xr * di) / d;
    }

    /** A response computed point by point from the plant: its origin and coherence. */
    private Frf fromPlant(double[] w, double[] re, double[] im) {
        Frf f = Frf.ofParts(w, re, im);
        Frf g = plant.isComputedFromModel() ? f.asComputedFromModel() : f;
        return plant.coherence().map(g::withCoherence).orElse(g);
    }

    public Piv piv() { return piv; }

    public FilterChain filters() { return filters; }

    public DriveTiming timing() { return timing; }

    /** P<sub>v</sub>, current (or torque) command to velocity, as given (a model: evaluated on the grid). */
    public Frf plantToVelocity() { return plant; }

    /** P = P<sub>v</sub>/(jω), current (or torque) command to position. */
    public Frf plantToPosition() { return plantToPosition; }

    /** The plant model, when the cascade was built from one. */
    public Optional<TransferFunction> plantModel() { return Optional.ofNullable(plantModel); }

    /** The grid in rad/s (a copy). */
    public double[] omegaRadPerS() { return plant.omegaRadPerS(); }

    /**
     * C = C<sub>v</sub>·F·D·(jω + K<sub>p</sub>): the whole PIV as one controller from the position error to the current
     * (or torque) reaching the plant, filters and drive effects included, so that P·C = L<sub>u</sub>.
     */
    public Frf controller() { return controller; }

    /** L<sub>v</sub>, the velocity loop broken at the velocity feedback (position loop open). */
    public Frf velocityLoop() { return velocityLoop; }

    /** T<sub>v</sub>, velocity command to velocity. */
    public Frf velocityClosedLoop() { return velocityClosedLoop; }

    /** L<sub>p</sub> = K<sub>p</sub>T<sub>v</sub>/(jω), the position loop broken at the position feedback (velocity loop closed). */
    public Frf positionLoop() { return positionLoop; }

    /** T<sub>p</sub>, position reference to position. */
    public Frf positionClosedLoop() { return positionClosedLoop; }

    /** L<sub>u</sub> = P·C, broken at the plant input (current or torque command), both loops closed. */
    public Frf plantInputLoop() { return plantInputLoop; }

    /**
     * The three loop gains by name, in the order {@value #VELOCITY_LOOP}, {@value #POSITION_LOOP},
     * {@value #PLANT_INPUT_LOOP} (unmodifiable), for tables and specs over every break point.
     */
    public Map<String, Frf> loops() {
        Map<String, Frf> m = new LinkedHashMap<>();
        m.put(VELOCITY_LOOP, velocityLoop);
        m.put(POSITION_LOOP, positionLoop);
        m.put(PLANT_INPUT_LOOP, plantInputLoop);
        return Collections.unmodifiableMap(m);
    }

    /**
     * The Gang of Four at the plant input, of P = {@link #plantToPosition()} and C = {@link #controller()}:
     * S, T = L<sub>u</sub>/(1 + L<sub>u</sub>), PS (torque disturbance to position) and CS (position noise to current).
     * Computed on each call.
     */
    public GangOfFour gangOfFour() { return GangOfFour.of(plantToPosition, controller); }

    /**
     * Exact transfer functions of the loops, for a model plant without delay:
     * <ul>
     *   <li>continuous timing (a current-loop lag allowed): the continuous loops, the same functions as the {@code Frf}s;</li>
     *   <li>sampled timing with a whole number of samples of computation delay: the exact sampled-data loops at the
     *       sample instants, with the plant (and current-loop lag) replaced by its zero-order-hold equivalent, which
     *       contains the hold whatever {@link DriveTiming#hasZeroOrderHold()} says. These differ from the {@code Frf}s,
     *       which model the hold in continuous time (by sinc² of ωT/2 on a rigid body); they are what the simulator runs.</li>
     * </ul>
     * Empty for a measured plant, a plant with a delay, or a fractional computation delay (its sampled model needs the
     * modified z-transform; the {@code Frf}s keep it exact).
     */
    public Optional<Models> models() {
        if (plantModel == null || plantModel.hasDelay()) return Optional.empty();
        if (!timing.isSampled()) return Optional.of(continuousModels());
        double m = timing.computationDelaySamples();
        if (Math.abs(m - Math.rint(m)) > 1e-12) return Optional.empty();
        return Optional.of(sampledModels((int) Math.rint(m)));
    }

    /**
     * Loop gains and closed loops as transfer functions ({@link Cascade#models()}). Products are not reduced: common
     * factors are kept rather than cancelled numerically.
     */
    public record Models(TransferFunction velocityLoop, TransferFunction velocityClosedLoop, TransferFunction positionLoop,
                         TransferFunction positionClosedLoop, TransferFunction plantInputLoop) {
        public Models {
            Objects.requireNonNull(velocityLoop, "velocityLoop");
            Objects.requireNonNull(velocityClosedLoop, "velocityClosedLoop");
            Objects.requireNonNull(positionLoop, "positionLoop");
            Objects.requireNonNull(positionClosedLoop, "positionClosedLoop");
            Objects.requireNonNull(plantInputLoop, "plantInputLoop");
        }
    }

    /** L<sub>v</sub> = C<sub>v</sub>(s)F(s)G<sub>cl</sub>(s)P<sub>v</sub>(s), L<sub>u</sub> = L<sub>v</sub>(s + K<sub>p</sub>)/s, L<sub>p</sub> = K<sub>p</sub>T<sub>v</sub>/s. */
    private Models continuousModels() {
        TransferFunction lv = piv.velocity().continuous().times(filters.continuous()).times(timing.currentLoop()).times(plantModel);
        double kp = piv.positionGainPerS();
        TransferFunction tv = lv.feedback();
        TransferFunction lp = tv.times(TransferFunction.continuous(new double[] {1}, new double[] {1, 0})).times(kp);
        TransferFunction lu = lv.times(TransferFunction.continuous(new double[] {1, kp}, new double[] {1, 0}));
        return new Models(lv, tv, lp, lp.feedback(), lu);
    }

    /**
     * P<sub>v</sub>(z) = ZOH{G<sub>cl</sub>P<sub>v</sub>}, P<sub>x</sub>(z) = ZOH{G<sub>cl</sub>P<sub>v</sub>/s}, C(z) = C<sub>v</sub>(z)F(z)z<sup>-m</sup>:
     * L<sub>v</sub> = C·P<sub>v</sub>, L<sub>u</sub> = C·(K<sub>p</sub>P<sub>x</sub> + P<sub>v</sub>), L<sub>p</sub> = K<sub>p</sub>P<sub>x</sub>·C/(1 + L<sub>v</sub>),
     * written over common polynomials (P<sub>x</sub>'s denominator is P<sub>v</sub>'s times (z - 1)) so that no factor appears twice.
     */
    private Models sampledModels(int delaySamples) {
        double t = timing.sampleTimeS();
        TimeBase tb = TimeBase.sampled(t);
        TransferFunction pg = timing.currentLoop().times(plantModel);
        TransferFunction pv = Discretization.zoh(pg, t);
        TransferFunction px = Discretization.zoh(pg.times(TransferFunction.continuous(new double[] {1}, new double[] {1, 0})), t);
        // P_x has the poles of P_v and one more at z = 1 (the integrator, e^{0·T}); build its denominator as exactly
        // D_v·(z - 1) so that the closed loops below carry no duplicated, numerically uncancelled factors.
        Polynomial zm1 = Polynomial.ofDescending(1, -1);
        Polynomial dv = pv.denominator(), nv = pv.numerator(), dx = dv.times(zm1), nx = px.numerator();
        double[] dxa = dx.coefficientsDescending(), dxb = px.denominator().coefficientsDescending();
        double scale = 0, diff = 0;
        for (int i = 0; i < dxa.length; i++) {
            scale = Math.max(scale, Math.abs(dxa[i]));
            diff = Math.max(diff, Math.abs(dxa[i] - (i < dxb.length ? dxb[i] : 0)));
        }
        if (dxa.length != dxb.length || diff > 1e-9 * scale) {
            throw new IllegalStateException("zero-order-hold equivalents of P and P/s do not share their poles (" + px + " vs " + pv + ")");
        }
        double[] zm = new double[delaySamples + 1];
        zm[0] = 1;
        TransferFunction c = piv.velocity().discrete(t).times(filters.discrete(timing.sampleRateHz()))
                .times(TransferFunction.of(Polynomial.one(), Polynomial.ofDescending(zm), tb));
        Polynomial nc = c.numerator(), dc = c.denominator();
        double kp = piv.positionGainPerS();
        Polynomial closedV = dc.times(dv).plus(nc.times(nv));   // (1 + L_v)·D_c·D_v
        Polynomial fwdX = nx.times(nc).times(kp);               // K_p·N_x·N_c
        TransferFunction lv = TransferFunction.of(nc.times(nv), dc.times(dv), tb);
        TransferFunction tv = TransferFunction.of(nc.times(nv), closedV, tb);
        TransferFunction lp = TransferFunction.of(fwdX, zm1.times(closedV), tb);
        TransferFunction tp = TransferFunction.of(fwdX, zm1.times(closedV).plus(fwdX), tb);
        TransferFunction lu = TransferFunction.of(nc.times(nx.times(kp).plus(zm1.times(nv))), dc.times(dv).times(zm1), tb);
        return new Models(lv, tv, lp, tp, lu);
    }

    @Override public String toString() {
        return "PIV cascade (" + piv + "; " + filters + "; " + timing + ") on " + (plantModel != null ? "a plant model, " : "")
                + plant.size() + " points";
    }
}
