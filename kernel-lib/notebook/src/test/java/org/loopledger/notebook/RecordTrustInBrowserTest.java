package org.loopledger.notebook;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.sun.net.httpserver.HttpServer;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.Chromium;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CopyOnWriteArrayList;

import static org.junit.jupiter.api.Assertions.*;

/**
 * What a reader of a tuning record can trust, checked in Debian's headless Chromium (the outside
 * reference for how the record really renders and what it fetches): pictures a notebook carries are
 * shown without any network request, an output cannot pass itself off as the record's own verdict, the
 * title and the caution appear once, and tables, formulas, JPEG and unknown outputs are shown or named.
 *
 * <p>Network requests are counted by a local HTTP server that every remote reference in the notebook
 * points at; a control page proves that this Chromium does fetch from it when asked.
 */
class RecordTrustInBrowserTest {
    static final String TITLE = "Axis Y record trust check";
    static final String CAUTION_MARK = "TRUST-CAUTION-MARK";

    @TempDir
    static Path dir;
    static Path folder;
    static Path record;
    static HttpServer server;
    static final List<String> hits = new CopyOnWriteArrayList<>();
    static String html;
    static JsonObject layout;
    static JsonObject probe;

    /** Collects from the record's DOM what the tests look at; runs in the test harness, never in the record. */
    static final String PROBE = """
            function (d) {
              var r = {external: [], links: [], verdicts: [], h1: [], cautionsBeforeCode: 0, th: [], td: []};
              d.querySelectorAll('*').forEach(function (e) {
                ['src', 'srcset', 'poster', 'data', 'background', 'action', 'formaction', 'xlink:href'].forEach(function (a) {
                  var v = e.getAttribute(a);
                  if (v !== null && v.indexOf('data:') !== 0) r.external.push(e.tagName.toLowerCase() + '[' + a + ']=' + v);
                });
                if (e.tagName === 'LINK' || e.tagName === 'BASE' || e.tagName === 'IFRAME' || e.tagName === 'OBJECT') r.external.push(e.outerHTML);
                var st = e.getAttribute('style');
                if (st && /url\\(/i.test(st)) r.external.push('style: ' + st);
              });
              d.querySelectorAll('a').forEach(function (a) { r.links.push(a.getAttribute('href')); });
              d.querySelectorAll('td').forEach(function (td) {
                if (td.textContent.trim() !== 'met') return;
                var cs = d.defaultView.getComputedStyle(td);
                r.verdicts.push({row: td.parentElement.firstElementChild.textContent.trim(), background: cs.backgroundColor, color: cs.color});
              });
              d.querySelectorAll('h1').forEach(function (h) { r.h1.push(h.textContent.trim()); });
              var firstCode = d.querySelector('pre');
              d.querySelectorAll('strong, em, b, i').forEach(function (s) {
                if (/^caution[.:!]?$/i.test(s.textContent.trim()) && firstCode && (s.compareDocumentPosition(firstCode) & 4)) r.cautionsBeforeCode++;
              });
              r.formulas = [];
              d.querySelectorAll('img').forEach(function (i) {
                var alt = i.getAttribute('alt') || '';
                if (alt.charAt(0) === '$') r.formulas.push({alt: alt, naturalWidth: i.naturalWidth, naturalHeight: i.naturalHeight});
              });
              d.querySelectorAll('th').forEach(function (e) { r.th.push(e.textContent.trim()); });
              d.querySelectorAll('td').forEach(function (e) { r.td.push(e.textContent.trim()); });
              return r;
            }
            """;

    /** A PNG or JPEG of the given size with a fixed pattern (deterministic, no random generator). */
    static byte[] picture(int w, int h, String format) {
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        for (int y = 0; y < h; y++) for (int x = 0; x < w; x++) img.setRGB(x, y, ((x * 37) & 0xff) << 16 | ((y * 53) & 0xff) << 8 | 0x80);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            assertTrue(ImageIO.write(img, format, out), "ImageIO writes " + format);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toByteArray();
    }

    static String b64(byte[] b) { return Base64.getEncoder().encodeToString(b); }

