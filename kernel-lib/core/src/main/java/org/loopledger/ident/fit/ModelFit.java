package org.loopledger.ident.fit;

import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Weighted nonlinear least squares of a physical model to a measured {@link Frf}, with Commons Math's
 * Levenberg-Marquardt, on the log of the complex ratio: per point the residuals are
 * w·ln|G<sub>m</sub>/G| and w·arg(G<sub>m</sub>/G) (phase-aware, no unwrapping needed, and equal relative
 * weight to every decade). Weights: w = √2·|G|/σ when the FRF carries its uncertainty σ (then each residual
 * has unit variance, since ln G has variance σ²/|G|² split over its two parts), else w = √(γ²/(1 - γ²))
 * from the coherence (γ² capped at 0.9999), else 1.
 *
 * <p>Positive parameters are fitted as logarithms; the delay linearly in units of 100 µs and left free
 * (its estimate is reported as fitted, so a negative value shows a mismatch; the returned model uses
 * max(0, τ)). Covariance: s²·(JᵀJ)<sup>-1</sup> at the optimum, s² the residual mean square (Seber and Wild,
 * Nonlinear Regression, 1989, section 2.1, from memory); 95 % intervals with 1.96σ (many points).
 * Several damping starts are tried and the lowest cost kept.
 */
public final class ModelFit {
    private static final double DELAY_UNIT_S = 1e-4;
    private static final double Z95 = 1.96;

    private ModelFit() {}

    enum Kind { RIGID, TWO_MASS }

    /**
     * Fits K<sub>t</sub>/(J s + b) (or /(J s² + b s) to position), optionally with delay. The parameters are
     * named and united by {@link FitOptions#motion()}: "inertia" in kg·m² and N·m·s/rad on a rotary axis,
     * "mass" in kg and N·s/m on a linear one. The result carries the warnings of the usability checks
     * ({@link FitChecks}).
     */
    public static RigidBodyFit rigidBody(Frf frf, FitOptions o) {
        return rigidBody(frf, o, true);
    }

    private static RigidBodyFit rigidBody(Frf frf, FitOptions o, boolean check) {
        Data d = Data.of(frf, o);
        double[] a = velocityMagnitudes(d, o);
        double[] sorted = a.clone();
        Arrays.sort(sorted);
        double j0 = 1 / sorted[sorted.length / 2];
        double b0 = j0 * d.w[0] * 0.3;
        double[] start = o.fitDelay() ? new double[] {Math.log(j0), Math.log(b0), 0.1} : new double[] {Math.log(j0), Math.log(b0)};
        Solution s = solve(Kind.RIGID, d, o, List.of(start));
        double tau = o.fitDelay() ? Math.max(0, s.theta[2]) * DELAY_UNIT_S : 0;
        RigidBodyParameters p = new RigidBodyParameters(Math.exp(s.theta[0]), Math.exp(s.theta[1]), tau, o.motion());
        List<ParameterEstimate> est = new ArrayList<>();
        est.add(logParam(o.motion().inertiaName(), o.motion().inertiaUnit(), s, 0));
        est.add(logParam("viscous friction", o.motion().dampingUnit(), s, 1));
        if (o.fitDelay()) est.add(delayParam(s, 2));
        List<double[]> bands = decadeBands(d.fLow(), d.fHigh());
        FitResult fr = new FitResult(p.model(o.torqueConstantNmPerA(), o.toPosition()), est, quality(Kind.RIGID, d, o, s, bands, null), s.reducedChi2, d.n(),
                s.iterations, List.of());
        if (check) {
            fr = fr.withWarnings(FitChecks.check(new FitChecks.Input("rigid body", d.fLow(), d.fHigh(), est, fittedNames(Kind.RIGID, o), s.cov, s.condition,
                    s.weightedRmsLog, o.fitDelay() ? s.theta[2] * DELAY_UNIT_S : 0, null,
                    FitChecks.subBands(d.fLow(), d.fHigh(), d.fHigh(), d.fLow()), band -> rigidBody(frf, o.bandHz(band[0], band[1]), false).fit().parameters())));
        }
        return new RigidBodyFit(p, fr);
    }

    /**
     * Fits the two-mass modal form of {@link TwoMassParameters}, optionally with delay; the result carries the
     * warnings of the usability checks ({@link FitChecks}).
     */
    public static TwoMassFit twoMass(Frf frf, FitOptions o) {
        return twoMass(frf, o, true);
    }

