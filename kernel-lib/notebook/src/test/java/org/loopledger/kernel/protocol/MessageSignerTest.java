package org.loopledger.kernel.protocol;

import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** HMAC-SHA256 as the Jupyter messaging specification 5.3 requires it. */
class MessageSignerTest {
    private static byte[] b(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    /** RFC 4231, section 4.3, test case 2: key "Jefe", data "what do ya want for nothing?". */
    @Test
    void rfc4231TestCase2() {
        MessageSigner s = MessageSigner.forKey("Jefe");
        String expected = "5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843";
        assertEquals(expected, s.sign(List.of(b("what do ya "), b("want for nothing?"))), "frames are hashed in sequence");
        assertTrue(s.verify(b(expected), List.of(b("what do ya want for nothing?"))));
        assertFalse(s.verify(b(expected.replace('5', '6')), List.of(b("what do ya want for nothing?"))));
        assertFalse(s.verify(b(""), List.of(b("what do ya want for nothing?"))));
        assertFalse(s.verify(b(expected.toUpperCase()), List.of(b("what do ya want for nothing?"))), "the spec's signature is lower-case hex");
    }

    @Test
    void emptyKeyDisablesSigning() {
        MessageSigner s = MessageSigner.forKey("");
        assertFalse(s.enabled());
        assertEquals("", s.sign(List.of(b("x"))));
        assertTrue(s.verify(b(""), List.of(b("x"))));
    }
}
