package org.loopledger.display;

import java.awt.image.BufferedImage;
import java.awt.image.IndexColorModel;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * A plot image reduced to at most 256 colours, for a palette PNG about half the size of an RGB one.
 * A plot is a few flat colours plus their anti-aliased blends (600 to 2,000 distinct colours): an image
 * with at most 256 keeps them exactly; otherwise median cut (P. Heckbert, "Color image quantization for
 * frame buffer display", SIGGRAPH 1982) splits the colour histogram, weighted by pixel count, into 256
 * boxes, each pixel takes the nearest box mean, without dithering. The flat colours of curves, grid and
 * background cover most pixels, so they end up alone in their boxes and stay exact. Deterministic.
 */
final class PaletteImage {
    private PaletteImage() {}

    static BufferedImage of(BufferedImage rgb) {
        int w = rgb.getWidth(), h = rgb.getHeight();
        int[] px = rgb.getRGB(0, 0, w, h, null, 0, w);
        ColourTable hist = new ColourTable();
        for (int p : px) hist.add(p & 0xFFFFFF);
        int[] colours = hist.colours();
        Arrays.sort(colours);
        int[] counts = new int[colours.length];
        for (int i = 0; i < colours.length; i++) counts[i] = hist.get(colours[i]);
        int[] palette = colours.length <= 256 ? colours : medianCut(colours, counts, 256);
        ColourTable index = new ColourTable();
        for (int c : colours) index.put(c, nearest(palette, c));
        byte[] r = new byte[palette.length], g = new byte[palette.length], b = new byte[palette.length];
        for (int i = 0; i < palette.length; i++) { r[i] = (byte) (palette[i] >> 16); g[i] = (byte) (palette[i] >> 8); b[i] = (byte) palette[i]; }
        int bits = palette.length <= 2 ? 1 : palette.length <= 4 ? 2 : palette.length <= 16 ? 4 : 8;
        IndexColorModel cm = new IndexColorModel(bits, palette.length, r, g, b);
        BufferedImage out = new BufferedImage(w, h, bits == 8 ? BufferedImage.TYPE_BYTE_INDEXED : BufferedImage.TYPE_BYTE_BINARY, cm);
        var raster = out.getRaster();
        int[] row = new int[w];
        int last = -1, lastIndex = 0;
        for (int y = 0; y < h; y++) {
            for (int x = 0; x < w; x++) {
                int c = px[y * w + x] & 0xFFFFFF;
                if (c != last) { last = c; lastIndex = index.get(c); }
                row[x] = lastIndex;
            }
            raster.setPixels(0, y, w, 1, row);
        }
        return out;
    }

    /** Colour (24-bit) to int, open addressing with linear probing; no boxing in the per-pixel loops. */
    private static final class ColourTable {
        private int[] keys = new int[4096], values = new int[4096];
        private int size;

        ColourTable() { Arrays.fill(keys, -1); }

        private int slot(int c) {
            int mask = keys.length - 1, i = (c * 0x9E3779B1 >>> 7) & mask;
            while (keys[i] != -1 && keys[i] != c) i = (i + 1) & mask;
            return i;
        }

        void add(int c) {
            int i = slot(c);
            if (keys[i] == -1) { keys[i] = c; size++; if (2 * size > keys.length) { grow(); i = slot(c); } }
            values[i]++;
        }

        void put(int c, int v) {
            int i = slot(c);
            if (keys[i] == -1) { keys[i] = c; size++; if (2 * size > keys.length) { grow(); i = slot(c); } }
            values[i] = v;
        }

        int get(int c) { int i = slot(c); return keys[i] == -1 ? 0 : values[i]; }

        int[] colours() {
            int[] r = new int[size];
            int j = 0;
            for (int k : keys) if (k != -1) r[j++] = k;
            return r;
        }

        private void grow() {
            int[] ok = keys, ov = values;
            keys = new int[ok.length * 2];
            values = new int[ok.length * 2];
            Arrays.fill(keys, -1);
            for (int i = 0; i < ok.length; i++) if (ok[i] != -1) { int s = slot(ok[i]); keys[s] = ok[i]; values[s] = ov[i]; }
        }
    }

    private record Box(int from, int to, long population, int widestChannel, int range) {}

    private static int[] medianCut(int[] colours, int[] counts, int size) {
        int n = colours.length;
        int[] c = colours.clone(), k = counts.clone();
        List<Box> boxes = new ArrayList<>();
        boxes.add(box(c, k, 0, n));
        while (boxes.size() < size) {
            int pick = -1;
            long score = 0;
            for (int i = 0; i < boxes.size(); i++) {
                Box bx = boxes.get(i);
                if (bx.to() - bx.from() < 2) continue;
                long s = (long) bx.range() * bx.range() * (long) Math.sqrt(bx.population());
                if (s > score) { score = s; pick = i; }
            }
            if (pick < 0) break;
            Box bx = boxes.remove(pick);
            sortByChannel(c, k, bx.from(), bx.to(), bx.widestChannel());
            long half = bx.population() / 2, acc = 0;
            int cut = bx.from() + 1;
            for (int i = bx.from(); i < bx.to() - 1; i++) {
                acc += k[i];
                cut = i + 1;
                if (acc >= half) break;
            }
            boxes.add(box(c, k, bx.from(), cut));
            boxes.add(box(c, k, cut, bx.to()));
        }
        int[] palette = new int[boxes.size()];
        for (int i = 0; i < palette.length; i++) {
            Box bx = boxes.get(i);
            long sr = 0, sg = 0, sb = 0, pop = 0;
            for (int j = bx.from(); j < bx.to(); j++) {
                sr += (long) ((c[j] >> 16) & 0xFF) * k[j];
                sg += (long) ((c[j] >> 8) & 0xFF) * k[j];
                sb += (long) (c[j] & 0xFF) * k[j];
                pop += k[j];
            }
            palette[i] = (int) ((sr + pop / 2) / pop) << 16 | (int) ((sg + pop / 2) / pop) << 8 | (int) ((sb + pop / 2) / pop);
        }
        Arrays.sort(palette);
        return palette;
    }

    private static Box box(int[] c, int[] k, int from, int to) {
        int[] lo = {255, 255, 255}, hi = {0, 0, 0};
        long pop = 0;
        for (int i = from; i < to; i++) {
            for (int ch = 0; ch < 3; ch++) {
                int v = (c[i] >> (16 - 8 * ch)) & 0xFF;
                lo[ch] = Math.min(lo[ch], v);
                hi[ch] = Math.max(hi[ch], v);
            }
            pop += k[i];
        }
        int widest = 0;
        for (int ch = 1; ch < 3; ch++) if (hi[ch] - lo[ch] > hi[widest] - lo[widest]) widest = ch;
        return new Box(from, to, pop, widest, hi[widest] - lo[widest]);
    }

    /** Sorts c[from, to) (and k alongside) by one channel, then by the whole colour for a deterministic order. */
    private static void sortByChannel(int[] c, int[] k, int from, int to, int channel) {
        int shift = 16 - 8 * channel;
        long[] keyed = new long[to - from];
        for (int i = from; i < to; i++) keyed[i - from] = ((long) ((c[i] >> shift) & 0xFF) << 56) | ((long) c[i] << 32) | (k[i] & 0xFFFFFFFFL);
        Arrays.sort(keyed);
        for (int i = from; i < to; i++) {
            long v = keyed[i - from];
            c[i] = (int) ((v >>> 32) & 0xFFFFFF);
            k[i] = (int) v;
        }
    }

    private static int nearest(int[] palette, int c) {
        int r = (c >> 16) & 0xFF, g = (c >> 8) & 0xFF, b = c & 0xFF, best = 0;
        long bestD = Long.MAX_VALUE;
        for (int i = 0; i < palette.length; i++) {
            int p = palette[i];
            long dr = r - ((p >> 16) & 0xFF), dg = g - ((p >> 8) & 0xFF), db = b - (p & 0xFF);
            long d = 3 * dr * dr + 4 * dg * dg + 2 * db * db;
            if (d < bestD) { bestD = d; best = i; }
        }
        return best;
    }
}
