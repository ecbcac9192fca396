package org.loopledger.kernel;

import com.google.gson.JsonObject;
import org.loopledger.kernel.protocol.Message;
import org.loopledger.kernel.session.StandardInput;

import java.io.IOException;
import java.util.List;
import java.util.Optional;

/**
 * Standard input for cells, as in the Jupyter messaging specification 5.3, section "Messages on the stdin
 * ROUTER/DEALER channel": the kernel sends {@code input_request} (content {@code prompt}, {@code password})
 * on the stdin ROUTER socket to the front-end that sent the {@code execute_request} (same routing
 * identities, the execute request as parent header) and waits for its {@code input_reply}, whose
 * {@code value} is the line typed. Sent only when the request said {@code allow_stdin: true}.
 *
 * <p>One cell runs at a time, so one read at a time uses the socket; the thread waiting here is the
 * session's input thread, never a socket thread of the kernel.
 */
final class StdinChannel {
    private final Channel channel;
    private final Replies replies;

    StdinChannel(Channel channel, Replies replies) {
        this.channel = channel;
        this.replies = replies;
    }

    /** The input of one execute request: each read sends an {@code input_request} to its front-end. */
    StandardInput forRequest(Message executeRequest) {
        return cancelled -> {
            synchronized (this) {
                return ask(executeRequest, cancelled);
            }
        };
    }

    private String ask(Message executeRequest, java.util.function.BooleanSupplier cancelled) throws IOException {
        try {
            // an input_reply left over from an earlier, interrupted read must not answer this one
            while (channel.receiveQueued().isPresent()) {
                KernelLog.debug("dropped a stale message on stdin");
            }
            JsonObject content = new JsonObject();
            content.addProperty("prompt", "");
            content.addProperty("password", false);
            Message request = new Message(executeRequest.identities(), replies.header("input_request", executeRequest),
                    executeRequest.header(), new JsonObject(), content, List.of());
            channel.send(request);
            while (!cancelled.getAsBoolean()) {
                Optional<Message> next = channel.receive();
                if (next.isEmpty()) continue;
                Message m = next.get();
                if (!"input_reply".equals(m.type())) {
                    KernelLog.warn("ignored a " + m.type() + " on stdin while waiting for input_reply");
                    continue;
                }
                JsonObject c = m.content();
                if (!c.has("value") || !c.get("value").isJsonPrimitive()) throw new IOException("the front-end's input_reply has no value");
                return c.get("value").getAsString();
            }
            throw new IOException("the cell was interrupted while waiting for standard input");
        } catch (RuntimeException e) {
            // the kernel is shutting down (socket or context closed)
            throw new IOException("standard input closed: " + e, e);
        }
    }
}
