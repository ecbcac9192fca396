package org.loopledger.sim;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.loopledger.lti.MatrixExponential;
import org.loopledger.lti.StateSpace;
import org.loopledger.lti.TimeBase;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.Objects;

/**
 * Time responses of linear SISO systems, continuous or sampled, given as a {@link TransferFunction} or a
 * {@link StateSpace}: step, impulse, initial condition, forced response to any input, and digital filtering.
 *
 * <p><b>Continuous systems</b> are simulated exactly for the stated inter-sample behaviour of the input
 * ({@link Hold}): over each interval of length h the state moves by x⁺ = Φx + (Γ₁ - Γ₂)u<sub>a</sub> + Γ₂u<sub>b</sub>,
 * where Φ, Γ₁, Γ₂ come from one matrix exponential of [[Ah, Bh, 0], [0, 0, 1], [0, 0, 0]] (u<sub>a</sub>, u<sub>b</sub> the
 * input at the two ends; for a hold, u<sub>b</sub> = u<sub>a</sub>). This is the scheme of scipy.signal.lsim, whose
 * default (interp=True) is the linear interpolation {@link Hold#FIRST_ORDER}; ZOH is its interp=False. Times must be
 * evenly spaced (relative tolerance 1e-9). A transfer function is realised as balanced series sections
 * ({@link StateSpace#seriesSections}, {@link StateSpace#balanced}); the state of a transfer function starts at rest.
 *
 * <p><b>A pure delay</b> τ of a continuous transfer function delays the input, which is zero before the first instant.
 * When τ is a whole number of steps (to 1e-9 of a step) the input is shifted by samples; otherwise each step is split at
 * the delayed sample instant into two exact sub-steps, so the response is still exact for the stated hold (no Padé
 * approximation anywhere). A sampled transfer function's delay must be a whole number of samples.
 *
 * <p><b>Sampled systems</b> follow x[k+1] = A x[k] + B u[k], y[k] = C x[k] + D u[k] (as scipy.signal.dlsim); the
 * instants must be spaced by the sample time. {@link #filter} runs the difference equation itself (as
 * scipy.signal.lfilter).
 */
public final class LinearResponse {
    private LinearResponse() {}

    /** How a continuous system sees its sampled input between the instants. */
    public enum Hold {
        /** Piecewise constant: u(t) = u[k] on [t<sub>k</sub>, t<sub>k+1</sub>) (scipy.signal.lsim interp=False). */
        ZERO_ORDER,
        /** Piecewise linear between the samples (scipy.signal.lsim's default, interp=True). */
        FIRST_ORDER
    }

    /** {@code n} evenly spaced instants from 0 to {@code endS} inclusive. */
    public static double[] timesS(double endS, int n) {
        if (!(endS > 0) || Double.isInfinite(endS)) throw new IllegalArgumentException("end time must be a finite positive number of seconds, got " + endS);
        if (n < 2) throw new IllegalArgumentException("a time grid needs at least 2 instants, got " + n);
        double[] t = new double[n];
        for (int i = 0; i < n; i++) t[i] = endS * i / (n - 1);
        return t;
    }

    // ---- transfer functions ----

    /** Unit-step response from rest (the step is applied at {@code timeS[0]}). */
    public static TimeSeries step(TransferFunction g, double[] timeS) { return forced(g, timeS, ones(timeS.length), Hold.ZERO_ORDER); }

    /**
     * Unit-impulse response from rest. Continuous: y(t) = C e<sup>A(t - τ - t<sub>0</sub>)</sup>B, the regular part;
     * a direct feed-through D·δ(t) cannot be sampled and is left out (as scipy.signal.impulse does). Sampled: the
     * response to a unit pulse u[0] = 1 (as scipy.signal.dimpulse), D included.
     */
    public static TimeSeries impulse(TransferFunction g, double[] timeS) {
        Objects.requireNonNull(g, "system");
        return impulse(Realisation.of(g), g.delayS(), timeS);
    }

