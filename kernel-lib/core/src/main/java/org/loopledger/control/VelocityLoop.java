package org.loopledger.control;

import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.Objects;

/**
 * The inner (velocity) loop alone: L<sub>v</sub>(jω) = C<sub>v</sub>·F·D·P<sub>v</sub>, broken at the velocity feedback,
 * and its closed loop T<sub>v</sub> = L<sub>v</sub>/(1 + L<sub>v</sub>) from velocity command to velocity. C<sub>v</sub> and F
 * are evaluated in continuous time for a continuous {@link DriveTiming}, and in their discrete forms at
 * z = e<sup>jωT</sup> for a sampled one; D is {@link DriveTiming#multiplyFactor}. Coherence of the plant data,
 * when present, is carried to every result (they are deterministic functions of the plant point by point);
 * uncertainty is dropped. Immutable.
 */
public final class VelocityLoop {
    private final Frf plant;
    private final VelocityPi controller;
    private final FilterChain filters;
    private final DriveTiming timing;
    private final Frf loopGain;
    private final Frf closedLoop;

    private VelocityLoop(Frf plant, VelocityPi controller, FilterChain filters, DriveTiming timing) {
        this.plant = Objects.requireNonNull(plant, "plant");
        this.controller = Objects.requireNonNull(controller, "velocity controller");
        this.filters = Objects.requireNonNull(filters, "filters");
        this.timing = Objects.requireNonNull(timing, "timing");
        double[] w = plant.omegaRadPerS();
        timing.requireWithinNyquist(w);
        if (timing.isSampled()) filters.requireBelowNyquist(timing.sampleRateHz());
        double[] re = plant.real(), im = plant.imag();
        multiplyByController(controller, filters, timing, w, re, im);
        this.loopGain = withCoherence(Frf.ofParts(w, re, im), plant);
        double[] tr = new double[w.length], ti = new double[w.length];
        for (int i = 0; i < w.length; i++) complementary(re[i], im[i], tr, ti, i);
        this.closedLoop = withCoherence(Frf.ofParts(w, tr, ti), plant);
    }

    /** From a plant {@code Frf}, input (current or torque command) to velocity in rad/s. */
    public static VelocityLoop of(Frf plantToVelocity, VelocityPi controller, FilterChain filters, DriveTiming timing) {
        return new VelocityLoop(plantToVelocity, controller, filters, timing);
    }

    /** From a continuous plant model, evaluated on {@code omegaRadPerS} (not modified). */
    public static VelocityLoop of(TransferFunction plantToVelocity, VelocityPi controller, FilterChain filters, DriveTiming timing, double[] omegaRadPerS) {
        return new VelocityLoop(CascadeLoops.modelOnGrid(plantToVelocity, omegaRadPerS), controller, filters, timing);
    }

    /**
     * (re + j·im) ← (re + j·im)·C<sub>v</sub>·F·D: the controller, filters and drive effects as the loop sees them
     * (discrete forms when {@code timing} is sampled). {@code omegaRadPerS} not modified.
     */
    public static void multiplyByController(VelocityPi controller, FilterChain filters, DriveTiming timing, double[] omegaRadPerS, double[] re, double[] im) {
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
    static void complementary(double xr, double xi, double[] outRe, double[] outIm, int i) {
        double dr = 1 + xr, di = xi;
        double d = dr * dr + di * di;
        if (d == 0) throw new IllegalArgumentException("the loop gain is exactly -1 at index " + i + ": the closed loop is marginally stable there");
        outRe[i] = (xr * dr + xi * di) / d;
        outIm[i] = (xi * dr - xr * di) / d;
    }

    static Frf withCoherence(Frf f, Frf source) {
        Frf g = source.isComputedFromModel() ? f.asComputedFromModel() : f; // a loop around a model plant is a model's response
        return source.coherence().map(g::withCoherence).orElse(g);
    }

    public Frf plant() { return plant; }

    public VelocityPi controller() { return controller; }

    public FilterChain filters() { return filters; }

    public DriveTiming timing() { return timing; }

    /** L<sub>v</sub> = C<sub>v</sub>·F·D·P<sub>v</sub>. */
    public Frf loopGain() { return loopGain; }

    /** T<sub>v</sub> = L<sub>v</sub>/(1 + L<sub>v</sub>), velocity command to velocity. */
    public Frf closedLoop() { return closedLoop; }

    @Override public String toString() {
        return "velocity loop: " + controller + "; " + filters + "; " + timing + "; plant " + plant;
    }
}
