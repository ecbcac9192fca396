package org.loopledger.ident.fit;

import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.Function;

/**
 * Usability checks on a finished fit: a least-squares optimum always exists, but it need not mean
 * anything. Each check that finds a problem adds a {@link FitWarning}; a fit with none is usable.
 * <ul>
 *   <li><b>Fit quality</b>: the weighted rms of the complex log ratio |ln(G<sub>m</sub>/G)| above
 *       {@value #MAX_RMS_LOG} (about 3 dB or 20°): the model does not describe the data.</li>
 *   <li><b>Band</b>: a resonance or antiresonance outside the band the data cover.</li>
 *   <li><b>Physical range</b>: modal damping ζ ≥ 1 (no resonance), antiresonance at or above the resonance
 *       (negative inertia ratio), a fitted delay below zero, a non-finite value.</li>
 *   <li><b>Conditioning</b>: the weighted Jacobian at the optimum with condition number above
 *       {@value #MAX_CONDITION}, or a parameter with a zero, negative or non-finite variance: the linearised
 *       covariance, hence every interval, means nothing (Seber and Wild, Nonlinear Regression, 1989, §2.1,
 *       from memory: the intervals rest on JᵀJ being well inverted).</li>
 *   <li><b>Determination</b>: a 95 % interval wider than a factor {@value #MAX_INTERVAL_RATIO} (high/low) for a
 *       parameter fitted on a log scale, or ±{@value #MAX_DELAY_HALF_WIDTH_S} s for the delay.</li>
 *   <li><b>Correlation</b>: |ρ| &gt; {@value #MAX_CORRELATION} between two fitted parameters, from the covariance.</li>
 *   <li><b>Sub-band consistency</b>: the fit is repeated without the lowest and without the highest third of the
 *       band (log scale; for the two-mass model never cutting into the resonance region). A parameter whose
 *       estimates differ by more than {@value #MAX_SUBBAND_SIGMAS} combined standard errors and by more than
 *       {@value #MIN_SUBBAND_CHANGE} relative (2 µs for the delay) depends on the band: the data cannot pin it
 *       down and its interval understates the uncertainty (a model missing something, e.g. Coulomb friction,
 *       shows this way while every interval looks tight). A sub-band fit that fails is skipped.</li>
 * </ul>
 * The thresholds are common practice for engineering fits (an interval over a factor 3, a correlation over
 * 0.99), chosen so the committed synthetic demo fits pass with margin and a fit to noise fails.
 */
final class FitChecks {
    static final double MAX_RMS_LOG = 0.35;
    static final double MAX_CONDITION = 1e8;
    static final double MAX_INTERVAL_RATIO = 3;
    static final double MAX_DELAY_HALF_WIDTH_S = 50e-6;
    static final double MAX_CORRELATION = 0.99;
    static final double MAX_SUBBAND_SIGMAS = 4;
    static final double MIN_SUBBAND_CHANGE = 0.10;
    static final double MIN_SUBBAND_DELAY_CHANGE_S = 2e-6;

    private FitChecks() {}

    /**
     * What the checks read.
     *
     * @param model          "two-mass" or "rigid body", for messages
     * @param fLowHz         lowest frequency of the data used
     * @param fHighHz        highest frequency of the data used
     * @param estimates      the reported parameters (physical units, intervals)
     * @param fittedNames    the names of θ's entries (the covariance's rows): log-scale parameters, then the delay
     * @param cov            covariance of θ
     * @param condition      condition number of the weighted Jacobian at the optimum
     * @param weightedRmsLog weighted rms of |ln(G<sub>m</sub>/G)|
     * @param fittedDelayS   the delay as fitted (may be negative), 0 when not fitted
     * @param twoMass        the two-mass parameters, null for a rigid body
     * @param subBands       bands to refit on (each {lowHz, highHz})
     * @param refit          fits the same model on a band, without checks (may throw)
     */
    record Input(String model, double fLowHz, double fHighHz, List<ParameterEstimate> estimates, List<String> fittedNames, double[][] cov,
                 double condition, double weightedRmsLog, double fittedDelayS, TwoMassParameters twoMass, List<double[]> subBands,
                 Function<double[], List<ParameterEstimate>> refit) {}

    /**
     * The sub-bands of [lo, hi] without its lowest and without its highest third (log scale), never cutting into
     * [keepFrom, keepTo]; a sub-band that would differ from the full band by less than 10 % at its edge is left out.
     */
    static List<double[]> subBands(double lo, double hi, double keepFrom, double keepTo) {
        List<double[]> out = new ArrayList<>();
        double q = Math.pow(hi / lo, 1.0 / 3);
        boolean keep = keepFrom <= keepTo;
        double a = keep ? Math.min(lo * q, keepFrom) : lo * q;
        double b = keep ? Math.max(hi / q, keepTo) : hi / q;
        if (a > lo * 1.1 && a < hi) out.add(new double[] {a, hi});
        if (b < hi / 1.1 && b > lo) out.add(new double[] {lo, b});
        return out;
    }

