package org.loopledger.tune;

import org.junit.jupiter.api.Test;
import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class ResonanceTest {
    /**
     * Two-mass velocity plant P = (1/(J s))·(s² + 2ζa ωa s + ωa²)/(s² + 2ζr ωr s + ωr²)·ωr²/ωa² (motor side;
     * standard two-inertia model, e.g. Ellis, Control System Design Guide, 4th ed., ch. 16, from memory).
     */
    static TransferFunction twoMass(double j, double fa, double za, double fr, double zr) {
        double wa = 2 * Math.PI * fa, wr = 2 * Math.PI * fr;
        TransferFunction rigid = TransferFunction.continuous(new double[] {1}, new double[] {j, 0});
        TransferFunction pair = TransferFunction.continuous(new double[] {1, 2 * za * wa, wa * wa}, new double[] {1, 2 * zr * wr, wr * wr});
        return rigid.times(pair).times(wr * wr / (wa * wa));
    }

    @Test
    void findsTheResonanceAndItsDampingByTheHalfPowerMethod() {
        // Half-power bandwidth: Δf ≈ 2ζ f for light damping (common practice); the antiresonance below it
        // and the trend removal bias the estimate a little, hence 2 % on frequency and 20 % on damping.
        double fr = 400, zr = 0.02;
        Frf p = Frf.ofModel(twoMass(5e-4, 250, 0.02, fr, zr), FrequencyGrid.logSpacedRadPerS(5, 3000, 3000));
        List<Resonance> found = Resonances.find(p, 6);
        assertFalse(found.isEmpty());
        Resonance r = found.get(0);
        assertEquals(fr, r.frequencyHz(), 0.02 * fr, r.toString());
        assertEquals(zr, r.dampingEstimate(), 0.2 * zr, r.toString());
        assertTrue(r.dampingResolved() && r.warnings().isEmpty(), "about 20 points across the peak: " + r);
        // a rigid body has none
        assertTrue(Resonances.find(Frf.ofModel(AutoTuneTest.rigid(5e-4), FrequencyGrid.logSpacedRadPerS(5, 3000, 500)), 3).isEmpty());
        assertThrows(IllegalArgumentException.class, () -> Resonances.find(p, 0));
    }

    @Test
    void aPeakNarrowerThanTheGridSpacingSaysItsDampingIsNotResolved() {
        // ζ = 0.001 at 400 Hz: half-power width 2ζf = 0.8 Hz (common practice), on a 300-point log grid from 5 to
        // 3000 Hz whose spacing at 400 Hz is 400·(ln 600/299) ≈ 8.6 Hz: the grid samples the peak once at most.
        double fr = 400;
        Frf coarse = Frf.ofModel(twoMass(5e-4, 250, 0.02, fr, 0.001), FrequencyGrid.logSpacedRadPerS(5, 3000, 300));
        Resonance r = Resonances.find(coarse, 6).get(0);
        assertFalse(r.dampingResolved(), r.toString());
        assertEquals(1, r.warnings().size(), r.toString());
        ResonanceWarning w = r.warnings().get(0);
        assertEquals(ResonanceWarning.Kind.DAMPING_NOT_RESOLVED, w.kind());
        assertEquals(fr, w.frequencyHz().getAsDouble(), 0.03 * fr);
        assertTrue(w.message().contains("damping not resolved") && w.message().contains("finer frequency resolution"), w.message());
        assertTrue(r.toString().contains("warning: damping not resolved"), r.toString());
        // the same resonance on a grid fine enough (0.05 Hz spacing, 16 points across the width): resolved, damping within 20 %
        Frf fine = Frf.ofModel(twoMass(5e-4, 250, 0.02, fr, 0.001), FrequencyGrid.logSpacedRadPerS(380, 420, 801));
        Resonance rf = Resonances.find(fine, 6).get(0);
        assertTrue(rf.dampingResolved(), rf.toString());
        assertEquals(0.001, rf.dampingEstimate(), 0.2 * 0.001, rf.toString());
    }

    @Test
    void theDemoAxisResonancesAreResolved() throws java.io.IOException {
        for (PlantCase c : DemoAxisTuningTest.demoCases()) {
            Resonance r = Resonances.find(c.plantToVelocity(), 6).get(0);
            assertTrue(r.warnings().isEmpty(), c.label() + ": " + r);
        }
    }

    @Test
    void aNotchOverAResonanceNearTheDelayPhaseCrossoverPays() {
        // A very lightly damped resonance at 1.2 kHz, where the 1-sample delay has taken the phase towards
        // -180°: without a notch its peak costs margin, with one the loop meets the spec at higher gain.
        DriveTiming drive = DriveTiming.sampledAtHz(16000).withComputationDelaySamples(1);
        double[] grid = FrequencyGrid.logSpacedRadPerS(5, 3000, 2000);
        List<PlantCase> cases = List.of(PlantCase.of("axis", Frf.ofModel(twoMass(5e-4, 900, 0.02, 1200, 0.005), grid)));
        TuningSpec spec = TuningSpec.builder().build();
        NotchProposal np = NotchProposal.propose(cases, drive, FilterChain.none(), spec, 6);
        assertEquals(1200, np.notch().centreHz(), 12);
        assertTrue(np.pays(), np.toString());
        assertTrue(np.with().reanalysisMeetsSpec(), np.toString());
        // same gains, notch added: the sensitivity peak drops (the notch removes the resonance's loop of the Nyquist curve)
        assertTrue(np.sameGainsWithNotch().get(0).velocityLoop().sensitivityPeak().magnitude()
                < np.without().cases().get(0).velocityLoop().sensitivityPeak().magnitude(), np.toString());
        var e = assertThrows(IllegalArgumentException.class, () -> NotchProposal.propose(
                List.of(PlantCase.of("rigid", Frf.ofModel(AutoTuneTest.rigid(5e-4), grid))), drive, FilterChain.none(), spec, 6));
        assertTrue(e.getMessage().contains("no notch is needed"));
    }

    /**
     * Physical two-mass axis, motor side, from the equations of motion J_M s²θ_M = T - (c s + k)(θ_M - θ_L),
     * J_L s²θ_L = (c s + k)(θ_M - θ_L): θ_M/T = (J_L s² + c s + k) / (s²·(J_M J_L s² + (J_M + J_L)(c s + k)))
     * (derivation by hand). Times s^(2 - integrators): to position (2), velocity (1), acceleration (0).
     */
    static TransferFunction physicalTwoMass(double jm, double jl, double k, double c, int integrators) {
        TransferFunction mech = TransferFunction.continuous(new double[] {jl, c, k}, new double[] {jm * jl, (jm + jl) * c, (jm + jl) * k, 0, 0});
        TransferFunction s = TransferFunction.continuous(new double[] {1, 0}, new double[] {1});
        for (int i = 0; i < 2 - integrators; i++) mech = mech.times(s);
        return mech;
    }

    @Test
    void antiresonanceAndResonanceOfATwoMassModelAtTheirClosedFormsToPositionVelocityAndAcceleration() {
        double jm = 3e-4, jl = 6e-4, k = 2000, c = 0.01; // kg·m², N·m/rad, N·m·s/rad (invented, for the check only)
        // closed forms (textbook / common practice): ω_a = √(k/J_L), ω_r = √(k (J_M + J_L)/(J_M J_L)); 290.6 Hz and 503.3 Hz
        double fa = Math.sqrt(k / jl) / (2 * Math.PI), fr = Math.sqrt(k * (jm + jl) / (jm * jl)) / (2 * Math.PI);
        // modal damping from the same polynomials (derivation by hand): 2ζ_a ω_a = c/J_L, 2ζ_r ω_r = c (J_M + J_L)/(J_M J_L)
        double za = c / (2 * jl * 2 * Math.PI * fa), zr = c * (jm + jl) / (2 * jm * jl * 2 * Math.PI * fr);
        double[] grid = FrequencyGrid.logSpacedRadPerS(10, 3000, 6000); // points 0.095 % apart
        for (int n : new int[] {Resonances.TO_POSITION, Resonances.TO_VELOCITY, Resonances.TO_ACCELERATION}) {
            Frf p = Frf.ofModel(physicalTwoMass(jm, jl, k, c, n), grid);
            List<Resonance> rs = Resonances.find(p, n, 6);
            List<Antiresonance> as = Resonances.findAntiresonances(p, n, 6);
            assertEquals(1, rs.size(), "integrators " + n + ": " + rs);
            assertEquals(1, as.size(), "integrators " + n + ": " + as);
            // Tolerance 0.2 %: two grid steps; damping shifts the extremes by O(ζ²) ≈ 1e-4 (derivation by hand)
            assertEquals(fr, rs.get(0).frequencyHz(), 0.002 * fr, "resonance, integrators " + n);
            assertEquals(fa, as.get(0).frequencyHz(), 0.002 * fa, "antiresonance, integrators " + n);
            // half-power width Δf ≈ 2ζf (common practice); the neighbouring extreme and trend removal bias it: 25 %
            assertEquals(zr, rs.get(0).dampingEstimate(), 0.25 * zr, "resonance damping, integrators " + n);
            assertEquals(za, as.get(0).dampingEstimate(), 0.25 * za, "antiresonance damping, integrators " + n);
            assertTrue(as.get(0).depthDb() > 20, as.get(0).toString());
        }
        // the velocity default agrees with the explicit form
        Frf v = Frf.ofModel(physicalTwoMass(jm, jl, k, c, 1), grid);
        assertEquals(Resonances.find(v, Resonances.TO_VELOCITY, 6), Resonances.find(v, 6));
        assertEquals(Resonances.findAntiresonances(v, Resonances.TO_VELOCITY, 6), Resonances.findAntiresonances(v, 6));
        // a rigid body to position has neither
        Frf rigid = Frf.ofModel(TransferFunction.continuous(new double[] {1}, new double[] {5e-4, 0, 0}), FrequencyGrid.logSpacedRadPerS(5, 3000, 500));
        assertTrue(Resonances.find(rigid, Resonances.TO_POSITION, 3).isEmpty());
        assertTrue(Resonances.findAntiresonances(rigid, Resonances.TO_POSITION, 3).isEmpty());
        assertThrows(IllegalArgumentException.class, () -> Resonances.findAntiresonances(v, 1, 0));
    }
}