    /** Response to {@code input[k]} at {@code timeS[k]} from rest; {@code hold} matters for continuous systems only. */
    public static TimeSeries forced(TransferFunction g, double[] timeS, double[] input, Hold hold) {
        Objects.requireNonNull(g, "system");
        Realisation r = Realisation.of(g);
        return simulate(r, g.delayS(), null, timeS, input, hold);
    }

    /** Response to {@code input} with linear interpolation between samples (scipy.signal.lsim's default). */
    public static TimeSeries forced(TransferFunction g, double[] timeS, double[] input) { return forced(g, timeS, input, Hold.FIRST_ORDER); }

    // ---- state space ----

    /** Unit-step response from rest. */
    public static TimeSeries step(StateSpace ss, double[] timeS) { return forced(ss, new double[ss.order()], timeS, ones(timeS.length), Hold.ZERO_ORDER); }

    /** Unit-impulse response from rest (see {@link #impulse(TransferFunction, double[])} for D). */
    public static TimeSeries impulse(StateSpace ss, double[] timeS) { return impulse(Realisation.of(ss), 0, timeS); }

    /** Free response from the initial state {@code x0} (in the coordinates of {@code ss}) with zero input. */
    public static TimeSeries initial(StateSpace ss, double[] x0, double[] timeS) {
        return forced(ss, x0, timeS, new double[timeS.length], Hold.ZERO_ORDER);
    }

    /** Response to {@code input} from the initial state {@code x0}; {@code hold} matters for continuous systems only. */
    public static TimeSeries forced(StateSpace ss, double[] x0, double[] timeS, double[] input, Hold hold) {
        Objects.requireNonNull(ss, "system");
        Objects.requireNonNull(x0, "initial state");
        if (x0.length != ss.order()) {
            throw new IllegalArgumentException("initial state has " + x0.length + " entries but the system has " + ss.order() + " states");
        }
        for (int i = 0; i < x0.length; i++) {
            if (!Double.isFinite(x0[i])) throw new IllegalArgumentException("initial state entry " + i + " is " + x0[i] + "; give finite numbers");
        }
        return simulate(Realisation.of(ss), 0, x0.clone(), timeS, input, hold);
    }

    // ---- digital filtering ----

    /**
     * Filters {@code x} through a sampled transfer function N(z)/D(z) from rest, by its difference equation in
     * transposed direct form II (as scipy.signal.lfilter with b = N padded to the degree of D and a = D, in powers
     * of z<sup>-1</sup>). A delay of whole samples shifts the output. The sample times are implied (x[k] at kT).
     */
    public static double[] filter(TransferFunction g, double[] x) {
        Objects.requireNonNull(g, "filter");
        Objects.requireNonNull(x, "signal");
        if (!(g.timeBase() instanceof TimeBase.Sampled sm)) {
            throw new IllegalArgumentException("filter needs a sampled transfer function, got a continuous one (" + g
                    + "); discretise it first (Discretization.zoh or tustin)");
        }
        g.requireProper("digital filtering");
        int shift = wholeSamples(g.delayS(), sm.sampleTimeS());
        double[] a = g.denominator().coefficientsDescending();
        double[] n = g.numerator().coefficientsDescending();
        double[] b = new double[a.length];
        System.arraycopy(n, 0, b, a.length - n.length, n.length);
        double[] y = lfilter(b, a, x);
        if (shift == 0) return y;
        double[] out = new double[y.length];
        for (int k = shift; k < y.length; k++) out[k] = y[k - shift];
        return out;
    }

