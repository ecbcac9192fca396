package org.loopledger.display;

import de.erichseifert.vectorgraphics2d.Document;
import de.erichseifert.vectorgraphics2d.VectorGraphics2D;
import de.erichseifert.vectorgraphics2d.VectorHints;
import de.erichseifert.vectorgraphics2d.svg.SVGProcessor;
import de.erichseifert.vectorgraphics2d.util.PageSize;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.internal.chartpart.Chart;
import org.knowm.xchart.style.AxesChartStyler;

import java.awt.BasicStroke;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.HashMap;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

/**
 * XChart charts a user built: a PNG drawn by XChart (the user's own styling), the plotted data of an
 * {@link XYChart} under {@link FigureRenderer#PLOT_DATA_MIME} (for {@code verify}, rounded as for our
 * figures) and a one-line text description; no SVG in the bundle, for the reasons given in
 * {@link FigureRenderer}. {@link #svg} still exports an SVG (VectorGraphics2D, no XML declaration, no
 * DOCTYPE, grid lines drawn solid because VectorGraphics2D writes every dash as its own shape).
 * The output depends only on the chart: no ids, dates or random numbers.
 */
public final class ChartRenderer {
    private ChartRenderer() {}

    public static MimeBundle render(Chart<?, ?> chart) throws IOException {
        MimeBundle.Builder b = MimeBundle.builder(describe(chart))
                .put(MimeBundle.IMAGE_PNG, Base64.getEncoder().encodeToString(png(chart)));
        if (chart instanceof XYChart xy) b.put(FigureRenderer.PLOT_DATA_MIME, FigureRenderer.plotData(org.loopledger.plot.Figure.single(xy)));
        return b.build();
    }

    /** One line: type, title, size and series names. */
    public static String describe(Chart<?, ?> chart) {
        String series = chart.getSeriesMap().keySet().stream().map(String::valueOf).collect(Collectors.joining(", "));
        String title = chart.getTitle() == null || chart.getTitle().isEmpty() ? "" : " \"" + chart.getTitle() + "\"";
        return chart.getClass().getSimpleName() + title + " (" + chart.getWidth() + "x" + chart.getHeight() + " px"
                + (series.isEmpty() ? "" : "; series: " + series) + ")";
    }

    /** The chart as an SVG element, ready to inline into HTML. */
    public static String svg(Chart<?, ?> chart) throws IOException {
        return withSolidGrid(chart, () -> {
            VectorGraphics2D g = new VectorGraphics2D();
            g.setRenderingHint(VectorHints.KEY_TEXT, VectorHints.VALUE_TEXT_DEFAULT);
            chart.paint(g, chart.getWidth(), chart.getHeight());
            Document doc = new SVGProcessor().getDocument(g.getCommands(), new PageSize(0, 0, chart.getWidth(), chart.getHeight()));
            ByteArrayOutputStream out = new ByteArrayOutputStream(64 * 1024);
            doc.writeTo(out);
            return stripProlog(out.toString(StandardCharsets.UTF_8));
        });
    }

    /** The chart as PNG bytes. */
    public static byte[] png(Chart<?, ?> chart) throws IOException {
        return withSolidGrid(chart, () -> FigureRenderer.png(BitmapEncoder.getBufferedImage(chart)));
    }

    private static final Pattern CLIP_ID = Pattern.compile("clip(-?\\d+)");
    private static final Pattern LONG_DECIMAL = Pattern.compile("(\\d\\.\\d{2})\\d+");

    /**
     * Removes the XML declaration and DOCTYPE so the SVG can sit inside HTML or a MIME bundle; renames
     * VectorGraphics2D's clip ids (identity hash codes, different in every run) to clip1, clip2, ... in
     * order of appearance; cuts coordinates to 0.01 px, which nobody can see and which halves the size.
     */
    static String stripProlog(String svg) {
        int start = svg.indexOf("<svg");
        if (start < 0) throw new IllegalStateException("VectorGraphics2D produced no <svg> element");
        String body = svg.substring(start).strip();
        Map<String, String> ids = new HashMap<>();
        Matcher m = CLIP_ID.matcher(body);
        StringBuilder b = new StringBuilder(body.length());
        while (m.find()) {
            String id = ids.computeIfAbsent(m.group(1), k -> "ll-clip" + (ids.size() + 1));
            m.appendReplacement(b, id);
        }
        m.appendTail(b);
        return LONG_DECIMAL.matcher(b).replaceAll("$1");
    }

    private interface IoSupplier<T> {
        T get() throws IOException;
    }

    private static <T> T withSolidGrid(Chart<?, ?> chart, IoSupplier<T> paint) throws IOException {
        if (!(chart.getStyler() instanceof AxesChartStyler s) || s.getPlotGridLinesStroke() == null
                || s.getPlotGridLinesStroke().getDashArray() == null) {
            return paint.get();
        }
        BasicStroke dashed = s.getPlotGridLinesStroke();
        s.setPlotGridLinesStroke(new BasicStroke(dashed.getLineWidth(), dashed.getEndCap(), dashed.getLineJoin(), dashed.getMiterLimit()));
        try {
            return paint.get();
        } finally {
            s.setPlotGridLinesStroke(dashed);
        }
    }
}