    private static TwoMassFit twoMass(Frf frf, FitOptions o, boolean check) {
        Data d = Data.of(frf, o);
        double[] a = velocityMagnitudes(d, o);
        int ir = 0;
        for (int i = 1; i < a.length; i++) if (a[i] > a[ir]) ir = i;
        int ia = -1;
        for (int i = 0; i < ir; i++) if (ia < 0 || a[i] < a[ia]) ia = i;
        double wr0 = d.w[ir], wa0 = ia >= 0 && d.w[ia] < wr0 ? d.w[ia] : wr0 / 1.3;
        double[] lowest = Arrays.copyOf(a, Math.max(1, a.length / 5));
        Arrays.sort(lowest);
        boolean standsOut = a[ir] > 1.5 * lowest[lowest.length / 2];
        if (ir == 0 || ir == a.length - 1 || !standsOut) {
            throw new IllegalArgumentException("no resonance peak inside the fit band " + Units.formatHz(d.fLow()) + " .. " + Units.formatHz(d.fHigh())
                    + " (|G|·ω/Kt peaks at " + Units.formatHz(Units.radPerSToHz(wr0)) + ", at the band's edge or less than 1.5 times its low-frequency level); "
                    + "widen the band or fit a rigid body");
        }
        List<Double> low = new ArrayList<>();
        for (int i = 0; i < a.length; i++) if (d.w[i] < wa0 / 3) low.add(a[i]);
        if (low.isEmpty()) low.add(a[0]);
        low.sort(null);
        double j0 = 1 / low.get(low.size() / 2);
        double b0 = j0 * d.w[0] * 0.3;
        List<double[]> starts = new ArrayList<>();
        for (double z : new double[] {0.02, 0.05, 0.15}) {
            double[] t = {Math.log(j0), Math.log(b0), Math.log(Units.radPerSToHz(wr0)), Math.log(z), Math.log(Units.radPerSToHz(wa0)), Math.log(z)};
            if (o.fitDelay()) {
                t = Arrays.copyOf(t, 7);
                t[6] = 0.3; // 30 µs
            }
            starts.add(t);
        }
        Solution s = solve(Kind.TWO_MASS, d, o, starts);
        double tau = o.fitDelay() ? Math.max(0, s.theta[6]) * DELAY_UNIT_S : 0;
        double[] t = s.theta;
        TwoMassParameters p = new TwoMassParameters(Math.exp(t[0]), Math.exp(t[1]), Math.exp(t[2]), Math.exp(t[3]), Math.exp(t[4]), Math.exp(t[5]), tau,
                o.motion());
        List<ParameterEstimate> est = new ArrayList<>();
        est.add(logParam(o.motion().inertiaName(), o.motion().inertiaUnit(), s, 0));
        est.add(logParam("viscous friction", o.motion().dampingUnit(), s, 1));
        est.add(logParam("resonance", "Hz", s, 2));
        est.add(logParam("resonance damping", "", s, 3));
        est.add(logParam("antiresonance", "Hz", s, 4));
        est.add(logParam("antiresonance damping", "", s, 5));
        // inertia ratio R = (fr/fa)² - 1 by the delta method on ln fr, ln fa
        double q = Math.pow(p.resonanceHz() / p.antiresonanceHz(), 2);
        double var = 4 * q * q * (s.cov[2][2] + s.cov[4][4] - 2 * s.cov[2][4]);
        double se = Math.sqrt(Math.max(0, var));
        est.add(new ParameterEstimate(o.motion().inertiaName() + " ratio", "", p.inertiaRatio(), se, p.inertiaRatio() - Z95 * se, p.inertiaRatio() + Z95 * se));
        if (o.fitDelay()) est.add(delayParam(s, 6));
        double fa = p.antiresonanceHz(), frHz = p.resonanceHz();
        List<double[]> bands = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        double e1 = Math.max(d.fLow(), fa / Math.sqrt(2)), e2 = Math.min(d.fHigh(), frHz * Math.sqrt(2));
        if (e1 > d.fLow()) { bands.add(new double[] {d.fLow(), e1}); labels.add("below antiresonance"); }
        bands.add(new double[] {e1, e2});
        labels.add("resonance region");
        if (e2 < d.fHigh()) { bands.add(new double[] {e2, d.fHigh()}); labels.add("above resonance"); }
        FitResult fr = new FitResult(p.model(o.torqueConstantNmPerA(), o.toPosition()), est, quality(Kind.TWO_MASS, d, o, s, bands, labels), s.reducedChi2, d.n(),
                s.iterations, List.of());
        if (check) {
            fr = fr.withWarnings(FitChecks.check(new FitChecks.Input("two-mass", d.fLow(), d.fHigh(), est, fittedNames(Kind.TWO_MASS, o), s.cov, s.condition,
                    s.weightedRmsLog, o.fitDelay() ? s.theta[6] * DELAY_UNIT_S : 0, p,
                    FitChecks.subBands(d.fLow(), d.fHigh(), e1, e2), band -> twoMass(frf, o.bandHz(band[0], band[1]), false).fit().parameters())));
        }
        return new TwoMassFit(p, fr);
    }

