package org.loopledger.kernel.protocol;

import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;
import java.nio.charset.StandardCharsets;
import java.security.GeneralSecurityException;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;

/**
 * HMAC-SHA256 signatures of Jupyter messages (messaging specification 5.3, "The Wire Protocol"): the
 * hex digest over the header, parent header, metadata and content frames, in that order. An empty key
 * disables signing (the signature frame is then empty), as the specification allows.
 *
 * <p>Verification compares in constant time ({@link MessageDigest#isEqual}). Thread-safe: a fresh
 * {@link Mac} per call.
 */
public final class MessageSigner {
    private static final HexFormat HEX = HexFormat.of();
    private final SecretKeySpec key;

    public MessageSigner(byte[] key) {
        this.key = key.length == 0 ? null : new SecretKeySpec(key.clone(), "HmacSHA256");
    }

    public static MessageSigner forKey(String key) {
        return new MessageSigner(key.getBytes(StandardCharsets.UTF_8));
    }

    public boolean enabled() {
        return key != null;
    }

    /** The lower-case hex HMAC of the frames; empty when signing is disabled. */
    public String sign(List<byte[]> frames) {
        if (key == null) return "";
        return HEX.formatHex(mac(frames));
    }

    /** True when {@code signature} is the HMAC of the frames (always true when signing is disabled). */
    public boolean verify(byte[] signature, List<byte[]> frames) {
        if (key == null) return true;
        byte[] expected = HEX.formatHex(mac(frames)).getBytes(StandardCharsets.US_ASCII);
        return MessageDigest.isEqual(expected, signature);
    }

    private byte[] mac(List<byte[]> frames) {
        try {
            Mac mac = Mac.getInstance("HmacSHA256");
            mac.init(key);
            for (byte[] f : frames) mac.update(f);
            return mac.doFinal();
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("HmacSHA256 is not available in this JVM", e);
        }
    }
}
