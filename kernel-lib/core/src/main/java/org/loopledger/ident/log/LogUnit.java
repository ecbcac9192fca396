package org.loopledger.ident.log;

import java.util.Locale;

/**
 * The unit a log column was written in, as a factor to an SI unit: value<sub>SI</sub> = value × {@link #toSi()}.
 * Immutable; {@link #times(double)} adds a gain (e.g. a sensor's newtons per volt).
 *
 * <p>SI tokens (see {@link LogColumns}): {@code s, m, rad, m_s, rad_s, m_s2, rad_s2, A, N, Nm, V}.
 * Encoder counts need the resolution: {@link #countsPerMetre(double)}, {@link #countsPerRev(double)},
 * and their per-second forms for velocities.
 *
 * @param siToken the SI unit token the values become
 * @param toSi    multiply the logged value by this to get SI
 * @param label   how the logged unit reads (for messages and provenance)
 */
public record LogUnit(String siToken, double toSi, String label) {
    private static final double TWO_PI = 2 * Math.PI;

    public LogUnit {
        if (!(Double.isFinite(toSi) && toSi != 0)) throw new IllegalArgumentException("unit factor must be finite and non-zero, got " + toSi + " for " + label);
        if (!LogColumns.isSiToken(siToken)) throw new IllegalArgumentException("'" + siToken + "' is not an SI unit token; use one of " + LogColumns.SI_TOKENS);
    }

    /** This unit with an extra gain, e.g. {@code LogUnit.volts("N").times(250)} for 250 N per volt. */
    public LogUnit times(double gain) { return new LogUnit(siToken, toSi * gain, label + " × " + fmt(gain)); }

    /** Any linear scale: value<sub>SI</sub> = value × factor. */
    public static LogUnit scale(double factor, String siToken) { return new LogUnit(siToken, factor, "× " + fmt(factor) + " → " + siToken); }

    public static LogUnit seconds() { return new LogUnit("s", 1, "s"); }
    public static LogUnit milliseconds() { return new LogUnit("s", 1e-3, "ms"); }
    public static LogUnit microseconds() { return new LogUnit("s", 1e-6, "µs"); }

    public static LogUnit metres() { return new LogUnit("m", 1, "m"); }
    public static LogUnit millimetres() { return new LogUnit("m", 1e-3, "mm"); }
    public static LogUnit micrometres() { return new LogUnit("m", 1e-6, "µm"); }
    public static LogUnit radians() { return new LogUnit("rad", 1, "rad"); }
    public static LogUnit degrees() { return new LogUnit("rad", Math.PI / 180, "deg"); }
    public static LogUnit revolutions() { return new LogUnit("rad", TWO_PI, "rev"); }
    /** Linear encoder counts: {@code counts} per metre of travel. */
    public static LogUnit countsPerMetre(double counts) { return new LogUnit("m", 1 / positive(counts), "counts (" + fmt(counts) + "/m)"); }
    /** Rotary encoder counts: {@code counts} per revolution. */
    public static LogUnit countsPerRev(double counts) { return new LogUnit("rad", TWO_PI / positive(counts), "counts (" + fmt(counts) + "/rev)"); }

    public static LogUnit metresPerSecond() { return new LogUnit("m_s", 1, "m/s"); }
    public static LogUnit millimetresPerSecond() { return new LogUnit("m_s", 1e-3, "mm/s"); }
    public static LogUnit metresPerMinute() { return new LogUnit("m_s", 1.0 / 60, "m/min"); }
    public static LogUnit radiansPerSecond() { return new LogUnit("rad_s", 1, "rad/s"); }
    public static LogUnit rpm() { return new LogUnit("rad_s", TWO_PI / 60, "rpm"); }
    public static LogUnit degreesPerSecond() { return new LogUnit("rad_s", Math.PI / 180, "deg/s"); }
    /** Linear velocity in counts per second, {@code counts} per metre. */
    public static LogUnit countsPerSecondLinear(double countsPerMetre) { return new LogUnit("m_s", 1 / positive(countsPerMetre), "counts/s (" + fmt(countsPerMetre) + "/m)"); }
    /** Rotary velocity in counts per second, {@code counts} per revolution. */
    public static LogUnit countsPerSecondRotary(double countsPerRev) { return new LogUnit("rad_s", TWO_PI / positive(countsPerRev), "counts/s (" + fmt(countsPerRev) + "/rev)"); }

    public static LogUnit metresPerSecondSquared() { return new LogUnit("m_s2", 1, "m/s²"); }
    public static LogUnit radiansPerSecondSquared() { return new LogUnit("rad_s2", 1, "rad/s²"); }

    public static LogUnit amperes() { return new LogUnit("A", 1, "A"); }
    public static LogUnit milliamperes() { return new LogUnit("A", 1e-3, "mA"); }
    public static LogUnit newtons() { return new LogUnit("N", 1, "N"); }
    public static LogUnit newtonMetres() { return new LogUnit("Nm", 1, "N·m"); }
    public static LogUnit volts() { return new LogUnit("V", 1, "V"); }
    /** A signal logged in volts standing for {@code siToken} at {@code perVolt} SI units per volt (e.g. 250 N/V). */
    public static LogUnit volts(String siToken, double perVolt) { return new LogUnit(siToken, perVolt, "V (" + fmt(perVolt) + " " + siToken + "/V)"); }

    private static double positive(double counts) {
        if (!(counts > 0 && Double.isFinite(counts))) throw new IllegalArgumentException("encoder resolution must be a positive count, got " + counts);
        return counts;
    }

    static String fmt(double v) { return String.format(Locale.ROOT, "%.9g", v).replaceAll("\\.?0+(e|$)", "$1"); }
}