    /** The names of θ's entries, in order (the covariance's rows). */
    private static List<String> fittedNames(Kind kind, FitOptions o) {
        List<String> n = new ArrayList<>(kind == Kind.RIGID ? List.of("inertia", "viscous friction")
                : List.of("inertia", "viscous friction", "resonance", "resonance damping", "antiresonance", "antiresonance damping"));
        if (o.fitDelay()) n.add("delay");
        return n;
    }

    private static ParameterEstimate logParam(String name, String unit, Solution s, int i) {
        double v = Math.exp(s.theta[i]), sl = Math.sqrt(Math.max(0, s.cov[i][i]));
        return new ParameterEstimate(name, unit, v, v * sl, v * Math.exp(-Z95 * sl), v * Math.exp(Z95 * sl));
    }

    private static ParameterEstimate delayParam(Solution s, int i) {
        double v = s.theta[i] * DELAY_UNIT_S, se = Math.sqrt(Math.max(0, s.cov[i][i])) * DELAY_UNIT_S;
        return new ParameterEstimate("delay", "s", v, se, v - Z95 * se, v + Z95 * se);
    }

    private static List<double[]> decadeBands(double lo, double hi) {
        List<double[]> b = new ArrayList<>();
        double a = lo;
        while (a < hi) {
            double e = Math.min(hi, Math.pow(10, Math.floor(Math.log10(a) + 1e-9) + 1));
            if (e <= a) e = hi;
            b.add(new double[] {a, e});
            a = e;
        }
        return b;
    }

    /** The FRF points in the band with their weights. */
    private record Data(double[] w, double[] re, double[] im, double[] weight) {
        static Data of(Frf frf, FitOptions o) {
            Frf f = frf.restrictedToHz(o.fLowHz(), o.fHighHz());
            double[] w = f.omegaRadPerS(), re = f.real(), im = f.imag(), weight = new double[w.length];
            double[] sig = f.uncertainty().orElse(null), coh = f.coherence().orElse(null);
            for (int i = 0; i < w.length; i++) {
                double mag = Math.hypot(re[i], im[i]);
                if (!(mag > 0)) throw new IllegalArgumentException("FRF is zero at " + Units.formatHz(Units.radPerSToHz(w[i])) + "; a log fit cannot use it, restrict the band");
                if (sig != null) {
                    if (!(sig[i] > 0)) throw new IllegalArgumentException("FRF uncertainty is zero at " + Units.formatHz(Units.radPerSToHz(w[i])) + "; cannot weight by it");
                    weight[i] = Math.sqrt(2) * mag / sig[i];
                } else if (coh != null) {
                    double g = Math.min(coh[i], 0.9999);
                    weight[i] = Math.sqrt(g / (1 - g));
                } else weight[i] = 1;
            }
            if (o.sampleTimeS() > 0 && w[w.length - 1] > Math.PI / o.sampleTimeS() * (1 + 1e-12)) {
                throw new IllegalArgumentException("the fit band reaches " + Units.formatHz(Units.radPerSToHz(w[w.length - 1]))
                        + ", above the Nyquist frequency of the sampled-data model; lower the band");
            }
            return new Data(w, re, im, weight);
        }

        int n() { return w.length; }

        double fLow() { return Units.radPerSToHz(w[0]); }

        double fHigh() { return Units.radPerSToHz(w[w.length - 1]); }
    }