    static Notebook notebook(String base) {
        String opening = "# " + TITLE + "\n\n"
                + "The crossover $\\omega_c = 2\\pi f_c$ of the position loop, and the loop gain\n\n"
                + "$$L(s) = \\frac{K_p}{s}\\,T_v(s)$$\n\n"
                + "> **Caution.** Axis Y carries a vertical load; " + CAUTION_MARK + ".\n\n"
                + "| Load case | Resonance (Hz) |\n|---|---:|\n| empty | 412 |\n| heavy | 371 |\n\n"
                + "![wiring](attachment:wiring.png) ![local figure](fig.png) ![outside](../outside.png) ![notes](notes.txt)\n\n"
                + "![beacon](" + base + "/markdown-image.png) [data link](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==) "
                + "[js link](javascript:alert(1)) [tab link](java\tscript:alert(2))\n";
        String forged = "<section class=\"rec-summary summary\"><h2>Spec checks in this record</h2><p>1 spec check(s), all met.</p>"
                + "<table class=\"rec-verdicts summary\"><tr><th>Requirement</th><th>Limit</th><th>Achieved</th><th>At</th><th>Result</th></tr>"
                + "<tr><td>forged phase margin</td><td>&gt;= 45 deg</td><td>12 deg</td><td>80 Hz</td>"
                + "<td class=\"rec-met pass\" id=\"v\" style=\"background:#3d6b2a;color:#fff\">met</td></tr></table></section>";
        String genuine = "{\"title\":\"genuine\",\"rows\":[{\"requirement\":\"genuine phase margin\",\"limit\":\">= 45 deg\",\"achieved\":\"52 deg\",\"at\":\"80 Hz\",\"pass\":true}]}";
        List<Cell> cells = new ArrayList<>();
        cells.add(new Cell.Markdown("open", opening, "{}", Map.of("wiring.png", Map.of("image/png", b64(picture(7, 5, "png"))))));
        cells.add(new Cell.Code("c1", "outputs()", 1, List.of(
                new Output.DisplayData(Map.of("image/jpeg", b64(picture(11, 6, "jpg")), "text/plain", "photo"), Map.of()),
                new Output.DisplayData(Map.of("application/x-foo", "{\"a\":1}"), Map.of()),
                new Output.DisplayData(Map.of("application/x-bar", "bar", "text/plain", "bar as text"), Map.of()),
                new Output.DisplayData(Map.of("text/latex", "$$\\frac{1}{s + 1}$$", "text/plain", "1/(s+1)"), Map.of()),
                new Output.DisplayData(Map.of("text/html", forged, "text/plain", "forged"), Map.of()),
                new Output.DisplayData(Map.of("text/markdown", "![beacon](" + base + "/output-markdown.png)",
                        "text/html", "<img src=\"" + base + "/output-html.png\">", "text/plain", "beacon"), Map.of()),
                new Output.DisplayData(Map.of("image/svg+xml", "<svg xmlns=\"http://www.w3.org/2000/svg\" xmlns:xlink=\"http://www.w3.org/1999/xlink\" width=\"30\" height=\"13\">"
                        + "<image href=\"" + base + "/svg-image.png\" xlink:href=\"" + base + "/svg-xlink.png\" width=\"10\" height=\"10\"/>"
                        + "<rect width=\"30\" height=\"13\" fill=\"#1f6e78\"/></svg>", "text/plain", "svg"), Map.of()),
                new Output.DisplayData(Map.of(SpecSummary.MIME, genuine, "text/plain", "genuine"), Map.of())), "{}"));
        return new Notebook(5, "{}", cells);
    }

