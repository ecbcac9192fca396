package org.loopledger.notebook;

import com.google.gson.JsonElement;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.PythonOracle;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

class NotebookFormatTest {

    static Notebook sample() {
        Map<String, String> plot = new LinkedHashMap<>();
        plot.put("text/plain", "Figure[Bode, 2 panel(s)]");
        plot.put("image/svg+xml", "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"10\" height=\"10\"><path d=\"M0 0L10 10\"/></svg>");
        return new Notebook(5, "{\"kernelspec\":{\"name\":\"loopledger\",\"display_name\":\"Loopledger (Java)\",\"language\":\"java\"},"
                + "\"language_info\":{\"name\":\"java\"}}", List.of(
                new Cell.Markdown("intro", "# Axis X tuning\nSynthetic demo <b>data</b>.\n", "{}"),
                new Cell.Code("c1", "int a = 1;\na + 1", 1, List.of(
                        new Output.Stream("stdout", "gain 1.2345 dB\nline two\n"),
                        new Output.ExecuteResult(1, Map.of("text/plain", "2"), Map.of())), "{}"),
                new Cell.Code("c2", "plot()", 2, List.of(new Output.DisplayData(plot, Map.of())), "{}"),
                new Cell.Code("c3", "boom()", 3, List.of(new Output.Error("IllegalArgumentException", "bad gain", List.of("at line 1"))), "{}")));
    }

    @Test
    void writesDeterministicJsonThatNbformatValidates(@TempDir Path dir) throws Exception {
        PythonOracle.require("nbformat");
        Notebook nb = sample();
        String once = NotebookJson.toJson(nb);
        String twice = NotebookJson.toJson(NotebookJson.parse(once, "x"));
        assertEquals(once, twice, "read-write round trip is byte-identical");
        Path f = dir.resolve("n.ipynb");
        NotebookJson.write(nb, f);
        // Reference: Jupyter's own nbformat (Debian python3-nbformat) validates against the nbformat 4 JSON schema.
        JsonElement r = PythonOracle.run("""
                import json, sys, nbformat
                p = json.load(sys.stdin)["path"]
                nb = nbformat.read(p, as_version=4)
                nbformat.validate(nb)
                print(json.dumps({"cells": len(nb.cells), "ids": [c.id for c in nb.cells],
                                  "out": nb.cells[1].outputs[0].text, "count": nb.cells[1].execution_count}))
                """, Map.of("path", f.toString()));
        assertEquals(4, r.getAsJsonObject().get("cells").getAsInt());
        assertEquals("gain 1.2345 dB\nline two\n", r.getAsJsonObject().get("out").getAsString());
        assertEquals("intro", r.getAsJsonObject().getAsJsonArray("ids").get(0).getAsString());
    }

    @Test
    void markdownAndRawAttachmentsSurviveReadAndWrite(@TempDir Path dir) throws Exception {
        PythonOracle.require("nbformat");
        // Reference: Jupyter's nbformat writes the input (as JupyterLab stores a pasted image: base64 under its MIME type)
        // and reads back what we wrote.
        Path in = dir.resolve("in.ipynb"), out = dir.resolve("out.ipynb");
        PythonOracle.run("""
                import json, sys, nbformat
                from nbformat.v4 import new_notebook, new_markdown_cell, new_raw_cell
                p = json.load(sys.stdin)["path"]
                nb = new_notebook(metadata={"kernelspec": {"name": "loopledger", "display_name": "Loopledger (Java)", "language": "java"}})
                nb.cells.append(new_markdown_cell("![wiring](attachment:wiring.png)", attachments={
                    "wiring.png": {"image/png": "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg=="},
                    "logo.svg": {"image/svg+xml": "<svg xmlns='http://www.w3.org/2000/svg' width='4' height='4'/>\\n"}}))
                nb.cells.append(new_raw_cell("raw", attachments={"a.txt": {"text/plain": "line 1\\nline 2\\n"}}))
                nbformat.write(nb, p)
                print("{}")
                """, Map.of("path", in.toString()));
        NotebookJson.write(NotebookJson.read(in), out);
        assertEquals(Files.readString(out), NotebookJson.toJson(NotebookJson.read(out)), "second round trip is byte-identical");
        JsonElement r = PythonOracle.run("""
                import json, sys, nbformat
                d = json.load(sys.stdin)
                a, b = nbformat.read(d["a"], as_version=4), nbformat.read(d["b"], as_version=4)
                nbformat.validate(b)
                print(json.dumps({"same": [c.get("attachments") == c2.get("attachments") for c, c2 in zip(a.cells, b.cells)],
                                  "names": sorted(b.cells[0].attachments)}))
                """, Map.of("a", in.toString(), "b", out.toString()));
        assertEquals("[true,true]", r.getAsJsonObject().get("same").toString(), "attachments as nbformat reads them are unchanged");
        assertEquals("[\"logo.svg\",\"wiring.png\"]", r.getAsJsonObject().get("names").toString());
    }

