package org.loopledger.kernel;

import com.google.gson.JsonObject;
import org.loopledger.kernel.protocol.Headers;
import org.loopledger.kernel.protocol.Message;

import java.util.List;

/** Makes replies and broadcasts whose parent is a request (Jupyter messaging specification 5.3). */
final class Replies {
    private final String session;

    Replies(String session) {
        this.session = session;
    }

    /** A reply to {@code request}, routed back to its sender. */
    Message reply(Message request, String type, JsonObject content) {
        return new Message(request.identities(), header(type, request), request.header(), new JsonObject(), content, List.of());
    }

    /** An iopub broadcast; the topic identity is the message type. */
    Message broadcast(JsonObject parentHeader, String type, JsonObject content) {
        JsonObject h = Headers.create(type, session, username(parentHeader));
        return new Message(List.of(("kernel." + session + "." + type).getBytes(java.nio.charset.StandardCharsets.UTF_8)),
                h, parentHeader, new JsonObject(), content, List.of());
    }

    /** A new header of {@code type} for a message sent in answer to {@code request} (same user). */
    JsonObject header(String type, Message request) {
        return Headers.create(type, session, username(request.header()));
    }

    private static String username(JsonObject parent) {
        return Message.stringOr(parent, "username", "loopledger");
    }
}
