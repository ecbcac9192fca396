package org.loopledger.kernel;

import org.loopledger.kernel.protocol.Message;
import org.loopledger.kernel.protocol.WireCodec;
import org.zeromq.ZMQ;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * One ZeroMQ socket of the kernel with the wire codec: receives decoded messages (dropping and logging
 * malformed or badly signed ones) and sends messages. Sends are synchronized, so several threads may
 * share a socket (the iopub socket is fed by the shell, control and output threads).
 */
final class Channel {
    /**
     * The largest message the kernel reads, in bytes: the sum of all frames, and through ZeroMQ's
     * {@code ZMQ_MAXMSGSIZE} each single frame, checked before anything is kept or verified. A cell's source
     * is far smaller; 64 MiB leaves room for the decoding copies in a default heap (a 1.5 GB unsigned frame
     * once drove the kernel to 6.7 GB).
     */
    static final int MAX_MESSAGE_BYTES = 64 << 20;
    private final String name;
    private final ZMQ.Socket socket;
    private final WireCodec codec;

    Channel(String name, ZMQ.Socket socket, WireCodec codec) {
        this.name = name;
        this.socket = socket;
        this.codec = codec;
    }

    String name() {
        return name;
    }

    /**
     * The next valid message, or empty after the receive timeout or when a message was dropped. A message
     * whose frames add up to more than {@link #MAX_MESSAGE_BYTES} is read to its end and dropped unverified.
     */
    Optional<Message> receive() {
        return receive(0);
    }

    /** {@link #receive()} without waiting: empty at once when no message is queued. */
    Optional<Message> receiveQueued() {
        return receive(ZMQ.DONTWAIT);
    }

    private Optional<Message> receive(int firstFlags) {
        byte[] first = socket.recv(firstFlags);
        if (first == null) return Optional.empty();
        List<byte[]> frames = new ArrayList<>();
        frames.add(first);
        long total = first.length;
        while (socket.hasReceiveMore()) {
            byte[] f = socket.recv(0);
            if (f == null) break;
            total += f.length;
            if (total > MAX_MESSAGE_BYTES) {
                frames.clear();
            } else {
                frames.add(f);
            }
        }
        if (total > MAX_MESSAGE_BYTES) {
            KernelLog.warn("dropped a message on " + name + ": " + total + " bytes, more than the limit of " + MAX_MESSAGE_BYTES);
            return Optional.empty();
        }
        WireCodec.Decoded d = codec.decode(frames);
        if (d.rejection().isPresent()) {
            KernelLog.warn("dropped a message on " + name + ": " + d.rejection().get().reason());
            return Optional.empty();
        }
        return d.message();
    }

    synchronized void send(Message m) {
        List<byte[]> frames = codec.encode(m);
        for (int i = 0; i < frames.size(); i++) {
            socket.send(frames.get(i), i < frames.size() - 1 ? ZMQ.SNDMORE : 0);
        }
    }
}
