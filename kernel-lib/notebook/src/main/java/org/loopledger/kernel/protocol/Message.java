package org.loopledger.kernel.protocol;

import com.google.gson.JsonObject;

import java.util.List;

/**
 * One Jupyter message (messaging specification 5.3): routing identities, header, parent header,
 * metadata, content and binary buffers. The JSON parts are deep-copied in and out.
 */
public final class Message {
    private final List<byte[]> identities;
    private final JsonObject header;
    private final JsonObject parentHeader;
    private final JsonObject metadata;
    private final JsonObject content;
    private final List<byte[]> buffers;

    public Message(List<byte[]> identities, JsonObject header, JsonObject parentHeader, JsonObject metadata, JsonObject content, List<byte[]> buffers) {
        this.identities = identities.stream().map(byte[]::clone).toList();
        this.header = header.deepCopy();
        this.parentHeader = parentHeader.deepCopy();
        this.metadata = metadata.deepCopy();
        this.content = content.deepCopy();
        this.buffers = buffers.stream().map(byte[]::clone).toList();
    }

    public List<byte[]> identities() {
        return identities.stream().map(byte[]::clone).toList();
    }

    public JsonObject header() {
        return header.deepCopy();
    }

    public JsonObject parentHeader() {
        return parentHeader.deepCopy();
    }

    public JsonObject metadata() {
        return metadata.deepCopy();
    }

    public JsonObject content() {
        return content.deepCopy();
    }

    public List<byte[]> buffers() {
        return buffers.stream().map(byte[]::clone).toList();
    }

    /** {@code header.msg_type}, or "" when absent or not a string. Never throws. */
    public String type() {
        return stringOr(header, "msg_type", "");
    }

    /** Never throws, whatever the header holds. */
    @Override
    public String toString() {
        return "Message[" + type() + " " + stringOr(header, "msg_id", "?") + "]";
    }

    /** {@code o.key} when it is a JSON string, else {@code fallback}. Never throws. */
    public static String stringOr(JsonObject o, String key, String fallback) {
        com.google.gson.JsonElement e = o == null ? null : o.get(key);
        return WireCodec.isString(e) ? e.getAsString() : fallback;
    }
}
