package org.loopledger.ident.fit;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.List;
import java.util.Random;
import java.util.Set;
import java.util.stream.Collectors;

import static org.junit.jupiter.api.Assertions.*;

/**
 * A fit says when it is not usable: fits to pure noise, to a model the data do not follow, and with
 * correlated parameters carry structured warnings; fits to data of the model itself carry none
 * (the demo datasets are checked in DemoFitTest).
 */
class FitChecksTest {
    static final double KT = 0.5;

    /** Seeded circular complex noise shaped like a velocity plant's 1/ω, so that |G|·ω is flat noise with random peaks. */
    static Frf pureNoise(long seed) {
        double[] w = FrequencyGrid.logSpacedRadPerS(5, 2000, 400);
        Random r = new Random(seed);
        double[] re = new double[w.length], im = new double[w.length];
        for (int i = 0; i < w.length; i++) {
            re[i] = r.nextGaussian() / w[i];
            im[i] = r.nextGaussian() / w[i];
        }
        return Frf.ofParts(w, re, im);
    }

    static Set<FitWarning.Kind> kinds(FitResult f) {
        return f.warnings().stream().map(FitWarning::kind).collect(Collectors.toSet());
    }

    static Set<String> flagged(FitResult f, FitWarning.Kind kind) {
        return f.warnings().stream().filter(w -> w.kind() == kind).map(w -> w.parameter().orElse("")).collect(Collectors.toSet());
    }

    @Test
    void aTwoMassFitToPureNoiseIsNotUsable() {
        TwoMassFit f = ModelFit.twoMass(pureNoise(1), FitOptions.velocity(KT));
        FitResult r = f.fit();
        assertFalse(r.isUsable(), r.toString());
        // noise is not described (rms log misfit near √2·1.3 for unit-variance complex noise), the optimiser ran the resonance out of the band
        // with an absurd damping, and the Jacobian is singular there (the zero-width intervals of the old output)
        assertTrue(kinds(r).containsAll(Set.of(FitWarning.Kind.POOR_FIT, FitWarning.Kind.OUTSIDE_BAND, FitWarning.Kind.OUTSIDE_PHYSICAL_RANGE,
                FitWarning.Kind.ILL_CONDITIONED)), r.toString());
        assertTrue(flagged(r, FitWarning.Kind.OUTSIDE_BAND).contains("resonance"), r.toString());
        FitWarning out = r.warnings().stream().filter(w -> w.kind() == FitWarning.Kind.OUTSIDE_BAND).findFirst().orElseThrow();
        assertEquals(f.estimate().resonanceHz(), out.frequencyHz().getAsDouble(), 0);
        assertTrue(f.estimate().resonanceHz() > 2000 || f.estimate().resonanceHz() < 5, f.toString());
        assertTrue(flagged(r, FitWarning.Kind.OUTSIDE_PHYSICAL_RANGE).contains("resonance damping"), r.toString());
        assertTrue(r.toString().contains("fit NOT usable"), r.toString());
    }

    @Test
    void aRigidBodyFitToPureNoiseIsNotUsable() {
        RigidBodyFit f = ModelFit.rigidBody(pureNoise(2), FitOptions.velocity(KT));
        FitResult r = f.fit();
        assertFalse(r.isUsable(), r.toString());
        assertTrue(kinds(r).contains(FitWarning.Kind.POOR_FIT), r.toString());
        // the friction pole (1.6 Hz) lies below the 5 Hz band and the noise leaves b free: a factor 16 interval
        assertTrue(flagged(r, FitWarning.Kind.NOT_DETERMINED).contains("viscous friction"), r.toString());
    }

    static Frf noisy(TransferFunction g, double[] w, double rel, long seed) {
        double[] re = new double[w.length], im = new double[w.length], sig = new double[w.length];
        g.response(w, re, im);
        Random r = new Random(seed);
        for (int i = 0; i < w.length; i++) {
            double m = Math.hypot(re[i], im[i]);
            sig[i] = rel * m;
            re[i] += sig[i] / Math.sqrt(2) * r.nextGaussian();
            im[i] += sig[i] / Math.sqrt(2) * r.nextGaussian();
        }
        return Frf.ofParts(w, re, im).withUncertainty(sig);
    }