    static List<FitWarning> check(Input in) {
        List<FitWarning> w = new ArrayList<>();
        quality(in, w);
        band(in, w);
        physical(in, w);
        boolean conditioned = conditioning(in, w);
        if (conditioned) {
            determination(in, w);
            correlation(in, w);
        }
        if (w.isEmpty()) subBandConsistency(in, w); // only meaningful for an otherwise sound fit
        return w;
    }

    private static void quality(Input in, List<FitWarning> w) {
        if (!(in.weightedRmsLog() <= MAX_RMS_LOG)) {
            double db = 20 / Math.log(10) * in.weightedRmsLog() / Math.sqrt(2), deg = Math.toDegrees(in.weightedRmsLog() / Math.sqrt(2));
            w.add(FitWarning.of(FitWarning.Kind.POOR_FIT, null, Double.NaN, String.format(Locale.ROOT,
                    "the %s model misses the data by %.3g (weighted rms of |ln(model/data)|, about %.2g dB and %.2g deg each) where a usable fit stays "
                            + "below %.2g: the model does not describe this FRF (check the coherence, the band, the model choice)",
                    in.model(), in.weightedRmsLog(), db, deg, MAX_RMS_LOG)));
        }
    }

    private static void band(Input in, List<FitWarning> w) {
        if (in.twoMass() == null) return;
        for (String name : List.of("resonance", "antiresonance")) {
            double f = name.equals("resonance") ? in.twoMass().resonanceHz() : in.twoMass().antiresonanceHz();
            if (!(f >= in.fLowHz() && f <= in.fHighHz())) {
                w.add(FitWarning.of(FitWarning.Kind.OUTSIDE_BAND, name, f, String.format(Locale.ROOT,
                        "the %s lies at %s, outside the fitted band %s .. %s: the data cannot have seen it; widen the band or fit a rigid body",
                        name, Units.formatHz(f), Units.formatHz(in.fLowHz()), Units.formatHz(in.fHighHz()))));
            }
        }
    }

    private static void physical(Input in, List<FitWarning> w) {
        for (ParameterEstimate p : in.estimates()) {
            if (!Double.isFinite(p.value())) {
                w.add(FitWarning.of(FitWarning.Kind.OUTSIDE_PHYSICAL_RANGE, p.name(), Double.NaN, p.name() + " is " + p.value() + ": the fit diverged"));
            }
        }
        TwoMassParameters t = in.twoMass();
        if (t != null) {
            for (String name : List.of("resonance damping", "antiresonance damping")) {
                boolean res = name.equals("resonance damping");
                double z = res ? t.resonanceDamping() : t.antiresonanceDamping();
                if (z >= 1) {
                    w.add(FitWarning.of(FitWarning.Kind.OUTSIDE_PHYSICAL_RANGE, name, res ? t.resonanceHz() : t.antiresonanceHz(), String.format(Locale.ROOT,
                            "%s ζ = %.3g ≥ 1: an overdamped pair is no %s; the data show no such peak or notch in the band", name, z,
                            res ? "resonance" : "antiresonance")));
                }
            }
            if (!(t.antiresonanceHz() < t.resonanceHz())) {
                w.add(FitWarning.of(FitWarning.Kind.OUTSIDE_PHYSICAL_RANGE, "inertia ratio", t.antiresonanceHz(), String.format(Locale.ROOT,
                        "antiresonance %s at or above the resonance %s gives an inertia ratio %.3g ≤ 0: no motor-side two-mass axis does that",
                        Units.formatHz(t.antiresonanceHz()), Units.formatHz(t.resonanceHz()), t.inertiaRatio())));
            }
        }
        if (in.fittedDelayS() < 0) {
            ParameterEstimate d = find(in, "delay");
            if (d == null || d.high95() < 0) {
                w.add(FitWarning.of(FitWarning.Kind.OUTSIDE_PHYSICAL_RANGE, "delay", Double.NaN, String.format(Locale.ROOT,
                        "the fitted delay is %.3g µs, below zero beyond its interval: the model misses phase the data have (or the sign or sample time is wrong)",
                        in.fittedDelayS() * 1e6)));
            }
        }
    }

    /** False when the covariance cannot be trusted (then the interval-based checks are skipped). */
    private static boolean conditioning(Input in, List<FitWarning> w) {
        boolean ok = true;
        if (!(in.condition() <= MAX_CONDITION)) {
            w.add(FitWarning.of(FitWarning.Kind.ILL_CONDITIONED, null, Double.NaN, String.format(Locale.ROOT,
                    "the Jacobian at the optimum is near singular (condition number %.3g, limit %.0e): the data do not determine all %d parameters, "
                            + "and the intervals (some of zero or enormous width) mean nothing", in.condition(), MAX_CONDITION, in.fittedNames().size())));
            ok = false;
        }
        for (int i = 0; i < in.fittedNames().size(); i++) {
            double v = in.cov()[i][i];
            if (!(v > 0) || !Double.isFinite(v)) {
                w.add(FitWarning.of(FitWarning.Kind.ILL_CONDITIONED, in.fittedNames().get(i), Double.NaN, String.format(Locale.ROOT,
                        "%s has variance %.3g: its interval (zero width) is an artefact of a singular Jacobian, not a measurement", in.fittedNames().get(i), v)));
                ok = false;
            }
        }
        return ok;
    }

