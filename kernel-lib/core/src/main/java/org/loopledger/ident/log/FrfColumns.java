package org.loopledger.ident.log;

import java.util.Locale;

/**
 * Which columns of a frequency-response file hold what: frequency (Hz), then either magnitude (dB or
 * ratio) and phase (deg or rad), or real and imaginary parts; optionally coherence. Immutable; each method
 * returns a new value. {@link #detect()} finds them by header name (case, blanks, brackets and underscores
 * ignored): {@code frequency_Hz}/{@code freq_Hz}/{@code f_Hz}; {@code magnitude_dB}/{@code mag_dB}/{@code gain_dB};
 * {@code magnitude}/{@code mag}/{@code gain}/{@code abs} (ratio); {@code phase_deg}/{@code phase_rad};
 * {@code real}/{@code re}; {@code imag}/{@code im}; {@code coherence}/{@code coh}.
 */
public final class FrfColumns {
    enum MagUnit { DB, RATIO }

    enum PhaseUnit { DEG, RAD }

    final String frequencyHz, magnitude, phase, real, imag, coherence;
    final MagUnit magUnit;
    final PhaseUnit phaseUnit;

    private FrfColumns(String frequencyHz, String magnitude, MagUnit magUnit, String phase, PhaseUnit phaseUnit, String real, String imag, String coherence) {
        this.frequencyHz = frequencyHz;
        this.magnitude = magnitude;
        this.magUnit = magUnit;
        this.phase = phase;
        this.phaseUnit = phaseUnit;
        this.real = real;
        this.imag = imag;
        this.coherence = coherence;
    }

    /** Find the columns by header name. */
    public static FrfColumns detect() { return new FrfColumns(null, null, null, null, null, null, null, null); }

    public FrfColumns frequencyHz(String column) { return new FrfColumns(column, magnitude, magUnit, phase, phaseUnit, real, imag, coherence); }

    public FrfColumns magnitudeDb(String column) { return new FrfColumns(frequencyHz, column, MagUnit.DB, phase, phaseUnit, null, null, coherence); }

    /** Magnitude as a plain ratio (output units per input unit). */
    public FrfColumns magnitudeRatio(String column) { return new FrfColumns(frequencyHz, column, MagUnit.RATIO, phase, phaseUnit, null, null, coherence); }

    public FrfColumns phaseDeg(String column) { return new FrfColumns(frequencyHz, magnitude, magUnit, column, PhaseUnit.DEG, null, null, coherence); }

    public FrfColumns phaseRad(String column) { return new FrfColumns(frequencyHz, magnitude, magUnit, column, PhaseUnit.RAD, null, null, coherence); }

    public FrfColumns realImag(String realColumn, String imagColumn) {
        return new FrfColumns(frequencyHz, null, null, null, null, realColumn, imagColumn, coherence);
    }

    public FrfColumns coherence(String column) { return new FrfColumns(frequencyHz, magnitude, magUnit, phase, phaseUnit, real, imag, column); }

    static String norm(String s) { return s.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]", ""); }

    /** Fills in what was not stated from the header names; throws naming the file, header line and fix. */
    FrfColumns resolve(String where, String[] names) {
        String f = frequencyHz != null ? frequencyHz : find(names, "frequencyhz", "freqhz", "fhz", "frequencyinhz", "freqinhz");
        String mag = magnitude, ph = phase, re = real, im = imag, coh = coherence;
        MagUnit mu = magUnit;
        PhaseUnit pu = phaseUnit;
        if (mag == null && re == null) {
            mag = find(names, "magnitudedb", "magdb", "gaindb", "amplitudedb", "ampdb");
            if (mag != null) mu = MagUnit.DB;
            else {
                mag = find(names, "magnitude", "mag", "gain", "abs", "magnitudeabs", "amplitude");
                if (mag != null) mu = MagUnit.RATIO;
            }
            if (mag == null) {
                re = find(names, "real", "re", "realpart");
                im = find(names, "imag", "im", "imaginary", "imagpart");
            }
        }
        if (mag != null && ph == null) {
            ph = find(names, "phasedeg", "phdeg", "phasedegrees");
            if (ph != null) pu = PhaseUnit.DEG;
            else {
                ph = find(names, "phaserad", "phrad", "phaseradians");
                if (ph != null) pu = PhaseUnit.RAD;
            }
        }
        if (coh == null) coh = find(names, "coherence", "coh", "coherencefunction", "gamma2");
        String cols = java.util.Arrays.toString(names);
        if (f == null) {
            throw new IllegalArgumentException(where + ": no frequency column in Hz among " + cols + "; name it frequency_Hz or pass FrfColumns.detect().frequencyHz(\"...\")");
        }
        if (mag == null && (re == null || im == null)) {
            throw new IllegalArgumentException(where + ": neither magnitude/phase nor real/imaginary columns found among " + cols
                    + "; name them magnitude_dB + phase_deg (or real + imag), or state them: FrfColumns.detect().magnitudeDb(\"...\").phaseDeg(\"...\")");
        }
        if (mag != null && ph == null) {
            throw new IllegalArgumentException(where + ": magnitude column '" + mag + "' but no phase column (phase_deg or phase_rad) among " + cols
                    + "; a frequency response needs the phase: state it with .phaseDeg(\"...\") or .phaseRad(\"...\")");
        }
        return new FrfColumns(f, mag, mu, ph, pu, re, im, coh);
    }

    private static String find(String[] names, String... keys) {
        for (String k : keys) for (String n : names) if (norm(n).equals(k)) return n;
        return null;
    }
}