    private static double[] withoutPosition(Data d, FitOptions o, int i) {
        // velocity-equivalent |G|·ω/Kt (position FRFs times ω once more)
        double m = Math.hypot(d.re[i], d.im[i]) * (o.toPosition() ? d.w[i] : 1);
        return new double[] {m};
    }

    private static double[] velocityMagnitudes(Data d, FitOptions o) {
        double[] a = new double[d.n()];
        for (int i = 0; i < a.length; i++) a[i] = withoutPosition(d, o, i)[0] * d.w[i] / o.torqueConstantNmPerA();
        return a;
    }

    /**
     * @param condition      ratio of the largest to the smallest singular value of the weighted Jacobian at the optimum (θ scale)
     * @param weightedRmsLog √(Σ w²|ln(G<sub>m</sub>/G)|² / Σ w²): the typical misfit as a complex log ratio
     */
    private record Solution(double[] theta, double[][] cov, double cost, double reducedChi2, int iterations, double condition, double weightedRmsLog) {}

    private static Solution solve(Kind kind, Data d, FitOptions o, List<double[]> starts) {
        Solution best = null;
        RuntimeException last = null;
        for (double[] start : starts) {
            Solution s;
            try {
                s = solveFrom(kind, d, o, start);
            } catch (RuntimeException e) {
                last = e;
                continue; // a start that diverges (singular Jacobian, too many evaluations) is skipped
            }
            if (best == null || s.cost < best.cost) best = s;
        }
        if (best == null) throw new IllegalArgumentException("the fit did not converge from any start on " + d.n() + " points ("
                + (last == null ? "no start" : last.getMessage()) + "); check the band and the model choice");
        return best;
    }

    private static Solution solveFrom(Kind kind, Data d, FitOptions o, double[] start) {
        int m = 2 * d.n(), p = start.length;
        if (m <= p) throw new IllegalArgumentException("only " + d.n() + " FRF points for " + p + " parameters; widen the band");
        org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction f = point -> {
            double[] th = point.toArray();
            double[] r0 = residuals(kind, d, o, th);
            double[][] jac = new double[m][p];
            for (int j = 0; j < p; j++) {
                double h = 1e-6 * Math.max(1, Math.abs(th[j]));
                double[] tp = th.clone(), tm = th.clone();
                tp[j] += h;
                tm[j] -= h;
                double[] rp = residuals(kind, d, o, tp), rm = residuals(kind, d, o, tm);
                for (int i = 0; i < m; i++) jac[i][j] = (rp[i] - rm[i]) / (2 * h);
            }
            return new Pair<RealVector, RealMatrix>(new ArrayRealVector(r0, false), new Array2DRowRealMatrix(jac, false));
        };
        LeastSquaresOptimizer.Optimum opt = new LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(1e-12).withParameterRelativeTolerance(1e-12)
                .optimize(new LeastSquaresBuilder().start(start).model(f).target(new double[m])
                        .maxEvaluations(2000).maxIterations(1000).build());
        double[] th = opt.getPoint().toArray();
        double ssr = opt.getCost() * opt.getCost();
        double s2 = ssr / (m - p);
        RealMatrix c = opt.getCovariances(1e-14);
        double[][] cov = new double[p][p];
        for (int i = 0; i < p; i++) for (int j = 0; j < p; j++) cov[i][j] = c.getEntry(i, j) * s2;
        double[] sv = new org.apache.commons.math3.linear.SingularValueDecomposition(opt.getJacobian()).getSingularValues();
        double condition = sv[sv.length - 1] > 0 ? sv[0] / sv[sv.length - 1] : Double.POSITIVE_INFINITY;
        double sw2 = 0;
        for (double wi : d.weight) sw2 += wi * wi;
        return new Solution(th, cov, ssr, s2, opt.getIterations(), condition, Math.sqrt(ssr / sw2));
    }