    @Test
    void aParameterThatMovesWithTheBandIsFlaggedThoughItsIntervalIsTight() {
        // Data: a rigid body whose effective damping rises with frequency (a lead-lag 20/40 Hz on Kt/(J s + b)), 1 % noise.
        // A rigid-body fit gives tight intervals (±4 % on b), but refitted without the lowest third of the band b
        // nearly doubles: the data cannot pin it down (the real-axis case: 89 .. 372 N·s/m across bands).
        TransferFunction base = TransferFunction.continuous(new double[] {KT}, new double[] {5e-4, 1e-2});
        double w1 = 2 * Math.PI * 20, w2 = 2 * Math.PI * 40;
        TransferFunction leadLag = TransferFunction.continuous(new double[] {1 / w1, 1}, new double[] {1 / w2, 1});
        RigidBodyFit f = ModelFit.rigidBody(noisy(base.times(leadLag), FrequencyGrid.logSpacedRadPerS(2, 500, 300), 0.01, 5), FitOptions.velocity(KT));
        FitResult r = f.fit();
        ParameterEstimate b = r.parameter("viscous friction");
        assertTrue(b.high95() / b.low95() < 1.1, "the interval looks tight: " + b);
        assertFalse(r.isUsable(), r.toString());
        assertEquals(Set.of("inertia", "viscous friction"), flagged(r, FitWarning.Kind.BAND_DEPENDENT), r.toString());
        assertEquals(2, r.warnings().size(), "one warning per parameter: " + r);
        // the same fit on data of its own model: usable, no warning
        RigidBodyFit own = ModelFit.rigidBody(noisy(base, FrequencyGrid.logSpacedRadPerS(2, 500, 300), 0.01, 5), FitOptions.velocity(KT));
        assertTrue(own.fit().isUsable(), own.toString());
    }

    @Test
    void correlatedParametersFromTheCovariance() {
        // Covariance of (ln J, ln b) with ρ = 0.995 (by construction): the data fix a combination only.
        double s1 = 0.01, s2 = 0.02, rho = 0.995;
        double[][] cov = {{s1 * s1, rho * s1 * s2}, {rho * s1 * s2, s2 * s2}};
        List<ParameterEstimate> est = List.of(new ParameterEstimate("inertia", "kg·m²", 1e-3, 1e-5, 0.98e-3, 1.02e-3),
                new ParameterEstimate("viscous friction", "N·m·s/rad", 1e-2, 2e-4, 0.96e-2, 1.04e-2));
        List<FitWarning> w = FitChecks.check(new FitChecks.Input("rigid body", 5, 500, est, List.of("inertia", "viscous friction"), cov, 10, 0.01, 0,
                null, List.of(), band -> est));
        assertEquals(1, w.size(), w.toString());
        assertEquals(FitWarning.Kind.CORRELATED, w.get(0).kind());
        assertTrue(w.get(0).message().contains("inertia and viscous friction are correlated (ρ = +0.9950)"), w.get(0).message());
        // ρ = 0.9 passes
        double[][] mild = {{s1 * s1, 0.9 * s1 * s2}, {0.9 * s1 * s2, s2 * s2}};
        assertTrue(FitChecks.check(new FitChecks.Input("rigid body", 5, 500, est, List.of("inertia", "viscous friction"), mild, 10, 0.01, 0,
                null, List.of(), band -> est)).isEmpty());
    }

    @Test
    void subBandsDropAThirdOfTheBandButNeverTheResonanceRegion() {
        // 5 .. 3000 Hz: a third of the log band is a factor 600^(1/3) = 8.434
        double q = Math.cbrt(600);
        List<double[]> rb = FitChecks.subBands(5, 3000, 3000, 5);
        assertEquals(2, rb.size());
        assertArrayEquals(new double[] {5 * q, 3000}, rb.get(0), 1e-9);
        assertArrayEquals(new double[] {5, 3000 / q}, rb.get(1), 1e-9);
        List<double[]> tm = FitChecks.subBands(5, 3000, 212, 519); // keep the two-mass resonance region
        assertArrayEquals(new double[] {5 * q, 3000}, tm.get(0), 1e-9);
        assertArrayEquals(new double[] {5, 519}, tm.get(1), 1e-9);
    }
}
