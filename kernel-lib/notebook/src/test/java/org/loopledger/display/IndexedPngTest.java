package org.loopledger.display;

import org.junit.jupiter.api.Test;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.plot.BodePlot;

import javax.imageio.ImageIO;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.IOException;

import static org.junit.jupiter.api.Assertions.*;

/** {@link IndexedPng} against the JDK's own PNG reader (an independent decoder): every pixel comes back. */
class IndexedPngTest {

    private static void assertSamePixels(BufferedImage expected, byte[] png) throws IOException {
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(png));
        assertNotNull(back, "ImageIO reads the file as PNG");
        assertEquals(expected.getWidth(), back.getWidth());
        assertEquals(expected.getHeight(), back.getHeight());
        for (int y = 0; y < expected.getHeight(); y++) {
            for (int x = 0; x < expected.getWidth(); x++) {
                assertEquals(expected.getRGB(x, y) & 0xFFFFFF, back.getRGB(x, y) & 0xFFFFFF, "pixel " + x + "," + y);
            }
        }
    }

    @Test
    void aBodeFigureRoundTripsThroughTheJdkReader() throws IOException {
        Frf f = Frf.ofModel(TransferFunction.continuous(new double[] {1}, new double[] {1e-3, 1, 0}), FrequencyGrid.logSpacedRadPerS(1, 1000, 400));
        BufferedImage palette = PaletteImage.of(BodePlot.of("G", f).toImage(1));
        byte[] png = IndexedPng.encode(palette);
        assertSamePixels(palette, png);
        assertArrayEquals(png, IndexedPng.encode(palette), "deterministic");
    }

    @Test
    void smallPalettesAndOddSizesToo() throws IOException {
        // two colours (a packed 1-bit raster in PaletteImage) and a width that is not a multiple of 8
        BufferedImage rgb = new BufferedImage(13, 7, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = rgb.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, 13, 7);
        g.setColor(Color.BLACK);
        g.fillRect(3, 2, 5, 3);
        g.dispose();
        BufferedImage palette = PaletteImage.of(rgb);
        assertSamePixels(palette, IndexedPng.encode(palette));
        assertThrows(IllegalArgumentException.class, () -> IndexedPng.encode(rgb));
    }
}