    /**
     * y = lfilter(b, a, x) from rest: a[0]·y[k] = Σ b[i]·x[k-i] - Σ<sub>i&ge;1</sub> a[i]·y[k-i], coefficients in
     * ascending powers of z<sup>-1</sup> (scipy.signal.lfilter's convention), a[0] &ne; 0.
     */
    public static double[] lfilter(double[] b, double[] a, double[] x) {
        Objects.requireNonNull(b, "b");
        Objects.requireNonNull(a, "a");
        Objects.requireNonNull(x, "signal");
        if (b.length == 0 || a.length == 0) throw new IllegalArgumentException("filter coefficients b and a must not be empty");
        if (a[0] == 0 || !Double.isFinite(a[0])) throw new IllegalArgumentException("a[0] must be a finite non-zero number, got " + a[0]);
        for (int i = 0; i < x.length; i++) {
            if (!Double.isFinite(x[i])) throw new IllegalArgumentException("signal sample " + i + " is " + x[i] + "; every sample must be finite");
        }
        int m = Math.max(a.length, b.length);
        double[] bn = new double[m], an = new double[m];
        for (int i = 0; i < b.length; i++) bn[i] = b[i] / a[0];
        for (int i = 0; i < a.length; i++) an[i] = a[i] / a[0];
        double[] z = new double[m]; // z[0..m-2] used
        double[] y = new double[x.length];
        for (int k = 0; k < x.length; k++) {
            double yk = bn[0] * x[k] + (m > 1 ? z[0] : 0);
            for (int i = 1; i < m; i++) z[i - 1] = bn[i] * x[k] - an[i] * yk + (i < m - 1 ? z[i] : 0);
            y[k] = yk;
        }
        return y;
    }

    // ---- engine ----

    private static double[] ones(int n) {
        double[] u = new double[n];
        java.util.Arrays.fill(u, 1.0);
        return u;
    }

    /** A realisation with plain arrays; n = 0 for a static gain. */
    private record Realisation(double[][] a, double[] b, double[] c, double d, TimeBase timeBase) {
        static Realisation of(TransferFunction g) {
            g.requireProper("a time response");
            TransferFunction r = g.withoutDelay();
            if (r.denominator().degree() == 0) {
                return new Realisation(new double[0][0], new double[0], new double[0], r.numerator().leading() / r.denominator().leading(), g.timeBase());
            }
            return of(StateSpace.seriesSections(r).balanced());
        }

        static Realisation of(StateSpace ss) { return new Realisation(ss.a(), ss.b(), ss.c(), ss.d(), ss.timeBase()); }

        int n() { return b.length; }
    }

    private static TimeSeries impulse(Realisation r, double delayS, double[] timeS) {
        double dt = uniformStep(timeS, r.timeBase());
        if (r.timeBase().isDiscrete()) {
            double[] u = new double[timeS.length];
            u[0] = 1;
            return simulate(r, delayS, null, timeS, u, Hold.ZERO_ORDER);
        }
        // continuous: x(t0+) = B, free motion; the delay shifts the whole response
        int n = r.n();
        double[] y = new double[timeS.length];
        if (n > 0) {
            Step full = Step.of(r.a(), r.b(), dt);
            double[] x = r.b().clone(), next = new double[n];
            double[] free = new double[timeS.length];
            for (int k = 0; k < timeS.length; k++) {
                free[k] = dot(r.c(), x);
                full.advance(x, 0, 0, next);
                System.arraycopy(next, 0, x, 0, n);
            }
            double steps = delayS / dt;
            long m = Math.round(steps);
            if (Math.abs(steps - m) <= 1e-9 * Math.max(1, steps)) {
                for (int k = (int) Math.min(m, timeS.length); k < timeS.length; k++) y[k] = free[(int) (k - m)];
            } else {
                // y(t_k) = C e^{A(t_k - t0 - τ)} B for t_k - t0 ≥ τ: start from e^{A(1-f)dt} B at the first instant past the delay
                int first = (int) Math.ceil(steps);
                double lead = first * dt - delayS;
                Step part = Step.of(r.a(), r.b(), lead);
                part.advance(r.b().clone(), 0, 0, x);
                for (int k = first; k < timeS.length; k++) {
                    y[k] = dot(r.c(), x);
                    full.advance(x, 0, 0, next);
                    System.arraycopy(next, 0, x, 0, n);
                }
            }
        }
        return new TimeSeries(timeS, y);
    }

