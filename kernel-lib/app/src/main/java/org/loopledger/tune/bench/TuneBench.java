package org.loopledger.tune.bench;

import org.loopledger.analysis.Margins;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.Cascade;
import org.loopledger.control.VelocityPi;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.tune.AutoTune;
import org.loopledger.tune.PlantCase;
import org.loopledger.tune.TuningResult;
import org.loopledger.tune.TuningSpec;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Benchmark (not a test): auto-tune on one 2,000-point FRF and on three at once (milliseconds per tune,
 * loop evaluations per second), against the reference measured in the same run: screening the same
 * number of loop gains through the general analysis path ({@code Margins.ofArrays}), which is what a
 * tuner without a dedicated screen would do. Plants: two-mass velocity plants (invented, for timing only).
 */
public final class TuneBench {
    private TuneBench() {}

    public static void main(String[] args) { run(System.out); }

    static TransferFunction twoMass(double j, double fa, double fr) {
        double wa = 2 * Math.PI * fa, wr = 2 * Math.PI * fr;
        return TransferFunction.continuous(new double[] {1}, new double[] {j, 0})
                .times(TransferFunction.continuous(new double[] {1, 2 * 0.03 * wa, wa * wa}, new double[] {1, 2 * 0.02 * wr, wr * wr}))
                .times(wr * wr / (wa * wa));
    }

    public static int run(PrintStream out) {
        double[] grid = FrequencyGrid.logSpacedRadPerS(2, 7000, 2000);
        DriveTiming drive = DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1).withZeroOrderHold(true);
        TuningSpec spec = TuningSpec.builder().positionBandwidthHz(40).build();
        List<PlantCase> three = new ArrayList<>();
        double[][] masses = {{4e-4, 300, 420}, {6e-4, 280, 400}, {9e-4, 250, 380}};
        for (double[] m : masses) three.add(PlantCase.of("J " + m[0], Frf.ofModel(twoMass(m[0], m[1], m[2]), grid)));
        List<PlantCase> one = List.of(three.get(0));
        for (int i = 0; i < 5; i++) { // warm-up (JIT)
            AutoTune.onMeasured(one, drive, FilterChain.none(), spec);
            AutoTune.onMeasured(three, drive, FilterChain.none(), spec);
        }
        double[] oneMs = time(one, drive, spec, 15), threeMs = time(three, drive, spec, 15);
        TuningResult r1 = AutoTune.onMeasured(one, drive, FilterChain.none(), spec);
        TuningResult r3 = AutoTune.onMeasured(three, drive, FilterChain.none(), spec);
        double refPerEvalUs = referenceMicrosPerEvaluation(one.get(0).plantToVelocity(), drive, 2000);
        double oneMed = median(oneMs), threeMed = median(threeMs);
        double evalsPerS1 = r1.evaluations() / (oneMed / 1e3), evalsPerS3 = r3.evaluations() / (threeMed / 1e3);
        out.printf(java.util.Locale.ROOT, "auto-tune, 1 FRF x 2000 points : median %.1f ms per tune, %d evaluations, %.0f evaluations/s%n", oneMed, r1.evaluations(), evalsPerS1);
        out.printf(java.util.Locale.ROOT, "auto-tune, 3 FRFs x 2000 points: median %.1f ms per tune, %d evaluations, %.0f evaluations/s%n", threeMed, r3.evaluations(), evalsPerS3);
        out.printf(java.util.Locale.ROOT, "reference, Margins.ofArrays on the same loops: %.1f us per evaluation, %.0f evaluations/s%n", refPerEvalUs, 1e6 / refPerEvalUs);
        out.printf(java.util.Locale.ROOT, "ratio (screen throughput / reference throughput): %.1fx (1 FRF), %.1fx (3 FRFs)%n",
                evalsPerS1 * refPerEvalUs / 1e6, evalsPerS3 * refPerEvalUs / 1e6);
        out.printf(java.util.Locale.ROOT, "target: under 200 ms for one FRF -> %s%n", oneMed < 200 ? "met" : "NOT met");
        return 0;
    }

    private static double[] time(List<PlantCase> cases, DriveTiming drive, TuningSpec spec, int reps) {
        double[] ms = new double[reps];
        for (int i = 0; i < reps; i++) {
            long t0 = System.nanoTime();
            AutoTune.onMeasured(cases, drive, FilterChain.none(), spec);
            ms[i] = (System.nanoTime() - t0) / 1e6;
        }
        return ms;
    }

    /** Builds a loop gain per trial gain and analyses it with the general path; µs per evaluation. */
    private static double referenceMicrosPerEvaluation(Frf plant, DriveTiming drive, int count) {
        double[] w = plant.omegaRadPerS();
        double[] re = plant.real(), im = plant.imag();
        Cascade.multiplyByVelocityPath(VelocityPi.ofRadPerS(1.0, 300), FilterChain.none(), drive, w, re, im);
        double[] lr = new double[w.length], li = new double[w.length];
        double sink = 0;
        for (int pass = 0; pass < 2; pass++) { // first pass warms up
            long t0 = System.nanoTime();
            for (int k = 0; k < count; k++) {
                double kv = 0.1 * Math.pow(1.002, k);
                for (int i = 0; i < w.length; i++) { lr[i] = kv * re[i]; li[i] = kv * im[i]; }
                Margins m = Margins.ofArrays(w, lr, li);
                sink += m.sensitivityPeak().magnitude();
            }
            if (pass == 1) {
                if (sink == 42) System.out.print("");
                return (System.nanoTime() - t0) / 1e3 / count;
            }
        }
        return Double.NaN;
    }

    private static double median(double[] v) {
        double[] c = v.clone();
        Arrays.sort(c);
        return c[c.length / 2];
    }
}
