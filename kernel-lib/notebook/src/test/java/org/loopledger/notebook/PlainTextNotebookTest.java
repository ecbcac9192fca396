package org.loopledger.notebook;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopledger.cli.Main;
import org.loopledger.testing.PythonOracle;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The plain-text form of a notebook ({@link PlainTextNotebook}): lossless for sources both ways on every
 * bundled notebook and on seeded random sources, refusals that name the line, and the {@code convert}
 * command. Outside reference: Jupyter's own nbformat (Debian python3-nbformat) validates the converted .ipynb.
 */
class PlainTextNotebookTest {

    static Stream<Path> bundled() throws IOException {
        return Files.list(DemoNotebooksTest.folder()).filter(p -> p.toString().endsWith(".ipynb") && !p.toString().endsWith(".out.ipynb")).sorted();
    }

    /** The parts of a notebook the plain-text form keeps: cell types, ids, sources, cell metadata, notebook metadata without the run record. */
    static List<String> sources(Notebook nb) {
        List<String> r = new ArrayList<>();
        JsonObject meta = JsonParser.parseString(nb.metadataJson()).getAsJsonObject();
        meta.remove("loopledger");
        r.add(canonical(meta));
        for (Cell c : nb.cells()) {
            r.add(c.getClass().getSimpleName() + "|" + c.id() + "|" + canonical(JsonParser.parseString(c.metadataJson())) + "|" + c.source());
        }
        return r;
    }

    static String canonical(JsonElement e) {
        return JsonParser.parseString(NotebookJson.toJson(new Notebook(5, e.isJsonObject() ? e.toString() : "{}", List.of()))).toString();
    }

    @ParameterizedTest
    @MethodSource("bundled")
    void everyBundledNotebookRoundTripsItsSources(Path file) {
        Notebook nb = NotebookJson.read(file);
        String text = PlainTextNotebook.format(nb);
        Notebook back = PlainTextNotebook.parse(text, "x.java");
        assertEquals(sources(nb), sources(back), "ipynb -> text -> notebook keeps every source, id and metadata");
        assertEquals(text, PlainTextNotebook.format(back), "text -> notebook -> text is byte-identical");
        assertTrue(back.codeCells().stream().allMatch(c -> c.outputs().isEmpty() && c.executionCount() == null), "the plain-text form holds no outputs");
        // Converting back into the stored notebook keeps every output: sources are unchanged.
        Notebook merged = PlainTextNotebook.withOutputsOf(back, nb);
        assertEquals(NotebookJson.toJson(nb), NotebookJson.toJson(merged), "text merged into its own .ipynb gives the .ipynb back, byte for byte");
    }

    @Test
    void seededRandomSourcesRoundTrip() {
        // Lines built from the pieces that could confuse the format: markers, escapes, comment prefixes, blanks.
        String[] pieces = {"", " ", "//", "// ", "//#", "//## code", "//## markdown", "//\\", "//\\x", "#", "# Title", "var x = 1;", "  indent",
                "/* c */", "\t", "µ°Ω", "{\"a\":1}", "//# metadata {}"};
        Random rnd = new Random(20261202L);
        for (int trial = 0; trial < 500; trial++) {
            List<Cell> cells = new ArrayList<>();
            int n = rnd.nextInt(6);
            for (int i = 0; i < n; i++) {
                StringBuilder src = new StringBuilder();
                int lines = rnd.nextInt(5);
                for (int k = 0; k < lines; k++) {
                    if (k > 0) src.append('\n');
                    src.append(pieces[rnd.nextInt(pieces.length)]);
                }
                if (rnd.nextInt(4) == 0) src.append('\n');
                String s = src.toString();
                String id = rnd.nextBoolean() ? NotebookJson.stableId(i, s) : "cell-" + trial + "-" + i;
                String meta = rnd.nextInt(3) == 0 ? "{\"tags\":[\"a b\"],\"z\":{\"y\":1}}" : "{}";
                cells.add(switch (rnd.nextInt(3)) {
                    case 0 -> new Cell.Code(id, s, null, List.of(), meta);
                    case 1 -> new Cell.Markdown(id, s, meta);
                    default -> new Cell.Raw(id, s, meta);
                });
            }
            Notebook nb = new Notebook(5, PlainTextNotebook.DEFAULT_METADATA, cells);
            String text = PlainTextNotebook.format(nb);
            Notebook back = PlainTextNotebook.parse(text, "t.java");
            assertEquals(sources(nb), sources(back), "trial " + trial + ":\n" + text);
        }
    }

