package org.loopledger.kernel.session;

import org.junit.jupiter.api.Test;
import org.loopledger.display.MimeBundle;

import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Output handling is linear in the output's size (issue 12): JShell delivers a cell's output in packets of
 * at most 127 bytes (its {@code MultiplexingOutputStream}), so whatever copies the whole output so far per
 * packet is quadratic (8 MB of print took 47 s). Checked without clocks: the bytes this thread allocates
 * while 1 MiB arrives in 127-byte packets must stay within a small multiple of the output (a per-packet
 * copy allocates about 8,000 × 0.5 MiB = 4 GiB).
 */
class LinearOutputTest {
    static final int SIZE = 1 << 20;
    static final int PACKET = 127;
    /** Allowed allocation per output byte: builders double (≤ 2 + 1 copies, 2 bytes a char at worst), plus packets. */
    static final long BYTES_PER_BYTE = 24;

    static long allocated() {
        return ((com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean()).getCurrentThreadAllocatedBytes();
    }

    @Test
    void streamPiecesAreMergedInLinearSpace() {
        CellResult.Collector c = new CellResult.Collector(OutputListener.IGNORE);
        String piece = "x".repeat(PACKET - 1) + "\n";
        c.output(new CellOutput.Stream("stdout", piece)); // warm
        long before = allocated();
        for (int i = 1; i < SIZE / PACKET; i++) c.output(new CellOutput.Stream("stdout", piece));
        CellResult r = c.result();
        long used = allocated() - before;
        assertEquals(1, r.outputs().size());
        assertEquals((SIZE / PACKET) * PACKET, ((CellOutput.Stream) r.outputs().get(0)).text().length());
        assertTrue(used < BYTES_PER_BYTE * SIZE, "allocated " + used + " bytes for " + SIZE + " bytes of output");
    }

    @Test
    void streamsAndDisplaysKeepTheirOrder() {
        CellResult.Collector c = new CellResult.Collector(OutputListener.IGNORE);
        c.output(new CellOutput.Stream("stdout", "a"));
        c.output(new CellOutput.Stream("stdout", "b"));
        c.output(new CellOutput.Stream("stderr", "c"));
        c.output(new CellOutput.Display(MimeBundle.ofText("d")));
        c.output(new CellOutput.Stream("stdout", "e"));
        assertEquals(List.of(new CellOutput.Stream("stdout", "ab"), new CellOutput.Stream("stderr", "c"),
                new CellOutput.Display(MimeBundle.ofText("d")), new CellOutput.Stream("stdout", "e")), c.result().outputs());
    }

    @Test
    void aLargeDisplayFrameIsReassembledInLinearSpace() {
        List<MimeBundle> got = new ArrayList<>();
        DisplayFrameSink sink = new DisplayFrameSink(got::add);
        String text = "y".repeat(SIZE);
        byte[] frame = org.loopledger.display.DisplayChannel.frame(MimeBundle.ofText(text));
        long before = allocated();
        for (int at = 0; at < frame.length; at += PACKET) sink.write(frame, at, Math.min(PACKET, frame.length - at));
        long used = allocated() - before;
        assertEquals(List.of(MimeBundle.ofText(text)), got);
        assertTrue(used < BYTES_PER_BYTE * SIZE, "allocated " + used + " bytes for a frame of " + frame.length + " bytes");
    }

    @Test
    void framesSplitAnywhereComeOutWhole() {
        List<MimeBundle> got = new ArrayList<>();
        DisplayFrameSink sink = new DisplayFrameSink(got::add);
        ByteArrayBuilder all = new ByteArrayBuilder();
        for (int i = 0; i < 50; i++) all.frame(MimeBundle.ofText("bundle " + i + " " + "z".repeat(i * 37)).toJson());
        byte[] bytes = all.bytes();
        java.util.Random rnd = new java.util.Random(12);
        for (int at = 0; at < bytes.length; ) {
            int n = Math.min(bytes.length - at, rnd.nextInt(300));
            sink.write(bytes, at, n);
            at += n;
        }
        assertEquals(50, got.size());
        for (int i = 0; i < 50; i++) assertEquals(MimeBundle.ofText("bundle " + i + " " + "z".repeat(i * 37)), got.get(i));
    }

    private static final class ByteArrayBuilder {
        private final java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();

        void frame(String json) {
            byte[] j = json.getBytes(StandardCharsets.UTF_8);
            out.write(j.length >>> 24);
            out.write(j.length >>> 16);
            out.write(j.length >>> 8);
            out.write(j.length);
            out.writeBytes(j);
        }

        byte[] bytes() {
            return out.toByteArray();
        }
    }
}
