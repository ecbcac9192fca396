package org.loopledger.display;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.notebook.Cell;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookJson;
import org.loopledger.notebook.Output;
import org.loopledger.plot.Palette;
import org.loopledger.testing.Chromium;
import org.loopledger.testing.PythonOracle;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Base64;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.*;

/**
 * A figure stored by Loopledger shows in {@code jupyter nbconvert --to html} as Debian ships it (6.5),
 * the outside reference: its {@code clean_html} filter (lxml's Cleaner) strips every element inside an
 * inline {@code <svg>}, so an {@code image/svg+xml} output, which it prefers to PNG, comes out blank.
 */
class FigureInNbconvertTest {
    private static final Pattern IMG = Pattern.compile("<img src=\"data:image/png;base64,([A-Za-z0-9+/=\\s]+)\"");

    @Test
    void aBodeFigureIsVisibleInDebiansNbconvertHtml(@TempDir Path dir) throws Exception {
        PythonOracle.require("nbconvert", "nbformat");
        MimeBundle b = Bundles.of(FigureSvgTest.bode());
        Notebook nb = new Notebook(5, "{\"kernelspec\":{\"name\":\"loopledger\",\"display_name\":\"Loopledger (Java)\",\"language\":\"java\"},"
                + "\"language_info\":{\"name\":\"java\"}}", List.of(
                new Cell.Code("c1", "BodePlot.create()...figure()", 1, List.of(new Output.DisplayData(b.data(), Map.of())), "{}")));
        Path ipynb = dir.resolve("figure.ipynb");
        NotebookJson.write(nb, ipynb);
        Process p = new ProcessBuilder(PythonOracle.python(), "-m", "nbconvert", "--to", "html", ipynb.toString())
                .redirectErrorStream(true).start();
        String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(300, TimeUnit.SECONDS), "nbconvert did not finish");
        assertEquals(0, p.exitValue(), log);
        Path html = dir.resolve("figure.html");
        String page = Files.readString(html);
        assertFalse(page.contains("data-mime-type=\"image/svg+xml\""), "nbconvert chose an SVG output, which its sanitiser empties");
        Matcher m = IMG.matcher(page);
        assertTrue(m.find(), "the figure is an <img> in nbconvert's HTML");
        byte[] png = Base64.getDecoder().decode(m.group(1).replaceAll("\\s", ""));
        assertArrayEquals(Base64.getDecoder().decode(b.get(MimeBundle.IMAGE_PNG).orElseThrow()), png, "the stored drawing, unchanged");
        BufferedImage img = ImageIO.read(new ByteArrayInputStream(png));
        int teal = Chromium.pixelsNear(img, Palette.TEAL.getRGB() & 0xFFFFFF, 40);
        assertTrue(teal > 500, "the first curve is drawn: " + teal + " teal pixels");

        // And a browser shows it: Chromium renders nbconvert's page with the curve's colour on screen.
        Chromium.require();
        Chromium.Shot shot = Chromium.screenshot(dir, html, 1000, 900);
        int onScreen = Chromium.pixelsNear(shot.image(), Palette.TEAL.getRGB() & 0xFFFFFF, 40);
        assertTrue(onScreen > 500, "the curve is visible in Chromium: " + onScreen + " teal pixels");
    }
}
