package org.loopledger.display;

import java.awt.image.BufferedImage;
import java.awt.image.IndexColorModel;
import java.awt.image.Raster;
import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.zip.CRC32;
import java.util.zip.Deflater;

/**
 * Writes a palette image ({@link IndexColorModel}, at most 256 colours) as a PNG (W3C, Portable Network Graphics
 * Specification, 2nd ed., 2003): IHDR, PLTE, one IDAT, IEND, 8 bits per index, no interlace, filter type None on
 * every row (§12.6 recommends None for palette images, as neighbouring indices are not numerically related), deflate
 * at level {@value #DEFLATE_LEVEL}. Faster than the JDK's writer at its strongest setting, which tries every filter on every
 * row, and smaller on plots. Deterministic: no time stamp or text chunk.
 */
final class IndexedPng {
    /**
     * Deflate level 8: on the figure benchmark's Bode figure 8.3 ms and 20.9 KB, against 21.4 ms and 20.75 KB at level 9
     * and 2.3 ms and 23.2 KB at level 6 (measured, CPU time, best of 15): the last level buys 0.6 % for 13 ms.
     */
    static final int DEFLATE_LEVEL = 8;
    private static final byte[] SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1A, '\n'};

    private IndexedPng() {}

    static byte[] encode(BufferedImage img) {
        if (!(img.getColorModel() instanceof IndexColorModel cm)) {
            throw new IllegalArgumentException("IndexedPng writes palette images only, got colour model " + img.getColorModel());
        }
        int w = img.getWidth(), h = img.getHeight(), colours = cm.getMapSize();
        ByteArrayOutputStream out = new ByteArrayOutputStream(32 * 1024);
        out.writeBytes(SIGNATURE);
        byte[] ihdr = new byte[13];
        putInt(ihdr, 0, w);
        putInt(ihdr, 4, h);
        ihdr[8] = 8;  // bit depth
        ihdr[9] = 3;  // colour type: palette
        chunk(out, "IHDR", ihdr, ihdr.length);
        byte[] plte = new byte[3 * colours];
        for (int i = 0; i < colours; i++) {
            plte[3 * i] = (byte) cm.getRed(i);
            plte[3 * i + 1] = (byte) cm.getGreen(i);
            plte[3 * i + 2] = (byte) cm.getBlue(i);
        }
        chunk(out, "PLTE", plte, plte.length);
        byte[] raw = new byte[h * (w + 1)];
        Raster r = img.getRaster();
        int[] row = new int[w];
        for (int y = 0; y < h; y++) {
            r.getSamples(0, y, w, 1, 0, row);
            int o = y * (w + 1); // raw[o] = 0: filter type None
            for (int x = 0; x < w; x++) raw[o + 1 + x] = (byte) row[x];
        }
        Deflater d = new Deflater(DEFLATE_LEVEL);
        try {
            d.setInput(raw);
            d.finish();
            byte[] buf = new byte[Math.max(1024, raw.length / 4)];
            ByteArrayOutputStream z = new ByteArrayOutputStream(raw.length / 8 + 64);
            while (!d.finished()) z.write(buf, 0, d.deflate(buf));
            byte[] idat = z.toByteArray();
            chunk(out, "IDAT", idat, idat.length);
        } finally {
            d.end();
        }
        chunk(out, "IEND", new byte[0], 0);
        return out.toByteArray();
    }

    private static void chunk(ByteArrayOutputStream out, String type, byte[] data, int n) {
        byte[] len = new byte[4];
        putInt(len, 0, n);
        out.writeBytes(len);
        byte[] t = type.getBytes(StandardCharsets.US_ASCII);
        out.writeBytes(t);
        out.write(data, 0, n);
        CRC32 crc = new CRC32();
        crc.update(t);
        crc.update(data, 0, n);
        byte[] c = new byte[4];
        putInt(c, 0, (int) crc.getValue());
        out.writeBytes(c);
    }

    private static void putInt(byte[] b, int at, int v) {
        b[at] = (byte) (v >>> 24);
        b[at + 1] = (byte) (v >>> 16);
        b[at + 2] = (byte) (v >>> 8);
        b[at + 3] = (byte) v;
    }
}
