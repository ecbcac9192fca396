package org.loopledger.plot;

import org.knowm.xchart.XYChart;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;

import org.loopledger.sim.TimeResponse;

/**
 * Time responses: one or more panels over a common time axis (s), each with one or more signals, e.g.
 * position and reference in one panel, current and its limit in another.
 */
public final class TimePlot {
    private record Signal(String label, double[] values, boolean reference) {}

    private record Panel(String yTitle, double scale, List<Signal> signals) {}

    private final double[] timeS;
    private final List<Panel> panels = new ArrayList<>();
    private String title = "";

    private TimePlot(double[] timeS) {
        if (timeS.length < 2) throw new IllegalArgumentException("a time plot needs at least two samples, got " + timeS.length);
        this.timeS = timeS.clone();
    }

    public static TimePlot over(double[] timeS) { return new TimePlot(timeS); }


    /** A time plot over a simulated response's time points (seconds). */
    public static TimePlot over(TimeResponse response) { return new TimePlot(response.timeS()); }

    public TimePlot title(String title) { this.title = title == null ? "" : title; return this; }

    /** Starts a new panel with the given y-axis title (include the unit, e.g. "Position (mm)"). */
    public TimePlot panel(String yTitle) { return panel(yTitle, 1); }

    /**
     * Starts a new panel whose signals are shown multiplied by {@code scale}: signals stay in SI units and the
     * panel converts, e.g. {@code panel("Position (µm)", 1e6)} for positions in metres, or
     * {@code panel("Position (µm)", 1000 / radPerMm)} for motor angles in rad. The title names the shown unit.
     */
    public TimePlot panel(String yTitle, double scale) {
        if (!Double.isFinite(scale) || scale == 0) {
            throw new IllegalArgumentException("panel '" + yTitle + "': scale must be finite and non-zero, got " + scale + " (1 shows values as given)");
        }
        panels.add(new Panel(yTitle, scale, new ArrayList<>()));
        return this;
    }

    /** Adds a signal to the current panel (multiplied by the panel's scale). */
    public TimePlot signal(String label, double[] values) { return add(label, values, false); }

    /** Adds a dashed reference (setpoint, limit) to the current panel (multiplied by the panel's scale). */
    public TimePlot reference(String label, double[] values) { return add(label, values, true); }

    /** Adds a constant dashed reference (a limit) to the current panel, e.g. {@code level("limit", 10)} for a 10 A limit. */
    public TimePlot level(String label, double value) {
        double[] v = new double[timeS.length];
        java.util.Arrays.fill(v, value);
        return add(label, v, true);
    }

    /**
     * Adds one signal per response to the current panel, labels and responses paired by position, e.g.
     * {@code signals(labels, steps, TimeResponse::positionRad)}. Every response must share this plot's time points.
     */
    public <T> TimePlot signals(List<String> labels, List<T> responses, Function<? super T, double[]> signal) {
        if (labels.size() != responses.size()) {
            throw new IllegalArgumentException("give one label per response (" + labels.size() + " labels, " + responses.size() + " responses)");
        }
        for (int i = 0; i < labels.size(); i++) signal(labels.get(i), signal.apply(responses.get(i)));
        return this;
    }

    /** {@link #signals(List, List, Function)} with the labels as an array. */
    public <T> TimePlot signals(String[] labels, List<T> responses, Function<? super T, double[]> signal) {
        return signals(List.of(labels), responses, signal);
    }

    private TimePlot add(String label, double[] values, boolean ref) {
        if (panels.isEmpty()) panel("");
        if (values.length != timeS.length) {
            throw new IllegalArgumentException("signal '" + label + "' has " + values.length + " samples for " + timeS.length + " time points");
        }
        Panel p = panels.get(panels.size() - 1);
        double[] v = values.clone();
        if (p.scale() != 1) for (int i = 0; i < v.length; i++) v[i] *= p.scale();
        p.signals().add(new Signal(label, v, ref));
        return this;
    }

    public Figure figure() {
        if (panels.isEmpty()) throw new IllegalArgumentException("a time plot needs at least one signal: call signal(label, values)");
        List<XYChart> charts = new ArrayList<>();
        for (int p = 0; p < panels.size(); p++) {
            Panel pn = panels.get(p);
            boolean last = p == panels.size() - 1;
            XYChart c = ChartStyle.newChart(640, 220, null, last ? "Time (s)" : "", pn.yTitle());
            int colour = 0;
            for (Signal s : pn.signals()) {
                double[][] d = Decimation.forPanel(timeS, s.values(), false, 640, 220);
                if (s.reference()) {
                    ChartStyle.reference(c, s.label(), d[0], d[1], Palette.REFERENCE, true).setShowInLegend(true);
                } else {
                    ChartStyle.curve(c, s.label(), d[0], d[1], colour++);
                }
            }
            charts.add(c);
        }
        String t = title.isEmpty() ? "Time response: " + String.join(", ", panels.stream().map(Panel::yTitle).filter(y -> !y.isEmpty()).toList()) : title;
        return Figure.column(t, charts);
    }
}
