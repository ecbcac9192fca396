package org.loopledger.ident.spectral;

import org.loopledger.lti.Units;

import java.util.List;
import java.util.Locale;

/**
 * The noise and nonlinear-distortion floor of one channel of a periodic record, read on the lines the
 * excitation does not excite (for an odd multisine: its even lines, and any odd line it leaves out), per
 * frequency band, relative to the channel's own level on the excited lines of that band.
 *
 * <p>On a non-excited line of the period-averaged spectrum a linear system shows only noise (variance
 * σ²/M after M periods); nonlinear distortion and non-periodic disturbances show as well. With two or more
 * periods the period-to-period noise on the same averaged spectrum is given beside it ({@link Band#noiseDb}),
 * so the excess of the floor over the noise is distortion (or a non-periodic disturbance such as drift);
 * with one period only the combined floor is known (Pintelon and Schoukens, System Identification: A
 * Frequency Domain Approach, 2nd ed., 2012, detection lines of odd multisines, from memory).
 *
 * @param channel the channel index in the {@link PeriodicAverage}
 * @param periods averaged periods (1: no separate noise estimate)
 * @param bands   bands holding both excited and non-excited lines, increasing in frequency
 */
public record LineFloor(int channel, int periods, List<Band> bands) {
    public LineFloor {
        bands = List.copyOf(bands);
    }

    /**
     * One band.
     *
     * @param fLowHz       lower edge (inclusive)
     * @param fHighHz      upper edge (exclusive, inclusive for the last band)
     * @param excitedLines number of excited lines in the band
     * @param quietLines   number of non-excited lines in the band
     * @param floorDb      10·log10(mean |X̄|² on the non-excited lines / mean |X̄|² on the excited lines), dB (negative: below)
     * @param noiseDb      10·log10(mean σ²<sub>X̄</sub> over the band's lines / mean |X̄|² on the excited lines), dB; NaN with one period
     */
    public record Band(double fLowHz, double fHighHz, int excitedLines, int quietLines, double floorDb, double noiseDb) {
        /** floorDb - noiseDb: how far the floor stands above the period-to-period noise (NaN with one period). */
        public double excessOverNoiseDb() { return floorDb - noiseDb; }

        @Override public String toString() {
            String s = String.format(Locale.ROOT, "%s .. %s: %d excited, %d non-excited lines, floor %s dB", Units.formatHz(fLowHz), Units.formatHz(fHighHz),
                    excitedLines, quietLines, Units.g4(floorDb));
            return Double.isNaN(noiseDb) ? s : s + ", period-to-period noise " + Units.g4(noiseDb) + " dB";
        }
    }

    /** The highest floor over the bands, dB relative to the excited lines (NaN when no band has both kinds of line). */
    public double worstFloorDb() {
        return bands.stream().mapToDouble(Band::floorDb).max().orElse(Double.NaN);
    }

    @Override public String toString() {
        if (bands.isEmpty()) {
            return "channel " + channel + ": no band holds both excited and non-excited lines, so no floor can be read "
                    + "(the excitation excites every line; use an odd multisine or similar to leave detection lines free)";
        }
        StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "channel %d, noise and distortion floor on the non-excited lines (%d period%s), "
                + "relative to the excited lines:", channel, periods, periods == 1 ? "" : "s"));
        for (Band b : bands) sb.append("\n  ").append(b);
        return sb.toString();
    }
}