    private static void determination(Input in, List<FitWarning> w) {
        for (ParameterEstimate p : in.estimates()) {
            if (!in.fittedNames().contains(p.name())) continue; // derived parameters follow from the fitted ones
            if (p.name().equals("delay")) {
                double half = 1.96 * p.standardError();
                if (half > MAX_DELAY_HALF_WIDTH_S) {
                    w.add(FitWarning.of(FitWarning.Kind.NOT_DETERMINED, p.name(), Double.NaN, String.format(Locale.ROOT,
                            "the delay's 95 %% interval is ±%.3g µs (more than ±%.3g µs): the data do not determine it", half * 1e6, MAX_DELAY_HALF_WIDTH_S * 1e6)));
                }
                continue;
            }
            double ratio = p.high95() / p.low95();
            if (!(ratio <= MAX_INTERVAL_RATIO)) {
                w.add(FitWarning.of(FitWarning.Kind.NOT_DETERMINED, p.name(), Double.NaN, String.format(Locale.ROOT,
                        "%s = %.4g %s has a 95 %% interval %.4g .. %.4g (a factor %.3g, more than %.0f): the data in %s .. %s do not determine it",
                        p.name(), p.value(), p.unit(), p.low95(), p.high95(), ratio, MAX_INTERVAL_RATIO, Units.formatHz(in.fLowHz()), Units.formatHz(in.fHighHz()))));
            }
        }
    }

    private static void correlation(Input in, List<FitWarning> w) {
        List<String> n = in.fittedNames();
        double[][] c = in.cov();
        for (int i = 0; i < n.size(); i++) {
            for (int j = i + 1; j < n.size(); j++) {
                double rho = c[i][j] / Math.sqrt(c[i][i] * c[j][j]);
                if (Math.abs(rho) > MAX_CORRELATION) {
                    w.add(FitWarning.of(FitWarning.Kind.CORRELATED, n.get(i), Double.NaN, String.format(Locale.ROOT,
                            "%s and %s are correlated (ρ = %+.4f): the data fix a combination of the two, not each one; their separate intervals understate it",
                            n.get(i), n.get(j), rho)));
                }
            }
        }
    }

    private static void subBandConsistency(Input in, List<FitWarning> w) {
        List<List<ParameterEstimate>> fits = new ArrayList<>();
        List<double[]> bands = new ArrayList<>();
        for (double[] band : in.subBands()) {
            try {
                fits.add(in.refit().apply(band));
                bands.add(band);
            } catch (RuntimeException e) {
                // the sub-band alone cannot carry the model: nothing to compare
            }
        }
        for (ParameterEstimate full : in.estimates()) {
            if (!in.fittedNames().contains(full.name())) continue;
            boolean delay = full.name().equals("delay");
            double worstZ = 0;
            ParameterEstimate worst = null;
            double[] worstBand = null;
            for (int k = 0; k < fits.size(); k++) {
                ParameterEstimate s = null;
                for (ParameterEstimate p : fits.get(k)) if (p.name().equals(full.name())) s = p;
                if (s == null) continue;
                double diff, sigma;
                boolean large;
                if (delay) {
                    diff = Math.abs(s.value() - full.value());
                    sigma = Math.hypot(s.standardError(), full.standardError());
                    large = diff > Math.max(MIN_SUBBAND_DELAY_CHANGE_S, MIN_SUBBAND_CHANGE * Math.abs(full.value()));
                } else {
                    diff = Math.abs(Math.log(s.value() / full.value()));
                    sigma = Math.hypot(s.standardError() / s.value(), full.standardError() / full.value());
                    large = Math.expm1(diff) > MIN_SUBBAND_CHANGE;
                }
                double z = diff / sigma;
                if (large && z > MAX_SUBBAND_SIGMAS && z > worstZ) {
                    worstZ = z;
                    worst = s;
                    worstBand = bands.get(k);
                }
            }
            if (worst != null) {
                w.add(FitWarning.of(FitWarning.Kind.BAND_DEPENDENT, full.name(), Double.NaN, String.format(Locale.ROOT,
                        "%s = %.4g %s on %s .. %s but %.4g on %s .. %s (%.3g combined standard errors apart): the estimate depends on the band, "
                                + "the data cannot pin it down, and its interval understates the uncertainty",
                        full.name(), full.value(), full.unit(), Units.formatHz(in.fLowHz()), Units.formatHz(in.fHighHz()), worst.value(),
                        Units.formatHz(worstBand[0]), Units.formatHz(worstBand[1]), worstZ)));
            }
        }
    }

    private static ParameterEstimate find(Input in, String name) {
        for (ParameterEstimate p : in.estimates()) if (p.name().equals(name)) return p;
        return null;
    }
}
