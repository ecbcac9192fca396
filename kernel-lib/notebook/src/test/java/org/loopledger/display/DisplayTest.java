package org.loopledger.display;

import org.junit.jupiter.api.Test;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.w3c.dom.Document;
import tech.tablesaw.api.DoubleColumn;
import tech.tablesaw.api.StringColumn;
import tech.tablesaw.api.Table;

import javax.xml.parsers.DocumentBuilderFactory;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.Base64;

import static org.junit.jupiter.api.Assertions.*;

class DisplayTest {
    static XYChart chart() {
        XYChart c = new XYChartBuilder().width(600).height(400).title("Step").xAxisTitle("t [s]").yAxisTitle("y").build();
        double[] x = new double[500];
        double[] y = new double[500];
        for (int i = 0; i < x.length; i++) {
            x[i] = i * 0.01;
            y[i] = 1 - Math.exp(-x[i]);
        }
        c.addSeries("response", x, y).setMarker(org.knowm.xchart.style.markers.SeriesMarkers.NONE);
        return c;
    }

    @Test
    void chartIsAPngWithItsDataDeterministicAndSvgExportStaysWellFormed() throws Exception {
        MimeBundle b = Bundles.of(chart());
        assertEquals(java.util.List.of(MimeBundle.TEXT_PLAIN, MimeBundle.IMAGE_PNG, FigureRenderer.PLOT_DATA_MIME), java.util.List.copyOf(b.data().keySet()),
                "no image/svg+xml: nbconvert 6.5 would pick it and show it blank");
        assertEquals(b, Bundles.of(chart()), "two renderings are identical");
        byte[] png = Base64.getDecoder().decode(b.get(MimeBundle.IMAGE_PNG).orElseThrow());
        assertEquals((byte) 0x89, png[0]);
        assertEquals("PNG", new String(png, 1, 3, StandardCharsets.US_ASCII));
        assertTrue(b.plainText().contains("XYChart \"Step\" (600x400 px; series: response)"), b.plainText());
        assertTrue(b.get(FigureRenderer.PLOT_DATA_MIME).orElseThrow().contains("\"name\":\"response\""));
        String svg = ChartRenderer.svg(chart());
        assertTrue(svg.startsWith("<svg"), "no XML declaration or DOCTYPE");
        assertFalse(svg.matches("(?s).*clip-?\\d{5,}.*"), "no run-dependent ids");
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        Document doc = f.newDocumentBuilder().parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
        assertEquals("svg", doc.getDocumentElement().getLocalName());
        assertEquals(svg, ChartRenderer.svg(chart()));
    }

    @Test
    void tableHtmlIsEscaped() {
        Table t = Table.create("gains <raw>", StringColumn.create("axis", "X & <Y>"), DoubleColumn.create("kp [1/s]", 42.5));
        MimeBundle b = Bundles.of(t);
        String html = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        assertTrue(html.contains("<td>X &amp; &lt;Y&gt;</td>"), html);
        assertTrue(html.contains("<caption>gains &lt;raw&gt;</caption>"), html);
        assertTrue(b.plainText().contains("42.5"));
    }

    @Test
    void markdownEscapesRawHtml() {
        MimeBundle b = Displays.markdown("# Margins\n<script>alert(1)</script>").toMimeBundle();
        assertEquals("# Margins\n<script>alert(1)</script>", b.get(MimeBundle.TEXT_MARKDOWN).orElseThrow());
        String html = b.get(MimeBundle.TEXT_HTML).orElseThrow();
        assertTrue(html.contains("<h1>Margins</h1>"));
        assertFalse(html.contains("<script>"), html);
    }

    @Test
    void registryPrefersTheLatestRegistrationAndDisplayable() throws Exception {
        RendererRegistry r = RendererRegistry.empty().register(Number.class, n -> MimeBundle.ofText("number")).register(Integer.class, n -> MimeBundle.ofText("int"));
        assertEquals("int", r.render(3).orElseThrow().plainText());
        assertEquals("number", r.render(3.0).orElseThrow().plainText());
        assertTrue(r.render("s").isEmpty());
        assertEquals("md", r.render((Displayable) () -> MimeBundle.ofText("md")).orElseThrow().plainText());
    }

    @Test
    void plainTextAndJsonRoundTrip() {
        assertEquals("\"a\\\"b\\n\"", Bundles.plainText("a\"b\n"));
        assertEquals("[1.0, 2.0]", Bundles.plainText(new double[] {1, 2}));
        MimeBundle b = MimeBundle.builder("t").put("text/html", "<b>t</b>").build();
        assertEquals(b, MimeBundle.fromJson(b.toJson()));
        assertThrows(IllegalArgumentException.class, () -> MimeBundle.builder("t").put("html", "x"));
    }
}
