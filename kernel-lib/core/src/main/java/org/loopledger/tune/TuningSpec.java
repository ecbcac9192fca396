package org.loopledger.tune;

import org.loopledger.analysis.Spec;
import org.loopledger.lti.Units;

import java.util.Arrays;
import java.util.Locale;

/**
 * What an auto-tune must achieve, with units in every name. Robustness limits apply to every loop the
 * tuner closes (velocity loop, position loop, and the loop broken at the plant input), on every load
 * case. Bandwidth: either a target velocity-loop crossover (the tuner then keeps it and picks the
 * integral corner), or the highest crossover the limits allow, up to an optional ceiling.
 *
 * <p>Defaults (common practice for servo axes): phase margin ≥ 45°, gain margin ≥ 8 dB, Ms ≤ 1.8
 * (5.1 dB), velocity-integral corner between 1/10 and 1/2 of the velocity crossover, position gain at
 * most 1/3 of the velocity crossover.
 *
 * <p>The robustness limits are an {@link Spec analysis.Spec} ({@link #limits()}), validated by its rules
 * alone, so a notebook states 45° / 8 dB / 1.8 once and checks the loops with the same object:
 * {@code spec.limits().check(loop)}. The tuner also always requires closed-loop stability.
 */
public final class TuningSpec {
    private final Spec limits;
    private final double minPhaseMarginDeg;
    private final double minGainMarginDb;
    private final double maxSensitivityPeak;
    private final double velocityCrossoverHz;     // NaN: maximise
    private final double maxVelocityCrossoverHz;  // +inf: none
    private final double positionBandwidthHz;     // NaN: as high as allowed
    private final double maxPositionToVelocityRatio;
    private final double[] integralRatios;        // ω_cv/ω_i candidates
    private final boolean allowLowPass;

    private TuningSpec(Builder b) {
        this.limits = b.limits;
        this.minPhaseMarginDeg = limits.minPhaseMarginDeg().getAsDouble();
        this.minGainMarginDb = limits.minGainMarginDb().getAsDouble();
        this.maxSensitivityPeak = limits.maxSensitivityPeak().getAsDouble();
        this.velocityCrossoverHz = b.velocityCrossoverHz;
        this.maxVelocityCrossoverHz = b.maxVelocityCrossoverHz;
        this.positionBandwidthHz = b.positionBandwidthHz;
        this.maxPositionToVelocityRatio = b.maxPositionToVelocityRatio;
        this.integralRatios = b.integralRatios.clone();
        this.allowLowPass = b.allowLowPass;
    }

    public static Builder builder() { return new Builder(); }

    /** The defaults above. */
    public static TuningSpec defaults() { return builder().build(); }

    /** The robustness limits (phase margin, gain margin, Ms) as an analysis spec, to check any loop against. */
    public Spec limits() { return limits; }

    public double minPhaseMarginDeg() { return minPhaseMarginDeg; }

    public double minGainMarginDb() { return minGainMarginDb; }

    public double maxSensitivityPeak() { return maxSensitivityPeak; }

    public boolean hasVelocityCrossoverTarget() { return !Double.isNaN(velocityCrossoverHz); }

    public double velocityCrossoverHz() { return velocityCrossoverHz; }

    public double maxVelocityCrossoverHz() { return maxVelocityCrossoverHz; }

    public boolean hasPositionBandwidthTarget() { return !Double.isNaN(positionBandwidthHz); }

    public double positionBandwidthHz() { return positionBandwidthHz; }

    public double maxPositionToVelocityRatio() { return maxPositionToVelocityRatio; }

    public double[] integralRatios() { return integralRatios.clone(); }

    public boolean allowLowPass() { return allowLowPass; }

    /** Screening guard bands: the screen interpolates linearly between grid points, the re-analysis refines. */
    static final double GUARD_PM_DEG = 0.5, GUARD_GM_DB = 0.1, GUARD_MS = 0.005;

    /**
     * Whether the screened figures meet every robustness limit (stability included), with small guard
     * bands so that the refined re-analysis of the chosen loops meets them too.
     */
    boolean meets(LoopFigures f) {
        return f.stable() && f.phaseMarginDeg() >= minPhaseMarginDeg + GUARD_PM_DEG && f.gainMarginDb() >= minGainMarginDb + GUARD_GM_DB
                && f.sensitivityPeak() <= maxSensitivityPeak - GUARD_MS;
    }

