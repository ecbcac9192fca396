package org.loopledger.kernel.session.agent;

import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;

/**
 * The input connection between the agent JVM and its launcher (a third loopback connection beside the
 * JShell command stream and the stop channel). The agent writes a request: an int sequence number. The
 * launcher answers each request with: the sequence number (int), a status byte ({@code 0} a line,
 * {@code 1} a failure), and the UTF-8 bytes of the line or the failure message (int length, bytes).
 *
 * <p>Why not JShell's own remote input: it costs one round trip per byte, and its agent side can ask for a
 * second byte that nobody typed (its pipe re-asks when a tag byte arrives before its data byte), which here
 * would send a second {@code input_request}.
 */
final class StdinProtocol {
    record Answer(int sequence, String line, String failure) {}

    private StdinProtocol() {}

    static Answer readAnswer(DataInputStream in) throws IOException {
        int sequence = in.readInt();
        int status = in.readUnsignedByte();
        byte[] text = new byte[in.readInt()];
        in.readFully(text);
        String s = new String(text, StandardCharsets.UTF_8);
        return status == 0 ? new Answer(sequence, s, null) : new Answer(sequence, null, s);
    }

    static void writeAnswer(DataOutputStream out, int sequence, String line, String failure) throws IOException {
        byte[] text = (line != null ? line : failure).getBytes(StandardCharsets.UTF_8);
        out.writeInt(sequence);
        out.writeByte(line != null ? 0 : 1);
        out.writeInt(text.length);
        out.write(text);
        out.flush();
    }
}
