package org.loopledger.kernel.protocol;

import com.google.gson.JsonObject;

import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.UUID;

/** Builds message headers as the Jupyter messaging specification 5.3 defines them. */
public final class Headers {
    public static final String PROTOCOL_VERSION = "5.3";

    private Headers() {}

    public static JsonObject create(String msgType, String session, String username) {
        JsonObject h = new JsonObject();
        h.addProperty("msg_id", UUID.randomUUID().toString());
        h.addProperty("session", session);
        h.addProperty("username", username);
        h.addProperty("date", Instant.now().truncatedTo(ChronoUnit.MICROS).toString());
        h.addProperty("msg_type", msgType);
        h.addProperty("version", PROTOCOL_VERSION);
        return h;
    }
}
