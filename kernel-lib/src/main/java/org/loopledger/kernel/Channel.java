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
    private final String name;
    private final ZMQ.Socket socket;
    private final WireCodec codec;

    Channel(String name, ZMQ.Socket socket, WireCodec codec) {
        this.name = name;
        this.socket = socket;
        this.codec = codec;
    }

    /** The next valid message, or empty after the receive timeout or when a message was dropped. */
    Optional<Message> receive() {
        byte[] first = socket.recv(0);
        if (first == null) return Optional.empty();
        List<byte[]> frames = new ArrayList<>();
        frames.add(first);
        while (socket.hasReceiveMore()) {
            byte[] f = socket.recv(0);
            if (f == null) break;
            frames.add(f);
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
