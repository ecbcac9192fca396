package org.loopledger.display;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import org.junit.jupiter.api.Test;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class FrfRendererTest {
    private static final TransferFunction LAG = TransferFunction.continuous(new double[] {1}, new double[] {1, 1});

    /** A two-mass axis (rigid body with a lightly damped resonance at 300 Hz, antiresonance at 200 Hz) on 2,000 points. */
    static Frf twoMass() {
        double wr = 2 * Math.PI * 300, wa = 2 * Math.PI * 200, z = 0.02;
        TransferFunction g = TransferFunction.continuous(new double[] {wr * wr / (wa * wa), 2 * z * wr * wr / wa, wr * wr},
                new double[] {1, 2 * z * wr, wr * wr, 0, 0});
        return Frf.ofModel(g, FrequencyGrid.logSpacedRadPerS(1, 4000, 2000));
    }

    /** Linear interpolation in log x of a plotted series. */
    private static double readAt(JsonObject series, double x) {
        double[] xs = numbers(series, "x"), ys = numbers(series, "y");
        for (int i = 1; i < xs.length; i++) {
            double x0 = xs[i - 1], x1 = xs[i];
            if (x1 >= x) {
                double t = (Math.log(x) - Math.log(x0)) / (Math.log(x1) - Math.log(x0));
                return ys[i - 1] + t * (ys[i] - ys[i - 1]);
            }
        }
        throw new AssertionError(x + " outside the plotted range");
    }

    /** A series' coordinates: plot data stores them as one string of numbers separated by spaces. */
    static double[] numbers(JsonObject series, String axis) {
        return java.util.Arrays.stream(series.get(axis).getAsString().split(" ")).mapToDouble(Double::parseDouble).toArray();
    }

    private static JsonObject series(JsonObject plotData, int panel, String name) {
        for (var s : plotData.getAsJsonArray("panels").get(panel).getAsJsonObject().getAsJsonArray("series")) {
            if (s.getAsJsonObject().get("name").getAsString().equals(name)) return s.getAsJsonObject();
        }
        throw new AssertionError("no series " + name + " in panel " + panel);
    }

    @Test
    void frfIsABodeFigureWhoseDataPutMinus3dbAtTheCorner() throws Exception {
        MimeBundle b = Bundles.of(Frf.ofModel(LAG, FrequencyGrid.logSpacedRadPerS(0.001, 100, 500)));
        assertEquals(List.of(MimeBundle.TEXT_PLAIN, MimeBundle.IMAGE_PNG, FigureRenderer.PLOT_DATA_MIME), List.copyOf(b.data().keySet()));
        assertTrue(b.plainText().startsWith("Frf[500 points"), b.plainText());
        JsonObject data = JsonParser.parseString(b.get(FigureRenderer.PLOT_DATA_MIME).orElseThrow()).getAsJsonObject();
        assertEquals(2, data.getAsJsonArray("panels").size(), "magnitude and phase, no coherence panel without coherence");
        // 1/(s+1) at 1 rad/s = 0.159 Hz: |G| = 1/sqrt(2) = -3.01 dB, phase -45 deg (derivation by hand).
        // Tolerance: the plot decimates within a fraction of a pixel (about 0.5 dB per pixel here), so 0.15 dB and 0.5 deg.
        assertEquals(-10 * Math.log10(2), readAt(series(data, 0, FrfRenderer.LABEL), 1 / (2 * Math.PI)), 0.15);
        assertEquals(-45, readAt(series(data, 1, FrfRenderer.LABEL), 1 / (2 * Math.PI)), 0.5);
        assertEquals("Frequency (Hz)", data.getAsJsonArray("panels").get(1).getAsJsonObject().get("x_axis").getAsString());
    }

    @Test
    void coherenceAddsAPanelBelow() throws Exception {
        Frf f = Frf.ofModel(LAG, FrequencyGrid.logSpacedRadPerS(0.01, 100, 300));
        double[] coh = new double[f.size()];
        for (int i = 0; i < coh.length; i++) coh[i] = 0.5 + 0.5 * i / (coh.length - 1.0);
        MimeBundle b = Bundles.of(f.withCoherence(coh));
        JsonObject data = JsonParser.parseString(b.get(FigureRenderer.PLOT_DATA_MIME).orElseThrow()).getAsJsonObject();
        assertEquals(3, data.getAsJsonArray("panels").size());
        assertEquals("Coherence", data.getAsJsonArray("panels").get(2).getAsJsonObject().get("y_axis").getAsString());
        double[] y = numbers(series(data, 2, FrfRenderer.LABEL), "y");
        assertEquals(0.5, y[0], 1e-12, "first coherence point drawn as given");
        assertEquals(1.0, y[y.length - 1], 1e-12, "last coherence point drawn as given");
        BufferedImage png = ImageIO.read(new ByteArrayInputStream(Base64.getDecoder().decode(b.get(MimeBundle.IMAGE_PNG).orElseThrow())));
        assertEquals(FrfRenderer.figure(f.withCoherence(coh)).heightPx(), png.getHeight());
        assertTrue(png.getHeight() > 3 * 200, "three panels stacked: " + png.getHeight() + " px");
    }

    @Test
    void bodeSvgOfAResonantAxisIsSmallWellFormedAndByteIdenticalTwice() throws Exception {
        Frf f = twoMass();
        MimeBundle a = Bundles.of(f), b = Bundles.of(twoMass());
        String svg = FigureRenderer.svg(FrfRenderer.figure(f));
        System.out.println("SVG of a Bode figure (2 panels, 640x544 px, 2000-point two-mass FRF): " + svg.length() + " bytes; PNG "
                + Base64.getDecoder().decode(a.get(MimeBundle.IMAGE_PNG).orElseThrow()).length + " bytes; bundle " + a.toJson().length() + " bytes");
        assertTrue(svg.length() < 30_000, "issue 11: one path per series, text as text; got " + svg.length() + " bytes");
        assertTrue(a.toJson().length() < 150_000, "issue 11: the stored figure under 150 KB, got " + a.toJson().length());
        assertTrue(svg.startsWith("<svg"), "no prolog");
        var dbf = DocumentBuilderFactory.newInstance();
        dbf.setNamespaceAware(true);
        assertEquals("svg", dbf.newDocumentBuilder().parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8))).getDocumentElement().getLocalName());
        assertEquals(svg, FigureRenderer.svg(FrfRenderer.figure(twoMass())), "SVG differs between two renders");
        for (String mime : a.data().keySet()) assertEquals(a.data().get(mime), b.data().get(mime), mime + " differs between two renders");
    }
}
