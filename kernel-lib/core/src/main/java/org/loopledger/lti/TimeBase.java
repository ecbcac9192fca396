package org.loopledger.lti;

/**
 * Whether a system lives in continuous time (Laplace variable s) or is sampled (variable z, with a
 * sample time). A type, not a sentinel: joining systems of different time bases throws at the join.
 */
public sealed interface TimeBase permits TimeBase.Continuous, TimeBase.Sampled {

    /** The continuous time base. */
    static TimeBase continuous() { return Continuous.INSTANCE; }

    /** A sampled time base with sample time {@code sampleTimeS} in seconds (finite, positive). */
    static TimeBase sampled(double sampleTimeS) { return new Sampled(sampleTimeS); }

    /** A sampled time base at {@code rateHz} samples per second. */
    static TimeBase sampledAtHz(double rateHz) {
        if (!(rateHz > 0) || Double.isInfinite(rateHz)) {
            throw new IllegalArgumentException("sample rate must be a finite positive number of Hz, got " + rateHz);
        }
        return new Sampled(1.0 / rateHz);
    }

    boolean isDiscrete();

    /** Throws unless {@code other} is the same time base (same sample time for sampled ones). */
    default void requireSame(TimeBase other, String operation) {
        if (!this.equals(other)) {
            throw new IllegalArgumentException(operation + ": time bases differ (" + this + " vs " + other
                    + "); discretise the continuous system first (Discretization.zoh/tustin) or resample");
        }
    }

    /** Continuous time. */
    enum Continuous implements TimeBase {
        INSTANCE;

        @Override public boolean isDiscrete() { return false; }

        @Override public String toString() { return "continuous"; }
    }

    /** Sampled time with sample time in seconds. */
    record Sampled(double sampleTimeS) implements TimeBase {
        public Sampled {
            if (!(sampleTimeS > 0) || Double.isInfinite(sampleTimeS)) {
                throw new IllegalArgumentException("sample time must be a finite positive number of seconds, got " + sampleTimeS);
            }
        }

        @Override public boolean isDiscrete() { return true; }

        /** Nyquist frequency π/T in rad/s. */
        public double nyquistRadPerS() { return Math.PI / sampleTimeS; }

        public double rateHz() { return 1.0 / sampleTimeS; }

        @Override public String toString() { return "sampled, T = " + Units.g4(sampleTimeS) + " s (" + Units.formatHz(rateHz()) + ")"; }
    }
}
