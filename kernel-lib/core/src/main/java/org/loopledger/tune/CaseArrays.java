package org.loopledger.tune;

import org.loopledger.control.DriveTiming;
import org.loopledger.control.FilterChain;
import org.loopledger.control.LowPass2;
import org.loopledger.control.Cascade;
import org.loopledger.control.VelocityPi;
import org.loopledger.frf.Frf;

/**
 * Per load case, the primitive arrays the search works on: the grid, the fixed part of the velocity
 * loop B = P·F·D (plant, user's filters, drive effects) and the integral basis g, with
 * C<sub>v</sub> = K<sub>v</sub>(1 + ω<sub>i</sub>·g) so that L<sub>v</sub> = K<sub>v</sub>·B·(1 + ω<sub>i</sub>g).
 * g is read off {@link VelocityPi} itself (g = C(K<sub>v</sub> = 1, ω<sub>i</sub> = 1) - 1), so the
 * search and the controller the drive runs cannot disagree. Mutable scratch space; one per thread.
 */
final class CaseArrays {
    final String label;
    final Frf plant;
    final int n;
    final double[] omega;
    final double[] fixedRe, fixedIm;  // B without any tuner-placed low-pass
    final double[] gRe, gIm;
    final double fixedPhase0;          // unwrapped phase of B at omega[0]
    final double[] baseRe, baseIm;     // B with the candidate low-pass
    final double[] lRe, lIm;           // scratch loop gain
    final double[] l2Re, l2Im;         // second scratch

    CaseArrays(PlantCase pc, DriveTiming timing, FilterChain filters) {
        this.label = pc.label();
        this.plant = pc.plantToVelocity();
        this.omega = plant.omegaRadPerS();
        this.n = omega.length;
        if (timing.isSampled()) timing.requireWithinNyquist(omega);
        fixedRe = plant.real();
        fixedIm = plant.imag();
        // B = P·F·D: multiply by the controller with Kv = 1, ωi = 0 (a pure unit gain), i.e. filters and drive effects only.
        Cascade.multiplyByVelocityPath(VelocityPi.proportional(1.0), filters, timing, omega, fixedRe, fixedIm);
        double[] unitRe = new double[n], unitIm = new double[n];
        java.util.Arrays.fill(unitRe, 1.0);
        Cascade.multiplyByVelocityPath(VelocityPi.ofRadPerS(1.0, 1.0), FilterChain.none(), withoutDrive(timing), omega, unitRe, unitIm);
        gRe = new double[n];
        gIm = new double[n];
        for (int i = 0; i < n; i++) {
            gRe[i] = unitRe[i] - 1.0;
            gIm[i] = unitIm[i];
        }
        double p0 = plant.phaseRadUnwrapped()[0];
        double[] fr = {1.0}, fi = {0.0};
        Cascade.multiplyByVelocityPath(VelocityPi.proportional(1.0), filters, timing, new double[] {omega[0]}, fr, fi);
        fixedPhase0 = p0 + Math.atan2(fi[0], fr[0]);
        baseRe = fixedRe.clone();
        baseIm = fixedIm.clone();
        lRe = new double[n];
        lIm = new double[n];
        l2Re = new double[n];
        l2Im = new double[n];
    }

    /** The same time base as {@code timing} but with no delay, hold or current loop: the controller alone. */
    private static DriveTiming withoutDrive(DriveTiming timing) {
        if (!timing.isSampled()) return DriveTiming.continuous();
        return DriveTiming.sampledAtHz(timing.sampleRateHz()).withComputationDelaySamples(0).withZeroOrderHold(false).withoutCurrentLoopLag();
    }

    /** base ← fixed·LP(ω) (LP null: base ← fixed). */
    void setLowPass(LowPass2 lp, DriveTiming timing) {
        System.arraycopy(fixedRe, 0, baseRe, 0, n);
        System.arraycopy(fixedIm, 0, baseIm, 0, n);
        if (lp != null) {
            FilterChain chain = FilterChain.of(lp);
            if (timing.isSampled()) chain.multiplyDiscrete(timing.sampleRateHz(), omega, baseRe, baseIm);
            else chain.multiplyContinuous(omega, baseRe, baseIm);
        }
    }

    /** |B(ω)| at any ω inside the grid, interpolated linearly in log|B| over log ω. */
    double baseMagnitudeAt(double w) {
        int i = bracket(w);
        double a = Math.log(Math.hypot(baseRe[i], baseIm[i])), b = Math.log(Math.hypot(baseRe[i + 1], baseIm[i + 1]));
        double t = Math.log(w / omega[i]) / Math.log(omega[i + 1] / omega[i]);
        return Math.exp(a + t * (b - a));
    }

    /** |1 + ωi·g(ω)| at ω, interpolated the same way (g is smooth). */
    double piMagnitudeAt(double w, double omegaI) {
        int i = bracket(w);
        double a = Math.log(Math.hypot(1 + omegaI * gRe[i], omegaI * gIm[i]));
        double b = Math.log(Math.hypot(1 + omegaI * gRe[i + 1], omegaI * gIm[i + 1]));
        double t = Math.log(w / omega[i]) / Math.log(omega[i + 1] / omega[i]);
        return Math.exp(a + t * (b - a));
    }

    private int bracket(double w) {
        int i = java.util.Arrays.binarySearch(omega, w);
        if (i >= 0) return Math.min(i, n - 2);
        int ins = -i - 1;
        return Math.max(0, Math.min(ins - 1, n - 2));
    }

    /** lRe/lIm ← kv·base·(1 + ωi·g); returns the unwrapped phase of L at omega[0]. */
    double velocityLoop(double kv, double omegaI) {
        for (int i = 0; i < n; i++) {
            double pr = 1 + omegaI * gRe[i], pi = omegaI * gIm[i];
            double br = baseRe[i], bi = baseIm[i];
            lRe[i] = kv * (br * pr - bi * pi);
            lIm[i] = kv * (br * pi + bi * pr);
        }
        double lpPhase0 = Math.atan2(baseIm[0], baseRe[0]) - Math.atan2(fixedIm[0], fixedRe[0]);
        return fixedPhase0 + lpPhase0 + Math.atan2(omegaI * gIm[0], 1 + omegaI * gRe[0]);
    }
}
