package org.loopledger.ident.log;

import java.util.List;
import java.util.Locale;

/**
 * Loopledger's header convention for drive logs: every column is named {@code quantity_unit}, the unit
 * being the last token(s) after an underscore, from this closed list:
 *
 * <table>
 *   <caption>unit tokens</caption>
 *   <tr><th>token</th><th>unit</th></tr>
 *   <tr><td>{@code s}</td><td>s</td></tr>
 *   <tr><td>{@code A}</td><td>A</td></tr>
 *   <tr><td>{@code V}</td><td>V</td></tr>
 *   <tr><td>{@code Nm}</td><td>N·m</td></tr>
 *   <tr><td>{@code rad}</td><td>rad</td></tr>
 *   <tr><td>{@code rad_s}</td><td>rad/s</td></tr>
 *   <tr><td>{@code rad_s2}</td><td>rad/s²</td></tr>
 *   <tr><td>{@code m}</td><td>m</td></tr>
 *   <tr><td>{@code m_s}</td><td>m/s</td></tr>
 *   <tr><td>{@code m_s2}</td><td>m/s²</td></tr>
 * </table>
 *
 * Quantities are lower-case words joined by underscores. The standard names are {@link #TIME}
 * ({@code time_s}, required), {@link #INJECTED_CURRENT}, {@link #MEASURED_CURRENT}, {@link #VELOCITY} and
 * {@link #POSITION}. Example header: {@code time_s,current_injected_A,current_measured_A,velocity_rad_s,position_rad}.
 * Only SI units: convert rpm, counts or mm before logging or when exporting.
 */
public final class LogColumns {
    public static final String TIME = "time_s";
    public static final String INJECTED_CURRENT = "current_injected_A";
    public static final String MEASURED_CURRENT = "current_measured_A";
    public static final String VELOCITY = "velocity_rad_s";
    public static final String POSITION = "position_rad";

    /** Unit tokens, longest first so that {@code rad_s2} wins over {@code s2}-less forms. */
    private static final List<String[]> UNITS = List.of(
            new String[] {"rad_s2", "rad/s²"}, new String[] {"rad_s", "rad/s"}, new String[] {"m_s2", "m/s²"}, new String[] {"m_s", "m/s"},
            new String[] {"rad", "rad"}, new String[] {"Nm", "N·m"}, new String[] {"A", "A"}, new String[] {"V", "V"},
            new String[] {"s", "s"}, new String[] {"m", "m"});

    private LogColumns() {}

    /** A parsed column name: its quantity and unit. */
    public record Column(String name, String quantity, String unitToken, String unit) {
        @Override public String toString() { return quantity + " [" + unit + "]"; }
    }

    /** Parses {@code quantity_unit}; throws naming the column and the accepted units when it does not follow the convention. */
    public static Column parse(String name) {
        if (name != null) {
            for (String[] u : UNITS) {
                String suffix = "_" + u[0];
                if (name.endsWith(suffix) && name.length() > suffix.length()) {
                    String q = name.substring(0, name.length() - suffix.length());
                    if (q.matches("[a-z][a-z0-9]*(_[a-z0-9]+)*")) return new Column(name, q, u[0], u[1]);
                }
            }
        }
        StringBuilder tokens = new StringBuilder();
        for (String[] u : UNITS) tokens.append(tokens.length() == 0 ? "" : ", ").append(u[0]);
        throw new IllegalArgumentException(String.format(Locale.ROOT,
                "column '%s' does not follow the header convention quantity_unit (e.g. velocity_rad_s); unit tokens: %s", name, tokens));
    }
}
