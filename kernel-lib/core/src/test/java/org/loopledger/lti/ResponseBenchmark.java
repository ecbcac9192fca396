package org.loopledger.lti;

import org.loopledger.frf.FrequencyGrid;

/**
 * Speed of the allocation-free grid evaluation (a benchmark main, not a timed unit test):
 * {@code java -cp kernel-lib/core/target/classes:kernel-lib/core/target/test-classes:<commons-math3.jar> org.loopledger.lti.ResponseBenchmark}.
 * Evaluates a 6th-order continuous model with delay, its 16 kHz ZOH equivalent in coefficient form, and
 * the same as a state-space model ({@link Discretization#zohStateSpace}) on a 2,000-point grid.
 */
public final class ResponseBenchmark {
    private ResponseBenchmark() {}

    public static void main(String[] args) {
        TransferFunction g = TransferFunction.continuous(new double[] {1, 30, 4e5},
                Polynomial.ofDescending(1, 0, 0).times(Polynomial.ofDescending(1, 188, 3.55e6)).times(Polynomial.ofDescending(1, 2e3, 4e6))
                        .coefficientsDescending()).withDelay(1e-4);
        TransferFunction d = Discretization.zoh(g, 1 / 16000.0);
        double[] w = FrequencyGrid.logSpacedRadPerS(1, 8000, 2000);
        double[] re = new double[w.length], im = new double[w.length];
        int reps = 5000;
        for (TransferFunction m : new TransferFunction[] {g, d}) {
            for (int k = 0; k < reps; k++) m.response(w, re, im); // warm up
            long t0 = System.nanoTime();
            for (int k = 0; k < reps; k++) m.response(w, re, im);
            double ms = (System.nanoTime() - t0) / 1e6;
            System.out.printf("%s: %d evaluations of a %d-point grid in %.1f ms (%.1f ns per point)%n",
                    m.isDiscrete() ? "sampled 16 kHz" : "continuous", reps, w.length, ms, ms * 1e6 / reps / w.length);
        }
        // The polynomial-free ZOH response: one 6x6 complex LU per point.
        StateSpace ss = Discretization.zohStateSpace(g.withoutDelay(), 1 / 16000.0);
        int ssReps = reps / 10;
        for (int k = 0; k < ssReps; k++) ss.response(w, re, im);
        long t0 = System.nanoTime();
        for (int k = 0; k < ssReps; k++) ss.response(w, re, im);
        double ms = (System.nanoTime() - t0) / 1e6;
        System.out.printf("state-space ZOH 16 kHz: %d evaluations of a %d-point grid in %.1f ms (%.1f ns per point)%n",
                ssReps, w.length, ms, ms * 1e6 / ssReps / w.length);
    }
}
