package org.loopledger.notebook;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopledger.cli.Main;
import org.loopledger.testing.PythonOracle;
import picocli.CommandLine;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The committed demo notebooks in {@code notebooks/}: each is valid nbformat 4 by Jupyter's own
 * validator (Debian python3-nbformat, the outside reference), carries its stored outputs, opens with
 * what it does and the safety caution, and reproduces: {@code loopledger verify} re-executes it and
 * finds every output as stored (exit status 0). Surefire runs in {@code kernel-lib/}, so the notebooks
 * find {@code ../datasets} as they would {@code datasets} from the repository root.
 */
class DemoNotebooksTest {
    static JsonObject validation;

    static Path folder() {
        for (String p : new String[] {"notebooks", "../notebooks"}) {
            if (Files.isDirectory(Path.of(p))) return Path.of(p);
        }
        throw new AssertionError("notebooks/ not found from " + Path.of("").toAbsolutePath());
    }

    static List<Path> notebooks() throws IOException {
        try (Stream<Path> s = Files.list(folder())) {
            return s.filter(p -> p.getFileName().toString().endsWith(".ipynb")).sorted().toList();
        }
    }

    @BeforeAll
    static void validateAllWithNbformat() throws IOException {
        PythonOracle.require("nbformat");
        JsonArray paths = new JsonArray();
        for (Path p : notebooks()) paths.add(p.toString());
        // one Python process for all notebooks: nbformat.validate against the v4 schema, plus the facts below
        validation = PythonOracle.run("""
                import json, sys, nbformat
                out = {}
                for p in json.load(sys.stdin)["paths"]:
                    nb = nbformat.read(p, as_version=4)
                    try:
                        nbformat.validate(nb)
                        err = None
                    except nbformat.ValidationError as e:
                        err = str(e)[:500]
                    code = [c for c in nb.cells if c.cell_type == "code"]
                    out[p] = {"error": err, "minor": nb.nbformat_minor,
                              "kernel": nb.metadata.get("kernelspec", {}).get("name"),
                              "language": nb.metadata.get("language_info", {}).get("name"),
                              "first": nb.cells[0].cell_type + ":" + nb.cells[0].source if nb.cells else "",
                              "code": len(code), "executed": sum(1 for c in code if c.execution_count is not None),
                              "errors": sum(1 for c in code for o in c.outputs if o.output_type == "error"),
                              "ids": len(set(c.id for c in nb.cells)) == len(nb.cells)}
                print(json.dumps(out))
                """, Map.of("paths", paths)).getAsJsonObject();
    }

    @Test
    void theDemoNotebooksArePresent() throws IOException {
        List<String> names = notebooks().stream().map(p -> p.getFileName().toString()).toList();
        assertTrue(names.contains("01-identify-axis-x.ipynb"), names.toString());
        assertTrue(names.contains("04-reference-checks.ipynb"), names.toString());
    }

    @ParameterizedTest
    @MethodSource("notebooks")
    void validNbformatWithStoredOutputsAndTheCaution(Path nb) {
        JsonElement e = validation.get(nb.toString());
        assertNotNull(e, "not validated: " + nb);
        JsonObject v = e.getAsJsonObject();
        assertTrue(v.get("error").isJsonNull(), nb + ": " + v.get("error"));
        assertEquals(5, v.get("minor").getAsInt(), "nbformat 4.5 (cell ids)");
        assertTrue(v.get("ids").getAsBoolean(), "unique cell ids");
        assertEquals("loopledger", v.get("kernel").getAsString());
        assertEquals("java", v.get("language").getAsString());
        int code = v.get("code").getAsInt();
        assertTrue(code > 3, nb + " has only " + code + " code cells");
        assertEquals(code, v.get("executed").getAsInt(), nb + ": every code cell has stored outputs (run it with --in-place)");
        assertEquals(0, v.get("errors").getAsInt(), nb + ": no stored error outputs");
        String first = v.get("first").getAsString();
        assertTrue(first.startsWith("markdown:# "), "opens with a Markdown title: " + first.lines().findFirst().orElse(""));
        for (String must : new String[] {"What this notebook does", "Caution", "reduced current and speed limits", "emergency stop",
                "risk assessment", "ISO 12100", "IEC 60204-1", "not a certification"}) {
            // Markdown wraps lines (and block quotes start them with '>'): compare on the text as read
            String flat = first.replaceAll("\\s*\\n\\s*(>\\s*)?", " ");
            assertTrue(flat.contains(must), nb + ": the opening cell must state \"" + must + "\"");
        }
    }

    @ParameterizedTest
    @MethodSource("notebooks")
    void verifyReproducesEveryStoredOutput(Path nb) {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream out = System.out, err = System.err;
        PrintStream tee = new PrintStream(buf, true, StandardCharsets.UTF_8);
        int status;
        try {
            System.setOut(tee);
            System.setErr(tee);
            status = new CommandLine(new Main()).execute("verify", nb.toString());
        } finally {
            System.setOut(out);
            System.setErr(err);
        }
        String report = buf.toString(StandardCharsets.UTF_8);
        out.println(report);
        assertEquals(0, status, nb + " does not reproduce:\n" + report);
        assertTrue(report.contains("code cells reproduce"), report);
    }
}
