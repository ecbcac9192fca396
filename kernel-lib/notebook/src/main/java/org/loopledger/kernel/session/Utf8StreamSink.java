package org.loopledger.kernel.session;

import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.function.Consumer;

/** Decodes UTF-8 bytes that may be split anywhere into text pieces, keeping partial characters for the next write. */
final class Utf8StreamSink extends OutputStream {
    private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
            .onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE);
    private final Consumer<String> target;
    private ByteBuffer carry = ByteBuffer.allocate(0);

    Utf8StreamSink(Consumer<String> target) {
        this.target = target;
    }

    @Override
    public void write(int b) {
        write(new byte[] {(byte) b}, 0, 1);
    }

    @Override
    public synchronized void write(byte[] b, int off, int len) {
        if (len == 0) return;
        ByteBuffer in = ByteBuffer.allocate(carry.remaining() + len);
        in.put(carry).put(b, off, len).flip();
        CharBuffer out = CharBuffer.allocate(in.remaining() + 1);
        decoder.decode(in, out, false);
        carry = in.slice();
        out.flip();
        if (out.hasRemaining()) target.accept(out.toString());
    }
}
