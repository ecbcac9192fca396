package org.loopledger.display;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.plot.BodePlot;
import org.loopledger.plot.Figure;
import org.loopledger.plot.TimePlot;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

import javax.xml.parsers.DocumentBuilderFactory;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.*;

/** Issue 11, figures: compact SVG, small stored outputs, plot data rounded to what verify compares. */
class FigureSvgTest {
    private static final Pattern NUMBER = Pattern.compile("-?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][-+]?\\d+)?");

    static Figure bode() {
        double[] w = FrequencyGrid.logSpacedRadPerS(1, 4000, 2000);
        return BodePlot.create().title("Two-mass axis & a lag")
                .add("two-mass", FrfRendererTest.twoMass())
                .add("lag", Frf.ofModel(TransferFunction.continuous(new double[] {1e4}, new double[] {1, 100}), w))
                .mark("crossover", 100, 0, -130).figure();
    }

    private static Document parse(String svg) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        return f.newDocumentBuilder().parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
    }

    private static List<Element> elements(Document d, String name) {
        NodeList nl = d.getElementsByTagNameNS("*", name);
        List<Element> r = new ArrayList<>();
        for (int i = 0; i < nl.getLength(); i++) r.add((Element) nl.item(i));
        return r;
    }

    @Test
    void eachSeriesIsOnePathTextIsTextStylesAreSharedCoordinatesToATenthOfAPixel() throws Exception {
        String svg = FigureRenderer.svg(bode());
        Document d = parse(svg);
        assertEquals(0, elements(d, "line").size(), "no per-segment <line>");
        // Two panels, two curves: one path per curve and panel, plus the legend's sample line (common practice in SVG plots).
        long teal = elements(d, "path").stream().filter(e -> e.getAttribute("stroke").equals("#1f6e78")).count();
        assertTrue(teal >= 2 && teal <= 3, "the first series' paths: " + teal);
        List<String> texts = elements(d, "text").stream().map(Element::getTextContent).toList();
        for (String t : List.of("Two-mass axis & a lag", "Frequency (Hz)", "Magnitude (dB)", "Phase (deg)", "two-mass", "lag", "100")) {
            assertTrue(texts.contains(t), "text '" + t + "' kept as text: " + texts);
        }
        assertFalse(svg.contains("style="), "styles are attributes shared by runs of equal style, not inline per element");
        for (Element p : elements(d, "path")) {
            Matcher m = NUMBER.matcher(p.getAttribute("d"));
            while (m.find()) assertFalse(m.group().matches(".*\\.\\d\\d.*"), "more than a tenth of a pixel: " + m.group());
        }
        assertTrue(svg.length() < 30_000, "compact: " + svg.length() + " bytes");
    }

    @Test
    void sameFigureSameBytesAndDifferentFiguresDifferentClipIds() throws Exception {
        String a = FigureRenderer.svg(bode()), b = FigureRenderer.svg(bode());
        assertEquals(a, b);
        Figure other = TimePlot.over(new double[] {0, 1, 2}).panel("y").signal("y", new double[] {0, 1, 0}).figure();
        String c = FigureRenderer.svg(other);
        String idA = elements(parse(a), "clipPath").get(0).getAttribute("id"), idC = elements(parse(c), "clipPath").get(0).getAttribute("id");
        assertNotEquals(idA, idC, "two figures inlined into one page must not share clip ids");
    }

    /** 40,940 samples (the demo logs' length) of seeded noise in two panels, as in the log plot. */
    static Figure longLog() {
        int n = 40_940;
        double[] t = new double[n], a = new double[n], b = new double[n], v = new double[n];
        SplittableRandom r = new SplittableRandom(7);
        double s = 0;
        for (int i = 0; i < n; i++) {
            t[i] = i / 16000.0;
            a[i] = r.nextDouble() < 0.5 ? -1 : 1;
            b[i] = a[i] + 0.3 * (r.nextDouble() - 0.5);
            s = 0.95 * s + 0.1 * b[i];
            v[i] = s;
        }
        return TimePlot.over(t).title("log").panel("Current (A)").signal("injected", a).signal("measured", b)
                .panel("Velocity (rad/s)").signal("velocity", v).figure();
    }

    @Test
    void aTwoPanel40940SampleLogStoresUnder150Kilobytes() {
        MimeBundle b = Bundles.of(longLog());
        int bytes = b.toJson().getBytes(StandardCharsets.UTF_8).length;
        System.out.println("40,940-sample two-panel time plot: bundle " + bytes + " bytes " + b.data().keySet());
        assertTrue(bytes < 150_000, "issue 11 target 150 KB, got " + bytes);
    }

    @Test
    void plotDataIsRoundedToSevenSignificantDigits() {
        // By hand: 1/3 -> 0.3333333; 0.1 + 0.2 = 0.30000000000000004 -> 0.3; 123456789 -> 123456800; -2.5e-9 stays.
        assertEquals("0.3333333", FigureRenderer.rounded(1 / 3.0));
        assertEquals("0.3", FigureRenderer.rounded(0.1 + 0.2));
        assertEquals("123456800", FigureRenderer.rounded(123456789.0));
        assertEquals("-2.5e-9", FigureRenderer.rounded(-2.5e-9));
        String data = Bundles.of(bode()).get(FigureRenderer.PLOT_DATA_MIME).orElseThrow();
        Matcher m = Pattern.compile("(?<=[\" ])-?[0-9.]+(?:e-?\\d+)?(?=[\" ])").matcher(data);
        int numbers = 0;
        while (m.find()) {
            String digits = m.group().replaceAll("e.*", "").replace("-", "").replace(".", "").replaceFirst("^0+", "");
            assertTrue(digits.length() <= 7, "more than 7 significant digits: " + m.group());
            numbers++;
        }
        assertTrue(numbers > 100, "the data are there: " + numbers + " numbers");
        // verify's default relative tolerance is 1e-6 (VerifyCommand): rounding moves a value by at most 5e-7 of itself.
        double x = 2.0 / 3.0;
        assertTrue(Math.abs(Double.parseDouble(FigureRenderer.rounded(x)) - x) <= 5e-7 * x);
    }
}
