package org.loopledger.kernel.protocol;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

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
}
