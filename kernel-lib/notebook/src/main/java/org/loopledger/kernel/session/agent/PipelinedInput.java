package org.loopledger.kernel.session.agent;

import java.io.IOException;
import java.io.ObjectInput;
import java.io.ObjectInputStream;

/**
 * The launcher's view of the agent's replies, with room for commands sent without waiting
 * ({@link LauncherControl#sendWithoutWaiting}): the replies of those commands come first on the stream and are
 * read and dropped before any other read, so JShell's own commands read their own replies.
 *
 * <p>An {@code ObjectInputStream} only because {@code StreamingExecutionControl} insists on one: every read is
 * delegated (the subclass constructor leaves the stream's own state unused, {@link #readObjectOverride}).
 */
final class PipelinedInput extends ObjectInputStream {
    private final ObjectInput in;
    private int unreadReplies;

    private PipelinedInput(ObjectInput in) throws IOException {
        super();
        this.in = in;
    }

    static PipelinedInput over(ObjectInput in) {
        try {
            return new PipelinedInput(in);
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e); // not thrown by ObjectInputStream's subclass constructor
        }
    }

    /** One more reply to drop (an extension command's: a status, then an object on success or a message). */
    synchronized void expectReply() {
        unreadReplies++;
    }

    private synchronized void drain() throws IOException {
        while (unreadReplies > 0) {
            unreadReplies--;
            int status = in.readInt();
            try {
                if (status == LauncherControl.RESULT_SUCCESS) in.readObject();
                else in.readUTF();
            } catch (ClassNotFoundException e) {
                throw new IOException("unreadable reply of the agent: " + e, e);
            }
        }
    }

    @Override protected Object readObjectOverride() throws ClassNotFoundException, IOException { drain(); return in.readObject(); }
    @Override public Object readUnshared() throws ClassNotFoundException, IOException { drain(); return in.readObject(); }
    @Override public int read() throws IOException { drain(); return in.read(); }
    @Override public int read(byte[] b) throws IOException { drain(); return in.read(b); }
    @Override public int read(byte[] b, int off, int len) throws IOException { drain(); return in.read(b, off, len); }
    @Override public long skip(long n) throws IOException { drain(); return in.skip(n); }
    @Override public int available() throws IOException { return in.available(); }
    @Override public void close() throws IOException { in.close(); }
    @Override public void readFully(byte[] b) throws IOException { drain(); in.readFully(b); }
    @Override public void readFully(byte[] b, int off, int len) throws IOException { drain(); in.readFully(b, off, len); }
    @Override public int skipBytes(int n) throws IOException { drain(); return in.skipBytes(n); }
    @Override public boolean readBoolean() throws IOException { drain(); return in.readBoolean(); }
    @Override public byte readByte() throws IOException { drain(); return in.readByte(); }
    @Override public int readUnsignedByte() throws IOException { drain(); return in.readUnsignedByte(); }
    @Override public short readShort() throws IOException { drain(); return in.readShort(); }
    @Override public int readUnsignedShort() throws IOException { drain(); return in.readUnsignedShort(); }
    @Override public char readChar() throws IOException { drain(); return in.readChar(); }
    @Override public int readInt() throws IOException { drain(); return in.readInt(); }
    @Override public long readLong() throws IOException { drain(); return in.readLong(); }
    @Override public float readFloat() throws IOException { drain(); return in.readFloat(); }
    @Override public double readDouble() throws IOException { drain(); return in.readDouble(); }
    @SuppressWarnings("deprecation")
    @Override public String readLine() throws IOException { drain(); return in.readLine(); }
    @Override public String readUTF() throws IOException { drain(); return in.readUTF(); }
}
