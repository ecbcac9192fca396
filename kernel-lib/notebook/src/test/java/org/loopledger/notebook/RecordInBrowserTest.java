package org.loopledger.notebook;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.analysis.Margins;
import org.loopledger.display.Bundles;
import org.loopledger.display.MimeBundle;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.plot.BodePlot;
import org.loopledger.plot.Palette;
import org.loopledger.testing.Chromium;
import tech.tablesaw.api.DoubleColumn;
import tech.tablesaw.api.StringColumn;
import tech.tablesaw.api.Table;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The tuning record as Debian's headless Chromium renders it (the outside reference): no console
 * messages, nothing fetched, every image decoded with a non-zero laid-out size, plots visible in the
 * screenshot, hostile outputs shown as text with no script and no event handler in the DOM.
 */
class RecordInBrowserTest {
    static final String TITLE = "Axis X record check";
    static final String HOSTILE_STREAM = "<script>document.title='pwned by stream'</script>";
    static final String HOSTILE_TEXT = "<img src=x onerror=\"document.title='pwned by text'\">";

    @TempDir
    static Path dir;
    static Path record;
    static JsonObject layout;

    private static Output.DisplayData shown(Object value) {
        return new Output.DisplayData(Bundles.of(value).data(), Map.of());
    }

    static Notebook notebook() {
        TransferFunction plant = TransferFunction.continuous(new double[] {1}, new double[] {1, 1});
        TransferFunction loop = TransferFunction.continuous(new double[] {2}, new double[] {1, 3, 3, 1});
        double[] grid = FrequencyGrid.logSpacedRadPerS(0.01, 100, 400);
        Frf measured = Frf.ofModel(plant, grid);
        double[] coh = new double[grid.length];
        for (int i = 0; i < coh.length; i++) coh[i] = 0.6 + 0.4 * Math.sin(Math.PI * i / (coh.length - 1.0));
        Table gains = Table.create("drive parameters", StringColumn.create("parameter", "Kp [1/s]", "Kv [A/(rad/s)]"), DoubleColumn.create("value", 120.0, 0.35));
        List<Cell> cells = new ArrayList<>();
        cells.add(new Cell.Markdown("md1", "# " + TITLE + "\nRaw HTML in Markdown stays text: <img src=x onerror=\"document.title='pwned by markdown'\">\n", "{}"));
        cells.add(new Cell.Code("c1", "plant", 1, List.of(new Output.ExecuteResult(1, Bundles.of(plant).data(), Map.of())), "{}"));
        cells.add(new Cell.Code("c2", "bode", 2, List.of(shown(BodePlot.create().add("plant", measured).add("loop", Frf.ofModel(loop, grid)).figure())), "{}"));
        cells.add(new Cell.Code("c3", "frf", 3, List.of(shown(measured.withCoherence(coh))), "{}"));
        cells.add(new Cell.Code("c4", "margins", 4, List.of(shown(Margins.of(loop)), shown(gains)), "{}"));
        cells.add(new Cell.Code("c5", "hostile", 5, List.of(
                new Output.Stream("stdout", HOSTILE_STREAM + "\n"),
                new Output.DisplayData(Map.of("text/plain", "html", "text/html",
                        "<b>kept</b><img src=x onerror=\"document.title='pwned by html'\"><script>document.title='pwned by script'</script>"
                                + "<svg onload=\"document.title='pwned by svg'\"></svg><a href=\"javascript:alert(1)\">link</a>"), Map.of()),
                new Output.DisplayData(Map.of("text/plain", "svg", MimeBundle.IMAGE_SVG,
                        "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"40\" height=\"20\"><script>document.title='pwned by svg script'</script>"
                                + "<rect width=\"40\" height=\"20\" fill=\"#c86a1e\"/></svg>"), Map.of()),
                new Output.ExecuteResult(5, Map.of("text/plain", HOSTILE_TEXT), Map.of())), "{}"));
        return new Notebook(5, "{}", cells);
    }

