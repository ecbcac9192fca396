package org.loopledger.kernel;

import com.google.gson.JsonObject;

import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;

/**
 * The iopub broadcasts (Jupyter messaging specification 5.3). Stream text is collected and sent in
 * batches: every {@value #FLUSH_MS} ms while a cell runs, when a batch reaches {@value #MAX_BATCH}
 * characters, and before any other output so the order of outputs is kept.
 */
final class Iopub implements AutoCloseable {
    static final long FLUSH_MS = 50;
    static final int MAX_BATCH = 64 * 1024;

    private final Channel channel;
    private final Replies replies;
    private final ScheduledExecutorService flusher = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "loopledger-stream-flush");
        t.setDaemon(true);
        return t;
    });
    private final StringBuilder pending = new StringBuilder();
    private String pendingName;
    private JsonObject pendingParent;

    Iopub(Channel channel, Replies replies) {
        this.channel = channel;
        this.replies = replies;
        flusher.scheduleWithFixedDelay(this::flush, FLUSH_MS, FLUSH_MS, TimeUnit.MILLISECONDS);
    }

    synchronized void publish(JsonObject parent, String type, JsonObject content) {
        flush();
        channel.send(replies.broadcast(parent, type, content));
    }

    void status(JsonObject parent, String state) {
        JsonObject c = new JsonObject();
        c.addProperty("execution_state", state);
        publish(parent, "status", c);
    }

    synchronized void stream(JsonObject parent, String name, String text) {
        if (pendingName != null && (!pendingName.equals(name) || pendingParent != parent)) flush();
        pendingName = name;
        pendingParent = parent;
        int at = 0;
        while (at < text.length()) {
            int take = Math.min(text.length() - at, MAX_BATCH - pending.length());
            pending.append(text, at, at + take);
            at += take;
            if (pending.length() >= MAX_BATCH) {
                flush();
                pendingName = name;
                pendingParent = parent;
            }
        }
    }

    synchronized void flush() {
        if (pendingName == null || pending.length() == 0) return;
        JsonObject c = new JsonObject();
        c.addProperty("name", pendingName);
        c.addProperty("text", pending.toString());
        pending.setLength(0);
        JsonObject parent = pendingParent;
        pendingName = null;
        pendingParent = null;
        channel.send(replies.broadcast(parent, "stream", c));
    }

    @Override
    public void close() {
        flusher.shutdownNow();
        flush();
    }
}
