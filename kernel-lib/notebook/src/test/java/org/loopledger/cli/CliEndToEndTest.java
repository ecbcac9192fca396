package org.loopledger.cli;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.Chromium;
import org.loopledger.testing.PythonOracle;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * {@code loopledger run}, {@code verify} and {@code render} as a user runs them: a separate JVM on the
 * test class path, exit codes and messages checked, files inspected afterwards. Outside references:
 * Jupyter's nbformat (Debian python3-nbformat) validates what {@code run} writes; headless Chromium
 * loads the record it writes.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class CliEndToEndTest {
    @TempDir
    static Path dir;
    static Path notebook;
    static Path executed;
    static Path record;
    static byte[] inputBytes;
    static FileTime inputTime;
    static Result firstRun;

    /** What one command printed and returned. */
    record Result(int exit, String stdout, String stderr) {
        String all() { return stdout + "\n" + stderr; }
    }

    static Result loopledger(String... args) throws IOException, InterruptedException {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString()));
        cmd.addAll(org.loopledger.kernel.session.SessionOptions.HOST_FLAGS);
        cmd.addAll(List.of("-cp", System.getProperty("java.class.path"), "org.loopledger.cli.Main"));
        cmd.addAll(List.of(args));
        Path out = Files.createTempFile(dir, "out", ".txt"), err = Files.createTempFile(dir, "err", ".txt");
        Process p = new ProcessBuilder(cmd).directory(dir.toFile()).redirectOutput(out.toFile()).redirectError(err.toFile()).start();
        // A run starts a JVM and a JShell session; on a loaded two-core machine that takes up to a minute.
        if (!p.waitFor(300, TimeUnit.SECONDS)) {
            p.descendants().forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            fail("loopledger " + String.join(" ", args) + " did not finish in 300 s");
        }
        Result r = new Result(p.exitValue(), Files.readString(out), Files.readString(err));
        Files.delete(out);
        Files.delete(err);
        return r;
    }

    /** A notebook (nbformat 4.5) of Java code cells, with a Markdown title first. */
    static String notebookJson(String title, String language, int nbformat, String... codeCells) {
        JsonObject nb = new JsonObject();
        JsonArray cells = new JsonArray();
        JsonObject md = new JsonObject();
        md.addProperty("cell_type", "markdown");
        md.add("metadata", new JsonObject());
        md.addProperty("source", "# " + title + "\nAn end-to-end check of the runner.\n");
        cells.add(md);
        for (String src : codeCells) {
            JsonObject c = new JsonObject();
            c.addProperty("cell_type", "code");
            c.add("metadata", new JsonObject());
            c.add("outputs", new JsonArray());
            c.add("execution_count", null);
            c.addProperty("source", src);
            cells.add(c);
        }
        nb.add("cells", cells);
        JsonObject meta = new JsonObject(), ks = new JsonObject();
        ks.addProperty("name", "loopledger");
        ks.addProperty("display_name", "Java (Loopledger)");
        ks.addProperty("language", language);
        meta.add("kernelspec", ks);
        nb.add("metadata", meta);
        nb.addProperty("nbformat", nbformat);
        nb.addProperty("nbformat_minor", 4);
        return nb.toString();
    }

    static final String READ_CSV = """
            var csv = java.nio.file.Path.of("gains.csv");
            org.loopledger.provenance.Provenance.recordDataset(csv);
            double sum = java.nio.file.Files.readAllLines(csv).stream().skip(1).mapToDouble(Double::parseDouble).sum();
            System.out.println("sum of gains = " + sum);""";
    static final String BODE_OF_CSV = """
            var g = TransferFunction.continuous(new double[] {sum}, new double[] {1, 1});
            BodePlot.of("G", Frf.ofModel(g, FrequencyGrid.logSpacedRadPerS(0.01, 100, 200)))""";
    static final String SPEC = """
            Spec.builder().minPhaseMarginDeg(45).minGainMarginDb(6).build()
                .check(TransferFunction.continuous(new double[] {2}, new double[] {1, 3, 3, 1}))""";

    @BeforeAll
    static void runOnce() throws Exception {
        Files.writeString(dir.resolve("gains.csv"), "gain\n1.5\n2.5\n");
        notebook = dir.resolve("gains.ipynb");
        Files.writeString(notebook, notebookJson("Gain check", "java", 4, READ_CSV, BODE_OF_CSV, SPEC));
        inputBytes = Files.readAllBytes(notebook);
        inputTime = Files.getLastModifiedTime(notebook);
        executed = dir.resolve("gains.out.ipynb");
        record = dir.resolve("gains.html");
        firstRun = loopledger("run", notebook.toString(), "--html", record.toString());
    }

    @Test
    @Order(1)
    void runWritesTheExecutedNotebookBesideTheInputAndLeavesTheInputAlone() throws Exception {
        assertEquals(0, firstRun.exit(), firstRun.all());
        assertArrayEquals(inputBytes, Files.readAllBytes(notebook), "input untouched");
        assertEquals(inputTime, Files.getLastModifiedTime(notebook));
        assertTrue(Files.exists(executed) && Files.exists(record));
        try (Stream<Path> s = Files.list(dir)) {
            assertEquals(List.of(), s.filter(p -> p.getFileName().toString().endsWith(".tmp")).toList(), "no temporary file left behind");
        }
        assertTrue(firstRun.stderr().contains("cell 1 of 3") && firstRun.stderr().contains("cell 3 of 3"), "progress per cell: " + firstRun.stderr());
        String nb = Files.readString(executed);
        assertTrue(nb.contains("sum of gains = 4.0"), "stream output stored");
        assertTrue(nb.contains("application/vnd.loopledger.plot-data+json") && nb.contains("image/png"));
        assertFalse(nb.contains("image/svg+xml"), "plots are stored as PNG + plot data (issue 11: nbconvert 6.5 blanks SVG)");
        assertTrue(nb.contains("application/vnd.loopledger.spec-report+json"));
        JsonObject meta = JsonParser.parseString(nb).getAsJsonObject().getAsJsonObject("metadata").getAsJsonObject("loopledger");
        JsonObject ds = meta.getAsJsonArray("datasets").get(0).getAsJsonObject();
        assertEquals("gains.csv", ds.get("path").getAsString());
        // SHA-256 of "gain\n1.5\n2.5\n" (sha256sum of the same bytes, coreutils).
        assertEquals(sha256sum(dir.resolve("gains.csv")), ds.get("sha256").getAsString());
        String html = Files.readString(record);
        assertTrue(html.contains(sha256sum(dir.resolve("gains.csv"))), "the record states the dataset digest");
        // PM 67.6 deg >= 45 and GM 12.04 dB >= 6 of 2/(s+1)^3 (by hand, see MarginsRendererTest): the summary lists one check, met.
        assertTrue(html.contains("1 spec check(s), all met."), "the record's closing summary lists the spec check");
    }

    static String sha256sum(Path f) throws Exception {
        Process p = new ProcessBuilder("sha256sum", f.toString()).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertEquals(0, p.waitFor());
        return out.split("\\s+")[0];
    }

    @Test
    @Order(2)
    void whatRunWritesValidatesWithNbformat() {
        PythonOracle.require("nbformat");
        JsonElement r = PythonOracle.run("""
                import json, sys, nbformat
                out = {}
                for p in json.load(sys.stdin)["paths"]:
                    try:
                        nb = nbformat.read(p, as_version=4)
                        nbformat.validate(nb)
                        out[p] = "valid"
                    except Exception as e:
                        out[p] = repr(e)
                print(json.dumps(out))
                """, Map.of("paths", List.of(executed.toString())));
        assertEquals("valid", r.getAsJsonObject().get(executed.toString()).getAsString());
    }

    @Test
    @Order(3)
    void verifyPassesOnTheUnchangedNotebook() throws Exception {
        Result r = loopledger("verify", executed.toString());
        assertEquals(0, r.exit(), r.all());
        assertTrue(r.stdout().contains("all 3 code cells reproduce"), r.stdout());
    }

    @Test
    @Order(4)
    void renderRewritesTheSameRecordDeterministically() throws Exception {
        Path again = dir.resolve("again.html");
        Result r = loopledger("render", executed.toString(), "-o", again.toString());
        assertEquals(0, r.exit(), r.all());
        // The same record as run wrote, except that it names the file it was rendered from.
        assertEquals(Files.readString(record).replace("<td>gains.ipynb</td>", "<td>gains.out.ipynb</td>"), Files.readString(again),
                "render of the executed notebook = the record run wrote");
        Result twice = loopledger("render", executed.toString(), "-o", dir.resolve("twice.html").toString());
        assertEquals(0, twice.exit(), twice.all());
        assertArrayEquals(Files.readAllBytes(again), Files.readAllBytes(dir.resolve("twice.html")), "two renders are byte-identical");
        Result bad = loopledger("render", notebook.toString(), "-o", dir.resolve("never.html").toString());
        assertEquals(2, bad.exit(), bad.all());
        assertTrue(bad.stderr().contains("has not been executed"), bad.stderr());
        assertFalse(Files.exists(dir.resolve("never.html")));
    }

    @Test
    @Order(5)
    void theRecordOfARealRunRendersInChromium() {
        Chromium.require();
        JsonObject layout = Chromium.layout(dir, record, 1000);
        assertEquals(0, layout.getAsJsonArray("resources").size(), layout.get("resources").toString());
        assertEquals(0, layout.get("scripts").getAsInt());
        assertEquals(1, layout.getAsJsonArray("images").size(), "one Bode figure");
        JsonObject img = layout.getAsJsonArray("images").get(0).getAsJsonObject();
        assertTrue(img.get("naturalWidth").getAsDouble() > 0 && img.get("width").getAsDouble() > 0 && img.get("height").getAsDouble() > 0, img.toString());
        assertEquals(List.of(), Chromium.screenshot(dir, record, 1000, 2500).consoleMessages());
    }

    @Test
    @Order(6)
    void aChangedDatasetMakesVerifyFailAndNameTheCells() throws Exception {
        Path copy = dir.resolve("changed");
        Files.createDirectories(copy);
        Files.writeString(copy.resolve("gains.csv"), "gain\n1.5\n2.6\n");
        Files.copy(executed, copy.resolve("gains.out.ipynb"));
        // verify runs in the notebook's session folder (the working directory), where gains.csv now differs.
        Result r = loopledgerIn(copy, "verify", "gains.out.ipynb");
        assertEquals(1, r.exit(), r.all());
        assertTrue(r.stdout().contains("cell 2: DIFFERS") && r.stdout().contains("4.0 became 4.1"), r.stdout());
        assertTrue(r.stdout().contains("cell 3: DIFFERS") && r.stdout().contains("plot-data"), "the plot differs through its data: " + r.stdout());
        assertTrue(r.stdout().contains("cell 4: reproduces"), "a cell that does not read the data still reproduces: " + r.stdout());
        assertTrue(r.stdout().contains("2 of 3 code cells differ"), r.stdout());
    }

    static Result loopledgerIn(Path workDir, String... args) throws IOException, InterruptedException {
        Path saved = dir;
        try {
            dir = workDir;
            return loopledger(args);
        } finally {
            dir = saved;
        }
    }

    @Test
    @Order(7)
    void inPlaceRewritesOnlyWhenAsked() throws Exception {
        Path nb = dir.resolve("inplace.ipynb");
        Files.writeString(nb, notebookJson("In place", "java", 4, "1 + 1"));
        Result r = loopledger("run", nb.toString(), "--in-place");
        assertEquals(0, r.exit(), r.all());
        JsonObject code = JsonParser.parseString(Files.readString(nb)).getAsJsonObject().getAsJsonArray("cells").get(1).getAsJsonObject();
        assertEquals(1, code.get("execution_count").getAsInt());
        JsonObject result = code.getAsJsonArray("outputs").get(0).getAsJsonObject();
        assertEquals("2", String.join("", new com.google.gson.Gson().fromJson(result.getAsJsonObject("data").get("text/plain"), String[].class)));
        assertFalse(Files.exists(dir.resolve("inplace.out.ipynb")), "no sibling written with --in-place");
        Result both = loopledger("run", nb.toString(), "--in-place", "-o", dir.resolve("x.ipynb").toString());
        assertEquals(2, both.exit(), both.all());
    }

    @Test
    @Order(8)
    void badInputGivesAClearErrorExitCode2AndLeavesTheInputUntouched() throws Exception {
        record Case(String file, String content, String expected, String[] extra) {}
        List<Case> cases = List.of(
                new Case("notjson.ipynb", "this is { not json", "not valid JSON", new String[0]),
                new Case("python.ipynb", notebookJson("Py", "python", 4, "print(1)"), "kernel language 'python'", new String[0]),
                new Case("v3.ipynb", "{\"nbformat\": 3, \"nbformat_minor\": 0, \"metadata\": {}, \"worksheets\": []}", "nbformat 3", new String[0]),
                new Case("nofolder.ipynb", notebookJson("Ok", "java", 4, "1"), "does not exist",
                        new String[] {"-o", dir.resolve("no/such/folder/out.ipynb").toString()}));
        for (Case c : cases) {
            Path f = dir.resolve(c.file());
            Files.writeString(f, c.content());
            List<String> args = new ArrayList<>(List.of("run", f.toString()));
            args.addAll(List.of(c.extra()));
            Result r = loopledger(args.toArray(String[]::new));
            assertEquals(2, r.exit(), c.file() + ": " + r.all());
            assertTrue(r.stderr().contains(c.expected()), c.file() + ": " + r.stderr());
            assertEquals(c.content(), Files.readString(f), c.file() + " untouched");
            assertFalse(Files.exists(dir.resolve(c.file().replace(".ipynb", ".out.ipynb"))), c.file() + ": no output written");
        }
        assertFalse(Files.exists(dir.resolve("no")));
        Result missing = loopledger("verify", dir.resolve("absent.ipynb").toString());
        assertEquals(2, missing.exit());
        assertTrue(missing.stderr().contains("does not exist"), missing.stderr());
    }

    @Test
    @Order(9)
    void aFailingCellOrAMissingDatasetNamesTheCellAndExitsNonZero() throws Exception {
        Path nb = dir.resolve("fails.ipynb");
        String content = notebookJson("Fails", "java", 4, "int a = 1;",
                "var log = org.loopledger.provenance.Provenance.recordDataset(java.nio.file.Path.of(\"missing-log.csv\"));",
                "System.out.println(\"never runs\");");
        Files.writeString(nb, content);
        Result r = loopledger("run", nb.toString());
        assertNotEquals(0, r.exit(), r.all());
        assertTrue(r.stderr().contains("cell 3 failed"), "names the notebook cell: " + r.stderr());
        assertTrue(r.stderr().contains("missing-log.csv"), "names the missing dataset: " + r.stderr());
        assertEquals(content, Files.readString(nb), "input untouched");
        String out = Files.readString(dir.resolve("fails.out.ipynb"));
        assertTrue(out.contains("\"output_type\": \"error\""), "the error is stored for the reader");
        assertFalse(out.contains("never runs\\n\""), "cells after the failure do not run");
    }
}