    /**
     * How far the figures miss the limits, as the worst relative shortfall (0 when all are met):
     * used to rank candidates when no candidate meets the spec.
     */
    double shortfall(LoopFigures f) {
        if (!f.stable()) return 10;
        double a = Math.max(0, (minPhaseMarginDeg - f.phaseMarginDeg()) / minPhaseMarginDeg);
        double b = Math.max(0, (minGainMarginDb - f.gainMarginDb()) / minGainMarginDb);
        double c = Math.max(0, (f.sensitivityPeak() - maxSensitivityPeak) / maxSensitivityPeak);
        return Math.max(a, Math.max(b, c));
    }

    /** The limit that binds (smallest headroom) or fails, named for the record. */
    String bindingConstraint(LoopFigures f) {
        if (!f.stable()) return "closed-loop stability";
        double a = (f.phaseMarginDeg() - minPhaseMarginDeg) / minPhaseMarginDeg;
        double b = (f.gainMarginDb() - minGainMarginDb) / minGainMarginDb;
        double c = (maxSensitivityPeak - f.sensitivityPeak()) / maxSensitivityPeak;
        if (a <= b && a <= c) return "phase margin ≥ " + Units.g4(minPhaseMarginDeg) + " deg";
        if (b <= c) return "gain margin ≥ " + Units.g4(minGainMarginDb) + " dB";
        return "sensitivity peak Ms ≤ " + Units.g4(maxSensitivityPeak);
    }

    @Override public String toString() {
        StringBuilder sb = new StringBuilder("TuningSpec[");
        sb.append("PM ≥ ").append(Units.g4(minPhaseMarginDeg)).append(" deg, GM ≥ ").append(Units.g4(minGainMarginDb))
                .append(" dB, Ms ≤ ").append(Units.g4(maxSensitivityPeak));
        if (hasVelocityCrossoverTarget()) sb.append(", velocity crossover ").append(Units.formatHz(velocityCrossoverHz));
        else if (Double.isFinite(maxVelocityCrossoverHz)) sb.append(", velocity crossover ≤ ").append(Units.formatHz(maxVelocityCrossoverHz));
        else sb.append(", velocity crossover as high as allowed");
        if (hasPositionBandwidthTarget()) sb.append(", position bandwidth ").append(Units.formatHz(positionBandwidthHz));
        sb.append(", Kp ≤ ω_cv/").append(Units.g4(maxPositionToVelocityRatio));
        sb.append(", ω_cv/ω_i in ").append(Arrays.toString(integralRatios).replace(".0", ""));
        if (allowLowPass) sb.append(", low-pass placement allowed");
        return sb.append(']').toString();
    }

    /** Builder with validated, unit-bearing setters. */
    public static final class Builder {
        private Spec limits = Spec.builder().minPhaseMarginDeg(45).minGainMarginDb(8).maxSensitivityPeak(1.8).build();
        private double velocityCrossoverHz = Double.NaN;
        private double maxVelocityCrossoverHz = Double.POSITIVE_INFINITY;
        private double positionBandwidthHz = Double.NaN;
        private double maxPositionToVelocityRatio = 3;
        private double[] integralRatios = {2, 2.5, 3, 4, 5, 6, 8, 10};
        private boolean allowLowPass = false;

        private Builder() {}

        /**
         * The robustness limits as an analysis spec: it must set the phase margin, the gain margin and Ms, and
         * nothing the tuner cannot aim at (bandwidth, delay margin, Mt, lower gain margin: use the
         * crossover and bandwidth targets below, and check the rest on the result).
         */
        public Builder limits(Spec spec) {
            if (spec == null) throw new IllegalArgumentException("limits: give an analysis Spec, got null");
            if (spec.minPhaseMarginDeg().isEmpty() || spec.minGainMarginDb().isEmpty() || spec.maxSensitivityPeak().isEmpty()) {
                throw new IllegalArgumentException("the tuner's limits need a phase margin, a gain margin and Ms, got " + spec
                        + "; for example Spec.builder().minPhaseMarginDeg(45).minGainMarginDb(8).maxSensitivityPeak(1.8).build()");
            }
            if (spec.minBandwidthHz().isPresent() || spec.minDelayMarginS().isPresent() || spec.maxComplementaryPeak().isPresent()
                    || spec.minLowerGainMarginDb().isPresent()) {
                throw new IllegalArgumentException("the tuner aims only at phase margin, gain margin and Ms (and always requires stability), got "
                        + spec + "; set a bandwidth with positionBandwidthHz or velocityCrossoverHz, and check other requirements on the result");
            }
            limits = spec.requiresStability()
                    ? Spec.builder().minPhaseMarginDeg(spec.minPhaseMarginDeg().getAsDouble()).minGainMarginDb(spec.minGainMarginDb().getAsDouble())
                            .maxSensitivityPeak(spec.maxSensitivityPeak().getAsDouble()).build()
                    : spec;
            return this;
        }

