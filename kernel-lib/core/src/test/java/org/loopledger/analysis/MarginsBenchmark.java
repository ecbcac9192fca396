package org.loopledger.analysis;

import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;

/**
 * Speed of the fast path (not a unit test): margins of a 2,000-point measured loop from primitive arrays,
 * as auto-tune calls it thousands of times. Run with
 * {@code java -cp kernel-lib/core/target/classes:kernel-lib/core/target/test-classes:<commons-math3.jar> org.loopledger.analysis.MarginsBenchmark}.
 */
public final class MarginsBenchmark {
    private MarginsBenchmark() {}

    public static void main(String[] args) {
        // a servo-like velocity loop (invented, for timing only): rigid body J = 0.01 kg m² with a two-mass
        // antiresonance at 500 rad/s (ζ = 0.01) and resonance at 700 rad/s (ζ = 0.02), 125 us of delay
        TransferFunction plant = TransferFunction.continuous(new double[] {1.0 / (500 * 500), 0.02 / 500, 1},
                new double[] {0.01 / (700 * 700), 0.01 * 0.04 / 700, 0.01, 0}).withDelay(125e-6);
        TransferFunction pi = TransferFunction.continuous(new double[] {2, 2 * 60}, new double[] {1, 0});
        double[] w = FrequencyGrid.logSpacedRadPerS(1, 8000, 2000);
        double[] re = new double[w.length], im = new double[w.length];
        plant.times(pi).response(w, re, im);
        int warm = 2000, runs = 5000;
        double sink = 0;
        for (int i = 0; i < warm; i++) sink += Margins.ofArrays(w, re, im).modulusMargin();
        long t0 = System.nanoTime();
        for (int i = 0; i < runs; i++) sink += Margins.ofArrays(w, re, im).modulusMargin();
        long t1 = System.nanoTime();
        System.out.println(Margins.ofArrays(w, re, im));
        System.out.printf("Margins.ofArrays on %d points: %.1f us per call (%d calls, checksum %.3f)%n", w.length, (t1 - t0) / 1e3 / runs, runs, sink);
        for (int i = 0; i < 50; i++) sink += Margins.of(plant.times(pi)).modulusMargin();
        long t2 = System.nanoTime();
        for (int i = 0; i < 50; i++) sink += Margins.of(plant.times(pi)).modulusMargin();
        long t3 = System.nanoTime();
        System.out.printf("Margins.of(model) with delay (grid built each call): %.2f ms per call%n", (t3 - t2) / 1e6 / 50);
        // a raw 2,000-point primitive scan as the yardstick (the machine is shared: compare ratios, not absolutes)
        long t4 = System.nanoTime();
        for (int k = 0; k < runs; k++) for (int i = 0; i < w.length; i++) sink += re[i] * re[i] + im[i] * im[i] > 1 ? 1 : 0;
        long t5 = System.nanoTime();
        System.out.printf("yardstick: one primitive pass over %d points: %.2f us (checksum %.1f)%n", w.length, (t5 - t4) / 1e3 / runs, sink);
    }
}
