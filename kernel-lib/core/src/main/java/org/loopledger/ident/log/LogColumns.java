package org.loopledger.ident.log;

import java.util.List;
import java.util.Locale;

/**
 * Loopledger's header convention for drive logs: every column is named {@code quantity_unit}, the unit
 * being the last token(s) after an underscore. SI tokens are kept as they are; a few common non-SI tokens
 * are converted to SI on reading, and the column takes its SI name ({@code velocity_rpm} becomes
 * {@code velocity_rad_s}):
 *
 * <table>
 *   <caption>unit tokens</caption>
 *   <tr><th>token</th><th>unit</th><th>read as</th></tr>
 *   <tr><td>{@code s}, {@code ms}, {@code us}</td><td>s, ms, µs</td><td>s</td></tr>
 *   <tr><td>{@code A}, {@code mA}</td><td>A, mA</td><td>A</td></tr>
 *   <tr><td>{@code V}</td><td>V</td><td>V</td></tr>
 *   <tr><td>{@code N}</td><td>N</td><td>N</td></tr>
 *   <tr><td>{@code Nm}</td><td>N·m</td><td>N·m</td></tr>
 *   <tr><td>{@code rad}, {@code deg}, {@code rev}</td><td>rad, deg, rev</td><td>rad</td></tr>
 *   <tr><td>{@code rad_s}, {@code deg_s}, {@code rpm}</td><td>rad/s, deg/s, rpm</td><td>rad/s</td></tr>
 *   <tr><td>{@code rad_s2}</td><td>rad/s²</td><td>rad/s²</td></tr>
 *   <tr><td>{@code m}, {@code mm}, {@code um}</td><td>m, mm, µm</td><td>m</td></tr>
 *   <tr><td>{@code m_s}, {@code mm_s}</td><td>m/s, mm/s</td><td>m/s</td></tr>
 *   <tr><td>{@code m_s2}</td><td>m/s²</td><td>m/s²</td></tr>
 * </table>
 *
 * Quantities are lower-case words joined by underscores. The standard names are {@link #TIME}
 * ({@code time_s}; without it the sample rate must be stated), {@link #INJECTED_CURRENT},
 * {@link #MEASURED_CURRENT}, {@link #VELOCITY} / {@link #VELOCITY_LINEAR} and {@link #POSITION} /
 * {@link #POSITION_LINEAR}. Example header: {@code time_s,current_injected_A,current_measured_A,velocity_rad_s,position_rad}.
 * Encoder counts and other names need a {@link ColumnMap}.
 */
public final class LogColumns {
    public static final String TIME = "time_s";
    public static final String INJECTED_CURRENT = "current_injected_A";
    public static final String MEASURED_CURRENT = "current_measured_A";
    public static final String VELOCITY = "velocity_rad_s";
    public static final String POSITION = "position_rad";
    /** Linear axes: velocity in m/s. */
    public static final String VELOCITY_LINEAR = "velocity_m_s";
    /** Linear axes: position in m. */
    public static final String POSITION_LINEAR = "position_m";
    public static final String FORCE = "force_N";

    /** The SI unit tokens a column of a {@link DriveLog} carries. */
    public static final List<String> SI_TOKENS = List.of("s", "m", "rad", "m_s", "rad_s", "m_s2", "rad_s2", "A", "N", "Nm", "V");

    /** token, display, SI token, factor to SI; longest first so that {@code rad_s2} wins over shorter forms. */
    private static final List<Object[]> UNITS = List.of(
            new Object[] {"rad_s2", "rad/s²", "rad_s2", 1.0}, new Object[] {"rad_s", "rad/s", "rad_s", 1.0},
            new Object[] {"deg_s", "deg/s", "rad_s", Math.PI / 180}, new Object[] {"m_s2", "m/s²", "m_s2", 1.0},
            new Object[] {"mm_s", "mm/s", "m_s", 1e-3}, new Object[] {"m_s", "m/s", "m_s", 1.0},
            new Object[] {"rpm", "rpm", "rad_s", 2 * Math.PI / 60}, new Object[] {"rad", "rad", "rad", 1.0},
            new Object[] {"deg", "deg", "rad", Math.PI / 180}, new Object[] {"rev", "rev", "rad", 2 * Math.PI},
            new Object[] {"Nm", "N·m", "Nm", 1.0}, new Object[] {"mA", "mA", "A", 1e-3},
            new Object[] {"mm", "mm", "m", 1e-3}, new Object[] {"um", "µm", "m", 1e-6},
            new Object[] {"ms", "ms", "s", 1e-3}, new Object[] {"us", "µs", "s", 1e-6},
            new Object[] {"A", "A", "A", 1.0}, new Object[] {"V", "V", "V", 1.0}, new Object[] {"N", "N", "N", 1.0},
            new Object[] {"s", "s", "s", 1.0}, new Object[] {"m", "m", "m", 1.0});

    private LogColumns() {}

    /** A parsed column name: its quantity and unit; {@link #siName()} is the name it takes in a {@link DriveLog}. */
    public record Column(String name, String quantity, String unitToken, String unit) {
        @Override public String toString() { return quantity + " [" + unit + "]"; }

        /** The SI unit token the values are converted to. */
        public String siToken() { return (String) row(unitToken)[2]; }

        /** Multiply the logged values by this for SI. */
        public double toSiFactor() { return (Double) row(unitToken)[3]; }

        /** {@code quantity_siToken}, e.g. {@code velocity_rad_s} for {@code velocity_rpm}. */
        public String siName() { return quantity + "_" + siToken(); }
    }

    private static Object[] row(String token) {
        for (Object[] u : UNITS) if (u[0].equals(token)) return u;
        throw new IllegalStateException(token);
    }

    static boolean isSiToken(String token) { return SI_TOKENS.contains(token); }

    /** Whether {@code name} follows the convention. */
    public static boolean follows(String name) {
        try {
            parse(name);
            return true;
        } catch (IllegalArgumentException e) {
            return false;
        }
    }

    /** Parses {@code quantity_unit}; throws naming the column and the accepted units when it does not follow the convention. */
    public static Column parse(String name) {
        if (name != null) {
            for (Object[] u : UNITS) {
                String suffix = "_" + u[0];
                if (name.endsWith(suffix) && name.length() > suffix.length()) {
                    String q = name.substring(0, name.length() - suffix.length());
                    if (q.matches("[a-z][a-z0-9]*(_[a-z0-9]+)*")) return new Column(name, q, (String) u[0], (String) u[1]);
                }
            }
        }
        StringBuilder tokens = new StringBuilder();
        for (Object[] u : UNITS) tokens.append(tokens.length() == 0 ? "" : ", ").append(u[0]);
        throw new IllegalArgumentException(String.format(Locale.ROOT,
                "column '%s' does not follow the header convention quantity_unit (e.g. velocity_rad_s); unit tokens: %s; "
                        + "or map it: ColumnMap.of().column(\"%s\", Quantity.VELOCITY, LogUnit.rpm())", name, tokens, name));
    }
}
