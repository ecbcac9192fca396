package org.loopledger.control;

import org.loopledger.frf.Frf;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.lti.TransferFunction;
import org.loopledger.sim.ServoSimulation;

/**
 * Speed of the cascade loop gains and of the simulator (a benchmark main, not a unit test). Run with the test class
 * path: {@code java -cp target/classes:target/test-classes:<deps> org.loopledger.control.CascadeBenchmark}.
 */
public final class CascadeBenchmark {
    private CascadeBenchmark() {}

    public static void main(String[] args) {
        double fs = 16000;
        double[] w = FrequencyGrid.logSpacedRadPerS(1, fs / 2, 2000);
        TransferFunction p = CascadeTest.twoMassPlant();
        Frf plant = Frf.ofModel(p, w);
        Piv piv = Piv.of(150, 0.08, 25);
        FilterChain f = FilterChain.of(Notch.ofHz(400, 20, 100), LowPass2.ofHz(2000, 0.7));
        DriveTiming t = DriveTiming.sampledAtHz(fs).withComputationDelaySamples(1).withCurrentLoopBandwidthHz(3000);
        double sink = 0;
        for (int warm = 0; warm < 300; warm++) sink += Cascade.of(plant, piv, f, t).plantInputLoop().realAt(5);
        int reps = 2000;
        long t0 = System.nanoTime();
        for (int i = 0; i < reps; i++) sink += Cascade.of(plant, piv.withPositionGain(100 + i % 50), f, t).plantInputLoop().realAt(5);
        double msCascade = (System.nanoTime() - t0) / 1e6 / reps;
        ServoSimulation sim = ServoSimulation.of(p, piv, f, t).withCurrentLimit(10);
        for (int warm = 0; warm < 20; warm++) sink += sim.positionStep(0.01, 0.1).positionRad()[10];
        int simReps = 50;
        long t1 = System.nanoTime();
        for (int i = 0; i < simReps; i++) sink += sim.positionStep(0.01, 1.0).positionRad()[10];
        double msSim = (System.nanoTime() - t1) / 1e6 / simReps;
        System.out.printf("Cascade.of on a 2000-point FRF (all five loops, two filters, sampled drive): %.3f ms per evaluation%n", msCascade);
        System.out.printf("ServoSimulation: 1 s at 16 kHz (16001 samples, two-mass plant, two filters): %.2f ms per run (%.0f samples/ms)%n",
                msSim, 16001 / msSim);
        if (sink == 42) System.out.println();
    }
}
