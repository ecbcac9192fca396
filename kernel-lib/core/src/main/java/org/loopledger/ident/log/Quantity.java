package org.loopledger.ident.log;

import java.util.List;

/**
 * What a log column measures, with the SI units its values may take after reading (linear or rotary).
 * The column's name in the {@link DriveLog} is {@code key_unitToken}, following {@link LogColumns}.
 */
public enum Quantity {
    TIME("time", "s"),
    POSITION("position", "m", "rad"),
    VELOCITY("velocity", "m_s", "rad_s"),
    ACCELERATION("acceleration", "m_s2", "rad_s2"),
    /** The excitation injected at the current (force/torque) command. */
    CURRENT_INJECTED("current_injected", "A"),
    /** The measured (actual) current, the plant input. */
    CURRENT_MEASURED("current_measured", "A"),
    CURRENT_COMMAND("current_command", "A"),
    FORCE("force", "N"),
    TORQUE("torque", "Nm"),
    VOLTAGE("voltage", "V");

    private final String key;
    private final List<String> siTokens;

    Quantity(String key, String... siTokens) {
        this.key = key;
        this.siTokens = List.of(siTokens);
    }

    /** The quantity part of the column name, e.g. {@code current_measured}. */
    public String key() { return key; }

    /** The SI unit tokens this quantity accepts, e.g. {@code m_s} and {@code rad_s} for velocity. */
    public List<String> siTokens() { return siTokens; }
}
