package org.loopledger.display;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;

/**
 * Where {@link Displays#display} sends MIME bundles while a notebook cell runs.
 *
 * <p>Frame format: 4-byte big-endian length, then that many bytes of UTF-8 MIME bundle JSON. The kernel
 * installs the stream (a dedicated channel beside stdout and stderr, so printed text can never be taken
 * for a display); outside a kernel nothing is installed and {@code display} prints plain text instead.
 */
public final class DisplayChannel {
    private static volatile OutputStream sink;

    private DisplayChannel() {}

    /** Installs the frame sink; called once by the kernel's agent at start-up. */
    public static void install(OutputStream out) {
        sink = out;
    }

    static boolean installed() {
        return sink != null;
    }

    /** One bundle as a frame: its JSON in UTF-8 after a 4-byte big-endian length. */
    public static byte[] frame(MimeBundle bundle) {
        byte[] json = bundle.toJson().getBytes(StandardCharsets.UTF_8);
        byte[] frame = new byte[4 + json.length];
        frame[0] = (byte) (json.length >>> 24);
        frame[1] = (byte) (json.length >>> 16);
        frame[2] = (byte) (json.length >>> 8);
        frame[3] = (byte) json.length;
        System.arraycopy(json, 0, frame, 4, json.length);
        return frame;
    }

    /** Sends one bundle as one frame; returns false when no channel is installed. */
    static synchronized boolean send(MimeBundle bundle) {
        OutputStream out = sink;
        if (out == null) return false;
        byte[] frame = frame(bundle);
        try {
            System.out.flush();
            System.err.flush();
            out.write(frame);
            out.flush();
            return true;
        } catch (IOException e) {
            return false;
        }
    }
}
