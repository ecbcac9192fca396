package org.loopledger.notebook;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParseException;
import com.google.gson.JsonParser;

import java.util.ArrayList;
import java.util.List;

/**
 * The plain-text form of a notebook: a Java source file that diffs like code.
 *
 * <pre>
 * //# loopledger notebook, plain-text form 1
 * //# metadata {"kernelspec":{...}}
 *
 * //## markdown
 * // # Axis Y: identification
 * //
 * // Markdown lives in line comments.
 *
 * //## code
 * var log = DriveLogReader.read(Path.of("datasets/axis-y.csv"), LogCheckOptions.defaults());
 *
 * //## code nb-07 {"tags":["slow"]}
 * ...
 * </pre>
 *
 * <p>Rules (they make the conversion lossless for every cell's source):
 * <ul>
 * <li>A line starting with {@code //## } opens a cell: its type ({@code code}, {@code markdown} or {@code raw}),
 * then the cell id when it is not the stable id the position and source would give, then the cell metadata
 * as one-line JSON when it is not empty.</li>
 * <li>Code lines are written verbatim. A code line that itself starts with {@code //#} or {@code //\} is
 * escaped by prefixing {@code //\}; reading strips that prefix.</li>
 * <li>Markdown and raw lines are written as {@code // text} ({@code //} alone for an empty line), so the file stays
 * valid Java.</li>
 * <li>Each cell is followed by one empty separator line, which reading drops; any further empty lines belong
 * to the source.</li>
 * <li>Header lines ({@code //# ...}) come first: the format line and the notebook metadata as one-line JSON with
 * sorted keys. The run record ({@code metadata.loopledger}: datasets read, run date) is not part of the
 * sources and is not written; outputs and Markdown attachments are not written either
 * (see {@link #droppedOnFormat(Notebook)}).</li>
 * </ul>
 * Line endings are {@code \n}; {@code \r\n} files are read as if they had {@code \n}.
 */
public final class PlainTextNotebook {
    private PlainTextNotebook() {}

    /** The first line of every file in this form. */
    public static final String FORMAT_LINE = "//# loopledger notebook, plain-text form 1";
    /** The file name suffix of the plain-text form. */
    public static final String SUFFIX = ".java";

    private static final String HEADER = "//# ";
    private static final String MARKER = "//## ";
    private static final String ESCAPE = "//\\";
    private static final String METADATA_KEY = "metadata ";
    /** The notebook metadata of a file that states none: the Loopledger kernel. */
    static final String DEFAULT_METADATA = KernelIdentity.notebookMetadata().toString();

