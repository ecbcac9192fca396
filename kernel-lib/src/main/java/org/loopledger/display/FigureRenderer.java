package org.loopledger.display;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import de.erichseifert.vectorgraphics2d.Document;
import de.erichseifert.vectorgraphics2d.VectorGraphics2D;
import de.erichseifert.vectorgraphics2d.VectorHints;
import de.erichseifert.vectorgraphics2d.svg.SVGProcessor;
import de.erichseifert.vectorgraphics2d.util.PageSize;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.loopledger.plot.Figure;

import javax.imageio.ImageIO;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Base64;

/**
 * A {@link Figure} as inline SVG (text kept as text, no prolog), a PNG fallback, and the data its
 * series draw under {@value #PLOT_DATA_MIME}, so that a reproducibility check compares plots through
 * their data and not their pixels. Deterministic: the same figure gives the same bytes.
 */
public final class FigureRenderer {
    /** MIME type of the plotted data (JSON: panels, each with series name, x and y). */
    public static final String PLOT_DATA_MIME = "application/vnd.loopledger.plot-data+json";

    private FigureRenderer() {}

    public static MimeBundle render(Figure f) throws IOException {
        return MimeBundle.builder(f.toString())
                .put(MimeBundle.IMAGE_SVG, svg(f))
                .put(MimeBundle.IMAGE_PNG, Base64.getEncoder().encodeToString(png(f)))
                .put(PLOT_DATA_MIME, plotData(f))
                .build();
    }

    public static String svg(Figure f) throws IOException {
        VectorGraphics2D g = new VectorGraphics2D();
        g.setRenderingHint(VectorHints.KEY_TEXT, VectorHints.VALUE_TEXT_DEFAULT);
        f.paint(g);
        Document doc = new SVGProcessor().getDocument(g.getCommands(), new PageSize(0, 0, f.widthPx(), f.heightPx()));
        ByteArrayOutputStream out = new ByteArrayOutputStream(64 * 1024);
        doc.writeTo(out);
        return ChartRenderer.stripProlog(out.toString(StandardCharsets.UTF_8));
    }

    public static byte[] png(Figure f) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream(64 * 1024);
        ImageIO.write(f.toImage(1.0), "png", out);
        return out.toByteArray();
    }

    /** The series each panel draws, as JSON text. */
    public static String plotData(Figure f) {
        JsonObject root = new JsonObject();
        root.addProperty("title", f.title());
        JsonArray panels = new JsonArray();
        for (XYChart c : f.panels()) {
            JsonObject p = new JsonObject();
            p.addProperty("title", c.getTitle());
            p.addProperty("x_axis", c.getXAxisTitle());
            p.addProperty("y_axis", c.getYAxisTitle());
            JsonArray series = new JsonArray();
            for (XYSeries s : c.getSeriesMap().values()) {
                JsonObject so = new JsonObject();
                so.addProperty("name", s.getName());
                so.add("x", array(s.getXData()));
                so.add("y", array(s.getYData()));
                series.add(so);
            }
            p.add("series", series);
            panels.add(p);
        }
        root.add("panels", panels);
        return root.toString();
    }

    private static JsonArray array(double[] v) {
        JsonArray a = new JsonArray(v.length);
        for (double d : v) a.add(Double.isFinite(d) ? (Number) d : (Number) 0.0);
        return a;
    }
}
