package org.loopledger.notebook;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonNull;
import com.google.gson.JsonObject;
import com.google.gson.JsonParseException;
import com.google.gson.JsonParser;
import com.google.gson.JsonPrimitive;
import com.google.gson.stream.JsonWriter;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Reads and writes notebooks as nbformat v4 JSON (nbformat 4.5 schema: cells carry ids).
 *
 * <p>Writing is deterministic, so that {@code git diff} of a re-run shows only real changes: keys
 * sorted, one-space indent and multi-line strings split into lines as Jupyter itself writes them,
 * no timestamps; cells without an id get a stable one derived from their position and source.
 */
public final class NotebookJson {
    private NotebookJson() {}

    /** Reads a notebook file; every defect is an IllegalArgumentException naming the file and the fix. */
    public static Notebook read(Path file) {
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            throw new IllegalArgumentException("notebook " + file + " does not exist; check the path");
        } catch (IOException e) {
            throw new IllegalArgumentException("cannot read notebook " + file + ": " + e.getMessage());
        }
        return parse(text, file.toString());
    }

    /** Parses notebook JSON text; {@code name} is used in error messages. */
    public static Notebook parse(String text, String name) {
        JsonElement root;
        NotebookSchema.requireShallow(text, name);
        try {
            root = JsonParser.parseString(text);
        } catch (JsonParseException e) {
            throw new IllegalArgumentException(name + " is not a notebook: it is not valid JSON (" + e.getMessage() + ")");
        } catch (StackOverflowError e) {
            throw new IllegalArgumentException(name + " is not a notebook: its JSON nests too deeply to read");
        }
        if (!root.isJsonObject()) throw new IllegalArgumentException(name + " is not a notebook: the top level is not a JSON object");
        JsonObject o = root.getAsJsonObject();
        NotebookSchema.check(o, name);
        if (!o.has("nbformat")) throw new IllegalArgumentException(name + " is not a notebook: it has no 'nbformat' field");
        int major = o.get("nbformat").getAsInt();
        if (major != 4) {
            throw new IllegalArgumentException(name + " is nbformat " + major + "; Loopledger reads nbformat 4. Convert it with "
                    + "'jupyter nbconvert --to notebook --nbformat 4 " + name + "'");
        }
        int minor = o.has("nbformat_minor") ? o.get("nbformat_minor").getAsInt() : 0;
        JsonObject meta = o.has("metadata") && o.get("metadata").isJsonObject() ? o.getAsJsonObject("metadata") : new JsonObject();
        String lang = language(meta);
        if (lang != null && !lang.equalsIgnoreCase("java")) {
            throw new IllegalArgumentException(name + " is written for the kernel language '" + lang + "'; Loopledger runs Java notebooks "
                    + "(metadata.kernelspec.language must be java)");
        }
        if (!o.has("cells") || !o.get("cells").isJsonArray()) throw new IllegalArgumentException(name + " is not a notebook: it has no 'cells' list");
        List<Cell> cells = new ArrayList<>();
        JsonArray arr = o.getAsJsonArray("cells");
        for (int i = 0; i < arr.size(); i++) cells.add(cell(arr.get(i), i, name));
        return new Notebook(Math.max(5, minor), meta.toString(), cells);
    }

    private static String language(JsonObject meta) {
        if (meta.has("kernelspec") && meta.get("kernelspec").isJsonObject()) {
            JsonObject ks = meta.getAsJsonObject("kernelspec");
            if (ks.has("language")) return ks.get("language").getAsString();
        }
        if (meta.has("language_info") && meta.get("language_info").isJsonObject()) {
            JsonObject li = meta.getAsJsonObject("language_info");
            if (li.has("name")) return li.get("name").getAsString();
        }
        return null;
    }

    private static Cell cell(JsonElement e, int index, String name) {
        if (!e.isJsonObject()) throw new IllegalArgumentException(name + ": cell " + (index + 1) + " is not a JSON object");
        JsonObject c = e.getAsJsonObject();
        String type = c.has("cell_type") ? c.get("cell_type").getAsString() : "";
        String source = multiline(c.get("source"));
        String id = c.has("id") && !c.get("id").isJsonNull() ? c.get("id").getAsString() : stableId(index, source);
        String meta = c.has("metadata") ? c.get("metadata").toString() : "{}";
        return switch (type) {
            case "code" -> {
                Integer count = c.has("execution_count") && !c.get("execution_count").isJsonNull() ? c.get("execution_count").getAsInt() : null;
                List<Output> outs = new ArrayList<>();
                if (c.has("outputs")) for (JsonElement oe : c.getAsJsonArray("outputs")) outs.add(output(oe.getAsJsonObject(), index, name));
                yield new Cell.Code(id, source, count, outs, meta);
            }
            case "markdown" -> new Cell.Markdown(id, source, meta, attachments(c, index, name));
            case "raw" -> new Cell.Raw(id, source, meta, attachments(c, index, name));
            default -> throw new IllegalArgumentException(name + ": cell " + (index + 1) + " has unknown cell_type '" + type + "' (expected code, markdown or raw)");
        };
    }

    /** A cell's {@code attachments}: file name to MIME bundle (nbformat 4 schema), kept as stored. */
    private static Map<String, Map<String, String>> attachments(JsonObject c, int index, String name) {
        Map<String, Map<String, String>> a = new LinkedHashMap<>();
        if (!c.has("attachments") || c.get("attachments").isJsonNull()) return a;
        if (!c.get("attachments").isJsonObject()) {
            throw new IllegalArgumentException(name + ": cell " + (index + 1) + " has 'attachments' that is not a JSON object (nbformat 4: file name to MIME bundle)");
        }
        for (var en : c.getAsJsonObject("attachments").entrySet()) {
            if (!en.getValue().isJsonObject()) {
                throw new IllegalArgumentException(name + ": cell " + (index + 1) + ", attachment '" + en.getKey()
                        + "' is not a MIME bundle (a JSON object such as {\"image/png\": \"<base64>\"})");
            }
            a.put(en.getKey(), mime(en.getValue().getAsJsonObject()));
        }
        return a;
    }

    private static Output output(JsonObject o, int index, String name) {
        String type = o.has("output_type") ? o.get("output_type").getAsString() : "";
        return switch (type) {
            case "stream" -> new Output.Stream(o.get("name").getAsString(), multiline(o.get("text")));
            case "display_data" -> new Output.DisplayData(mime(o.getAsJsonObject("data")), mime(o.getAsJsonObject("metadata")));
            case "execute_result" -> new Output.ExecuteResult(o.has("execution_count") && !o.get("execution_count").isJsonNull()
                    ? o.get("execution_count").getAsInt() : 0, mime(o.getAsJsonObject("data")), mime(o.getAsJsonObject("metadata")));
            case "error" -> {
                List<String> tb = new ArrayList<>();
                if (o.has("traceback")) for (JsonElement t : o.getAsJsonArray("traceback")) tb.add(t.getAsString());
                yield new Output.Error(o.get("ename").getAsString(), o.get("evalue").getAsString(), tb);
            }
            default -> throw new IllegalArgumentException(name + ": cell " + (index + 1) + " has an output of unknown type '" + type + "'");
        };
    }

    private static Map<String, String> mime(JsonObject d) {
        Map<String, String> m = new LinkedHashMap<>();
        if (d == null) return m;
        for (var en : d.entrySet()) {
            JsonElement v = en.getValue();
            m.put(en.getKey(), v.isJsonPrimitive() ? v.getAsString() : v.isJsonArray() && allStrings(v.getAsJsonArray()) ? multiline(v) : v.toString());
        }
        return m;
    }

    private static boolean allStrings(JsonArray a) {
        for (JsonElement e : a) if (!e.isJsonPrimitive() || !e.getAsJsonPrimitive().isString()) return false;
        return true;
    }

    private static String multiline(JsonElement e) {
        if (e == null || e.isJsonNull()) return "";
        if (e.isJsonPrimitive()) return e.getAsString();
        StringBuilder sb = new StringBuilder();
        for (JsonElement x : e.getAsJsonArray()) sb.append(x.getAsString());
        return sb.toString();
    }

    /** A stable cell id: 12 hex digits of SHA-256 over the cell's position and source. */
    static String stableId(int index, String source) {
        try {
            byte[] h = MessageDigest.getInstance("SHA-256").digest((index + "\n" + source).getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(h, 0, 6);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** The notebook as deterministic nbformat v4 JSON text (ends with a newline). */
    public static String toJson(Notebook nb) {
        TreeMap<String, JsonElement> root = new TreeMap<>();
        JsonArray cells = new JsonArray();
        for (Cell c : nb.cells()) cells.add(cellJson(c));
        root.put("cells", cells);
        root.put("metadata", JsonParser.parseString(nb.metadataJson()));
        root.put("nbformat", new JsonPrimitive(4));
        root.put("nbformat_minor", new JsonPrimitive(nb.nbformatMinor()));
        StringWriter sw = new StringWriter();
        try (JsonWriter w = new JsonWriter(sw)) {
            w.setIndent(" ");
            w.setHtmlSafe(false);
            writeSorted(w, toObject(root));
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
        return sw + "\n";
    }

    private static JsonObject toObject(Map<String, JsonElement> m) {
        JsonObject o = new JsonObject();
        m.forEach(o::add);
        return o;
    }

    private static JsonObject cellJson(Cell c) {
        JsonObject o = new JsonObject();
        o.add("id", new JsonPrimitive(c.id()));
        o.add("metadata", JsonParser.parseString(c.metadataJson()));
        o.add("source", lines(c.source()));
        if (c instanceof Cell.Code code) {
            o.addProperty("cell_type", "code");
            o.add("execution_count", code.executionCount() == null ? JsonNull.INSTANCE : new JsonPrimitive(code.executionCount()));
            JsonArray outs = new JsonArray();
            for (Output out : code.outputs()) outs.add(outputJson(out));
            o.add("outputs", outs);
        } else {
            o.addProperty("cell_type", c instanceof Cell.Markdown ? "markdown" : "raw");
            Map<String, Map<String, String>> att = c instanceof Cell.Markdown md ? md.attachments() : ((Cell.Raw) c).attachments();
            if (!att.isEmpty()) {
                JsonObject a = new JsonObject();
                att.forEach((file, bundle) -> a.add(file, mimeJson(bundle)));
                o.add("attachments", a);
            }
        }
        return o;
    }

    private static JsonObject outputJson(Output out) {
        JsonObject o = new JsonObject();
        if (out instanceof Output.Stream s) {
            o.addProperty("output_type", "stream");
            o.addProperty("name", s.name());
            o.add("text", lines(s.text()));
        } else if (out instanceof Output.DisplayData d) {
            o.addProperty("output_type", "display_data");
            o.add("data", mimeJson(d.data()));
            o.add("metadata", metaJson(d.metadataJson()));
        } else if (out instanceof Output.ExecuteResult r) {
            o.addProperty("output_type", "execute_result");
            o.addProperty("execution_count", r.executionCount());
            o.add("data", mimeJson(r.data()));
            o.add("metadata", metaJson(r.metadataJson()));
        } else if (out instanceof Output.Error er) {
            o.addProperty("output_type", "error");
            o.addProperty("ename", er.ename());
            o.addProperty("evalue", er.evalue());
            JsonArray tb = new JsonArray();
            er.traceback().forEach(tb::add);
            o.add("traceback", tb);
        }
        return o;
    }

    private static JsonObject mimeJson(Map<String, String> data) {
        JsonObject o = new JsonObject();
        for (var e : data.entrySet()) {
            String k = e.getKey();
            if (k.equals("application/json") || k.endsWith("+json")) {
                o.add(k, JsonParser.parseString(e.getValue()));
            } else if (k.startsWith("text/") || k.equals("image/svg+xml")) {
                o.add(k, lines(e.getValue()));
            } else {
                o.addProperty(k, e.getValue());
            }
        }
        return o;
    }

    private static JsonObject metaJson(Map<String, String> meta) {
        JsonObject o = new JsonObject();
        for (var e : meta.entrySet()) o.add(e.getKey(), JsonParser.parseString(e.getValue()));
        return o;
    }

    /** Splits text into lines that keep their newline, as nbformat stores multi-line strings. */
    private static JsonArray lines(String text) {
        JsonArray a = new JsonArray();
        int start = 0;
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) == '\n') {
                a.add(text.substring(start, i + 1));
                start = i + 1;
            }
        }
        if (start < text.length()) a.add(text.substring(start));
        return a;
    }

    private static void writeSorted(JsonWriter w, JsonElement e) throws IOException {
        if (e.isJsonObject()) {
            w.beginObject();
            TreeMap<String, JsonElement> sorted = new TreeMap<>();
            for (var en : e.getAsJsonObject().entrySet()) sorted.put(en.getKey(), en.getValue());
            for (var en : sorted.entrySet()) {
                w.name(en.getKey());
                writeSorted(w, en.getValue());
            }
            w.endObject();
        } else if (e.isJsonArray()) {
            w.beginArray();
            for (JsonElement x : e.getAsJsonArray()) writeSorted(w, x);
            w.endArray();
        } else if (e.isJsonNull()) {
            w.nullValue();
        } else {
            JsonPrimitive p = e.getAsJsonPrimitive();
            if (p.isBoolean()) w.value(p.getAsBoolean());
            else if (p.isNumber()) w.value(p.getAsNumber());
            else w.value(p.getAsString());
        }
    }

    /** Writes the notebook atomically (see {@link AtomicFiles}). */
    public static void write(Notebook nb, Path file) {
        AtomicFiles.writeString(file, toJson(nb));
    }
}