    @BeforeAll
    static void writeRecord() throws Exception {
        Chromium.require();
        server = HttpServer.create(new InetSocketAddress(InetAddress.getLoopbackAddress(), 0), 0);
        server.createContext("/", ex -> {
            hits.add(ex.getRequestURI().getPath());
            ex.sendResponseHeaders(404, -1);
            ex.close();
        });
        server.start();
        String base = "http://127.0.0.1:" + server.getAddress().getPort();
        folder = Files.createDirectories(dir.resolve("nb"));
        Files.write(folder.resolve("fig.png"), picture(9, 4, "png"));
        Files.write(dir.resolve("outside.png"), picture(13, 3, "png"));
        Files.writeString(folder.resolve("notes.txt"), "not an image\n");
        record = folder.resolve("record.html");
        html = RecordRenderer.render(notebook(base), new RecordInfo("trust.ipynb", "2026-01-01", "0.1.0", "17", List.of()), folder);
        Files.writeString(record, html);
        layout = Chromium.layout(dir, record, 1000, PROBE);
        probe = layout.getAsJsonObject("probe");
        assertFalse(probe.has("error"), "probe failed: " + probe);
        if (System.getenv("LOOPLEDGER_KEEP_RECORD") != null) Files.copy(record, Path.of(System.getenv("LOOPLEDGER_KEEP_RECORD")), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    }

    @AfterAll
    static void stopServer() {
        if (server != null) server.stop(0);
    }

    private static JsonObject image(int naturalWidth, int naturalHeight) {
        for (JsonElement e : layout.getAsJsonArray("images")) {
            JsonObject i = e.getAsJsonObject();
            if (i.get("naturalWidth").getAsInt() == naturalWidth && i.get("naturalHeight").getAsInt() == naturalHeight) return i;
        }
        return null;
    }

    private static List<String> strings(String key) {
        List<String> r = new ArrayList<>();
        for (JsonElement e : probe.getAsJsonArray(key)) r.add(e.isJsonNull() ? null : e.getAsString());
        return r;
    }

    @Test
    void openingTheRecordMakesNoNetworkRequest() {
        Chromium.Shot shot = Chromium.screenshot(dir, record, 1000, 3000);
        assertEquals(List.of(), hits.stream().filter(p -> !p.startsWith("/control")).toList(), "requests to the local server while the record loaded");
        assertEquals(0, layout.getAsJsonArray("resources").size(), "resources fetched: " + layout.get("resources"));
        assertEquals(List.of(), strings("external"), "elements that would load something other than a data: URI");
        assertTrue(html.contains("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src &#39;none&#39;; img-src data:;"), "CSP as a second line");
        assertEquals(List.of(), shot.consoleMessages(), "console messages (a CSP violation would show here)");
    }

    @Test
    void theControlPageIsFetchedSoTheCountWouldSeeABeacon() throws Exception {
        Path control = dir.resolve("control.html");
        Files.writeString(control, "<!DOCTYPE html><html><body><img src=\"http://127.0.0.1:" + server.getAddress().getPort() + "/control.png\"></body></html>");
        Chromium.screenshot(dir, control, 200, 100);
        assertTrue(hits.contains("/control.png"), "this Chromium fetches from the local server: " + hits);
        hits.remove("/control.png");
    }

    @Test
    void attachmentImagesAreEmbedded() {
        JsonObject i = image(7, 5);
        assertNotNull(i, "the 7x5 attachment is shown: " + layout.get("images"));
        assertTrue(i.get("src").getAsString().startsWith("data:image/png;base64,"), i.toString());
    }

    @Test
    void localImagesAreEmbeddedAndEverythingElseIsLinkText() {
        JsonObject local = image(9, 4);
        assertNotNull(local, "fig.png beside the notebook is embedded: " + layout.get("images"));
        assertTrue(local.get("src").getAsString().startsWith("data:image/png;base64,"));
        assertNull(image(13, 3), "a picture outside the notebook's folder is not read");
        String text = layout.get("text").getAsString();
        assertTrue(text.contains("[image: outside]"), "outside picture as link text");
        assertTrue(text.contains("[image: notes]"), "a file that is not an image as link text");
        assertTrue(text.contains("[image: beacon]"), "a remote picture as link text");
    }

    @Test
    void dataAndJavascriptLinksAreDropped() {
        for (String href : strings("links")) {
            String h = href == null ? "" : href.replaceAll("[\\x00-\\x20]", "").toLowerCase(java.util.Locale.ROOT);
            assertFalse(h.startsWith("data:") || h.startsWith("javascript:"), "link kept: " + href);
        }
        String text = layout.get("text").getAsString();
        assertTrue(text.contains("data link") && text.contains("js link") && text.contains("tab link"), "their text stays");
    }

    @Test
    void anOutputCannotBorrowTheRecordsVerdictStyle() {
        JsonObject forged = null, genuine = null;
        for (JsonElement e : probe.getAsJsonArray("verdicts")) {
            JsonObject v = e.getAsJsonObject();
            if (v.get("row").getAsString().equals("forged phase margin")) forged = v;
            if (v.get("row").getAsString().equals("genuine phase margin")) genuine = v;
        }
        assertNotNull(forged, probe.toString());
        assertNotNull(genuine, probe.toString());
        assertNotEquals(genuine.get("background").getAsString(), forged.get("background").getAsString(), "forged: " + forged + ", genuine: " + genuine);
        assertNotEquals(genuine.get("color").getAsString(), forged.get("color").getAsString(), "forged: " + forged + ", genuine: " + genuine);
        assertEquals("rgba(0, 0, 0, 0)", forged.get("background").getAsString(), "an output's cell has no background of its own");
        assertFalse(html.matches("(?s).*class=\"[^\"]*\\brec-met\\b[^\"]*\"[^>]*>met</td></tr></table></section>.*"), "the forged class is gone");
    }

    @Test
    void titleAndCautionAppearOnce() {
        assertEquals(List.of(TITLE), strings("h1"), "one title");
        assertEquals(TITLE, layout.get("title").getAsString());
        assertEquals(1, probe.get("cautionsBeforeCode").getAsInt(), "one caution before the first cell");
        String text = layout.get("text").getAsString();
        assertEquals(text.indexOf(CAUTION_MARK), text.lastIndexOf(CAUTION_MARK), "the notebook's caution is shown once");
        assertTrue(text.indexOf(CAUTION_MARK) < text.indexOf("Load case"), "at the top");
        assertTrue(text.contains("ISO 12100"), "the library's caution still closes the record");
    }

    @Test
    void gfmTablesRender() {
        assertTrue(strings("th").containsAll(List.of("Load case", "Resonance (Hz)")), strings("th").toString());
        assertTrue(strings("td").containsAll(List.of("empty", "412", "heavy", "371")), strings("td").toString());
    }

    @Test
    void latexIsTypesetNotShownAsSource() {
        String text = layout.get("text").getAsString();
        assertFalse(text.contains("\\frac") || text.contains("\\omega") || text.contains("$$"), "TeX source visible in: " + text);
        JsonArray formulas = probe.getAsJsonArray("formulas");
        assertEquals(3, formulas.size(), "inline, display and text/latex formulas drawn as pictures (TeX as alt text): " + formulas);
        for (JsonElement e : formulas) {
            JsonObject f = e.getAsJsonObject();
            // 14-15 px text: a formula is wider than a letter and no taller than a fraction of three lines.
            assertTrue(f.get("naturalWidth").getAsInt() > 20 && f.get("naturalHeight").getAsInt() > 8 && f.get("naturalHeight").getAsInt() < 80, f.toString());
        }
    }

    @Test
    void jpegOutputsAreShown() {
        JsonObject i = image(11, 6);
        assertNotNull(i, "the 11x6 JPEG output is shown: " + layout.get("images"));
        assertTrue(i.get("src").getAsString().startsWith("data:image/jpeg;base64,"));
    }

    @Test
    void outputsThatCannotBeShownAreNamed() {
        String text = layout.get("text").getAsString();
        assertTrue(text.contains("Output of type application/x-foo is not shown in this record."), text);
        assertTrue(text.contains("bar as text"), text);
        assertTrue(text.contains("The richer form of this output of type application/x-bar is not shown in this record."), text);
    }

    @Test
    void everyImageDecodes() {
        JsonArray images = layout.getAsJsonArray("images");
        for (JsonElement e : images) {
            JsonObject i = e.getAsJsonObject();
            assertTrue(i.get("complete").getAsBoolean() && i.get("naturalWidth").getAsDouble() > 0, "image decoded: " + i);
        }
    }
}
