package org.loopledger.ident.demo;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.loopledger.frf.Frf;
import org.loopledger.ident.fit.FitOptions;
import org.loopledger.ident.fit.ModelFit;
import org.loopledger.ident.fit.ParameterEstimate;
import org.loopledger.ident.fit.RigidBodyFit;
import org.loopledger.ident.fit.TwoMassFit;
import org.loopledger.ident.fit.TwoMassParameters;
import org.loopledger.ident.log.DriveLog;
import org.loopledger.ident.log.DriveLogReader;
import org.loopledger.ident.log.LogCheckOptions;
import org.loopledger.ident.spectral.PeriodicAverage;
import org.loopledger.lti.Units;

import java.io.IOException;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The whole identification chain on the committed synthetic datasets: read the CSV (Tablesaw, checks),
 * synchronous average over the PRBS periods (closed loop, excitation at the current command), fit the
 * two-mass model, compare with the true parameters the generator documents (derived exactly from the
 * invented physical parameters, {@link GantryAxis#modalTruth}).
 */
class DemoFitTest {
    static final double FS = DriveLoopSettings.demo().sampleRateHz();

    static DriveLog load(GantryLoadCase c) throws IOException {
        return DriveLogReader.read(DatasetsFolder.find().resolve(c.fileName()), LogCheckOptions.defaults().withSampleRateHz(FS));
    }

    static Frf velocityFrf(DriveLog log) {
        int period = ((1 << DriveLoopSettings.demo().prbsOrder()) - 1) * DriveLoopSettings.demo().prbsSamplesPerBit();
        PeriodicAverage pa = PeriodicAverage.of(log.sampleRateHz(), period, 1, log.injectedCurrentA(), log.measuredCurrentA(), log.velocityRadPerS());
        return pa.frf(1, 2, 0);
    }

    @ParameterizedTest
    @EnumSource(GantryLoadCase.class)
    void twoMassFitRecoversTheTrueParametersWithinTheirConfidence(GantryLoadCase c) throws IOException {
        DriveLog log = load(c);
        assertEquals(FS, log.sampleRateHz(), 1e-9);
        assertTrue(log.warnings().isEmpty(), log.warnings().toString());
        Frf g = velocityFrf(log);
        FitOptions o = FitOptions.velocity(GantryLoadCase.TORQUE_CONSTANT_NM_PER_A).sampledAt(1 / FS).withDelay().bandHz(5, 3000);
        TwoMassFit fit = ModelFit.twoMass(g, o);
        TwoMassParameters truth = DemoDatasets.truth(c);
        Map<String, Double> expected = Map.of(
                "inertia", truth.inertiaKgM2(), "viscous friction", truth.viscousNmsPerRad(),
                "resonance", truth.resonanceHz(), "resonance damping", truth.resonanceDamping(),
                "antiresonance", truth.antiresonanceHz(), "antiresonance damping", truth.antiresonanceDamping(),
                "inertia ratio", truth.inertiaRatio(), "delay", truth.delayS());
        // 8 parameters × 3 load cases: at 95 % about one would miss by chance, so each truth must lie
        // within 3.5 standard errors (two-sided p ≈ 5e-4 each; the fixed seeds make the outcome repeatable)
        for (Map.Entry<String, Double> e : expected.entrySet()) {
            ParameterEstimate p = fit.fit().parameter(e.getKey());
            assertTrue(p.standardErrorsFrom(e.getValue()) < 3.5, c + ": " + p + " vs true " + e.getValue() + " (" + p.standardErrorsFrom(e.getValue()) + " σ)\n" + fit);
        }
        // the resonance is located to better than 0.5 %, the inertia to 1 %: the fit is informative, not just wide
        assertEquals(truth.resonanceHz(), fit.estimate().resonanceHz(), 0.005 * truth.resonanceHz(), fit.toString());
        assertEquals(truth.inertiaKgM2(), fit.estimate().inertiaKgM2(), 0.01 * truth.inertiaKgM2(), fit.toString());
        // weights from the period-to-period noise make the reduced chi² about 1 (9 periods: the variance
        // estimates carry 8 degrees of freedom, which inflates chi² by about 8/6; 0.7 .. 2 allows that)
        assertTrue(fit.fit().reducedChiSquare() > 0.7 && fit.fit().reducedChiSquare() < 2, fit.toString());
        assertFalse(fit.fit().quality().isEmpty());
        // and the usability checks find nothing to warn about
        assertTrue(fit.fit().isUsable(), c + ": " + fit);
    }

    @Test
    void rigidBodyFitShowsMinus40DbPerDecadeAboveTheMechanicalPole() throws IOException {
        // Common practice: current → position of a rigid body falls at -40 dB/decade above b/J.
        DriveLog log = load(GantryLoadCase.HEAVY_HEAD);
        int period = ((1 << DriveLoopSettings.demo().prbsOrder()) - 1) * DriveLoopSettings.demo().prbsSamplesPerBit();
        PeriodicAverage pa = PeriodicAverage.of(FS, period, 1, log.injectedCurrentA(), log.measuredCurrentA(), log.positionRad());
        Frf pos = pa.frf(1, 2, 0, 4, 50); // well below the antiresonance (235 Hz) the axis moves as one body
        // no delay: 62.5 µs turns the phase by 1.1° at 50 Hz, which this band cannot resolve (asked for, it is flagged, see below)
        RigidBodyFit fit = ModelFit.rigidBody(pos, FitOptions.position(GantryLoadCase.TORQUE_CONSTANT_NM_PER_A));
        TwoMassParameters truth = DemoDatasets.truth(GantryLoadCase.HEAVY_HEAD);
        // below 50 Hz the coupling still lowers the magnitude by up to (1-(f/fa)²)/(1-(f/fr)²) ≈ 0.98: 5 % on J
        assertEquals(truth.inertiaKgM2(), fit.estimate().inertiaKgM2(), 0.05 * truth.inertiaKgM2(), fit.toString());
        assertTrue(fit.fit().isUsable(), fit.toString());
        RigidBodyFit withDelay = ModelFit.rigidBody(pos, FitOptions.position(GantryLoadCase.TORQUE_CONSTANT_NM_PER_A).withDelay());
        assertEquals(1, withDelay.fit().warnings().size(), withDelay.toString());
        assertEquals(org.loopledger.ident.fit.FitWarning.Kind.NOT_DETERMINED, withDelay.fit().warnings().get(0).kind());
        assertEquals("delay", withDelay.fit().warnings().get(0).parameter().orElseThrow());
        // slope of the fitted model well above the pole: d(20 log10|G|)/d(log10 f) at 20× the pole is
        // -20 - 20/(1 + 1/400) ≈ -39.95 (derivation by hand)
        double fp = fit.estimate().mechanicalPoleHz();
        double f1 = 20 * fp, f2 = 200 * fp;
        double m1 = fit.fit().model().response(Units.hzToRadPerS(f1)).abs(), m2 = fit.fit().model().response(Units.hzToRadPerS(f2)).abs();
        assertEquals(-40.0, 20 * Math.log10(m2 / m1), 0.1);
        // and the data: least-squares slope of dB against log10 f over 10 .. 50 Hz
        double[] f = pos.frequencyHz(), db = pos.magnitudeDb();
        double sx = 0, sy = 0, sxx = 0, sxy = 0;
        int n = 0;
        for (int i = 0; i < f.length; i++) {
            if (f[i] < 10 || f[i] > 50) continue;
            double x = Math.log10(f[i]);
            sx += x; sy += db[i]; sxx += x * x; sxy += x * db[i]; n++;
        }
        double slope = (n * sxy - sx * sy) / (n * sxx - sx * sx);
        // 1.5 dB/decade: the friction pole (1.1 Hz) adds -0.2 at 10 Hz, the coupling adds a little rise towards 50 Hz
        assertEquals(-40.0, slope, 1.5, "measured slope");
    }
}