    @Test
    void attachmentsComeBackWhenConvertingIntoTheSameNotebook() {
        var png = java.util.Map.of("image/png", "iVBORw0KGgo=");
        Notebook nb = new Notebook(5, PlainTextNotebook.DEFAULT_METADATA, List.of(
                new Cell.Markdown("m1", "![wiring](attachment:wiring.png)", "{}", java.util.Map.of("wiring.png", png)),
                new Cell.Code("c1", "1 + 1", null, List.of(), "{}")));
        assertTrue(PlainTextNotebook.droppedOnFormat(nb).stream().anyMatch(s -> s.contains("attachments")));
        Notebook back = PlainTextNotebook.parse(PlainTextNotebook.format(nb), "a.java");
        assertEquals(java.util.Map.of(), ((Cell.Markdown) back.cells().get(0)).attachments());
        Notebook merged = PlainTextNotebook.withOutputsOf(back, nb);
        assertEquals(java.util.Map.of("wiring.png", png), ((Cell.Markdown) merged.cells().get(0)).attachments());
    }

    @Test
    void handWrittenFileWithWindowsLineEndingsAndBom() {
        String text = "\uFEFF" + PlainTextNotebook.FORMAT_LINE + "\r\n\r\n//## markdown\r\n// # Axis Y\r\n\r\n//## code\r\nint a = 1;\r\na + 1\r\n";
        Notebook nb = PlainTextNotebook.parse(text, "y.java");
        assertEquals(2, nb.cells().size());
        assertEquals("# Axis Y", nb.cells().get(0).source());
        assertEquals("int a = 1;\na + 1", nb.cells().get(1).source());
        assertTrue(nb.metadataJson().contains("\"loopledger\""), "a file without metadata is for the Loopledger kernel: " + nb.metadataJson());
    }

    @Test
    void refusalsNameTheLineAndTheFix() {
        String h = PlainTextNotebook.FORMAT_LINE + "\n";
        assertMessage("class Foo {}\n", "line 1", "convert");
        assertMessage(h + "int a;\n//## code\n", "line 2", "//## code");
        assertMessage(h + "//## python\nx\n", "line 2", "unknown cell type 'python'");
        assertMessage(h + "//## markdown\n# Title\n", "line 3", "'// '");
        assertMessage(h + "//# metadata {oops\n", "line 2", "JSON");
        assertMessage(h + "//## code {\"a\":\n", "line 2", "JSON");
        assertMessage(h + "//## code bad/id\n", "line 2", "cell id");
        assertMessage(h + "//# colour blue\n", "line 2", "unknown header");
    }

