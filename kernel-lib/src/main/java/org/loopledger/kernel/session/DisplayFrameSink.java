package org.loopledger.kernel.session;

import org.loopledger.display.MimeBundle;

import java.io.ByteArrayOutputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.function.Consumer;

/**
 * Reassembles the display channel's length-prefixed frames (see {@link org.loopledger.display.DisplayChannel})
 * from bytes that may arrive split anywhere.
 */
final class DisplayFrameSink extends OutputStream {
    private final Consumer<MimeBundle> target;
    private final ByteArrayOutputStream pending = new ByteArrayOutputStream();

    DisplayFrameSink(Consumer<MimeBundle> target) {
        this.target = target;
    }

    @Override
    public void write(int b) {
        write(new byte[] {(byte) b}, 0, 1);
    }

    @Override
    public synchronized void write(byte[] b, int off, int len) {
        pending.write(b, off, len);
        byte[] all = pending.toByteArray();
        int pos = 0;
        while (all.length - pos >= 4) {
            int n = ((all[pos] & 0xff) << 24) | ((all[pos + 1] & 0xff) << 16) | ((all[pos + 2] & 0xff) << 8) | (all[pos + 3] & 0xff);
            if (n < 0) throw new IllegalStateException("corrupt display frame length " + n);
            if (all.length - pos - 4 < n) break;
            String json = new String(all, pos + 4, n, StandardCharsets.UTF_8);
            pos += 4 + n;
            MimeBundle bundle;
            try {
                bundle = MimeBundle.fromJson(json);
            } catch (RuntimeException e) {
                bundle = MimeBundle.ofText("(unreadable display output: " + e.getMessage() + ")");
            }
            target.accept(bundle);
        }
        pending.reset();
        pending.write(all, pos, all.length - pos);
    }
}
