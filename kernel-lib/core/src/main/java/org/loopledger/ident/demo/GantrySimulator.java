package org.loopledger.ident.demo;

import org.loopledger.ident.excitation.Prbs;
import org.loopledger.ident.excitation.PrbsPolynomial;

import java.util.Random;

/**
 * Deterministic closed-loop simulation of the synthetic gantry axis (SYNTHETIC). The mechanics are
 * discretised exactly for a zero-order-held current (matrix exponential of [[A, B], [0, 0]]·T, Franklin,
 * Powell and Workman, Digital Control of Dynamic Systems, 3rd ed., section 4.3.3), computed with plain
 * arithmetic only (Taylor series after scaling, then squaring), and noise comes from
 * {@link Random#nextGaussian()} with a fixed seed: both are specified bit for bit by Java 17, so the
 * output is identical on every machine.
 *
 * <p>Per sample k (state at t = kT, current i<sub>k</sub> held over [kT, (k+1)T)):
 * v<sub>k</sub> = ω<sub>m</sub>((k-1)T) + noise (one-sample measurement delay); filtered; PI on -v;
 * i<sub>cmd</sub> = PI + r<sub>k</sub>, clipped; i<sub>k+1</sub> = i<sub>cmd</sub> (computation delay);
 * logged measured current = i<sub>k</sub> + noise; torque = K<sub>t</sub>(i<sub>k</sub> + d<sub>k</sub>).
 */
public final class GantrySimulator {
    private GantrySimulator() {}

    /** The simulated log. Arrays are owned by the record (internal use; copy before handing out). */
    public record Record(double[] timeS, double[] injectedA, double[] measuredA, double[] velocityRadPerS, double[] positionRad, int periodSamples) {}

    public static Record simulate(GantryAxis axis, DriveLoopSettings s, long seed) {
        double t = s.sampleTimeS();
        // states θm, ωm, θl, ωl; input: torque-producing current
        double[][] phi = TwoMassMechanics.zohTransition(axis.motorInertiaKgM2(), axis.loadInertiaKgM2(), axis.stiffnessNmPerRad(), axis.dampingNmsPerRad(),
                axis.viscousNmsPerRad(), axis.torqueConstantNmPerA(), t);
        Prbs prbs = new Prbs(PrbsPolynomial.ofOrder(s.prbsOrder()), s.prbsAmplitudeA(), s.prbsSamplesPerBit(), s.prbsPeriods(), s.sampleRateHz());
        double[] r = prbs.signal().samples();
        int n = r.length;
        double[] time = new double[n], im = new double[n], vel = new double[n], pos = new double[n];
        Random rnd = new Random(seed);
        double alpha = StrictMath.exp(-2 * Math.PI * s.feedbackFilterHz() * t);
        double kp = s.velocityGainAsPerRad(), ki = kp * 2 * Math.PI * s.integralCornerHz() * t;
        double q = 2 * Math.PI / s.encoderCountsPerRev();
        double[] x = new double[4], xn = new double[4];
        double prevOmega = 0, prevTheta = 0, iApplied = 0, vf = 0, integ = 0;
        for (int step = 0; step < n; step++) {
            double nv = rnd.nextGaussian() * s.velocityNoiseRadPerS();
            double ni = rnd.nextGaussian() * s.currentNoiseA();
            double d = rnd.nextGaussian() * s.torqueNoiseA();
            time[step] = step / s.sampleRateHz();
            double v = prevOmega + nv;
            vel[step] = v;
            pos[step] = Math.floor(prevTheta / q + 0.5) * q;
            im[step] = iApplied + ni;
            vf = alpha * vf + (1 - alpha) * v;
            double e = -vf;
            integ += ki * e;
            double cmd = kp * e + integ + r[step];
            if (cmd > s.currentLimitA()) cmd = s.currentLimitA();
            if (cmd < -s.currentLimitA()) cmd = -s.currentLimitA();
            double u = iApplied + d;
            prevOmega = x[1];
            prevTheta = x[0];
            for (int i = 0; i < 4; i++) {
                double acc = phi[i][4] * u;
                for (int j = 0; j < 4; j++) acc += phi[i][j] * x[j];
                xn[i] = acc;
            }
            System.arraycopy(xn, 0, x, 0, 4);
            iApplied = cmd;
        }
        return new Record(time, r, im, vel, pos, prbs.periodSamples());
    }

    /** e^M by scaling and squaring with a degree-20 Taylor series (plain arithmetic: reproducible bit for bit). */
    static double[][] expm(double[][] m) {
        int n = m.length;
        double norm = 0;
        for (double[] row : m) {
            double s = 0;
            for (double v : row) s += Math.abs(v);
            norm = Math.max(norm, s);
        }
        int squarings = 0;
        double scale = 1;
        while (norm * scale > 0.25) { scale *= 0.5; squarings++; }
        double[][] a = new double[n][n];
        for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) a[i][j] = m[i][j] * scale;
        double[][] sum = identity(n), term = identity(n);
        for (int p = 1; p <= 20; p++) {
            term = multiply(term, a);
            for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) term[i][j] /= p;
            for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) sum[i][j] += term[i][j];
        }
        for (int q = 0; q < squarings; q++) sum = multiply(sum, sum);
        return sum;
    }

    private static double[][] identity(int n) {
        double[][] e = new double[n][n];
        for (int i = 0; i < n; i++) e[i][i] = 1;
        return e;
    }

    private static double[][] multiply(double[][] x, double[][] y) {
        int n = x.length;
        double[][] z = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double s = 0;
                for (int l = 0; l < n; l++) s += x[i][l] * y[l][j];
                z[i][j] = s;
            }
        }
        return z;
    }
}