    private static TimeSeries simulate(Realisation r, double delayS, double[] x0, double[] timeS, double[] input, Hold hold) {
        Objects.requireNonNull(timeS, "timeS");
        Objects.requireNonNull(input, "input");
        Objects.requireNonNull(hold, "hold (Hold.ZERO_ORDER or Hold.FIRST_ORDER)");
        if (input.length != timeS.length) {
            throw new IllegalArgumentException("input has " + input.length + " samples but timeS has " + timeS.length + "; give one input value per instant");
        }
        for (int i = 0; i < input.length; i++) {
            if (!Double.isFinite(input[i])) throw new IllegalArgumentException("input sample " + i + " is " + input[i] + "; every sample must be finite");
        }
        double dt = uniformStep(timeS, r.timeBase());
        int n = r.n(), len = timeS.length;
        double[] x = x0 == null ? new double[n] : x0.clone(), next = new double[n];
        double[] y = new double[len];
        if (r.timeBase() instanceof TimeBase.Sampled sm) {
            int shift = wholeSamples(delayS, sm.sampleTimeS());
            for (int k = 0; k < len; k++) {
                double u = k >= shift ? input[k - shift] : 0;
                y[k] = dot(r.c(), x) + r.d() * u;
                if (n > 0) {
                    for (int i = 0; i < n; i++) {
                        double s = r.b()[i] * u;
                        for (int j = 0; j < n; j++) s += r.a()[i][j] * x[j];
                        next[i] = s;
                    }
                    System.arraycopy(next, 0, x, 0, n);
                }
            }
            return new TimeSeries(timeS, y);
        }
        // continuous: the delayed input as pieces; piece j spans [t_{j-1}, t_j] with end values (start, end), zero for j <= 0
        double steps = delayS / dt;
        long mr = Math.round(steps);
        boolean whole = Math.abs(steps - mr) <= 1e-9 * Math.max(1, steps);
        int m = whole ? (int) Math.min(mr, len + 1) : (int) Math.floor(steps);
        double f = whole ? 0 : steps - m;          // fraction of a step by which the delay exceeds m steps
        Step full = n > 0 ? Step.of(r.a(), r.b(), dt) : null;
        Step first = n > 0 && !whole ? Step.of(r.a(), r.b(), f * dt) : null;
        Step second = n > 0 && !whole ? Step.of(r.a(), r.b(), (1 - f) * dt) : null;
        double[] mid = new double[n];
        for (int k = 0; k < len; k++) {
            y[k] = dot(r.c(), x) + r.d() * delayedInput(input, hold, k, m, f);
            if (k + 1 == len || n == 0) continue;
            if (whole) {
                int j = k + 1 - m;
                full.advance(x, pieceStart(input, hold, j), pieceEnd(input, hold, j), next);
            } else {
                // [t_k, t_k + f·dt] carries piece j = k - m from its fraction 1 - f to its end; the rest carries piece j + 1 up to 1 - f
                int j = k - m;
                double a0 = pieceAt(input, hold, j, 1 - f), a1 = pieceEnd(input, hold, j);
                first.advance(x, a0, a1, mid);
                double b0 = pieceStart(input, hold, j + 1), b1 = pieceAt(input, hold, j + 1, 1 - f);
                second.advance(mid, b0, b1, next);
            }
            System.arraycopy(next, 0, x, 0, n);
        }
        return new TimeSeries(timeS, y);
    }

    /** The input as the system sees it at t<sub>k</sub>: u(t<sub>k</sub> - τ), zero before the first instant. */
    private static double delayedInput(double[] u, Hold hold, int k, int m, double f) {
        if (f == 0) {
            int i = k - m;
            return i >= 0 && i < u.length ? u[i] : 0;
        }
        // t_k - τ lies inside piece j = k - m at fraction 1 - f (right-continuous hold)
        return pieceAt(u, hold, k - m, 1 - f);
    }

    private static double pieceStart(double[] u, Hold hold, int j) { return j <= 0 || j > u.length ? 0 : u[j - 1]; }

    private static double pieceEnd(double[] u, Hold hold, int j) {
        if (j <= 0 || j > u.length) return 0;
        return hold == Hold.ZERO_ORDER || j == u.length ? u[j - 1] : u[j];
    }

