package org.loopledger.plot;

import org.knowm.xchart.XYChart;
import org.loopledger.frf.Frf;

import java.util.List;

/** Coherence (0..1) over frequency (Hz, log axis) of one or more measured FRFs. */
public final class CoherencePlot {
    private CoherencePlot() {}

    /** Coherence of each FRF; labels and FRFs pair up by position. Every FRF must carry coherence. */
    public static Figure of(List<String> labels, List<Frf> frfs) {
        if (labels.size() != frfs.size() || frfs.isEmpty()) {
            throw new IllegalArgumentException("give one label per FRF and at least one FRF (" + labels.size() + " labels, " + frfs.size() + " FRFs)");
        }
        XYChart c = ChartStyle.newChart(640, 240, null, "Frequency (Hz)", "Coherence");
        c.getStyler().setXAxisLogarithmic(true);
        c.getStyler().setYAxisMin(0.0);
        c.getStyler().setYAxisMax(1.05);
        c.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.InsideSW);
        for (int i = 0; i < frfs.size(); i++) {
            Frf f = frfs.get(i);
            double[] coh = f.coherence().orElseThrow(() -> new IllegalArgumentException(
                    "FRF has no coherence: estimate it from a log (Welch H1) or plot its magnitude with BodePlot instead"));
            double[][] d = Decimation.forPanel(f.frequencyHz(), coh, true, 640, 240);
            ChartStyle.curve(c, labels.get(i), d[0], d[1], i);
        }
        return Figure.column("Coherence: " + String.join(", ", labels), List.of(c));
    }

    public static Figure of(String label, Frf frf) { return of(List.of(label), List.of(frf)); }
}
