package org.loopledger.kernel.protocol;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/** Framing of the wire protocol (Jupyter messaging specification 5.3, "The Wire Protocol"). */
class WireCodecTest {
    private final WireCodec codec = new WireCodec(MessageSigner.forKey("secret"));

    private Message sample() {
        JsonObject content = new JsonObject();
        content.addProperty("code", "1+1");
        return new Message(List.of(b("client-id")), Headers.create("execute_request", "s1", "u"), new JsonObject(), new JsonObject(), content, List.of(b("buf")));
    }

    private static byte[] b(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    @Test
    void framesAreIdentitiesDelimiterSignatureFourPartsBuffers() {
        List<byte[]> f = codec.encode(sample());
        assertEquals(8, f.size());
        assertEquals("client-id", new String(f.get(0), StandardCharsets.UTF_8));
        assertEquals("<IDS|MSG>", new String(f.get(1), StandardCharsets.UTF_8));
        assertEquals(64, f.get(2).length, "hex HMAC-SHA256");
        assertEquals("buf", new String(f.get(7), StandardCharsets.UTF_8));
    }

    @Test
    void roundTrip() {
        Message back = codec.decode(codec.encode(sample())).message().orElseThrow();
        assertEquals("execute_request", back.type());
        assertEquals("1+1", back.content().get("code").getAsString());
        assertEquals("client-id", new String(back.identities().get(0), StandardCharsets.UTF_8));
        assertEquals(1, back.buffers().size());
    }

    @Test
    void tamperedUnsignedAndMalformedAreRejectedWithoutThrowing() {
        List<byte[]> f = new ArrayList<>(codec.encode(sample()));
        f.set(6, b("{\"code\":\"System.exit(0)\"}"));
        assertTrue(codec.decode(f).rejection().orElseThrow().reason().contains("signature"));
        assertTrue(new WireCodec(MessageSigner.forKey("other")).decode(codec.encode(sample())).message().isEmpty());
        assertTrue(codec.decode(List.of(b("garbage"))).rejection().isPresent());
        assertTrue(codec.decode(List.of(WireCodec.DELIMITER, b("x"))).rejection().isPresent());
        WireCodec unsigned = new WireCodec(MessageSigner.forKey(""));
        List<byte[]> bad = List.of(WireCodec.DELIMITER, b(""), b("{not json"), b("{}"), b("{}"), b("{}"));
        assertTrue(unsigned.decode(bad).rejection().isPresent());
        assertFalse(codec.decode(List.of(WireCodec.DELIMITER, b("x"), b("{}"), b("{}"), b("{}"), b("{}"))).rejection().orElseThrow().reason().contains("secret"));
    }

    /** A signed message whose four JSON parts are the given texts (as a client holding the key would send). */
    private List<byte[]> signed(String header, String parent, String metadata, String content) {
        List<byte[]> parts = List.of(b(header), b(parent), b(metadata), b(content));
        List<byte[]> f = new ArrayList<>(List.of(b("id"), WireCodec.DELIMITER, b(MessageSigner.forKey("secret").sign(parts))));
        f.addAll(parts);
        return f;
    }

    @Test
    void aSignedMessageWithANullOrObjectTypeIsRejectedNotThrown() {
        // found by a fuzz run: msg_type null or an object once killed the shell thread (issue 12)
        for (String type : List.of("null", "{}", "[]", "3", "true")) {
            WireCodec.Decoded d = codec.decode(signed("{\"msg_id\":\"m\",\"msg_type\":" + type + "}", "{}", "{}", "{}"));
            assertTrue(d.rejection().orElseThrow().reason().contains("msg_type"), type);
        }
    }

    @Test
    void typeAndToStringNeverThrow() {
        JsonObject h = new JsonObject();
        h.add("msg_type", new JsonObject());
        h.add("msg_id", com.google.gson.JsonNull.INSTANCE);
        Message m = new Message(List.of(), h, new JsonObject(), new JsonObject(), new JsonObject(), List.of());
        assertEquals("", m.type());
        assertEquals("Message[ ?]", m.toString());
    }

    @Test
    void aReplayedSignatureIsRejected() {
        // jupyter_client's Session rejects a signature it has seen ("Duplicate Signature"); so do we
        List<byte[]> frames = codec.encode(sample());
        assertTrue(codec.decode(frames).message().isPresent());
        assertTrue(codec.decode(frames).rejection().orElseThrow().reason().contains("duplicate"));
        assertTrue(codec.decode(codec.encode(sample())).message().isPresent(), "a fresh message (new msg_id) is accepted");
        // an unsigned kernel has no signatures to remember (jupyter_client checks digests only with a key)
        WireCodec unsigned = new WireCodec(MessageSigner.forKey(""));
        List<byte[]> plain = unsigned.encode(sample());
        assertTrue(unsigned.decode(plain).message().isPresent());
        assertTrue(unsigned.decode(plain).message().isPresent());
    }

    @Test
    void theDigestHistoryIsBounded() {
        List<byte[]> first = codec.encode(sample());
        codec.decode(first);
        for (int i = 0; i < WireCodec.DIGEST_HISTORY; i++) codec.decode(codec.encode(sample()));
        assertTrue(codec.decode(first).message().isPresent(), "the oldest signature has been forgotten");
    }

    @Test
    void seededMutationsNeverThrow() {
        Random rnd = new Random(20261202L);
        String[] values = {"null", "{}", "[]", "0", "-1", "1e999", "\"\"", "\"execute_request\"", "true", "[[[[[[[[]]]]]]]]", "{\"a\":{\"b\":[1,2,{}]}}"};
        String[] keys = {"msg_type", "msg_id", "username", "session", "code", "silent", "cursor_pos", "restart"};
        for (int i = 0; i < 5000; i++) {
            String[] parts = {"{\"msg_id\":\"m" + i + "\",\"msg_type\":\"execute_request\",\"username\":\"u\",\"session\":\"s\"}", "{}", "{}", "{\"code\":\"1+1\",\"silent\":false}"};
            int which = rnd.nextInt(4);
            switch (rnd.nextInt(5)) {
                case 0 -> parts[which] = "{\"" + keys[rnd.nextInt(keys.length)] + "\":" + values[rnd.nextInt(values.length)] + "}";
                case 1 -> parts[which] = values[rnd.nextInt(values.length)];
                case 2 -> parts[which] = parts[which].substring(0, rnd.nextInt(parts[which].length() + 1));
                case 3 -> parts[which] = "[".repeat(rnd.nextInt(100_000)); // deep nesting
                default -> parts[which] = new String(randomBytes(rnd), StandardCharsets.ISO_8859_1);
            }
            List<byte[]> f = new ArrayList<>(signed(parts[0], parts[1], parts[2], parts[3]));
            if (rnd.nextInt(4) == 0) f = f.subList(0, rnd.nextInt(f.size() + 1));
            List<byte[]> frames = f;
            assertDoesNotThrow(() -> codec.decode(frames), () -> "mutation " + String.join(" | ", parts));
        }
    }

    private static byte[] randomBytes(Random rnd) {
        byte[] r = new byte[rnd.nextInt(40)];
        rnd.nextBytes(r);
        return r;
    }
}
