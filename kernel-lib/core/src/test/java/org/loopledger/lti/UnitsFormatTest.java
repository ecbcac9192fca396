package org.loopledger.lti;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Number formatting for domain messages and {@code toString} lives in {@link Units} only (it used to be spread over
 * analysis.Fmt, control.Checks.hz and Units). Expected strings written by hand: 1 Hz = 2π rad/s (common practice),
 * 4 significant digits after rounding angles and levels to 2 decimals.
 */
class UnitsFormatTest {

    @Test
    void oneFormatterPerQuantity() {
        assertEquals("50 Hz", Units.formatRadPerSAsHz(2 * Math.PI * 50));
        assertEquals("1.2 kHz", Units.formatRadPerSAsHz(2 * Math.PI * 1200));
        assertEquals("53.41 deg", Units.formatDeg(53.41078618));
        assertEquals("0 deg", Units.formatDeg(-0.001), "no -0");
        assertEquals("15.56 dB", Units.formatDb(20 * Math.log10(6)));
        assertEquals("-9.54 dB", Units.formatDb(-9.5424));
        assertEquals("0 s", Units.formatSeconds(0));
        assertEquals("62.5 us", Units.formatSeconds(62.5e-6));
        assertEquals("759.6 ms", Units.formatSeconds(0.75961));
        assertEquals("2 s", Units.formatSeconds(2));
        assertEquals("ab  ", Units.padRight("ab", 4));
        assertEquals("abcdef", Units.padRight("abcdef", 4));
    }

    @Test
    void noOtherDomainFormatters() {
        assertThrows(ClassNotFoundException.class, () -> Class.forName("org.loopledger.analysis.Fmt"));
        Class<?> checks = assertDoesNotThrow(() -> Class.forName("org.loopledger.control.Checks"));
        for (var m : checks.getDeclaredMethods()) assertNotEquals("hz", m.getName(), "control.Checks.hz folded into Units.formatRadPerSAsHz");
    }
}
