package org.loopledger.display;

import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.List;
import java.util.Optional;
import java.util.regex.Pattern;

/**
 * The images a tuning record embeds: PNG, JPEG, GIF and SVG, as {@code data:} URIs, so that opening the
 * record fetches nothing. The type is recognised from the bytes (PNG, JPEG and GIF signatures; SVG as XML
 * text with an {@code <svg} element), never trusted from a file name or a declared MIME type alone. SVG is
 * only ever shown through {@code <img>}, where browsers run no script and load nothing external.
 */
public final class ImageData {
    /** The MIME types that may be embedded, in order of preference. */
    public static final List<String> EMBEDDABLE = List.of("image/png", "image/jpeg", "image/gif", "image/svg+xml");

    private static final Pattern DATA_URI = Pattern.compile("data:(image/(?:png|jpeg|gif|svg\\+xml));base64,([A-Za-z0-9+/]*={0,2})", Pattern.CASE_INSENSITIVE);
    private static final byte[] PNG = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};

    private ImageData() {}

    /** The image type of {@code bytes} (one of {@link #EMBEDDABLE}), or empty when they are none of them. */
    public static Optional<String> sniff(byte[] bytes) {
        if (startsWith(bytes, PNG)) return Optional.of("image/png");
        if (bytes.length >= 3 && (bytes[0] & 0xff) == 0xff && (bytes[1] & 0xff) == 0xd8 && (bytes[2] & 0xff) == 0xff) return Optional.of("image/jpeg");
        if (startsWith(bytes, "GIF87a".getBytes(StandardCharsets.US_ASCII)) || startsWith(bytes, "GIF89a".getBytes(StandardCharsets.US_ASCII))) {
            return Optional.of("image/gif");
        }
        String head = new String(bytes, 0, Math.min(bytes.length, 4096), StandardCharsets.UTF_8).replace("\uFEFF", "").stripLeading();
        if (head.startsWith("<") && head.contains("<svg")) return Optional.of("image/svg+xml");
        return Optional.empty();
    }

    /** Base64 text (whitespace ignored) decoded, or empty when it is not base64. */
    public static Optional<byte[]> base64(String text) {
        try {
            return Optional.of(Base64.getDecoder().decode(text.replaceAll("\\s", "")));
        } catch (IllegalArgumentException e) {
            return Optional.empty();
        }
    }

    /** A data URI of the bytes, if they are an embeddable image; the type comes from the bytes. */
    public static Optional<String> dataUri(byte[] bytes) {
        return sniff(bytes).map(mime -> "data:" + mime + ";base64," + Base64.getEncoder().encodeToString(bytes));
    }

    /**
     * An image stored under {@code mime} in a MIME bundle (an output or a cell attachment), as a data URI:
     * base64 for PNG, JPEG and GIF; SVG either as base64 (how Jupyter stores attachments) or as its XML
     * text (how outputs store it). Empty when the type is not embeddable or the data are not that type.
     */
    public static Optional<String> fromBundle(String mime, String value) {
        if (value == null || !EMBEDDABLE.contains(mime)) return Optional.empty();
        Optional<byte[]> decoded = base64(value);
        if (decoded.isPresent() && sniff(decoded.get()).filter(mime::equals).isPresent()) return dataUri(decoded.get());
        if (mime.equals("image/svg+xml")) {
            byte[] text = value.getBytes(StandardCharsets.UTF_8);
            if (sniff(text).filter(mime::equals).isPresent()) return dataUri(text);
        }
        return Optional.empty();
    }

    /** A {@code data:image/...;base64,} URI whose bytes really are the image type it names, normalised; else empty. */
    public static Optional<String> fromDataUri(String uri) {
        var m = DATA_URI.matcher(uri.replaceAll("\\s", ""));
        if (!m.matches()) return Optional.empty();
        return fromBundle(m.group(1).toLowerCase(java.util.Locale.ROOT), m.group(2));
    }

    /** Whether {@code uri} has the shape of an embeddable image data URI (no decoding). */
    static boolean looksLikeImageDataUri(String uri) {
        return DATA_URI.matcher(uri).matches();
    }

    private static boolean startsWith(byte[] b, byte[] prefix) {
        if (b.length < prefix.length) return false;
        for (int i = 0; i < prefix.length; i++) if (b[i] != prefix[i]) return false;
        return true;
    }
}
