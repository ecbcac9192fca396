package org.loopledger.ident.fit;

import java.util.Locale;

/**
 * Fit quality within one frequency band: RMS of the magnitude error (dB) and phase error (deg) between
 * model and data, the normalised error ‖G<sub>model</sub> - G‖/‖G‖ in percent, and the reduced χ² of the
 * weighted log residuals (≈ 1 when the misfit is what the data's uncertainty predicts; much above 1
 * means the model misses something in this band).
 */
public record BandQuality(String label, double fLowHz, double fHighHz, int points, double rmsMagnitudeErrorDb, double rmsPhaseErrorDeg,
                          double normalisedErrorPercent, double reducedChiSquare) {
    @Override public String toString() {
        return String.format(Locale.ROOT, "%s %.4g .. %.4g Hz (%d points): %.3g dB, %.3g deg rms, error %.3g %%, reduced chi² %.3g",
                label, fLowHz, fHighHz, points, rmsMagnitudeErrorDb, rmsPhaseErrorDeg, normalisedErrorPercent, reducedChiSquare);
    }
}