    @Test
    void attachmentsThatAreNotMimeBundlesAreNamed() {
        String json = "{\"nbformat\":4,\"nbformat_minor\":5,\"metadata\":{},\"cells\":[{\"cell_type\":\"markdown\",\"id\":\"m\",\"metadata\":{},"
                + "\"source\":\"x\",\"attachments\":{\"a.png\":\"iVBOR\"}}]}";
        var e = assertThrows(IllegalArgumentException.class, () -> NotebookJson.parse(json, "att.ipynb"));
        assertTrue(e.getMessage().contains("att.ipynb: cell 1, attachment 'a.png'"), e.getMessage());
    }

    @Test
    void missingIdsBecomeStable() {
        String json = "{\"nbformat\":4,\"nbformat_minor\":4,\"metadata\":{},\"cells\":[{\"cell_type\":\"code\",\"source\":[\"1+1\"],\"metadata\":{},\"outputs\":[],\"execution_count\":null}]}";
        String a = NotebookJson.parse(json, "x").cells().get(0).id();
        String b = NotebookJson.parse(json, "x").cells().get(0).id();
        assertEquals(a, b);
        assertTrue(a.matches("[0-9a-f]{12}"));
    }

    @Test
    void badNotebooksGiveClearErrorsAndLeaveTheFileAlone(@TempDir Path dir) throws Exception {
        Path notJson = dir.resolve("broken.ipynb");
        Files.writeString(notJson, "{ this is not json");
        var e1 = assertThrows(IllegalArgumentException.class, () -> NotebookJson.read(notJson));
        assertTrue(e1.getMessage().contains("not valid JSON"), e1.getMessage());
        assertEquals("{ this is not json", Files.readString(notJson));

        var e2 = assertThrows(IllegalArgumentException.class, () -> NotebookJson.parse(
                "{\"nbformat\":4,\"nbformat_minor\":5,\"metadata\":{\"kernelspec\":{\"language\":\"python\"}},\"cells\":[]}", "py.ipynb"));
        assertTrue(e2.getMessage().contains("'python'"), e2.getMessage());

        var e3 = assertThrows(IllegalArgumentException.class, () -> NotebookJson.parse("{\"nbformat\":3,\"worksheets\":[]}", "old.ipynb"));
        assertTrue(e3.getMessage().contains("nbformat 3") && e3.getMessage().contains("--nbformat 4"), e3.getMessage());

        var e4 = assertThrows(IllegalArgumentException.class, () -> NotebookJson.read(dir.resolve("missing.ipynb")));
        assertTrue(e4.getMessage().contains("does not exist"));

        var e5 = assertThrows(IllegalArgumentException.class, () -> NotebookJson.write(sample(), dir.resolve("no/such/folder/out.ipynb")));
        assertTrue(e5.getMessage().contains("does not exist"), e5.getMessage());
    }

    @Test
    void atomicWriteLeavesNoTemporaryFiles(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("out.ipynb");
        Files.writeString(f, "old");
        NotebookJson.write(sample(), f);
        try (var s = Files.list(dir)) {
            assertEquals(List.of(f), s.toList());
        }
        assertTrue(Files.readString(f).startsWith("{"));
    }
}
