package org.loopledger.kernel.protocol;

import com.google.gson.Gson;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;

/**
 * Encodes and decodes the multipart frames of the wire protocol (Jupyter messaging specification 5.3):
 * {@code [identities..., "<IDS|MSG>", signature, header, parent_header, metadata, content, buffers...]}.
 * Decoding never throws: a malformed, badly signed or replayed message yields a {@link Rejection} naming why.
 *
 * <p>Replays: with signing on, the signature of every accepted message is remembered (the last
 * {@value #DIGEST_HISTORY} of them) and a message carrying a remembered signature is rejected as a
 * duplicate, as jupyter_client's {@code Session} does with its digest history (there 2<sup>16</sup> entries,
 * culled at random; here the oldest go first). Only verified signatures enter the history, so a sender
 * without the key cannot fill it. Thread-safe: the channels share one codec.
 */
public final class WireCodec {
    public static final byte[] DELIMITER = "<IDS|MSG>".getBytes(StandardCharsets.US_ASCII);
    /** How many signatures are remembered to reject replays (jupyter_client's {@code digest_history_size}). */
    public static final int DIGEST_HISTORY = 1 << 16;
    private static final Gson GSON = new Gson();
    private final MessageSigner signer;
    private final LinkedHashSet<String> seenSignatures = new LinkedHashSet<>();

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
        Decoded decoded;
        try {
            JsonObject header = parse(parts.get(0));
            if (header == null || !header.has("msg_type")) return Decoded.rejected("header lacks msg_type");
            if (!isString(header.get("msg_type"))) return Decoded.rejected("header.msg_type is not a string");
            JsonObject parent = orEmpty(parse(parts.get(1)));
            JsonObject metadata = orEmpty(parse(parts.get(2)));
            JsonObject content = orEmpty(parse(parts.get(3)));
            decoded = Decoded.ok(new Message(frames.subList(0, d), header, parent, metadata, content, frames.subList(d + 6, frames.size())));
        } catch (RuntimeException | StackOverflowError e) {
            // StackOverflowError: JSON nested deeper than the copies of Message can follow
            return Decoded.rejected("frames are not JSON objects: " + e.getClass().getSimpleName());
        }
        if (signer.enabled() && !remember(new String(frames.get(d + 1), StandardCharsets.US_ASCII))) {
            return Decoded.rejected("duplicate signature: a replayed message");
        }
        return decoded;
    }

    /** Adds a verified signature to the history; false when it was there already. */
    private synchronized boolean remember(String signature) {
        if (!seenSignatures.add(signature)) return false;
        if (seenSignatures.size() > DIGEST_HISTORY) {
            var oldest = seenSignatures.iterator();
            oldest.next();
            oldest.remove();
        }
        return true;
    }

    static boolean isString(JsonElement e) {
        return e != null && e.isJsonPrimitive() && e.getAsJsonPrimitive().isString();
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
