package org.loopledger.kernel.session;

import org.loopledger.display.MimeBundle;

import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.function.Consumer;

/**
 * Reassembles the display channel's length-prefixed frames (see {@link org.loopledger.display.DisplayChannel})
 * from bytes that may arrive split anywhere.
 */
final class DisplayFrameSink extends OutputStream {
    private final Consumer<MimeBundle> target;
    /** Bytes received and not yet consumed: {@code buffer[start, end)}. Grows by doubling; linear in the total. */
    private byte[] buffer = new byte[8192];
    private int start;
    private int end;

    DisplayFrameSink(Consumer<MimeBundle> target) {
        this.target = target;
    }

    @Override
    public void write(int b) {
        write(new byte[] {(byte) b}, 0, 1);
    }

    @Override
    public synchronized void write(byte[] b, int off, int len) {
        ensureRoom(len);
        System.arraycopy(b, off, buffer, end, len);
        end += len;
        while (end - start >= 4) {
            int n = ((buffer[start] & 0xff) << 24) | ((buffer[start + 1] & 0xff) << 16) | ((buffer[start + 2] & 0xff) << 8) | (buffer[start + 3] & 0xff);
            if (n < 0) throw new IllegalStateException("corrupt display frame length " + n);
            if (end - start - 4 < n) break;
            String json = new String(buffer, start + 4, n, StandardCharsets.UTF_8);
            start += 4 + n;
            MimeBundle bundle;
            try {
                bundle = MimeBundle.fromJson(json);
            } catch (RuntimeException e) {
                bundle = MimeBundle.ofText("(unreadable display output: " + e.getMessage() + ")");
            }
            target.accept(bundle);
        }
        if (start == end) {
            start = 0;
            end = 0;
        }
    }

    private void ensureRoom(int len) {
        if (buffer.length - end >= len) return;
        int used = end - start;
        byte[] into = buffer;
        if (used + len > buffer.length / 2) {
            into = new byte[(int) Math.min(Integer.MAX_VALUE - 8, Math.max(2L * buffer.length, (long) used + len))];
        }
        System.arraycopy(buffer, start, into, 0, used);
        buffer = into;
        start = 0;
        end = used;
    }
}
