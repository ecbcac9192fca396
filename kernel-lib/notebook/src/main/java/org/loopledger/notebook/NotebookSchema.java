package org.loopledger.notebook;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;

import java.util.Set;

/**
 * Checks the types of a parsed notebook before {@link NotebookJson} converts it, so a wrong type is an
 * {@link IllegalArgumentException} naming the file and the field as a JSON path
 * ({@code cells[3].outputs: expected a list, got an object}) instead of a Gson exception or a
 * {@code NullPointerException}. The rules are those of the nbformat 4 schema (nbformat's
 * {@code nbformat.v4.schema.json}, from memory) for the fields Loopledger reads: cells, sources, outputs,
 * stream names, MIME bundles, error fields, and the {@code loopledger} run metadata.
 *
 * <p>Also guards the parse itself: {@link #requireShallow} rejects text nested deeper than
 * {@link #MAX_DEPTH} levels before any recursive code sees it.
 */
final class NotebookSchema {
    /** Deepest nesting of JSON arrays and objects accepted; real notebooks stay below 20. */
    static final int MAX_DEPTH = 200;

    private static final Set<String> CELL_TYPES = Set.of("code", "markdown", "raw");
    private static final Set<String> OUTPUT_TYPES = Set.of("stream", "display_data", "execute_result", "error");

    private final String name;

    private NotebookSchema(String name) { this.name = name; }

