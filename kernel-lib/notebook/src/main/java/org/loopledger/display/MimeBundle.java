package org.loopledger.display;

import com.google.gson.Gson;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * An immutable MIME bundle: an ordered map from MIME type to its representation as a string
 * (binary types such as {@code image/png} are base64), as in the {@code data} field of Jupyter's
 * {@code display_data} and {@code execute_result} messages (messaging specification 5.3).
 *
 * <p>Every bundle has {@code text/plain}, so a terminal client always shows something useful.
 */
public final class MimeBundle {
    public static final String TEXT_PLAIN = "text/plain";
    public static final String TEXT_HTML = "text/html";
    public static final String TEXT_MARKDOWN = "text/markdown";
    public static final String TEXT_LATEX = "text/latex";
    public static final String IMAGE_SVG = "image/svg+xml";
    public static final String IMAGE_PNG = "image/png";

    private static final Gson GSON = new Gson();
    private final Map<String, String> data;

    private MimeBundle(Map<String, String> data) {
        this.data = Collections.unmodifiableMap(data);
    }

    /** A bundle with only plain text. */
    public static MimeBundle ofText(String text) {
        return builder(text).build();
    }

    /** Starts a bundle; {@code plainText} is its mandatory {@code text/plain} entry. */
    public static Builder builder(String plainText) {
        return new Builder(plainText);
    }

    /** The entries in insertion order (unmodifiable). */
    public Map<String, String> data() {
        return data;
    }

    public String plainText() {
        return data.get(TEXT_PLAIN);
    }

    public Optional<String> get(String mime) {
        return Optional.ofNullable(data.get(mime));
    }

    /** The bundle as a JSON object {@code {mime: string, ...}}. */
    public JsonObject toJsonObject() {
        JsonObject o = new JsonObject();
        data.forEach(o::addProperty);
        return o;
    }

    public String toJson() {
        return GSON.toJson(toJsonObject());
    }

    /** Parses {@link #toJson()} output. Non-string values (JSON objects) are kept as their JSON text. */
    public static MimeBundle fromJson(String json) {
        JsonObject o = GSON.fromJson(json, JsonObject.class);
        if (o == null || !o.has(TEXT_PLAIN)) throw new IllegalArgumentException("a MIME bundle needs a text/plain entry: " + abbreviate(json));
        Builder b = builder(o.get(TEXT_PLAIN).getAsString());
        for (Map.Entry<String, JsonElement> e : o.entrySet()) {
            if (e.getKey().equals(TEXT_PLAIN)) continue;
            JsonElement v = e.getValue();
            b.put(e.getKey(), v.isJsonPrimitive() ? v.getAsString() : GSON.toJson(v));
        }
        return b.build();
    }

    private static String abbreviate(String s) {
        return s == null ? "null" : s.length() > 80 ? s.substring(0, 80) + "..." : s;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof MimeBundle m && m.data.equals(data);
    }

    @Override
    public int hashCode() {
        return data.hashCode();
    }

    @Override
    public String toString() {
        return "MimeBundle" + data.keySet();
    }

    /** Collects entries; the first {@code put} of a type wins its position, a later one replaces the value. */
    public static final class Builder {
        private final LinkedHashMap<String, String> data = new LinkedHashMap<>();

        private Builder(String plainText) {
            data.put(TEXT_PLAIN, Objects.requireNonNull(plainText, "text/plain must not be null"));
        }

        public Builder put(String mime, String value) {
            if (mime == null || !mime.contains("/")) throw new IllegalArgumentException("not a MIME type: " + mime + " (expected e.g. text/html)");
            data.put(mime, Objects.requireNonNull(value, () -> "value for " + mime + " must not be null"));
            return this;
        }

        public MimeBundle build() {
            return new MimeBundle(new LinkedHashMap<>(data));
        }
    }
}
