package org.loopledger.analysis;

import org.loopledger.lti.Units;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.OptionalDouble;

/**
 * Closed-loop bandwidth: the first frequency where |T| falls below its low-frequency value by a threshold. The default
 * ({@link Margins#bandwidth()}) is the usual -3 dB point, |T(0)|/√2 exactly ({@link #HALF_POWER_DB}, -3.0103 dB: half
 * the power); {@link #of(TransferFunction, double)} takes any threshold in dB (-6 for half the amplitude, or exactly -3).
 *
 * @param omegaRadPerS        the bandwidth in rad/s, empty when not reached in the analysed band
 * @param referenceMagnitude  the low-frequency |T| used (1 for loops with integrators)
 * @param note                why it is empty, or how the reference was taken (never null, may be empty)
 * @param thresholdDb         how far below the reference |T| has fallen, in dB (negative)
 */
public record Bandwidth(OptionalDouble omegaRadPerS, double referenceMagnitude, String note, double thresholdDb) {
    /** 20·log10(1/√2) = -3.0103 dB: the half-power point, the usual "-3 dB" bandwidth. */
    public static final double HALF_POWER_DB = 20 * Math.log10(1 / Math.sqrt(2));

    /** At the usual -3 dB (half-power) threshold. */
    public Bandwidth(OptionalDouble omegaRadPerS, double referenceMagnitude, String note) {
        this(omegaRadPerS, referenceMagnitude, note, HALF_POWER_DB);
    }

    /** The closed-loop bandwidth of a model loop gain at {@code thresholdDb} below the low-frequency |T| (thresholdDb &lt; 0). */
    public static Bandwidth of(TransferFunction loopGain, double thresholdDb) { return Margins.bandwidth(ModelLoop.of(loopGain), thresholdDb); }

    /** The same for a measured loop gain (inside its band only). */
    public static Bandwidth of(Frf loopGain, double thresholdDb) { return Margins.bandwidth(MeasuredLoop.of(loopGain), thresholdDb); }

    public OptionalDouble frequencyHz() {
        return omegaRadPerS.isPresent() ? OptionalDouble.of(omegaRadPerS.getAsDouble() / (2 * Math.PI)) : OptionalDouble.empty();
    }

    public boolean isPresent() { return omegaRadPerS.isPresent(); }

    @Override public String toString() {
        String s = omegaRadPerS.isPresent() ? Units.formatRadPerSAsHz(omegaRadPerS.getAsDouble()) : "none in band";
        String at = thresholdDb == HALF_POWER_DB ? "" : "at " + Units.formatDb(thresholdDb);
        String extra = at.isEmpty() ? note : note.isEmpty() ? at : at + "; " + note;
        return s + (extra.isEmpty() ? "" : " (" + extra + ")");
    }
}