    private static double pieceAt(double[] u, Hold hold, int j, double theta) {
        double s = pieceStart(u, hold, j), e = pieceEnd(u, hold, j);
        return s + theta * (e - s);
    }

    /** Whole samples in a sampled system's delay; refuses a fraction. */
    private static int wholeSamples(double delayS, double sampleTimeS) {
        if (delayS == 0) return 0;
        double steps = delayS / sampleTimeS;
        long m = Math.round(steps);
        if (Math.abs(steps - m) > 1e-9 * Math.max(1, steps)) {
            throw new IllegalArgumentException("the sampled system's delay " + Units.g4(delayS) + " s is " + Units.g4(steps)
                    + " samples, not a whole number; a sampled response is defined at the samples only (use a continuous model for fractional delays)");
        }
        return (int) Math.min(m, Integer.MAX_VALUE);
    }

    /** The common spacing of {@code timeS}; for a sampled system it must equal the sample time. */
    private static double uniformStep(double[] timeS, TimeBase tb) {
        Objects.requireNonNull(timeS, "timeS");
        if (timeS.length < 2) throw new IllegalArgumentException("a time response needs at least 2 instants, got " + timeS.length);
        for (int i = 0; i < timeS.length; i++) {
            if (!Double.isFinite(timeS[i])) throw new IllegalArgumentException("timeS[" + i + "] is " + timeS[i] + "; every instant must be finite");
        }
        double dt = (timeS[timeS.length - 1] - timeS[0]) / (timeS.length - 1);
        if (!(dt > 0)) throw new IllegalArgumentException("timeS must increase, got " + timeS[0] + " .. " + timeS[timeS.length - 1] + " s");
        for (int i = 1; i < timeS.length; i++) {
            double h = timeS[i] - timeS[i - 1];
            if (Math.abs(h - dt) > 1e-9 * dt + 4 * Math.ulp(Math.abs(timeS[i]))) {
                throw new IllegalArgumentException("timeS must be evenly spaced: step " + i + " is " + h + " s against " + dt
                        + " s on average (use LinearResponse.timesS(endS, n))");
            }
        }
        if (tb instanceof TimeBase.Sampled sm && Math.abs(dt - sm.sampleTimeS()) > 1e-9 * sm.sampleTimeS()) {
            throw new IllegalArgumentException("timeS is spaced by " + dt + " s but the sampled system's sample time is " + sm.sampleTimeS()
                    + " s; give one instant per sample");
        }
        return dt;
    }

    private static double dot(double[] c, double[] x) {
        double s = 0;
        for (int i = 0; i < c.length; i++) s += c[i] * x[i];
        return s;
    }

    /** One exact step of length h with the input linear from ua to ub: x⁺ = Φx + G0·ua + G1·ub. */
    private record Step(double[][] phi, double[] g0, double[] g1) {
        static Step of(double[][] a, double[] b, double h) {
            int n = b.length;
            RealMatrix mtx = new Array2DRowRealMatrix(n + 2, n + 2);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) mtx.setEntry(i, j, a[i][j] * h);
                mtx.setEntry(i, n, b[i] * h);
            }
            mtx.setEntry(n, n + 1, 1.0);
            RealMatrix e = MatrixExponential.expm(mtx);
            double[][] phi = e.getSubMatrix(0, n - 1, 0, n - 1).getData();
            double[] g1 = new double[n], g2 = new double[n], g0 = new double[n];
            for (int i = 0; i < n; i++) {
                g1[i] = e.getEntry(i, n);
                g2[i] = e.getEntry(i, n + 1);
                g0[i] = g1[i] - g2[i];
            }
            return new Step(phi, g0, g2);
        }

        void advance(double[] x, double ua, double ub, double[] out) {
            int n = x.length;
            for (int i = 0; i < n; i++) {
                double s = g0[i] * ua + g1[i] * ub;
                for (int j = 0; j < n; j++) s += phi[i][j] * x[j];
                out[i] = s;
            }
        }
    }
}
