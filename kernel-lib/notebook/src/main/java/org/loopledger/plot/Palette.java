package org.loopledger.plot;

import java.awt.Color;

/**
 * Loopledger's own plot palette: muted, print-friendly colours that stay distinct in greyscale,
 * cycled in this order for overlaid series.
 */
public final class Palette {
    /** Deep teal, the first series. */
    public static final Color TEAL = new Color(0x1F, 0x6E, 0x78);
    /** Burnt orange. */
    public static final Color ORANGE = new Color(0xC8, 0x6A, 0x1E);
    /** Plum. */
    public static final Color PLUM = new Color(0x74, 0x4A, 0x8C);
    /** Olive green. */
    public static final Color OLIVE = new Color(0x6B, 0x7D, 0x2A);
    /** Brick red, also used for limits and critical points. */
    public static final Color BRICK = new Color(0xA8, 0x3A, 0x32);
    /** Slate blue-grey. */
    public static final Color SLATE = new Color(0x4C, 0x5A, 0x6E);
    /** Light grid lines. */
    public static final Color GRID = new Color(0xE3, 0xE6, 0xEA);
    /** Reference lines (unit circle, 0 dB, -180 deg). */
    public static final Color REFERENCE = new Color(0x8A, 0x92, 0x9C);
    /** Text and axes. */
    public static final Color INK = new Color(0x22, 0x28, 0x30);

    private static final Color[] CYCLE = {TEAL, ORANGE, PLUM, OLIVE, SLATE, BRICK};

    private Palette() {}

    /** The colour of the {@code index}-th overlaid series (cycles). */
    public static Color series(int index) { return CYCLE[Math.floorMod(index, CYCLE.length)]; }

    /** The colours in cycling order (a copy). */
    public static Color[] cycle() { return CYCLE.clone(); }
}