    /** The notebook as plain text (ends with a newline); outputs, attachments and the run record are left out. */
    public static String format(Notebook nb) {
        StringBuilder sb = new StringBuilder();
        sb.append(FORMAT_LINE).append('\n');
        JsonObject meta = JsonParser.parseString(nb.metadataJson()).getAsJsonObject();
        meta.remove("loopledger");
        sb.append(HEADER).append(METADATA_KEY).append(sortedCompact(meta)).append('\n');
        sb.append('\n');
        List<Cell> cells = nb.cells();
        for (int i = 0; i < cells.size(); i++) {
            Cell c = cells.get(i);
            String type = c instanceof Cell.Code ? "code" : c instanceof Cell.Markdown ? "markdown" : "raw";
            sb.append(MARKER).append(type);
            if (!c.id().equals(NotebookJson.stableId(i, c.source()))) sb.append(' ').append(c.id());
            JsonElement cm = JsonParser.parseString(c.metadataJson());
            if (!(cm.isJsonObject() && cm.getAsJsonObject().size() == 0)) sb.append(' ').append(sortedCompact(cm));
            sb.append('\n');
            for (String line : c.source().split("\n", -1)) {
                if (c instanceof Cell.Code) {
                    if (line.startsWith("//#") || line.startsWith(ESCAPE)) sb.append(ESCAPE);
                    sb.append(line);
                } else {
                    sb.append(line.isEmpty() ? "//" : "// " + line);
                }
                sb.append('\n');
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** What {@link #format} leaves out of this notebook, as sentences for the user (empty when nothing). */
    public static List<String> droppedOnFormat(Notebook nb) {
        List<String> r = new ArrayList<>();
        int withOutputs = 0;
        for (Cell.Code c : nb.codeCells()) if (!c.outputs().isEmpty()) withOutputs++;
        if (withOutputs > 0) r.add(withOutputs + " code cell(s) have stored outputs; the plain-text form keeps sources only "
                + "(converting back into the same .ipynb keeps the outputs of unchanged cells)");
        long withAttachments = nb.cells().stream().filter(c -> c instanceof Cell.Markdown m && !m.attachments().isEmpty()
                || c instanceof Cell.Raw raw && !raw.attachments().isEmpty()).count();
        if (withAttachments > 0) r.add(withAttachments + " Markdown or raw cell(s) have attachments (pictures pasted into the cell); the plain-text form "
                + "does not hold them (converting back into the same .ipynb keeps them for cells whose id and source are unchanged)");
        JsonObject meta = JsonParser.parseString(nb.metadataJson()).getAsJsonObject();
        if (meta.has("loopledger")) r.add("the run record (metadata.loopledger: datasets read, run date) is not written; 'run' writes it again");
        return r;
    }

    /**
     * Parses the plain-text form; {@code name} (the file) is used in error messages, which name the line and
     * the fix.
     */
    public static Notebook parse(String text, String name) {
        String t = text.replace("\r\n", "\n");
        if (t.startsWith("\uFEFF")) t = t.substring(1);
        if (t.endsWith("\n")) t = t.substring(0, t.length() - 1);
        String[] lines = t.isEmpty() ? new String[0] : t.split("\n", -1);
        int i = 0;
        String metadata = DEFAULT_METADATA;
        if (lines.length == 0 || !lines[0].equals(FORMAT_LINE)) {
            throw new IllegalArgumentException(name + " line 1: not a Loopledger plain-text notebook; its first line must be '" + FORMAT_LINE
                    + "'. Make one from a notebook with './loopledger convert NOTEBOOK.ipynb'");
        }
        i++;
        for (; i < lines.length && lines[i].startsWith(HEADER) && !lines[i].startsWith(MARKER); i++) {
            String h = lines[i].substring(HEADER.length());
            if (h.startsWith(METADATA_KEY)) {
                String json = h.substring(METADATA_KEY.length());
                try {
                    JsonElement e = JsonParser.parseString(json);
                    if (!e.isJsonObject()) throw new JsonParseException("not an object");
                    metadata = e.toString();
                } catch (JsonParseException | IllegalStateException ex) {
                    throw new IllegalArgumentException(name + " line " + (i + 1) + ": the notebook metadata is not a JSON object on one line ("
                            + ex.getMessage() + "); fix the JSON or delete the line to use the default");
                }
            } else {
                throw new IllegalArgumentException(name + " line " + (i + 1) + ": unknown header line '" + lines[i]
                        + "'; header lines are '" + FORMAT_LINE + "' and '//# metadata {...}'");
            }
        }
        for (; i < lines.length && !lines[i].startsWith(MARKER); i++) {
            if (!lines[i].isBlank()) {
                throw new IllegalArgumentException(name + " line " + (i + 1) + ": text before the first cell marker; start a cell with '//## code' or '//## markdown' above it");
            }
        }
        List<Cell> cells = new ArrayList<>();
        while (i < lines.length) {
            int markerLine = i;
            String[] head = parseMarker(lines[i], name, i + 1);
            String type = head[0];
            i++;
            List<String> body = new ArrayList<>();
            for (; i < lines.length && !lines[i].startsWith(MARKER); i++) body.add(lines[i]);
            if (!body.isEmpty() && body.get(body.size() - 1).isEmpty()) body.remove(body.size() - 1);
            StringBuilder src = new StringBuilder();
            for (int k = 0; k < body.size(); k++) {
                String line = body.get(k);
                int lineNo = markerLine + 2 + k;
                if (k > 0) src.append('\n');
                if (type.equals("code")) {
                    src.append(line.startsWith(ESCAPE) ? line.substring(ESCAPE.length()) : line);
                } else if (line.equals("//")) {
                    // an empty Markdown line
                } else if (line.startsWith("// ")) {
                    src.append(line, 3, line.length());
                } else if (line.isEmpty()) {
                    // tolerated: an empty line inside a Markdown cell written by hand
                } else {
                    throw new IllegalArgumentException(name + " line " + lineNo + ": a " + type + " cell's lines must be comments ('// text'); "
                            + "put '// ' in front of this line, or start a code cell above it with '//## code'");
                }
            }
            String source = src.toString();
            int index = cells.size();
            String id = head[1] != null ? head[1] : NotebookJson.stableId(index, source);
            String meta = head[2] != null ? head[2] : "{}";
            cells.add(switch (type) {
                case "code" -> new Cell.Code(id, source, null, List.of(), meta);
                case "markdown" -> new Cell.Markdown(id, source, meta);
                default -> new Cell.Raw(id, source, meta);
            });
        }
        return new Notebook(5, metadata, cells);
    }

    /** type, id (or null), metadata JSON (or null). */
    private static String[] parseMarker(String line, String name, int lineNo) {
        String rest = line.substring(MARKER.length()).strip();
        int sp = rest.indexOf(' ');
        String type = sp < 0 ? rest : rest.substring(0, sp);
        if (!type.equals("code") && !type.equals("markdown") && !type.equals("raw")) {
            throw new IllegalArgumentException(name + " line " + lineNo + ": unknown cell type '" + type + "'; a cell marker reads '//## code', '//## markdown' or '//## raw'");
        }
        rest = sp < 0 ? "" : rest.substring(sp + 1).strip();
        String id = null;
        String meta = null;
        if (!rest.isEmpty() && !rest.startsWith("{")) {
            int sp2 = rest.indexOf(' ');
            id = sp2 < 0 ? rest : rest.substring(0, sp2);
            rest = sp2 < 0 ? "" : rest.substring(sp2 + 1).strip();
            if (!id.matches("[A-Za-z0-9_-]{1,64}")) {
                throw new IllegalArgumentException(name + " line " + lineNo + ": cell id '" + id + "' is not valid (1 to 64 letters, digits, '-' or '_', as nbformat requires)");
            }
        }
        if (!rest.isEmpty()) {
            try {
                JsonElement e = JsonParser.parseString(rest);
                if (!e.isJsonObject()) throw new JsonParseException("not an object");
                meta = e.toString();
            } catch (JsonParseException | IllegalStateException ex) {
                throw new IllegalArgumentException(name + " line " + lineNo + ": the cell metadata after the marker is not a JSON object ("
                        + ex.getMessage() + "); write it as one-line JSON or remove it");
            }
        }
        return new String[] {type, id, meta};
    }

    /**
     * The notebook {@code sources} with the stored outputs and run record of {@code stored} kept where they still
     * belong: a code cell keeps the outputs and execution count of the stored code cell at the same position among
     * code cells when both sources are identical; every other code cell has none. A Markdown or raw cell keeps the
     * attachments of the stored cell with the same id and source.
     */
    public static Notebook withOutputsOf(Notebook sources, Notebook stored) {
        List<Cell.Code> old = stored.codeCells();
        java.util.Map<String, Cell> storedById = new java.util.HashMap<>();
        for (Cell c : stored.cells()) storedById.putIfAbsent(c.id(), c);
        List<Cell> cells = new ArrayList<>();
        int k = 0;
        for (Cell c : sources.cells()) {
            if (c instanceof Cell.Code code) {
                if (k < old.size() && old.get(k).source().equals(code.source())) {
                    cells.add(code.withResults(old.get(k).executionCount(), old.get(k).outputs()));
                } else {
                    cells.add(code);
                }
                k++;
            } else {
                Cell before = storedById.get(c.id());
                if (c instanceof Cell.Markdown md && before instanceof Cell.Markdown bm && bm.source().equals(md.source())) {
                    cells.add(new Cell.Markdown(md.id(), md.source(), md.metadataJson(), bm.attachments()));
                } else if (c instanceof Cell.Raw raw && before instanceof Cell.Raw br && br.source().equals(raw.source())) {
                    cells.add(new Cell.Raw(raw.id(), raw.source(), raw.metadataJson(), br.attachments()));
                } else {
                    cells.add(c);
                }
            }
        }
        JsonObject meta = JsonParser.parseString(sources.metadataJson()).getAsJsonObject();
        JsonObject storedMeta = JsonParser.parseString(stored.metadataJson()).getAsJsonObject();
        if (storedMeta.has("loopledger")) meta.add("loopledger", storedMeta.get("loopledger"));
        return new Notebook(Math.max(sources.nbformatMinor(), stored.nbformatMinor()), meta.toString(), cells);
    }

    /** Each cell's kind and source, in order: what must agree between a plain-text notebook and its executed .ipynb. */
    public static List<String> sourcesOf(Notebook nb) {
        List<String> r = new ArrayList<>();
        for (Cell c : nb.cells()) r.add((c instanceof Cell.Code ? "code" : c instanceof Cell.Markdown ? "markdown" : "raw") + "\n" + c.source());
        return r;
    }

    private static String sortedCompact(JsonElement e) {
        return OutputComparison.sorted(e).toString();
    }
}