    private static void assertMessage(String text, String... parts) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> PlainTextNotebook.parse(text, "bad.java"));
        assertTrue(e.getMessage().startsWith("bad.java "), e.getMessage());
        for (String p : parts) assertTrue(e.getMessage().contains(p), "'" + p + "' in: " + e.getMessage());
    }

    @Test
    void convertBothWaysThroughTheCommandAndNbformatValidates(@TempDir Path dir) throws Exception {
        Path src = DemoNotebooksTest.folder().resolve("04-reference-checks.ipynb");
        Path nb = dir.resolve("checks.ipynb");
        Files.copy(src, nb);
        assertEquals(0, main("convert", nb.toString()));
        Path text = dir.resolve("checks.java");
        assertTrue(Files.readString(text).startsWith(PlainTextNotebook.FORMAT_LINE));

        // Edit one code cell in the text, convert back into the existing .ipynb: only that cell loses its outputs.
        String t = Files.readString(text);
        Notebook parsed = PlainTextNotebook.parse(t, "t");
        Cell.Code second = parsed.codeCells().get(1);
        String edited = t.replace(second.source(), second.source() + "\n// edited");
        Files.writeString(text, edited);
        assertEquals(0, main("convert", text.toString()));
        Notebook back = NotebookJson.read(nb);
        Notebook stored = NotebookJson.read(src);
        assertEquals(stored.codeCells().get(0).outputs(), back.codeCells().get(0).outputs(), "unchanged cell keeps its outputs");
        assertTrue(back.codeCells().get(1).outputs().isEmpty() && back.codeCells().get(1).executionCount() == null, "edited cell has none");
        assertEquals(stored.codeCells().get(2).outputs(), back.codeCells().get(2).outputs());

        // A fresh .ipynb from the text is valid nbformat 4 by Jupyter's own validator.
        Path fresh = dir.resolve("fresh.ipynb");
        assertEquals(0, main("convert", text.toString(), "-o", fresh.toString()));
        PythonOracle.require("nbformat");
        JsonElement r = PythonOracle.run("""
                import json, sys, nbformat
                p = json.load(sys.stdin)["path"]
                nb = nbformat.read(p, as_version=4)
                nbformat.validate(nb)
                print(json.dumps({"cells": len(nb.cells), "first": nb.cells[0].source}))
                """, Map.of("path", fresh.toString()));
        assertEquals(stored.cells().size(), r.getAsJsonObject().get("cells").getAsInt());
        assertEquals(stored.cells().get(0).source(), r.getAsJsonObject().get("first").getAsString());
    }

    @Test
    void convertNeverWritesOverAFileOfAnotherKind(@TempDir Path dir) throws Exception {
        Path nb = dir.resolve("a.ipynb");
        Files.copy(DemoNotebooksTest.folder().resolve("04-reference-checks.ipynb"), nb);
        Path javaSource = dir.resolve("a.java");
        Files.writeString(javaSource, "public class A {}\n");
        assertEquals(2, main("convert", nb.toString()), "an ordinary Java source is not overwritten");
        assertEquals("public class A {}\n", Files.readString(javaSource));

        Path log = dir.resolve("log.ipynb");
        Files.writeString(log, "time_s,current_A\n0,1\n");
        Path text = dir.resolve("t.java");
        Files.writeString(text, PlainTextNotebook.FORMAT_LINE + "\n//## code\n1 + 1\n");
        assertEquals(2, main("convert", text.toString(), "-o", log.toString()), "a file that is not a notebook is not overwritten");
        assertEquals("time_s,current_A\n0,1\n", Files.readString(log));

        assertEquals(2, main("convert", nb.toString(), "-o", dir.resolve("x.html").toString()), "wrong output kind");
        assertEquals(2, main("convert", dir.resolve("missing.ipynb").toString()));
    }

    @Test
    void runVerifyAndRenderAcceptThePlainTextForm(@TempDir Path dir) throws Exception {
        Path text = dir.resolve("axis.java");
        Files.writeString(text, PlainTextNotebook.FORMAT_LINE + "\n\n//## markdown\n// # Plain-text check\n\n//## code\nint a = 20;\n"
                + "System.out.println(\"a = \" + a);\n\n//## code\na * 2\n");
        assertEquals(2, main("run", text.toString(), "--in-place"), "a plain-text notebook holds no outputs: --in-place is refused");
        assertEquals(2, main("run", text.toString(), "-o", dir.resolve("other.java").toString()), "run writes .ipynb, not the plain-text form");
        assertEquals(2, main("verify", text.toString()), "no executed axis.ipynb beside it yet");
        Path executed = dir.resolve("axis.ipynb");
        assertEquals(0, main("run", text.toString(), "-o", executed.toString()));
        Notebook nb = NotebookJson.read(executed);
        assertEquals("a = 20\n", ((Output.Stream) nb.codeCells().get(0).outputs().get(0)).text());
        assertEquals(0, main("verify", text.toString()), "verify of the .java checks the stored outputs of axis.ipynb");
        assertEquals(0, main("render", text.toString(), "-o", dir.resolve("axis.html").toString()));
        assertTrue(Files.readString(dir.resolve("axis.html")).contains("a = 20"));
        Files.writeString(text, Files.readString(text).replace("a * 2", "a * 3"));
        assertEquals(2, main("verify", text.toString()), "sources differ from the executed notebook: refused, nothing run");
    }

    private static int main(String... args) {
        return Main.commandLine().execute(args);
    }
}
