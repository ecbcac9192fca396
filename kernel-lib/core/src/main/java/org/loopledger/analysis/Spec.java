package org.loopledger.analysis;

import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

/**
 * Loop requirements with units in their names, checked against a loop gain into a {@link SpecReport}.
 *
 * <pre>{@code
 * Spec spec = Spec.builder().minBandwidthHz(80).minPhaseMarginDeg(45).minGainMarginDb(8).maxSensitivityPeak(1.6).build();
 * SpecReport r = spec.check(loopGain);
 * }</pre>
 *
 * Limits are validated when set: a nonsense limit (negative phase margin, Ms below 1, NaN) is an
 * {@link IllegalArgumentException} naming the value and the allowed range. Every requirement is checked
 * against the worst case over all crossings (smallest PM, smallest upper GM, smallest delay margin).
 */
public final class Spec {
    private final double minBandwidthRadPerS;
    private final double minPhaseMarginDeg;
    private final double minGainMarginDb;
    private final double minLowerGainMarginDb;
    private final double maxSensitivityPeak;
    private final double maxComplementaryPeak;
    private final double minDelayMarginS;
    private final boolean requireStable;

    private Spec(Builder b) {
        this.minBandwidthRadPerS = b.minBandwidthRadPerS;
        this.minPhaseMarginDeg = b.minPhaseMarginDeg;
        this.minGainMarginDb = b.minGainMarginDb;
        this.minLowerGainMarginDb = b.minLowerGainMarginDb;
        this.maxSensitivityPeak = b.maxSensitivityPeak;
        this.maxComplementaryPeak = b.maxComplementaryPeak;
        this.minDelayMarginS = b.minDelayMarginS;
        this.requireStable = b.requireStable;
    }

    public static Builder builder() { return new Builder(); }

