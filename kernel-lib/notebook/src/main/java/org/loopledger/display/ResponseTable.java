package org.loopledger.display;

import org.loopledger.sim.Excitation;
import org.loopledger.sim.ResponseMetrics;
import org.loopledger.sim.TimeResponse;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Figures of several simulated responses in one table, one row per (load case, test): rise time (10-90 %),
 * overshoot, settling time (2 % band) or recovery time (2 % of peak) for a disturbance, peak following error
 * or peak deviation, peak current. Positions are shown in the axis' unit (rad or m) unless a display unit
 * is given with {@link Builder#positionUnit} (e.g. µm of carriage travel: {@code positionUnit("um", 1e3 / radPerMm)}).
 */
public final class ResponseTable implements Displayable {
    private record Entry(String loadCase, String test, ResponseMetrics metrics) {}

    private final String title;
    private final List<Entry> entries;
    private final String positionUnit;
    private final double positionScale;

    private ResponseTable(String title, List<Entry> entries, String positionUnit, double positionScale) {
        if (entries.isEmpty()) throw new IllegalArgumentException("a response table needs at least one response; add rows with row(loadCase, test, response)");
        this.title = title;
        this.entries = List.copyOf(entries);
        this.positionUnit = positionUnit;
        this.positionScale = positionScale;
    }

    public static Builder builder() { return new Builder(); }

    HtmlTable table() {
        HtmlTable t = HtmlTable.of(title, "load case", "test", "rise time 10-90 % (ms)", "overshoot (%)", "settling / recovery, 2 % (ms)",
                "peak error / deviation", "unit", "peak current (plant-input units, e.g. A)");
        for (Entry e : entries) {
            ResponseMetrics m = e.metrics();
            Excitation x = m.excitation();
            boolean position = x != Excitation.VELOCITY_STEP;
            String unit = position && positionUnit != null ? positionUnit : x.errorUnit(m.motion());
            double scale = position && positionUnit != null ? positionScale : 1;
            String settle = x == Excitation.POSITION_RAMP ? Figures.NONE
                    : m.settlingTimeS().isPresent() ? ms(m.settlingTimeS()) : "not settled within " + Figures.ms(m.recordLengthS()) + " ms";
            t.row(e.loadCase(), e.test(), ms(m.riseTimeS()), Figures.opt(m.overshootPct()), settle, Figures.num(m.peakFollowingError() * scale), unit,
                    Figures.num(m.peakCurrent()));
        }
        return t;
    }

    private static String ms(OptionalDouble s) { return s.isPresent() ? Figures.ms(s.getAsDouble()) : Figures.NONE; }

    @Override public String toString() { return table().toText().stripTrailing(); }

    @Override public MimeBundle toMimeBundle() {
        return MimeBundle.builder(toString()).put(MimeBundle.TEXT_HTML, table().toString()).build();
    }

    /** Collects responses in order. */
    public static final class Builder {
        private final List<Entry> entries = new ArrayList<>();
        private String title = "Simulated responses";
        private String positionUnit;
        private double positionScale = 1;

        private Builder() {}

        public Builder row(String loadCase, String test, TimeResponse response) {
            return row(loadCase, test, Objects.requireNonNull(response, "response").metrics());
        }

        public Builder row(String loadCase, String test, ResponseMetrics metrics) {
            entries.add(new Entry(Objects.requireNonNull(loadCase, "loadCase"), Objects.requireNonNull(test, "test"), Objects.requireNonNull(metrics, "metrics")));
            return this;
        }

        /** Shows position errors in {@code unit}: the axis' value (rad or m) times {@code perAxisUnit}. */
        public Builder positionUnit(String unit, double perAxisUnit) {
            if (unit == null || unit.isBlank()) throw new IllegalArgumentException("position unit must be a unit name such as \"um\"");
            if (!(perAxisUnit > 0) || !Double.isFinite(perAxisUnit)) throw new IllegalArgumentException("scale must be a positive number of " + unit + " per rad or m, got " + perAxisUnit);
            this.positionUnit = unit;
            this.positionScale = perAxisUnit;
            return this;
        }

        public Builder title(String title) {
            this.title = Objects.requireNonNull(title, "title");
            return this;
        }

        public ResponseTable build() { return new ResponseTable(title, entries, positionUnit, positionScale); }
    }
}
