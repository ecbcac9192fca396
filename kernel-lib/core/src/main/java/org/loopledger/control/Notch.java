package org.loopledger.control;

import org.loopledger.lti.TransferFunction;
import org.loopledger.lti.Units;

/**
 * A second-order notch (band-stop) with centre ω<sub>0</sub>, depth D and width Δω:
 * <pre>
 *   H(s) = (s² + 2ζ_zω_0s + ω_0²) / (s² + 2ζ_pω_0s + ω_0²),
 *   ζ_p = Δω/(2ω_0) = 1/(2Q),   ζ_z = ζ_p·10^(-D/20).
 * </pre>
 * <ul>
 *   <li><b>Centre</b> ω<sub>0</sub>: |H| is smallest there, H(jω<sub>0</sub>) = ζ<sub>z</sub>/ζ<sub>p</sub> (real, no phase).</li>
 *   <li><b>Depth</b> D in dB, positive: the attenuation at the centre, |H(jω<sub>0</sub>)| = 10<sup>-D/20</sup>;
 *       {@code Double.POSITIVE_INFINITY} gives the full notch (ζ<sub>z</sub> = 0, zeros on the axis).</li>
 *   <li><b>Width</b> Δω (or Q = ω<sub>0</sub>/Δω): the bandwidth 2ζ<sub>p</sub>ω<sub>0</sub> of the pole pair, which is
 *       exactly the distance between the -3 dB frequencies of the full-depth notch with the same poles
 *       (ω<sub>2</sub> - ω<sub>1</sub> = ω<sub>0</sub>/Q with ω<sub>1</sub>ω<sub>2</sub> = ω<sub>0</sub>², derivation by hand). This is
 *       the "EE" Q of the Audio EQ Cookbook's notch and of scipy.signal.iirnotch (Q = w0/bw), taken in the
 *       continuous domain.</li>
 * </ul>
 * Unity gain at DC and at high frequency. Source of the form: R. Bristow-Johnson, "Cookbook formulae for
 * audio EQ biquad filter coefficients" (W3C Audio EQ Cookbook, Working Group Note, 2021): the full notch is
 * its "notch", a finite depth is its "peakingEQ" with A = 10<sup>-D/40</sup> and Q<sub>cookbook</sub> = Q/A.
 *
 * <p><b>Discrete form.</b> Tustin prewarped at ω<sub>0</sub>. Its digital -3 dB width is
 * Δ<sub>d</sub> = (2/T)·atan(Δω·sin(ω<sub>0</sub>T)/(2ω<sub>0</sub>)), slightly narrower than Δω; equivalently,
 * scipy.signal.iirnotch(f<sub>0</sub>, Q<sub>d</sub>, fs) (which fixes the digital width) equals this notch (full
 * depth) with Q = sin(ω<sub>0</sub>T)/(2·tan(ω<sub>0</sub>T/(2Q<sub>d</sub>))) ({@link #ofDigitalQ}).
 *
 * <p>Made only through unit-named factories ({@link #ofHz}, {@link #ofRadPerS}, ...): a public constructor
 * {@code new Notch(620, 20, 250)} read as Hz but took rad/s. Hence a final class, not a record (a record's
 * constructor is as public as the record); equality is still by value.
 */
public final class Notch implements Filter {
    private final double centreRadPerS;
    private final double depthDb;
    private final double widthRadPerS;

    private Notch(double centreRadPerS, double depthDb, double widthRadPerS) {
        Checks.positive(centreRadPerS, "notch centre", "rad/s");
        if (!(depthDb > 0)) {
            throw new IllegalArgumentException("notch depth must be a positive number of dB (attenuation at the centre, e.g. 20), got " + depthDb
                    + " dB; use Double.POSITIVE_INFINITY for a full notch");
        }
        Checks.positive(widthRadPerS, "notch width", "rad/s");
        this.centreRadPerS = centreRadPerS;
        this.depthDb = depthDb;
        this.widthRadPerS = widthRadPerS;
    }

