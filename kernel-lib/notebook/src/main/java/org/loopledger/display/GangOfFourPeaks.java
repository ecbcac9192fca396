package org.loopledger.display;

import org.loopledger.analysis.GangOfFour;
import org.loopledger.frf.Frf;
import org.loopledger.lti.Units;

import java.util.Objects;

/**
 * The peaks of a {@link GangOfFour} with the plant's output in a unit the engineer reads: |S| (Ms) and |T| are
 * ratios; |PS| (load disturbance at the plant input to position) is shown in position units per input unit, e.g.
 * µm of carriage travel per A, and |CS| (position noise to the control signal) in input units per position unit.
 * {@code GangOfFourPeaks.of(gang).positionUnit("µm", umPerRad)} for a rotary motor on a screw, where the gang was
 * computed in rad; without a position unit the axis' own unit (rad or m) is shown. The frequency of each peak is
 * read off the grid; a peak at the first or last point is marked, since the true peak may lie outside. Immutable.
 */
public final class GangOfFourPeaks implements Displayable {
    private final GangOfFour gang;
    private final String positionUnit, inputUnit;
    private final double perAxisUnit;

    private GangOfFourPeaks(GangOfFour gang, String positionUnit, double perAxisUnit, String inputUnit) {
        this.gang = Objects.requireNonNull(gang, "gang of four");
        this.positionUnit = positionUnit;
        this.perAxisUnit = perAxisUnit;
        this.inputUnit = inputUnit;
    }

    /** The peaks, position in the axis' unit (rad), input in A. */
    public static GangOfFourPeaks of(GangOfFour gang) { return new GangOfFourPeaks(gang, "rad", 1, "A"); }

    /** Shows positions in {@code unit}: the axis' value (rad or m) times {@code perAxisUnit} (e.g. "µm", 1e6 for metres). */
    public GangOfFourPeaks positionUnit(String unit, double perAxisUnit) {
        if (unit == null || unit.isBlank()) throw new IllegalArgumentException("position unit must be a unit name such as \"µm\"");
        if (!(perAxisUnit > 0) || !Double.isFinite(perAxisUnit)) {
            throw new IllegalArgumentException("scale must be a positive number of " + unit + " per rad or m, got " + perAxisUnit);
        }
        return new GangOfFourPeaks(gang, unit.strip(), perAxisUnit, inputUnit);
    }

    /** The plant input's unit, "A" unless said otherwise (e.g. "N·m" for a torque command). */
    public GangOfFourPeaks inputUnit(String unit) {
        if (unit == null || unit.isBlank()) throw new IllegalArgumentException("input unit must be a unit such as \"A\" or \"N·m\"");
        return new GangOfFourPeaks(gang, positionUnit, perAxisUnit, unit.strip());
    }

    /** One peak: its value in the unit shown, the unit, and where. */
    public record Peak(String function, double value, String unit, double frequencyHz, boolean atGridEdge) {}

    /** Peak of |PS| in position units per input unit (e.g. µm/A). */
    public Peak loadSensitivityPeak() { return peak("|PS|", gang.loadSensitivity(), perAxisUnit, positionUnit + "/" + inputUnit); }

    /** Peak of |CS| in input units per position unit (e.g. A/µm). */
    public Peak noiseSensitivityPeak() { return peak("|CS|", gang.noiseSensitivity(), 1 / perAxisUnit, inputUnit + "/" + positionUnit); }

    /** Ms, the peak of |S|. */
    public Peak sensitivityPeak() { return peak("|S| = Ms", gang.sensitivity(), 1, ""); }

    /** Mt, the peak of |T|. */
    public Peak complementarySensitivityPeak() { return peak("|T|", gang.complementarySensitivity(), 1, ""); }

    private static Peak peak(String name, Frf f, double scale, String unit) {
        double[] mag = f.magnitude();
        int k = 0;
        for (int i = 1; i < mag.length; i++) if (mag[i] > mag[k]) k = i;
        return new Peak(name, mag[k] * scale, unit, Units.radPerSToHz(f.omegaAt(k)), mag.length > 1 && (k == 0 || k == mag.length - 1));
    }

    HtmlTable table() {
        Frf s = gang.sensitivity();
        HtmlTable t = HtmlTable.of("Gang of Four: peaks on the grid (" + s.size() + " points, " + Units.formatHz(s.frequencyHz()[0]) + " to "
                + Units.formatHz(s.frequencyHz()[s.size() - 1]) + ")", "Function", "From / to", "Peak", "Unit", "At (Hz)");
        row(t, sensitivityPeak(), "output disturbance to output");
        row(t, complementarySensitivityPeak(), "reference to output");
        row(t, loadSensitivityPeak(), "load disturbance at the plant input to position");
        row(t, noiseSensitivityPeak(), "position noise to the control signal");
        return t;
    }

    private static void row(HtmlTable t, Peak p, String path) {
        String value = p.unit().isEmpty() ? Figures.num(p.value()) + " (" + Figures.fixed2(Units.ratioToDb(p.value())) + " dB)" : Figures.num(p.value());
        t.row(p.function(), path, value, p.unit(), Figures.num(p.frequencyHz()) + (p.atGridEdge() ? " (band edge)" : ""));
    }

    @Override public String toString() { return table().toText().stripTrailing(); }

    @Override public MimeBundle toMimeBundle() {
        return MimeBundle.builder(toString()).put(MimeBundle.TEXT_HTML, table().toString()).build();
    }
}