    /**
     * Scans JSON text for its nesting depth (brackets outside strings), linear and without recursion.
     *
     * @throws IllegalArgumentException when the text nests deeper than {@link #MAX_DEPTH}, with line and column
     */
    static void requireShallow(String text, String name) {
        int depth = 0, line = 1, col = 0;
        boolean inString = false, escaped = false;
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            col++;
            if (c == '\n') {
                line++;
                col = 0;
            }
            if (inString) {
                if (escaped) escaped = false;
                else if (c == '\\') escaped = true;
                else if (c == '"') inString = false;
                continue;
            }
            if (c == '"') inString = true;
            else if (c == '[' || c == '{') {
                if (++depth > MAX_DEPTH) {
                    throw new IllegalArgumentException(name + " is not a notebook: its JSON nests deeper than " + MAX_DEPTH
                            + " levels (line " + line + ", column " + col + "); a notebook never does, so the file is damaged or not a notebook");
                }
            } else if (c == ']' || c == '}') depth--;
        }
    }

    /** Checks every field Loopledger reads; {@code root} must be a JSON object. */
    static void check(JsonObject root, String name) {
        new NotebookSchema(name).root(root);
    }

    private void root(JsonObject o) {
        if (!o.has("nbformat")) throw fail("nbformat", "is missing; a notebook (nbformat 4) has \"nbformat\": 4");
        integer(o.get("nbformat"), "nbformat");
        if (o.has("nbformat_minor")) integer(o.get("nbformat_minor"), "nbformat_minor");
        if (o.get("nbformat").getAsInt() != 4) return; // NotebookJson explains how to convert other versions
        if (o.has("metadata")) metadata(object(o.get("metadata"), "metadata"));
        if (!o.has("cells")) throw fail("cells", "is missing; a notebook has a list of cells");
        JsonArray cells = array(o.get("cells"), "cells");
        for (int i = 0; i < cells.size(); i++) cell(cells.get(i), "cells[" + i + "]");
    }

    private void metadata(JsonObject meta) {
        if (meta.has("kernelspec")) {
            JsonObject ks = object(meta.get("kernelspec"), "metadata.kernelspec");
            if (ks.has("language")) string(ks.get("language"), "metadata.kernelspec.language");
        }
        if (meta.has("language_info")) {
            JsonObject li = object(meta.get("language_info"), "metadata.language_info");
            if (li.has("name")) string(li.get("name"), "metadata.language_info.name");
        }
        if (meta.has("loopledger")) {
            JsonObject ll = object(meta.get("loopledger"), "metadata.loopledger");
            for (String k : new String[] {"library_version", "run_date", "java_version"}) {
                if (ll.has(k)) string(ll.get(k), "metadata.loopledger." + k);
            }
            if (ll.has("datasets")) {
                JsonArray ds = array(ll.get("datasets"), "metadata.loopledger.datasets");
                for (int i = 0; i < ds.size(); i++) {
                    String p = "metadata.loopledger.datasets[" + i + "]";
                    JsonObject d = object(ds.get(i), p);
                    string(required(d, "path", p), p + ".path");
                    integer(required(d, "bytes", p), p + ".bytes");
                    string(required(d, "sha256", p), p + ".sha256");
                }
            }
        }
    }

    private void cell(JsonElement e, String path) {
        JsonObject c = object(e, path);
        String type = string(required(c, "cell_type", path), path + ".cell_type");
        if (!CELL_TYPES.contains(type)) throw fail(path + ".cell_type", "is '" + type + "'; expected code, markdown or raw");
        if (c.has("id") && !c.get("id").isJsonNull()) string(c.get("id"), path + ".id");
        multiline(required(c, "source", path), path + ".source");
        if (c.has("metadata")) object(c.get("metadata"), path + ".metadata");
        if (c.has("attachments") && !c.get("attachments").isJsonNull()) object(c.get("attachments"), path + ".attachments");
        if (!type.equals("code")) return;
        if (c.has("execution_count") && !c.get("execution_count").isJsonNull()) integer(c.get("execution_count"), path + ".execution_count");
        if (!c.has("outputs")) return;
        JsonArray outs = array(c.get("outputs"), path + ".outputs");
        for (int i = 0; i < outs.size(); i++) output(outs.get(i), path + ".outputs[" + i + "]");
    }

    private void output(JsonElement e, String path) {
        JsonObject o = object(e, path);
        String type = string(required(o, "output_type", path), path + ".output_type");
        if (!OUTPUT_TYPES.contains(type)) throw fail(path + ".output_type", "is '" + type + "'; expected stream, display_data, execute_result or error");
        switch (type) {
            case "stream" -> {
                String n = string(required(o, "name", path), path + ".name");
                if (!n.equals("stdout") && !n.equals("stderr")) throw fail(path + ".name", "is '" + n + "'; expected stdout or stderr");
                multiline(required(o, "text", path), path + ".text");
            }
            case "display_data", "execute_result" -> {
                mimeBundle(required(o, "data", path), path + ".data");
                if (o.has("metadata")) object(o.get("metadata"), path + ".metadata");
                if (type.equals("execute_result") && o.has("execution_count") && !o.get("execution_count").isJsonNull()) {
                    integer(o.get("execution_count"), path + ".execution_count");
                }
            }
            default -> { // error
                string(required(o, "ename", path), path + ".ename");
                string(required(o, "evalue", path), path + ".evalue");
                if (o.has("traceback")) {
                    JsonArray tb = array(o.get("traceback"), path + ".traceback");
                    for (int i = 0; i < tb.size(); i++) string(tb.get(i), path + ".traceback[" + i + "]");
                }
            }
        }
    }

    /** MIME type to text, list of text lines, or (for JSON types) any JSON value. */
    private void mimeBundle(JsonElement e, String path) {
        JsonObject d = object(e, path);
        for (var en : d.entrySet()) {
            String k = en.getKey();
            if (k.equals("application/json") || k.endsWith("+json")) continue;
            JsonElement v = en.getValue();
            String p = path + "[\"" + k + "\"]";
            if (v.isJsonPrimitive() && v.getAsJsonPrimitive().isString()) continue;
            multiline(v, p);
        }
    }

    private void multiline(JsonElement e, String path) {
        if (e.isJsonPrimitive() && e.getAsJsonPrimitive().isString()) return;
        if (!e.isJsonArray()) throw fail(path, "expected a string or a list of strings, got " + kind(e));
        JsonArray a = e.getAsJsonArray();
        for (int i = 0; i < a.size(); i++) {
            JsonElement x = a.get(i);
            if (!x.isJsonPrimitive() || !x.getAsJsonPrimitive().isString()) throw fail(path + "[" + i + "]", "expected a string, got " + kind(x));
        }
    }

    private JsonElement required(JsonObject o, String field, String path) {
        if (!o.has(field)) throw fail(path.isEmpty() ? field : path + "." + field, "is missing");
        return o.get(field);
    }

    private JsonObject object(JsonElement e, String path) {
        if (!e.isJsonObject()) throw fail(path, "expected an object, got " + kind(e));
        return e.getAsJsonObject();
    }

    private JsonArray array(JsonElement e, String path) {
        if (!e.isJsonArray()) throw fail(path, "expected a list, got " + kind(e));
        return e.getAsJsonArray();
    }

    private String string(JsonElement e, String path) {
        if (!e.isJsonPrimitive() || !e.getAsJsonPrimitive().isString()) throw fail(path, "expected a string, got " + kind(e));
        return e.getAsString();
    }

    private void integer(JsonElement e, String path) {
        if (!e.isJsonPrimitive() || !e.getAsJsonPrimitive().isNumber()) throw fail(path, "expected an integer, got " + kind(e));
        double v = e.getAsDouble();
        if (v != Math.rint(v) || Math.abs(v) > Integer.MAX_VALUE) throw fail(path, "expected an integer, got " + e);
    }

    private static String kind(JsonElement e) {
        if (e == null || e.isJsonNull()) return "null";
        if (e.isJsonObject()) return "an object";
        if (e.isJsonArray()) return "a list";
        var p = e.getAsJsonPrimitive();
        String text = e.toString();
        if (text.length() > 40) text = text.substring(0, 37) + "...";
        return (p.isString() ? "the string " : p.isNumber() ? "the number " : "the value ") + text;
    }

    private IllegalArgumentException fail(String path, String what) {
        return new IllegalArgumentException(name + " is not a valid notebook: field " + path + " " + what
                + "; fix that field (nbformat 4 schema) or re-save the notebook from Jupyter");
    }
}