    /** Model response on the data grid for parameters θ (velocity or position, continuous or sampled). */
    static void response(Kind kind, FitOptions o, double[] th, double[] w, double[] re, double[] im) {
        double kt = o.torqueConstantNmPerA();
        double j = Math.exp(th[0]), b = Math.exp(th[1]);
        double gain;
        double[] zr, zi, pr, pi;
        int extra = o.toPosition() ? 1 : 0;
        double tau;
        if (kind == Kind.RIGID) {
            gain = kt / j;
            zr = new double[0];
            zi = new double[0];
            pr = new double[1 + extra];
            pi = new double[1 + extra];
            pr[0] = -b / j;
            tau = th.length > 2 ? th[2] * DELAY_UNIT_S : 0;
        } else {
            double wr = 2 * Math.PI * Math.exp(th[2]), zr0 = Math.exp(th[3]), wa = 2 * Math.PI * Math.exp(th[4]), za = Math.exp(th[5]);
            gain = kt * wr * wr / (j * wa * wa);
            zr = new double[2];
            zi = new double[2];
            quadraticRoots(wa, za, zr, zi);
            pr = new double[3 + extra];
            pi = new double[3 + extra];
            pr[0] = -b / j;
            double[] qr = new double[2], qi = new double[2];
            quadraticRoots(wr, zr0, qr, qi);
            pr[1] = qr[0]; pi[1] = qi[0]; pr[2] = qr[1]; pi[2] = qi[1];
            tau = th.length > 6 ? th[6] * DELAY_UNIT_S : 0;
        }
        PoleResidueResponse.evaluate(gain, zr, zi, pr, pi, tau, o.sampleTimeS(), w, re, im);
    }

    /** Roots of s² + 2ζωs + ω². */
    private static void quadraticRoots(double w, double z, double[] re, double[] im) {
        if (z < 1) {
            re[0] = re[1] = -z * w;
            im[0] = w * Math.sqrt(1 - z * z);
            im[1] = -im[0];
        } else {
            double s = w * Math.sqrt(z * z - 1);
            re[0] = -z * w + s;
            re[1] = -z * w - s;
            im[0] = im[1] = 0;
            if (s == 0) re[1] *= 1 + 1e-9; // keep the poles distinct for the sampled-data sum
        }
    }

    private static double[] residuals(Kind kind, Data d, FitOptions o, double[] th) {
        int n = d.n();
        double[] re = new double[n], im = new double[n];
        response(kind, o, th, d.w, re, im);
        double[] r = new double[2 * n];
        for (int i = 0; i < n; i++) {
            // q = Gm / G
            double g2 = d.re[i] * d.re[i] + d.im[i] * d.im[i];
            double qr = (re[i] * d.re[i] + im[i] * d.im[i]) / g2, qi = (im[i] * d.re[i] - re[i] * d.im[i]) / g2;
            r[2 * i] = d.weight[i] * 0.5 * Math.log(qr * qr + qi * qi);
            r[2 * i + 1] = d.weight[i] * Math.atan2(qi, qr);
        }
        return r;
    }

    private static List<BandQuality> quality(Kind kind, Data d, FitOptions o, Solution s, List<double[]> bands, List<String> labels) {
        int n = d.n();
        double[] re = new double[n], im = new double[n];
        response(kind, o, s.theta, d.w, re, im);
        double[] r = residuals(kind, d, o, s.theta);
        List<BandQuality> out = new ArrayList<>();
        for (int bi = 0; bi < bands.size(); bi++) {
            double lo = bands.get(bi)[0], hi = bands.get(bi)[1];
            int cnt = 0;
            double sm = 0, sp = 0, se = 0, sg = 0, sc = 0;
            for (int i = 0; i < n; i++) {
                double f = Units.radPerSToHz(d.w[i]);
                boolean last = bi == bands.size() - 1;
                if (f < lo || (last ? f > hi : f >= hi)) continue;
                cnt++;
                double lnq = r[2 * i] / d.weight[i], ph = r[2 * i + 1] / d.weight[i];
                sm += Math.pow(20 / Math.log(10) * lnq, 2);
                sp += Math.pow(Math.toDegrees(ph), 2);
                se += Math.pow(re[i] - d.re[i], 2) + Math.pow(im[i] - d.im[i], 2);
                sg += d.re[i] * d.re[i] + d.im[i] * d.im[i];
                sc += r[2 * i] * r[2 * i] + r[2 * i + 1] * r[2 * i + 1];
            }
            if (cnt == 0) continue;
            String label = labels != null ? labels.get(bi) : "band";
            out.add(new BandQuality(label, lo, hi, cnt, Math.sqrt(sm / cnt), Math.sqrt(sp / cnt), 100 * Math.sqrt(se / sg), sc / (2.0 * cnt)));
        }
        return out;
    }
}