    /** Centre and width in rad/s, depth in dB (positive; infinite for a full notch). */
    public static Notch ofRadPerS(double centreRadPerS, double depthDb, double widthRadPerS) {
        return new Notch(centreRadPerS, depthDb, widthRadPerS);
    }

    public double centreRadPerS() { return centreRadPerS; }

    /** Attenuation at the centre in dB (positive; infinite for a full notch). */
    public double depthDb() { return depthDb; }

    public double widthRadPerS() { return widthRadPerS; }

    @Override public boolean equals(Object o) {
        return o instanceof Notch n && Double.compare(centreRadPerS, n.centreRadPerS) == 0 && Double.compare(depthDb, n.depthDb) == 0
                && Double.compare(widthRadPerS, n.widthRadPerS) == 0;
    }

    @Override public int hashCode() { return java.util.Objects.hash(centreRadPerS, depthDb, widthRadPerS); }

    /** Centre and width in Hz, depth in dB (positive; infinite for a full notch). */
    public static Notch ofHz(double centreHz, double depthDb, double widthHz) {
        Checks.positive(centreHz, "notch centre", "Hz");
        Checks.positive(widthHz, "notch width", "Hz");
        return new Notch(Units.hzToRadPerS(centreHz), depthDb, Units.hzToRadPerS(widthHz));
    }

    /** Centre in Hz, depth in dB, quality factor Q = centre/width. */
    public static Notch ofHzAndQ(double centreHz, double depthDb, double q) {
        Checks.positive(q, "notch quality factor Q", "(dimensionless, centre/width)");
        return ofHz(centreHz, depthDb, centreHz / q);
    }

    /**
     * The full-depth notch whose discrete form at {@code sampleRateHz} has the digital -3 dB width
     * f<sub>0</sub>/Q<sub>d</sub>; the same filter as scipy.signal.iirnotch(f<sub>0</sub>, Q<sub>d</sub>, fs).
     */
    public static Notch ofDigitalQ(double centreHz, double digitalQ, double sampleRateHz) {
        Checks.sampleRateHz(sampleRateHz);
        Checks.positive(digitalQ, "notch quality factor Q", "(dimensionless, centre/width)");
        double w0 = Units.hzToRadPerS(Checks.positive(centreHz, "notch centre", "Hz"));
        Checks.belowNyquist(w0, sampleRateHz, "notch centre");
        double t = 1.0 / sampleRateHz;
        double q = Math.sin(w0 * t) / (2 * Math.tan(w0 * t / (2 * digitalQ)));
        return new Notch(w0, Double.POSITIVE_INFINITY, w0 / q);
    }

    public double centreHz() { return Units.radPerSToHz(centreRadPerS); }

    public double widthHz() { return Units.radPerSToHz(widthRadPerS); }

    public double q() { return centreRadPerS / widthRadPerS; }

    /** ζ<sub>p</sub> = Δω/(2ω<sub>0</sub>). */
    public double poleDamping() { return widthRadPerS / (2 * centreRadPerS); }

    /** ζ<sub>z</sub> = ζ<sub>p</sub>·10<sup>-D/20</sup> (0 for a full notch). */
    public double zeroDamping() { return Double.isInfinite(depthDb) ? 0 : poleDamping() * Units.dbToRatio(-depthDb); }

    public boolean isFullDepth() { return Double.isInfinite(depthDb); }

    @Override public TransferFunction continuous() {
        double w = centreRadPerS;
        return TransferFunction.continuous(new double[] {1, 2 * zeroDamping() * w, w * w}, new double[] {1, 2 * poleDamping() * w, w * w});
    }

    @Override public double prewarpRadPerS() { return centreRadPerS; }

    @Override public void requireBelowNyquist(double sampleRateHz) { Checks.belowNyquist(centreRadPerS, sampleRateHz, "notch centre"); }

    @Override public String describe() {
        return "notch " + Units.formatRadPerSAsHz(centreRadPerS) + ", depth " + (isFullDepth() ? "full" : Units.g4(depthDb) + " dB") + ", width "
                + Units.formatRadPerSAsHz(widthRadPerS) + " (Q " + Units.g4(q()) + ")";
    }

    @Override public String toString() { return describe(); }
}