        private Builder rebuild(double pm, double gm, double ms) {
            limits = Spec.builder().minPhaseMarginDeg(pm).minGainMarginDb(gm).maxSensitivityPeak(ms).build();
            return this;
        }

        /** Minimum phase margin; validated by {@link Spec.Builder#minPhaseMarginDeg}, in (0, 90) deg. */
        public Builder minPhaseMarginDeg(double deg) {
            return rebuild(deg, limits.minGainMarginDb().getAsDouble(), limits.maxSensitivityPeak().getAsDouble());
        }

        /** Minimum gain margin; validated by {@link Spec.Builder#minGainMarginDb}, positive dB. */
        public Builder minGainMarginDb(double db) {
            return rebuild(limits.minPhaseMarginDeg().getAsDouble(), db, limits.maxSensitivityPeak().getAsDouble());
        }

        /** Upper limit on Ms = max|S| (a ratio greater than 1, e.g. 1.6; use maxSensitivityPeakDb for dB). */
        public Builder maxSensitivityPeak(double ms) {
            return rebuild(limits.minPhaseMarginDeg().getAsDouble(), limits.minGainMarginDb().getAsDouble(), ms);
        }

        /** Upper limit on Ms in dB (above 0 dB). */
        public Builder maxSensitivityPeakDb(double db) {
            if (!(db > 0) || !Double.isFinite(db)) {
                throw new IllegalArgumentException("maximum sensitivity peak must be above 0 dB, got " + db + " dB; typical limits are 2.3 to 6 dB");
            }
            return maxSensitivityPeak(Units.dbToRatio(db));
        }

        /** Put the velocity-loop crossover at this frequency (worst load case) and choose the rest; the verdict checks it (±1 %). */
        public Builder velocityCrossoverHz(double hz) {
            if (!(hz > 0) || Double.isInfinite(hz)) throw new IllegalArgumentException("velocity crossover must be a positive frequency in Hz, got " + hz);
            velocityCrossoverHz = hz;
            return this;
        }

        public Builder maxVelocityCrossoverHz(double hz) {
            if (!(hz > 0)) throw new IllegalArgumentException("velocity crossover ceiling must be positive, got " + hz);
            maxVelocityCrossoverHz = hz;
            return this;
        }

        /**
         * Aim the position loop at this bandwidth (Kp ≈ 2π·f), as far as the limits allow. A target, hence part of the
         * verdict: the spec is met only if the re-analysed position-loop crossover reaches it on every load case.
         */
        public Builder positionBandwidthHz(double hz) {
            if (!(hz > 0) || Double.isInfinite(hz)) throw new IllegalArgumentException("position bandwidth must be a positive frequency in Hz, got " + hz);
            positionBandwidthHz = hz;
            return this;
        }

        /** Kp ≤ ω_cv / ratio (ratio ≥ 1; common practice 3 to 5). */
        public Builder maxPositionToVelocityRatio(double ratio) {
            if (!(ratio >= 1)) throw new IllegalArgumentException("velocity-to-position crossover ratio must be at least 1, got " + ratio);
            maxPositionToVelocityRatio = ratio;
            return this;
        }

        /** Candidate ratios ω_cv/ω_i (each > 1); include a large one for little integral action. */
        public Builder integralRatios(double... ratios) {
            if (ratios.length == 0) throw new IllegalArgumentException("give at least one integral ratio");
            for (double r : ratios) if (!(r > 1)) throw new IllegalArgumentException(String.format(Locale.ROOT, "integral ratio ω_cv/ω_i must exceed 1, got %s", r));
            integralRatios = ratios.clone();
            Arrays.sort(integralRatios);
            return this;
        }

        /** Let the tuner add a second-order low-pass (ζ = 0.7) on the current command, placed at a multiple of the crossover. */
        public Builder allowLowPass(boolean allow) {
            allowLowPass = allow;
            return this;
        }

        public TuningSpec build() {
            if (hasTarget() && velocityCrossoverHz > maxVelocityCrossoverHz) {
                throw new IllegalArgumentException("velocity crossover target " + Units.formatHz(velocityCrossoverHz) + " lies above its ceiling "
                        + Units.formatHz(maxVelocityCrossoverHz));
            }
            return new TuningSpec(this);
        }

        private boolean hasTarget() { return !Double.isNaN(velocityCrossoverHz); }
    }
}