    /** A builder holding this spec's requirements, to add the ones not yet set (each may still be set once). */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.minBandwidthRadPerS = minBandwidthRadPerS;
        b.minPhaseMarginDeg = minPhaseMarginDeg;
        b.minGainMarginDb = minGainMarginDb;
        b.minLowerGainMarginDb = minLowerGainMarginDb;
        b.maxSensitivityPeak = maxSensitivityPeak;
        b.maxComplementaryPeak = maxComplementaryPeak;
        b.minDelayMarginS = minDelayMarginS;
        b.requireStable = requireStable;
        return b;
    }

    private static OptionalDouble opt(double v) { return Double.isNaN(v) ? OptionalDouble.empty() : OptionalDouble.of(v); }

    /** Minimum closed-loop bandwidth in Hz, if required. */
    public OptionalDouble minBandwidthHz() { return Double.isNaN(minBandwidthRadPerS) ? OptionalDouble.empty() : OptionalDouble.of(Units.radPerSToHz(minBandwidthRadPerS)); }

    /** Minimum phase margin in degrees, if required. */
    public OptionalDouble minPhaseMarginDeg() { return opt(minPhaseMarginDeg); }

    /** Minimum gain margin (increase) in dB, if required. */
    public OptionalDouble minGainMarginDb() { return opt(minGainMarginDb); }

    /** Minimum gain margin for a decrease in dB (a positive number), if required. */
    public OptionalDouble minLowerGainMarginDb() { return opt(minLowerGainMarginDb); }

    /** Maximum sensitivity peak Ms as a ratio, if required. */
    public OptionalDouble maxSensitivityPeak() { return opt(maxSensitivityPeak); }

    /** Maximum complementary sensitivity peak Mt as a ratio, if required. */
    public OptionalDouble maxComplementaryPeak() { return opt(maxComplementaryPeak); }

    /** Minimum delay margin in seconds, if required. */
    public OptionalDouble minDelayMarginS() { return opt(minDelayMarginS); }

    /** Whether closed-loop stability is required. */
    public boolean requiresStability() { return requireStable; }

    /** Builder; each limit may be set once. NaN marks "not required". */
    public static final class Builder {
        private double minBandwidthRadPerS = Double.NaN;
        private double minPhaseMarginDeg = Double.NaN;
        private double minGainMarginDb = Double.NaN;
        private double minLowerGainMarginDb = Double.NaN;
        private double maxSensitivityPeak = Double.NaN;
        private double maxComplementaryPeak = Double.NaN;
        private double minDelayMarginS = Double.NaN;
        private boolean requireStable;

        private Builder() {}

        private static void once(double current, String what) {
            if (!Double.isNaN(current)) throw new IllegalArgumentException(what + " is set twice; set each requirement once");
        }

        private static double finite(double v, String what) {
            if (!Double.isFinite(v)) throw new IllegalArgumentException(what + " must be a finite number, got " + v);
            return v;
        }

        /** Closed-loop -3 dB bandwidth of T at least {@code hz} (0 &lt; hz). */
        public Builder minBandwidthHz(double hz) {
            once(minBandwidthRadPerS, "minimum bandwidth");
            if (!(finite(hz, "minimum bandwidth") > 0)) {
                throw new IllegalArgumentException("minimum bandwidth must be positive, got " + hz + " Hz");
            }
            minBandwidthRadPerS = Units.hzToRadPerS(hz);
            return this;
        }

        /**
         * Phase margin at every gain crossover at least {@code deg} (0 &lt; deg &lt; 90).
         *
         * <p>One rule for checks and for the tuner ({@code tune.TuningSpec} holds a Spec). 90° is excluded: a
         * loop with an integrator and any lag (a servo velocity loop with PI action, a position loop around it,
         * sampling delay) has arg L below −90° at its crossover, so a limit of 90° or more could never be met and
         * only hides a typo; common practice puts phase-margin limits at 30 to 60°.
         */
        public Builder minPhaseMarginDeg(double deg) {
            once(minPhaseMarginDeg, "minimum phase margin");
            if (!(finite(deg, "minimum phase margin") > 0 && deg < 90)) {
                throw new IllegalArgumentException("minimum phase margin must lie in (0, 90) deg, got " + deg
                        + " deg; a margin of 0 or less allows an unstable loop, 90 or more no loop with an integrator"
                        + " and any lag can meet (typical limits: 30 to 60 deg)");
            }
            minPhaseMarginDeg = deg;
            return this;
        }

        /** Gain margin for a gain increase at least {@code db} (0 &lt; dB). */
        public Builder minGainMarginDb(double db) {
            once(minGainMarginDb, "minimum gain margin");
            if (!(finite(db, "minimum gain margin") > 0)) {
                throw new IllegalArgumentException("minimum gain margin must be positive, got " + db
                        + " dB; 0 dB or less allows an unstable loop (typical targets: 6 to 12 dB)");
            }
            minGainMarginDb = db;
            return this;
        }

        /** For conditionally stable loops: the gain may drop by at least {@code db} (given as a positive number). */
        public Builder minLowerGainMarginDb(double db) {
            once(minLowerGainMarginDb, "minimum lower gain margin");
            if (!(finite(db, "minimum lower gain margin") > 0)) {
                throw new IllegalArgumentException("minimum lower gain margin must be given as a positive number of dB (the allowed decrease), got " + db);
            }
            minLowerGainMarginDb = db;
            return this;
        }

        /** Ms = max |S| at most {@code ratio} (1 &lt; ratio). */
        public Builder maxSensitivityPeak(double ratio) {
            once(maxSensitivityPeak, "maximum sensitivity peak");
            if (!(finite(ratio, "maximum sensitivity peak") > 1)) {
                throw new IllegalArgumentException("maximum sensitivity peak Ms must be above 1 (a ratio, not dB), got " + ratio
                        + "; typical limits are 1.3 to 2 (use maxSensitivityPeakDb for dB)");
            }
            maxSensitivityPeak = ratio;
            return this;
        }

        /** Ms at most {@code db} dB (0 &lt; dB). */
        public Builder maxSensitivityPeakDb(double db) {
            if (!(finite(db, "maximum sensitivity peak") > 0)) {
                throw new IllegalArgumentException("maximum sensitivity peak must be above 0 dB, got " + db + " dB; typical limits are 2.3 to 6 dB");
            }
            return maxSensitivityPeak(Units.dbToRatio(db));
        }

        /** Mt = max |T| at most {@code db} dB (0 &lt; dB). */
        public Builder maxComplementaryPeakDb(double db) {
            once(maxComplementaryPeak, "maximum complementary sensitivity peak");
            if (!(finite(db, "maximum complementary sensitivity peak") > 0)) {
                throw new IllegalArgumentException("maximum peak of |T| must be above 0 dB, got " + db + " dB");
            }
            maxComplementaryPeak = Units.dbToRatio(db);
            return this;
        }

        /** Delay margin at least {@code seconds} (0 &lt; s). */
        public Builder minDelayMarginS(double seconds) {
            once(minDelayMarginS, "minimum delay margin");
            if (!(finite(seconds, "minimum delay margin") > 0)) {
                throw new IllegalArgumentException("minimum delay margin must be positive, got " + seconds + " s");
            }
            minDelayMarginS = seconds;
            return this;
        }

        /** Closed loop must be stable (poles for models, Nyquist count for data with stated open-loop unstable poles). */
        public Builder requireStable() { requireStable = true; return this; }

        public Spec build() {
            if (Double.isNaN(minBandwidthRadPerS) && Double.isNaN(minPhaseMarginDeg) && Double.isNaN(minGainMarginDb)
                    && Double.isNaN(minLowerGainMarginDb) && Double.isNaN(maxSensitivityPeak) && Double.isNaN(maxComplementaryPeak)
                    && Double.isNaN(minDelayMarginS) && !requireStable) {
                throw new IllegalArgumentException("a Spec needs at least one requirement (for example minPhaseMarginDeg(45))");
            }
            return new Spec(this);
        }
    }

    /** Checks a model loop gain. */
    public SpecReport check(TransferFunction loopGain) { return check(ModelLoop.of(loopGain)); }

    /** Checks a measured loop gain (stability only when the unstable open-loop poles are stated, see {@link MeasuredLoop}). */
    public SpecReport check(Frf loopGain) { return check(MeasuredLoop.of(loopGain)); }

    /** Checks any loop response. */
    public SpecReport check(LoopResponse l) {
        Margins m = Margins.of(l);
        List<SpecReport.Row> rows = new ArrayList<>();
        String none = m.measured() ? "none in band" : "no crossover";
        if (!Double.isNaN(minBandwidthRadPerS)) {
            Bandwidth bw = m.bandwidth();
            if (bw.isPresent()) {
                double w = bw.omegaRadPerS().getAsDouble();
                rows.add(row("bandwidth (-3 dB of T)", ">= " + Units.formatRadPerSAsHz(minBandwidthRadPerS), Units.formatRadPerSAsHz(w), w >= minBandwidthRadPerS,
                        Units.radPerSToHz(w), Units.radPerSToHz(minBandwidthRadPerS), OptionalDouble.of(Units.radPerSToHz(w))));
            } else {
                rows.add(row("bandwidth (-3 dB of T)", ">= " + Units.formatRadPerSAsHz(minBandwidthRadPerS), bw.toString(), false, Double.NaN,
                        Units.radPerSToHz(minBandwidthRadPerS), OptionalDouble.empty()));
            }
        }
        if (!Double.isNaN(minPhaseMarginDeg)) {
            var g = m.phaseMarginCrossover();
            if (g.isPresent()) {
                double pm = g.get().phaseMarginDeg();
                rows.add(row("phase margin", ">= " + Units.formatDeg(minPhaseMarginDeg), Units.formatDeg(pm), pm >= minPhaseMarginDeg, pm, minPhaseMarginDeg,
                        OptionalDouble.of(g.get().frequencyHz())));
            } else {
                rows.add(row("phase margin", ">= " + Units.formatDeg(minPhaseMarginDeg), none, false, Double.NaN, minPhaseMarginDeg, OptionalDouble.empty()));
            }
        }
        if (!Double.isNaN(minGainMarginDb)) {
            var p = m.upperGainMargin();
            if (p.isPresent()) {
                double gm = p.get().gainMarginDb();
                rows.add(row("gain margin (increase)", ">= " + Units.formatDb(minGainMarginDb), Units.formatDb(gm), gm >= minGainMarginDb, gm, minGainMarginDb,
                        OptionalDouble.of(p.get().frequencyHz())));
            } else if (!m.measured()) {
                rows.add(row("gain margin (increase)", ">= " + Units.formatDb(minGainMarginDb), "unlimited (no phase crossover with |L| < 1)", true,
                        Double.POSITIVE_INFINITY, minGainMarginDb, OptionalDouble.empty()));
            } else {
                rows.add(row("gain margin (increase)", ">= " + Units.formatDb(minGainMarginDb), "none in band (unknown above the band)", false,
                        Double.NaN, minGainMarginDb, OptionalDouble.empty()));
            }
        }
        if (!Double.isNaN(minLowerGainMarginDb)) {
            var p = m.lowerGainMargin();
            if (p.isPresent()) {
                double gm = -p.get().gainMarginDb();
                rows.add(row("gain margin (decrease)", ">= " + Units.formatDb(minLowerGainMarginDb), Units.formatDb(gm), gm >= minLowerGainMarginDb, gm,
                        minLowerGainMarginDb, OptionalDouble.of(p.get().frequencyHz())));
            } else {
                rows.add(row("gain margin (decrease)", ">= " + Units.formatDb(minLowerGainMarginDb),
                        m.measured() ? "none in band" : "unlimited (no phase crossover with |L| > 1)", !m.measured(),
                        Double.POSITIVE_INFINITY, minLowerGainMarginDb, OptionalDouble.empty()));
            }
        }
        if (!Double.isNaN(maxSensitivityPeak)) {
            Peak s = m.sensitivityPeak();
            rows.add(row("sensitivity peak Ms", "<= " + Units.g4(maxSensitivityPeak) + " (" + Units.formatDb(Units.ratioToDb(maxSensitivityPeak)) + ")",
                    Units.g4(s.magnitude()) + " (" + Units.formatDb(s.magnitudeDb()) + ")", s.magnitude() <= maxSensitivityPeak, s.magnitude(),
                    maxSensitivityPeak, OptionalDouble.of(s.frequencyHz())));
        }
        if (!Double.isNaN(maxComplementaryPeak)) {
            Peak t = m.complementaryPeak();
            rows.add(row("peak |T| (Mt)", "<= " + Units.formatDb(Units.ratioToDb(maxComplementaryPeak)), Units.formatDb(t.magnitudeDb()),
                    t.magnitude() <= maxComplementaryPeak, t.magnitude(), maxComplementaryPeak, OptionalDouble.of(t.frequencyHz())));
        }
        if (!Double.isNaN(minDelayMarginS)) {
            var g = m.gainCrossovers().stream().min((a, b) -> Double.compare(a.delayMarginS(), b.delayMarginS()));
            if (g.isPresent()) {
                double dm = g.get().delayMarginS();
                rows.add(row("delay margin", ">= " + Units.formatSeconds(minDelayMarginS), Units.formatSeconds(dm), dm >= minDelayMarginS, dm, minDelayMarginS,
                        OptionalDouble.of(g.get().frequencyHz())));
            } else {
                rows.add(row("delay margin", ">= " + Units.formatSeconds(minDelayMarginS), none, false, Double.NaN, minDelayMarginS, OptionalDouble.empty()));
            }
        }
        if (requireStable) {
            if (l.openLoopUnstablePoles().isPresent()) {
                ClosedLoopStability st = ClosedLoopStability.of(l);
                rows.add(row("closed-loop stability", "stable", st.isStable() ? "stable" : "unstable (Z = " + st.unstableClosedLoopPoles() + ")",
                        st.isStable(), st.unstableClosedLoopPoles(), 0, OptionalDouble.empty()));
            } else {
                rows.add(row("closed-loop stability", "stable", "unknown: state the open-loop unstable poles of the data", false,
                        Double.NaN, 0, OptionalDouble.empty()));
            }
        }
        return new SpecReport(rows, m.warnings());
    }

    private static SpecReport.Row row(String req, String limit, String achieved, boolean pass, double achievedValue, double limitValue, OptionalDouble hz) {
        return new SpecReport.Row(req, limit, achieved, hz, pass, achievedValue, limitValue);
    }

    @Override public String toString() {
        List<String> r = new ArrayList<>();
        if (!Double.isNaN(minBandwidthRadPerS)) r.add("bandwidth >= " + Units.formatRadPerSAsHz(minBandwidthRadPerS));
        if (!Double.isNaN(minPhaseMarginDeg)) r.add("PM >= " + Units.formatDeg(minPhaseMarginDeg));
        if (!Double.isNaN(minGainMarginDb)) r.add("GM >= " + Units.formatDb(minGainMarginDb));
        if (!Double.isNaN(minLowerGainMarginDb)) r.add("lower GM >= " + Units.formatDb(minLowerGainMarginDb));
        if (!Double.isNaN(maxSensitivityPeak)) r.add("Ms <= " + Units.g4(maxSensitivityPeak));
        if (!Double.isNaN(maxComplementaryPeak)) r.add("Mt <= " + Units.formatDb(Units.ratioToDb(maxComplementaryPeak)));
        if (!Double.isNaN(minDelayMarginS)) r.add("delay margin >= " + Units.formatSeconds(minDelayMarginS));
        if (requireStable) r.add("stable");
        return "Spec[" + String.join(", ", r) + "]";
    }
}
