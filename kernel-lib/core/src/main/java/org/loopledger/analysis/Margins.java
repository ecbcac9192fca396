package org.loopledger.analysis;

import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * Stability margins of a loop gain L, all crossings listed:
 * <ul>
 *   <li>every gain crossover (|L| = 1) with its phase margin PM = ∠L + 180° (canonical unwrapped branch,
 *       anchored at -90° per net integrator; may be negative), delay margin PM/ω and distance |1+L| to -1;</li>
 *   <li>every phase crossover (∠L = -180° + k·360°) with its gain margin 1/|L| (ratio and dB); the upper
 *       gain margin is the smallest factor above 1, the lower gain margin the largest factor below 1
 *       (conditionally stable loops have both);</li>
 *   <li>modulus margin: Ms = max |S| = 1/min|1+L| and its frequency; peak |T|; closed-loop -3 dB bandwidth.</li>
 * </ul>
 *
 * <p>For measured loops only crossings inside the band are reported ("none in band" otherwise) and
 * {@link #warnings()} says when the band does not cover them. Sampled loops are evaluated at
 * z = e<sup>jωT</sup> up to the Nyquist frequency only.
 *
 * <p>References for the definitions: Åström and Murray, Feedback Systems, 2nd ed., §10.3 (gain, phase
 * and delay margins; stability margin s<sub>m</sub> = 1/Ms), and Skogestad and Postlethwaite,
 * Multivariable Feedback Control, 2nd ed., §2.4 (GM, PM, Ms, Mt, bandwidth of T).
 */
public final class Margins {
    private final int points;
    private final boolean computedFromModel;
    private final String modelDescription; // null for a loop on a grid
    private final double lowRadPerS;
    private final double highRadPerS;
    private final boolean measured;
    private final OptionalDouble sampleTimeS;
    private final List<GainCrossover> gainCrossovers;
    private final List<PhaseCrossover> phaseCrossovers;
    private final Peak sensitivityPeak;
    private final Peak complementaryPeak;
    private final Bandwidth bandwidth;
    private final int netIntegrators;
    private final OptionalInt openLoopUnstablePoles;
    private final int polesOnAxis;
    private final List<LoopWarning> warnings;

    private Margins(String modelDescription, LoopResponse l, List<GainCrossover> gc, List<PhaseCrossover> pc, Peak ms, Peak mt, Bandwidth bw,
                    List<LoopWarning> warnings) {
        this.modelDescription = modelDescription;
        this.points = l.size();
        this.computedFromModel = l instanceof MeasuredLoop ml && ml.computedFromModel();
        this.lowRadPerS = l.lowRadPerS();
        this.highRadPerS = l.highRadPerS();
        this.measured = l.isMeasured();
        this.sampleTimeS = l.sampleTimeS();
        this.gainCrossovers = List.copyOf(gc);
        this.phaseCrossovers = List.copyOf(pc);
        this.sensitivityPeak = ms;
        this.complementaryPeak = mt;
        this.bandwidth = bw;
        this.netIntegrators = l.netIntegrators();
        this.openLoopUnstablePoles = l.openLoopUnstablePoles();
        this.polesOnAxis = l.openLoopPolesOnAxis();
        this.warnings = List.copyOf(warnings);
    }

    /** Margins of a model loop gain (continuous or sampled, with or without delay). */
    public static Margins of(TransferFunction loopGain) { return of(ModelLoop.of(loopGain)); }

    /** Margins of a measured continuous-time loop gain (inside its band only). */
    public static Margins of(Frf loopGain) { return of(MeasuredLoop.of(loopGain)); }

    /** Fast path: margins of a measured loop given as primitive arrays (rad/s, Re L, Im L). */
    public static Margins ofArrays(double[] omegaRadPerS, double[] re, double[] im) {
        // the loop does not escape this call (the result keeps figures only), so the arrays need no copy
        return of(MeasuredLoop.validatedView(omegaRadPerS, re, im));
    }

    /** Margins of any loop response. */
    public static Margins of(LoopResponse l) {
        List<LoopWarning> warn = new ArrayList<>();
        OptionalDouble ts = l.sampleTimeS();
        double[] v = new double[3];

        // gain crossovers
        boolean flatGain = l instanceof ModelLoop ml0 && ml0.degenerateGain();
        boolean flatPhase = l instanceof ModelLoop ml1 && ml1.degeneratePhase();
        List<LoopScan.Crossing> gcs = flatGain ? List.of() : LoopScan.gainCrossings(l);
        Optional<double[]> exactGc = l.exactGainCrossoversRadPerS();
        if (exactGc.isPresent()) gcs = LoopScan.merge(l, exactGc.get(), gcs);
        List<GainCrossover> gain = new ArrayList<>();
        for (LoopScan.Crossing c : gcs) {
            double w = c.omegaRadPerS();
            l.valueAt(w, c.bracket(), v);
            double pmRad = v[2] + Math.PI;
            // the extra lag that brings this crossing onto -1 is PM reduced modulo 360° (0 when PM ≤ 0: already past it)
            double dm = (pmRad <= 0 ? 0 : pmRad % (2 * Math.PI)) / w;
            gain.add(new GainCrossover(w, Math.toDegrees(v[2]), Math.toDegrees(pmRad), Math.hypot(1 + v[0], v[1]), dm,
                    ts.isPresent() ? OptionalDouble.of(dm / ts.getAsDouble()) : OptionalDouble.empty()));
        }

        // phase crossovers
        List<LoopScan.Crossing> pcs = flatPhase ? List.of() : LoopScan.phaseCrossings(l);
        Optional<double[]> exactPc = l.exactPhaseCrossoversRadPerS();
        if (exactPc.isPresent()) pcs = LoopScan.merge(l, exactPc.get(), pcs);
        List<PhaseCrossover> phase = new ArrayList<>();
        Optional<TransferFunction> model = l.model();
        if (model.isPresent() && l.netIntegrators() == 0) {
            double dc = model.get().withoutDelay().dcGain();
            if (Double.isFinite(dc) && dc < 0) {
                double k0 = Math.round((l.phaseRad(0) + Math.PI) / (2 * Math.PI));
                phase.add(new PhaseCrossover(0, -dc, Math.toDegrees(2 * Math.PI * k0 - Math.PI), 1 / -dc, Math.abs(1 + dc)));
            }
        }
        for (LoopScan.Crossing c : pcs) {
            double w = c.omegaRadPerS();
            l.valueAt(w, c.bracket(), v);
            double mag = Math.hypot(v[0], v[1]);
            double k = Math.round((v[2] + Math.PI) / (2 * Math.PI));
            phase.add(new PhaseCrossover(w, mag, Math.toDegrees(2 * Math.PI * k - Math.PI), 1 / mag, Math.hypot(1 + v[0], v[1])));
        }
        if (model.isPresent() && ts.isPresent()) {
            // the Nyquist point z = -1 is real: a phase crossover when L is negative there
            int last = l.size() - 1;
            double wn = Math.PI / ts.getAsDouble();
            double r = l.re(last), m = l.im(last);
            boolean already = !phase.isEmpty() && Math.abs(phase.get(phase.size() - 1).omegaRadPerS() - wn) <= 1e-9 * wn;
            if (!already && Math.abs(l.omegaRadPerS(last) - wn) <= 1e-12 * wn && model.get().delayS() == 0 && r < 0
                    && Math.abs(m) <= 1e-9 * Math.abs(r)) {
                double k = Math.round((l.phaseRad(last) + Math.PI) / (2 * Math.PI));
                phase.add(new PhaseCrossover(wn, -r, Math.toDegrees(2 * Math.PI * k - Math.PI), 1 / -r, Math.abs(1 + r)));
            }
        }

        // a phase crossover where |L| is below 1e-12 (gain margin above 240 dB) is no margin: no gain change reaches it, and
        // there the phase is set by rounding (a ZOH double integrator and a Tustin low-pass put zeros at z = -1 that the
        // root finder returns split by 1e-7, on both sides of the unit circle, so L near Nyquist wanders around the origin)
        int negligible = 0;
        for (var it = phase.iterator(); it.hasNext(); ) {
            if (it.next().magnitude() < NEGLIGIBLE_LOOP_GAIN) { it.remove(); negligible++; }
        }
        if (negligible > 0) {
            warn.add(LoopWarning.of(LoopWarning.Kind.NEGLIGIBLE_CROSSOVERS_LEFT_OUT,
                    negligible + " phase crossover(s) where |L| < 1e-12 (gain margin above 240 dB, phase set by rounding) left out"));
        }

        // closed-loop peaks and bandwidth
        LoopScan.Extremum s = LoopScan.peak(l, LoopScan.Closed.SENSITIVITY);
        LoopScan.Extremum t = LoopScan.peak(l, LoopScan.Closed.COMPLEMENTARY);
        Peak ms = new Peak(Math.sqrt(s.value()), s.omegaRadPerS(), s.atEdge());
        Peak mt = new Peak(Math.sqrt(t.value()), t.omegaRadPerS(), t.atEdge());
        Bandwidth bw = bandwidth(l);

        // warnings
        final double hiW = l.highRadPerS(), loW = l.lowRadPerS();
        final int nInt = l.netIntegrators();
        if (l instanceof ModelLoop ml) {
            if (ml.degenerateGain()) warn.add(LoopWarning.of(LoopWarning.Kind.GAIN_NOT_ISOLATED, "|L| = 1 at every frequency (all-pass loop): gain crossovers are not isolated points"));
            if (ml.degeneratePhase()) warn.add(LoopWarning.of(LoopWarning.Kind.PHASE_NOT_ISOLATED, "L is real over whole frequency intervals: phase crossovers are not isolated points"));
            if (ml.delayS() > 0 && ts.isEmpty()) {
                warn.add(LoopWarning.atRadPerS(LoopWarning.Kind.CROSSOVERS_TRUNCATED, hiW, "the delay adds phase crossovers without end; listed up to "
                        + Units.formatRadPerSAsHz(hiW) + " (ten times the highest pole, zero or crossover frequency, and at least 3 delay periods)"));
            }
            int other = l.openLoopPolesOnAxis() - Math.max(0, l.netIntegrators());
            if (other > 0) warn.add(LoopWarning.of(LoopWarning.Kind.POLES_ON_BOUNDARY, other + " open-loop pole(s) on the imaginary axis (unit circle) besides integrators: |L| is infinite there"));
        }
        OptionalInt unstable = l.openLoopUnstablePoles();
        if (unstable.isPresent() && unstable.getAsInt() > 0) {
            warn.add(LoopWarning.of(LoopWarning.Kind.OPEN_LOOP_UNSTABLE, "the open loop has " + unstable.getAsInt()
                    + " unstable pole(s): margins alone do not decide closed-loop stability; use ClosedLoopStability"));
        }
        if (l.isMeasured()) {
            int last = l.size() - 1;
            double magTop = Math.exp(LoopScan.logMag(l, last));
            double magBottom = Math.exp(LoopScan.logMag(l, 0));
            if (magTop > 1) {
                warn.add(LoopWarning.atRadPerS(LoopWarning.Kind.CROSSOVER_ABOVE_BAND, hiW, "|L| is still " + Units.formatDb(Units.ratioToDb(magTop))
                        + " at the top of the band (" + Units.formatRadPerSAsHz(hiW) + "): a gain crossover lies above the measured band; margins there are unknown"));
            }
            if (magBottom < 1) {
                warn.add(LoopWarning.atRadPerS(LoopWarning.Kind.CROSSOVER_BELOW_BAND, loW, "|L| is already " + Units.formatDb(Units.ratioToDb(magBottom))
                        + " at the bottom of the band (" + Units.formatRadPerSAsHz(loW) + "): a gain crossover may lie below the measured band"));
            }
            if (gain.isEmpty()) warn.add(LoopWarning.of(LoopWarning.Kind.NO_GAIN_CROSSOVER_IN_BAND, "no gain crossover in the measured band: phase margin none in band"));
            if (phase.isEmpty()) {
                warn.add(LoopWarning.atRadPerS(LoopWarning.Kind.NO_PHASE_CROSSOVER_IN_BAND, hiW, "no phase crossover in the measured band: the gain margin may be set above "
                        + Units.formatRadPerSAsHz(hiW) + " (|L| there " + Units.formatDb(Units.ratioToDb(magTop)) + ")"));
            }
            int gClusters = clusters(gain.stream().mapToDouble(GainCrossover::omegaRadPerS).toArray());
            int pClusters = clusters(phase.stream().mapToDouble(PhaseCrossover::omegaRadPerS).toArray());
            if (gClusters + pClusters > 0) {
                warn.add(LoopWarning.of(LoopWarning.Kind.CLUSTERED_CROSSINGS, "crossings closer than 5 % in frequency (" + gClusters + " gain, " + pClusters
                        + " phase): likely measurement noise near |L| = 1 or -180 deg; all are listed and the worst one counts"));
            }
            if (ms.atBandEdge()) {
                warn.add(LoopWarning.atRadPerS(LoopWarning.Kind.PEAK_AT_BAND_EDGE, ms.omegaRadPerS(), "peak |S| sits at the band edge "
                        + Units.formatRadPerSAsHz(ms.omegaRadPerS()) + ": the true Ms may lie outside the band"));
            }
            if (l instanceof MeasuredLoop m && !m.integratorsStated()) {
                warn.add(LoopWarning.of(LoopWarning.Kind.INTEGRATORS_ESTIMATED, "net integrators estimated from the low-frequency slope: " + nInt
                        + " (state them with withIntegrators if known)"));
            }
        }
        return new Margins(l.isMeasured() ? null : l.describe(), l, gain, phase, ms, mt, bw, warn);
    }

    /** |L| under which a phase crossover is not reported (a gain margin of 240 dB). */
    public static final double NEGLIGIBLE_LOOP_GAIN = 1e-12;

    private static Bandwidth bandwidth(LoopResponse l) { return bandwidth(l, Bandwidth.HALF_POWER_DB); }

    /**
     * The first frequency where |T| falls {@code -thresholdDb} dB below its low-frequency value (thresholdDb &lt; 0;
     * {@link Bandwidth#HALF_POWER_DB} is the usual -3 dB point |T(0)|/√2). See {@link Bandwidth#of(TransferFunction, double)}.
     */
    static Bandwidth bandwidth(LoopResponse l, double thresholdDb) {
        if (!(thresholdDb < 0) || Double.isInfinite(thresholdDb)) {
            throw new IllegalArgumentException("bandwidth threshold must be a finite negative number of dB (-3 for the usual bandwidth, -6 for half amplitude), got "
                    + thresholdDb + " dB");
        }
        String level = Math.abs(thresholdDb - Bandwidth.HALF_POWER_DB) < 1e-12 ? "-3 dB" : Units.formatDb(thresholdDb);
        int n = l.netIntegrators();
        double ref;
        String note = "";
        if (n >= 1) {
            ref = 1;
        } else if (n < 0) {
            return new Bandwidth(OptionalDouble.empty(), 0, "T(0) = 0 (the loop has a zero at DC): no low-frequency reference", thresholdDb);
        } else if (l.model().isPresent()) {
            double dc = l.model().get().withoutDelay().dcGain();
            if (1 + dc == 0) return new Bandwidth(OptionalDouble.empty(), Double.POSITIVE_INFINITY, "1 + L(0) = 0: T(0) is infinite", thresholdDb);
            ref = Math.abs(dc / (1 + dc));
        } else {
            ref = Math.sqrt(LoopScan.closedSq(LoopScan.Closed.COMPLEMENTARY, l.re(0), l.im(0)));
            note = "reference |T| = " + Units.g4(ref) + " taken at the lowest measured frequency";
        }
        if (ref == 0) return new Bandwidth(OptionalDouble.empty(), 0, "T(0) = 0: no low-frequency reference", thresholdDb);
        double ratio = thresholdDb == Bandwidth.HALF_POWER_DB ? 1 / Math.sqrt(2) : Units.dbToRatio(thresholdDb);
        double w = LoopScan.firstBelow(l, ref * ratio);
        if (w < 0) {
            return new Bandwidth(OptionalDouble.empty(), ref, join(note, "|T| already below " + level + " at the lowest frequency " + Units.formatRadPerSAsHz(l.lowRadPerS())), thresholdDb);
        }
        if (Double.isNaN(w)) return new Bandwidth(OptionalDouble.empty(), ref, join(note, "|T| stays above " + level + " up to " + Units.formatRadPerSAsHz(l.highRadPerS())), thresholdDb);
        return new Bandwidth(OptionalDouble.of(w), ref, note, thresholdDb);
    }

    /** Number of neighbours closer than 5 % in frequency. */
    private static int clusters(double[] w) {
        int k = 0;
        for (int i = 1; i < w.length; i++) if (w[i] < 1.05 * w[i - 1]) k++;
        return k;
    }

    private static String join(String a, String b) { return a.isEmpty() ? b : a + "; " + b; }

    /** Every gain crossover, ascending in frequency (empty: no crossover). */
    public List<GainCrossover> gainCrossovers() { return gainCrossovers; }

    /** Every phase crossover, ascending in frequency (empty: no crossover). */
    public List<PhaseCrossover> phaseCrossovers() { return phaseCrossovers; }

    /** The smallest gain increase that moves a crossing onto -1 (empty: no phase crossover with |L| &lt; 1). */
    public Optional<PhaseCrossover> upperGainMargin() {
        PhaseCrossover best = null;
        for (PhaseCrossover p : phaseCrossovers) if (p.gainMarginRatio() > 1 && (best == null || p.gainMarginRatio() < best.gainMarginRatio())) best = p;
        return Optional.ofNullable(best);
    }

    /** The smallest gain decrease that moves a crossing onto -1 (empty: no phase crossover with |L| &gt; 1). */
    public Optional<PhaseCrossover> lowerGainMargin() {
        PhaseCrossover best = null;
        for (PhaseCrossover p : phaseCrossovers) if (p.gainMarginRatio() < 1 && (best == null || p.gainMarginRatio() > best.gainMarginRatio())) best = p;
        return Optional.ofNullable(best);
    }

    /**
     * The gain crossover with the smallest phase margin (empty: no gain crossover); its margin is
     * {@link #phaseMarginDeg}. (Named for what it returns, a crossover, not a margin.)
     */
    public Optional<GainCrossover> phaseMarginCrossover() {
        return gainCrossovers.stream().min((a, b) -> Double.compare(a.phaseMarginDeg(), b.phaseMarginDeg()));
    }

    /** Smallest phase margin in degrees, empty when there is no gain crossover. */
    public OptionalDouble phaseMarginDeg() {
        return phaseMarginCrossover().map(g -> OptionalDouble.of(g.phaseMarginDeg())).orElse(OptionalDouble.empty());
    }

    /** Upper gain margin in dB, empty when there is none. */
    public OptionalDouble gainMarginDb() {
        return upperGainMargin().map(p -> OptionalDouble.of(p.gainMarginDb())).orElse(OptionalDouble.empty());
    }

    /** Smallest delay margin over the gain crossovers, in s (empty: no gain crossover). */
    public OptionalDouble delayMarginS() {
        return gainCrossovers.stream().mapToDouble(GainCrossover::delayMarginS).min();
    }

    /** Smallest delay margin in samples for a sampled loop. */
    public OptionalDouble delayMarginSamples() {
        if (sampleTimeS.isEmpty()) return OptionalDouble.empty();
        OptionalDouble d = delayMarginS();
        return d.isPresent() ? OptionalDouble.of(d.getAsDouble() / sampleTimeS.getAsDouble()) : d;
    }

    /** Ms = max |S| and its frequency. */
    public Peak sensitivityPeak() { return sensitivityPeak; }

    /** Modulus margin 1/Ms = min |1 + L|: the distance from L to -1. */
    public double modulusMargin() { return 1 / sensitivityPeak.magnitude(); }

    /** Mt = max |T| and its frequency. */
    public Peak complementaryPeak() { return complementaryPeak; }

    public Bandwidth bandwidth() { return bandwidth; }

    public int netIntegrators() { return netIntegrators; }

    /** Open-loop unstable poles (models; data only when stated). */
    public OptionalInt openLoopUnstablePoles() { return openLoopUnstablePoles; }

    public int openLoopPolesOnAxis() { return polesOnAxis; }

    public boolean measured() { return measured; }

    public OptionalDouble sampleTimeS() { return sampleTimeS; }

    public double lowRadPerS() { return lowRadPerS; }

    public double highRadPerS() { return highRadPerS; }

    /**
     * Where the figures come from, in words: the model, or "measured data" / "model response on a grid" with the
     * number of points, the band and the sample rate.
     */
    public String source() {
        if (modelDescription != null) return modelDescription;
        return (computedFromModel ? "model response on a grid, " : "measured data, ") + points + " points, " + Units.formatRadPerSAsHz(lowRadPerS)
                + " .. " + Units.formatRadPerSAsHz(highRadPerS) + (sampleTimeS.isPresent() ? ", sampled at " + Units.formatHz(1 / sampleTimeS.getAsDouble()) : "");
    }

    /** Warnings and notes (band coverage, degenerate cases), structured: kind, frequency where it applies, message. */
    public List<LoopWarning> warnings() { return warnings; }

    private String none() { return measured ? "none in band" : "no crossover"; }

    /** One line: where the figures come from, phase margin, gain margin and Ms (the full report: {@code display.MarginsReportText}). */
    @Override public String toString() {
        return "Margins (" + source() + "): PM " + phaseMarginCrossover().map(g -> Units.formatDeg(g.phaseMarginDeg()) + " at " + Units.formatRadPerSAsHz(g.omegaRadPerS())).orElse(none())
                + ", GM " + upperGainMargin().map(p -> Units.formatDb(p.gainMarginDb()) + " at " + Units.formatRadPerSAsHz(p.omegaRadPerS())).orElse(none())
                + ", Ms " + Units.g4(sensitivityPeak.magnitude()) + (warnings.isEmpty() ? "" : ", " + warnings.size() + (warnings.size() == 1 ? " note" : " notes"));
    }
}
