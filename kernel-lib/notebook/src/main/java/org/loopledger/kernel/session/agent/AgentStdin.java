package org.loopledger.kernel.session.agent;

import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;

/**
 * The agent JVM's {@code System.in}: when its buffer is empty, a read asks the launcher for one line over
 * the input connection ({@link StdinProtocol}) and blocks until the answer; bytes left over stay for the
 * next read. A read nobody can answer (no keyboard, interrupted) throws an {@link java.io.UncheckedIOException}
 * with the launcher's message, so it reaches the cell's traceback through readers that swallow
 * {@code IOException}s (as {@code Scanner} does). Answers are read by a daemon thread and matched by sequence number, so a cell stopped while
 * waiting (by {@code Thread.stop}) leaves no half-read answer behind for the next read.
 */
final class AgentStdin extends InputStream {
    private final DataOutputStream requests;
    /**
     * Answers not yet taken, guarded by their own monitor. A monitor, not a {@code java.util.concurrent} queue:
     * {@code Thread.stop} (how an interrupt ends a cell) unwinds a monitor cleanly but can leave a
     * {@code ReentrantLock} held by the stopped thread, after which every later read would hang.
     */
    private final ArrayDeque<StdinProtocol.Answer> answers = new ArrayDeque<>();
    private byte[] buffer = new byte[0];
    private int position;
    private int nextSequence;
    private volatile boolean closed;

    AgentStdin(Socket socket) throws IOException {
        this.requests = new DataOutputStream(socket.getOutputStream());
        DataInputStream in = new DataInputStream(new java.io.BufferedInputStream(socket.getInputStream()));
        Thread reader = new Thread(() -> {
            try {
                while (true) {
                    StdinProtocol.Answer a = StdinProtocol.readAnswer(in);
                    synchronized (answers) {
                        answers.add(a);
                        answers.notifyAll();
                    }
                }
            } catch (IOException e) {
                synchronized (answers) {
                    closed = true;
                    answers.notifyAll();
                }
            }
        }, "loopledger-stdin");
        reader.setDaemon(true);
        reader.start();
    }

    @Override
    public synchronized int read() throws IOException {
        if (!fill()) return -1;
        return buffer[position++] & 0xFF;
    }

    @Override
    public synchronized int read(byte[] b, int off, int len) throws IOException {
        java.util.Objects.checkFromIndexSize(off, len, b.length);
        if (len == 0) return 0;
        if (!fill()) return -1;
        int n = Math.min(len, buffer.length - position);
        System.arraycopy(buffer, position, b, off, n);
        position += n;
        return n;
    }

    @Override
    public synchronized int available() {
        return buffer.length - position;
    }

    /** True when bytes are buffered, asking the launcher for a line if none are; false at end of input. */
    private boolean fill() throws IOException {
        if (position < buffer.length) return true;
        int sequence = ++nextSequence;
        requests.writeInt(sequence);
        requests.flush();
        StdinProtocol.Answer a = null;
        synchronized (answers) {
            while (a == null) {
                StdinProtocol.Answer head = answers.poll();
                if (head == null) {
                    if (closed) return false;
                    try {
                        answers.wait();
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                        throw new java.io.InterruptedIOException("interrupted while waiting for standard input");
                    }
                } else if (head.sequence() == sequence) {
                    a = head;
                }
                // any other answer belongs to a read that was stopped: dropped
            }
        }
        // unchecked: java.util.Scanner swallows an IOException and reports only "No line found"
        if (a.failure() != null) throw new java.io.UncheckedIOException(a.failure(), new IOException(a.failure()));
        buffer = (a.line() + "\n").getBytes(StandardCharsets.UTF_8);
        position = 0;
        return true;
    }
}
