package org.loopledger.sim;

import org.junit.jupiter.api.Test;
import org.loopledger.control.Cascade;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.LowPass2;
import org.loopledger.control.Notch;
import org.loopledger.control.Piv;
import org.loopledger.lti.TransferFunction;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The frequency-domain view and the simulator describe the same sampled loop: the step responses of the exact
 * sampled closed loops of {@link Cascade#models()} for a sampled drive (run as difference equations here, a definition
 * of a z-transfer function) equal the simulator's samples. Whole-sample delays only (that is where the sampled
 * transfer functions exist).
 */
class SampledLoopConsistencyTest {
    /** y = H(z)·u for H = N/D in descending powers of z, from rest. */
    static double[] filter(TransferFunction h, double[] u) {
        double[] den = h.denominator().coefficientsDescending();
        int n = den.length - 1;
        double[] b = new double[n + 1];
        for (int j = 0; j <= n; j++) b[j] = h.numerator().coefficientOfPower(n - j);
        double[] y = new double[u.length];
        for (int k = 0; k < u.length; k++) {
            double s = 0;
            for (int j = 0; j <= n && j <= k; j++) s += b[j] * u[k - j];
            for (int j = 1; j <= n && j <= k; j++) s -= den[j] * y[k - j];
            y[k] = s / den[0];
        }
        return y;
    }

    private static void check(TransferFunction plant, Piv piv, FilterChain f, DriveTiming t, double tol) {
        Cascade.Models tf = Cascade.of(plant, piv, f, t, FrequencyGrid.logSpacedRadPerS(1, 0.4 * t.sampleRateHz(), 10)).models().orElseThrow();
        ServoSimulation sim = ServoSimulation.of(plant, piv, f, t);
        TimeResponse vs = sim.velocityStep(1, 0.05), ps = sim.positionStep(1, 0.05);
        double[] u = new double[vs.size()];
        java.util.Arrays.fill(u, 1);
        double[] tv = filter(tf.velocityClosedLoop(), u), tp = filter(tf.positionClosedLoop(), u);
        double dv = 0, dp = 0;
        for (int k = 0; k < u.length; k++) {
            dv = Math.max(dv, Math.abs(tv[k] - vs.velocityRadPerS()[k]));
            dp = Math.max(dp, Math.abs(tp[k] - ps.positionRad()[k]));
        }
        System.out.printf("sampled loop vs simulator: velocity step %.1e, position step %.1e (unit steps)%n", dv, dp);
        assertTrue(dv < tol && dp < tol, dv + " " + dp);
    }

    @Test void frictionPlantWithFiltersAndOneSampleDelay() {
        // 1e-6 on unit steps: the expanded closed-loop polynomials (order 7 to 9, every pole clustered near z = 1 at a
        // 16 kHz rate) run as difference equations lose most of their digits to that clustering (measured 2e-9 velocity,
        // 1.5e-7 position); the simulator itself agrees with SciPy to 1e-13. A wrong formula gives errors of order 1
        // (an earlier draft with duplicated uncancelled factors was off by 90).
        check(ServoSimulationTest.frictionPlant(), Piv.of(120, 0.2, 20),
                FilterChain.of(Notch.ofHz(400, 20, 100), LowPass2.ofHz(1500, 0.7)), DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1), 1e-6);
    }

    @Test void twoMassPlantWithCurrentLoopAndTwoSampleDelay() {
        check(ServoSimulationTest.twoMassPlant(), Piv.of(120, 0.2, 20), FilterChain.of(Notch.ofHz(400, 20, 100)),
                DriveTiming.sampledAtHz(8000).withComputationDelaySamples(2).withCurrentLoopBandwidthHz(1500), 1e-6);
    }
}
