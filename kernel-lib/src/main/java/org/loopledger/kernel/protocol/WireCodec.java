package org.loopledger.kernel.protocol;

import com.google.gson.Gson;
import com.google.gson.JsonObject;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * Encodes and decodes the multipart frames of the wire protocol (Jupyter messaging specification 5.3):
 * {@code [identities..., "<IDS|MSG>", signature, header, parent_header, metadata, content, buffers...]}.
 * Decoding never throws: a malformed or badly signed message yields a {@link Rejection} naming why.
 */
public final class WireCodec {
    public static final byte[] DELIMITER = "<IDS|MSG>".getBytes(StandardCharsets.US_ASCII);
    private static final Gson GSON = new Gson();
    private final MessageSigner signer;

    public WireCodec(MessageSigner signer) {
        this.signer = signer;
    }

    /** Why a message was dropped; never contains the key. */
    public record Rejection(String reason) {}

    /** Either a message or the reason it was rejected. */
    public record Decoded(Optional<Message> message, Optional<Rejection> rejection) {
        static Decoded ok(Message m) {
            return new Decoded(Optional.of(m), Optional.empty());
        }

        static Decoded rejected(String why) {
            return new Decoded(Optional.empty(), Optional.of(new Rejection(why)));
        }
    }

    public List<byte[]> encode(Message m) {
        List<byte[]> parts = List.of(json(m.header()), json(m.parentHeader()), json(m.metadata()), json(m.content()));
        List<byte[]> frames = new ArrayList<>(m.identities());
        frames.add(DELIMITER);
        frames.add(signer.sign(parts).getBytes(StandardCharsets.US_ASCII));
        frames.addAll(parts);
        frames.addAll(m.buffers());
        return frames;
    }

    public Decoded decode(List<byte[]> frames) {
        int d = -1;
        for (int i = 0; i < frames.size(); i++) {
            if (Arrays.equals(frames.get(i), DELIMITER)) {
                d = i;
                break;
            }
        }
        if (d < 0) return Decoded.rejected("no <IDS|MSG> delimiter among " + frames.size() + " frames");
        if (frames.size() < d + 6) return Decoded.rejected("only " + (frames.size() - d - 1) + " frames after the delimiter; need signature, header, parent_header, metadata, content");
        List<byte[]> parts = frames.subList(d + 2, d + 6);
        if (!signer.verify(frames.get(d + 1), parts)) return Decoded.rejected("bad or missing HMAC-SHA256 signature");
        try {
            JsonObject header = parse(parts.get(0));
            if (header == null || !header.has("msg_type")) return Decoded.rejected("header lacks msg_type");
            JsonObject parent = orEmpty(parse(parts.get(1)));
            JsonObject metadata = orEmpty(parse(parts.get(2)));
            JsonObject content = orEmpty(parse(parts.get(3)));
            return Decoded.ok(new Message(frames.subList(0, d), header, parent, metadata, content, frames.subList(d + 6, frames.size())));
        } catch (RuntimeException e) {
            return Decoded.rejected("frames are not JSON objects: " + e.getClass().getSimpleName());
        }
    }

    private static JsonObject parse(byte[] b) {
        return GSON.fromJson(new String(b, StandardCharsets.UTF_8), JsonObject.class);
    }

    private static JsonObject orEmpty(JsonObject o) {
        return o == null ? new JsonObject() : o;
    }

    private static byte[] json(JsonObject o) {
        return GSON.toJson(o).getBytes(StandardCharsets.UTF_8);
    }
}
