package org.loopledger.plot;

import org.knowm.xchart.XYChart;

import java.util.ArrayList;
import java.util.List;

/**
 * Time responses: one or more panels over a common time axis (s), each with one or more signals, e.g.
 * position and reference in one panel, current and its limit in another.
 */
public final class TimePlot {
    private record Signal(String label, double[] values, boolean reference) {}

    private record Panel(String yTitle, List<Signal> signals) {}

    private final double[] timeS;
    private final List<Panel> panels = new ArrayList<>();
    private String title = "";

    private TimePlot(double[] timeS) {
        if (timeS.length < 2) throw new IllegalArgumentException("a time plot needs at least two samples, got " + timeS.length);
        this.timeS = timeS.clone();
    }

    public static TimePlot over(double[] timeS) { return new TimePlot(timeS); }

    public TimePlot title(String title) { this.title = title; return this; }

    /** Starts a new panel with the given y-axis title (include the unit, e.g. "Position (mm)"). */
    public TimePlot panel(String yTitle) {
        panels.add(new Panel(yTitle, new ArrayList<>()));
        return this;
    }

    /** Adds a signal to the current panel. */
    public TimePlot signal(String label, double[] values) { return add(label, values, false); }

    /** Adds a dashed reference (setpoint, limit) to the current panel. */
    public TimePlot reference(String label, double[] values) { return add(label, values, true); }

    private TimePlot add(String label, double[] values, boolean ref) {
        if (panels.isEmpty()) panel("");
        if (values.length != timeS.length) {
            throw new IllegalArgumentException("signal '" + label + "' has " + values.length + " samples for " + timeS.length + " time points");
        }
        panels.get(panels.size() - 1).signals().add(new Signal(label, values.clone(), ref));
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
        return Figure.column(title, charts);
    }
}