    @BeforeAll
    static void writeRecord() throws Exception {
        Chromium.require();
        record = dir.resolve("record.html");
        Files.writeString(record, RecordRenderer.render(notebook(), new RecordInfo("check.ipynb", "2026-01-01", "0.1.0", "17", List.of())));
        layout = Chromium.layout(dir, record, 1000);
        if (System.getenv("LOOPLEDGER_KEEP_RECORD") != null) Files.copy(record, Path.of(System.getenv("LOOPLEDGER_KEEP_RECORD")), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    }

    @Test
    void everyImageDecodesWithNonZeroSizeAndNothingIsFetched() {
        assertEquals(0, layout.getAsJsonArray("resources").size(), "a record fetches nothing: " + layout.get("resources"));
        // The plant's transfer function typeset from its text/latex, plots: Bode (overlay), FRF with coherence, and the
        // hostile SVG image; nothing else renders as an image.
        assertEquals(4, layout.getAsJsonArray("images").size(), layout.get("images").toString());
        for (JsonElement e : layout.getAsJsonArray("images")) {
            JsonObject i = e.getAsJsonObject();
            assertEquals("img", i.get("tag").getAsString(), "plots are images, never inline SVG that could carry script: " + i);
            assertTrue(i.get("complete").getAsBoolean() && i.get("naturalWidth").getAsDouble() > 0 && i.get("naturalHeight").getAsDouble() > 0,
                    "image decoded: " + i);
            assertTrue(i.get("width").getAsDouble() > 0 && i.get("height").getAsDouble() > 0, "image laid out with a size: " + i);
        }
        JsonObject bode = layout.getAsJsonArray("images").get(1).getAsJsonObject();
        assertEquals(640, bode.get("naturalWidth").getAsInt(), "the Bode SVG keeps its own width");
    }

    @Test
    void hostileOutputsAreTextAndNothingRuns() {
        assertEquals(TITLE, layout.get("title").getAsString(), "no hostile script changed the title");
        assertEquals(0, layout.get("scripts").getAsInt(), "no script element in the DOM");
        assertEquals(0, layout.getAsJsonArray("handlers").size(), "no event-handler attribute in the DOM: " + layout.get("handlers"));
        String text = layout.get("text").getAsString();
        assertTrue(text.contains(HOSTILE_STREAM), "stream output visible as text");
        assertTrue(text.contains(HOSTILE_TEXT), "plain-text output visible as text");
        assertTrue(text.contains("<img src=x onerror=\"document.title='pwned by markdown'\">"), "raw HTML in Markdown visible as text");
        assertTrue(text.contains("kept"), "allowed markup of an HTML output survives");
        assertTrue(text.contains("Gain margin (increase)"), "the margins table is shown");
    }

    @Test
    void screenshotShowsPlotsAndTheConsoleStaysSilent() {
        Chromium.Shot shot = Chromium.screenshot(dir, record, 1000, 4000);
        assertEquals(List.of(), shot.consoleMessages(), "console messages while loading the record");
        int colours = Chromium.distinctColours(shot.image());
        int orange = Chromium.pixelsNear(shot.image(), Palette.ORANGE.getRGB() & 0xFFFFFF, 24);
        System.out.println("record screenshot 1000x4000: " + colours + " distinct colours, " + orange + " pixels of the second series' orange");
        // A blank or text-only page has a few hundred greys; antialiased plots in several colours give thousands.
        assertTrue(colours > 1000, "screenshot looks blank: " + colours + " colours");
        // Orange is used only by the second plotted series (and the hostile SVG rectangle, 800 px): the Bode overlay drew.
        assertTrue(orange > 800 + 300, "the overlaid curve is not visible: " + orange + " orange pixels");
    }

    @Test
    void theCheckerCatchesABrokenPage() throws Exception {
        // Negative control: the same checks must fail on a page with a script, a handler, a broken image and a fetch.
        Path bad = dir.resolve("bad.html");
        Files.writeString(bad, "<!DOCTYPE html><html><head><title>bad</title></head><body><p>x</p><img src=\"missing.png\" onerror=\"void 0\">"
                + "<img src=\"http://192.0.2.1/x.png\"><script>console.error('boom')</script></body></html>");
        JsonObject badLayout = Chromium.layout(dir, bad, 800);
        assertEquals(1, badLayout.get("scripts").getAsInt());
        assertEquals(1, badLayout.getAsJsonArray("handlers").size());
        assertEquals(0, badLayout.getAsJsonArray("images").get(0).getAsJsonObject().get("naturalWidth").getAsInt(), "broken image detected");
        assertTrue(badLayout.getAsJsonArray("resources").toString().contains("192.0.2.1"), "fetch detected: " + badLayout.get("resources"));
        Chromium.Shot shot = Chromium.screenshot(dir, bad, 400, 300);
        assertTrue(shot.consoleMessages().stream().anyMatch(m -> m.contains("boom")), "console error detected: " + shot.consoleMessages());
        assertTrue(Chromium.distinctColours(shot.image()) < 1000, "a page without plots counts as blank");
    }
}
