package org.loopledger.cli;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.ident.demo.DemoDatasets;
import org.loopledger.ident.demo.GantryLoadCase;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The command line's promises about files, inputs and exit status, through {@link Main#commandLine()} as
 * {@code ./loopledger} calls it (in this JVM, so most cases cost no JVM start; the few that run cells
 * start the JShell agent JVM). Exit status convention (Main's Javadoc): 0 success, 1 the work failed,
 * 2 bad usage or input, 3 {@code run --allow-errors} with failed cells.
 */
class CliTrustTest {
    @TempDir
    Path dir;

    record Result(int exit, String stdout, String stderr) {
        String all() { return "exit " + exit + "\nstdout:\n" + stdout + "\nstderr:\n" + stderr; }
    }

    static Result cli(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream(), err = new ByteArrayOutputStream();
        PrintStream o = System.out, e = System.err;
        int exit;
        try {
            System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
            System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
            exit = Main.commandLine().execute(args);
        } finally {
            System.setOut(o);
            System.setErr(e);
        }
        return new Result(exit, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    /** A Java notebook whose code cells carry the given sources and (optionally) stored stdout outputs. */
    static String notebook(boolean executed, String[] sources, String[] storedStdout) {
        JsonObject nb = new JsonObject();
        JsonArray cells = new JsonArray();
        JsonObject md = new JsonObject();
        md.addProperty("cell_type", "markdown");
        md.add("metadata", new JsonObject());
        md.addProperty("source", "# Trust check\n");
        cells.add(md);
        for (int i = 0; i < sources.length; i++) {
            JsonObject c = new JsonObject();
            c.addProperty("cell_type", "code");
            c.add("metadata", new JsonObject());
            JsonArray outs = new JsonArray();
            if (storedStdout != null && storedStdout[i] != null) {
                JsonObject s = new JsonObject();
                s.addProperty("output_type", "stream");
                s.addProperty("name", "stdout");
                s.addProperty("text", storedStdout[i]);
                outs.add(s);
            }
            c.add("outputs", outs);
            if (storedStdout != null) c.addProperty("execution_count", i + 1);
            else c.add("execution_count", null);
            c.addProperty("source", sources[i]);
            cells.add(c);
        }
        nb.add("cells", cells);
        JsonObject meta = new JsonObject(), ks = new JsonObject();
        ks.addProperty("name", "loopledger");
        ks.addProperty("language", "java");
        meta.add("kernelspec", ks);
        if (executed) {
            JsonObject ll = new JsonObject();
            ll.addProperty("library_version", "0.1.0-SNAPSHOT");
            ll.addProperty("run_date", "2026-12-02");
            ll.addProperty("java_version", "17");
            ll.add("datasets", new JsonArray());
            meta.add("loopledger", ll);
        }
        nb.add("metadata", meta);
        nb.addProperty("nbformat", 4);
        nb.addProperty("nbformat_minor", 5);
        return nb.toString();
    }

    static String sha256(byte[] b) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
    }

    // ---- item 1: outputs that are the input, or a file of another kind, are refused (no cell runs) ----

    @Test
    void renderAndRunRefuseToWriteOverTheirInputOrAFileOfAnotherKind() throws Exception {
        Path nb = dir.resolve("executed.ipynb");
        String nbText = notebook(true, new String[] {"1 + 1"}, new String[] {"2\n"});
        Files.writeString(nb, nbText);
        Path log = dir.resolve("some-log.csv");
        String logText = "time_s,velocity_rad_s\n0,1\n";
        Files.writeString(log, logText);
        Path symlink = Files.createSymbolicLink(dir.resolve("link.ipynb"), nb);
        Path hardlink = Files.createLink(dir.resolve("hard.ipynb"), nb);
        Path dotted = dir.resolve(".").resolve("executed.ipynb"); // same file, different spelling
        Path notebookLike = dir.resolve("notes.txt");
        Files.writeString(notebookLike, "my notes, not a notebook\n");

        List<String[]> refused = List.of(
                new String[] {"render", nb.toString(), "-o", nb.toString()},
                new String[] {"render", nb.toString(), "-o", dotted.toString()},
                new String[] {"render", nb.toString(), "-o", symlink.toString()},
                new String[] {"render", nb.toString(), "-o", hardlink.toString()},
                new String[] {"render", nb.toString(), "-o", log.toString()},
                new String[] {"run", nb.toString(), "--html", nb.toString()},
                new String[] {"run", nb.toString(), "--html", symlink.toString()},
                new String[] {"run", nb.toString(), "-o", nb.toString()},
                new String[] {"run", nb.toString(), "-o", dotted.toString()},
                new String[] {"run", nb.toString(), "-o", hardlink.toString()},
                new String[] {"run", nb.toString(), "-o", log.toString()},
                new String[] {"run", nb.toString(), "-o", notebookLike.toString()},
                new String[] {"run", nb.toString(), "-o", dir.resolve("same.ipynb").toString(), "--html", dir.resolve("same.ipynb").toString()},
                new String[] {"run", nb.toString(), "--in-place", "--html", nb.toString()});
        for (String[] args : refused) {
            Result r = cli(args);
            String what = String.join(" ", args) + "\n" + r.all();
            assertEquals(2, r.exit(), what);
            assertTrue(r.stderr().contains("refusing to overwrite") || r.stderr().contains("same file"), what);
            assertFalse(r.stderr().contains("cell 1 of"), "refused before any cell ran: " + what);
            assertEquals(nbText, Files.readString(nb), "notebook untouched: " + what);
            assertEquals(logText, Files.readString(log), "drive log untouched: " + what);
            assertEquals("my notes, not a notebook\n", Files.readString(notebookLike), what);
            assertTrue(Files.isSymbolicLink(symlink), what);
            assertFalse(Files.exists(dir.resolve("same.ipynb")), what);
        }
        // An existing HTML file (an earlier record) may be replaced, through its own name.
        Path oldRecord = dir.resolve("record.html");
        Files.writeString(oldRecord, "<!DOCTYPE html>\n<html><body>old</body></html>\n");
        Result ok = cli("render", nb.toString(), "-o", oldRecord.toString());
        assertEquals(0, ok.exit(), ok.all());
        assertTrue(Files.readString(oldRecord).contains("Trust check"));
    }

    // ---- item 3: unwritable folders are found before any cell runs; stale temp files are cleaned ----

    @Test
    void anUnwritableFolderIsReportedBeforeAnyCellRunsAsPermissionDenied() throws Exception {
        Path nb = dir.resolve("nb.ipynb");
        Files.writeString(nb, notebook(false, new String[] {"System.out.println(\"ran\");"}, null));
        Path executed = dir.resolve("executed.ipynb");
        Files.writeString(executed, notebook(true, new String[] {"1 + 1"}, new String[] {"2\n"}));
        Path ro = Files.createDirectory(dir.resolve("read-only"));
        boolean root = "root".equals(System.getProperty("user.name"));
        // root ignores permission bits; an immutable folder (chattr +i, ext4) refuses even root.
        if (root) assertEquals(0, new ProcessBuilder("chattr", "+i", ro.toString()).inheritIO().start().waitFor(), "chattr +i");
        else Files.setPosixFilePermissions(ro, PosixFilePermissions.fromString("r-xr-xr-x"));
        try {
            Result run = cli("run", nb.toString(), "-o", ro.resolve("out.ipynb").toString());
            assertEquals(2, run.exit(), run.all());
            assertTrue(run.stderr().contains("permission denied"), run.all());
            assertTrue(run.stderr().contains(ro.toString()), "names the folder: " + run.all());
            assertFalse(run.stderr().contains("cell 1 of"), "no cell ran: " + run.all());
            Result html = cli("run", nb.toString(), "--html", ro.resolve("r.html").toString());
            assertEquals(2, html.exit(), html.all());
            assertTrue(html.stderr().contains("permission denied"), html.all());
            assertFalse(Files.exists(dir.resolve("nb.out.ipynb")), "nothing written when one output is impossible");
            Result render = cli("render", executed.toString(), "-o", ro.resolve("r.html").toString());
            assertEquals(2, render.exit(), render.all());
            assertTrue(render.stderr().contains("permission denied"), render.all());
        } finally {
            if (root) new ProcessBuilder("chattr", "-i", ro.toString()).inheritIO().start().waitFor();
            else Files.setPosixFilePermissions(ro, PosixFilePermissions.fromString("rwxr-xr-x"));
        }
    }

    @Test
    void staleTemporaryFilesOfAKilledWriteAreRemovedByTheNextWrite() throws Exception {
        Path nb = dir.resolve("executed.ipynb");
        Files.writeString(nb, notebook(true, new String[] {"1 + 1"}, new String[] {"2\n"}));
        Path record = dir.resolve("executed.html");
        // What a write killed with SIGKILL leaves: .NAME.PID.RANDOM.tmp (pid 2^31-2 exceeds Linux's pid_max 2^22, so it is dead).
        Path stale = dir.resolve(".executed.html.2147483646.42.tmp");
        Files.write(stale, new byte[1 << 20]);
        Path legacy = dir.resolve(".executed.html.123456789.tmp"); // the pattern before pids were in the name
        Files.write(legacy, new byte[10]);
        Files.setLastModifiedTime(legacy, java.nio.file.attribute.FileTime.fromMillis(System.currentTimeMillis() - 2 * 3_600_000L));
        long self = ProcessHandle.current().pid();
        Path live = dir.resolve(".executed.html." + self + ".7.tmp"); // a write in progress (this process): kept
        Files.write(live, new byte[10]);
        Path other = dir.resolve(".other.html.2147483646.42.tmp"); // another target's: not ours to judge here
        Files.write(other, new byte[10]);
        Path user = dir.resolve(".executed.html.notes.tmp"); // not our pattern: kept
        Files.write(user, new byte[10]);
        Result r = cli("render", nb.toString(), "-o", record.toString());
        assertEquals(0, r.exit(), r.all());
        assertFalse(Files.exists(stale), "stale temp of a dead writer removed");
        assertFalse(Files.exists(legacy), "old-pattern temp untouched for an hour removed");
        assertTrue(Files.exists(live) && Files.exists(other) && Files.exists(user), "only our own stale pattern, beside this target");
        try (var s = Files.list(dir)) {
            assertEquals(3, s.filter(p -> p.getFileName().toString().endsWith(".tmp")).count());
        }
    }

    // ---- item 7: malformed notebooks: exit 2 naming the file and the field ----

    @Test
    void aNotebookWithWrongTypesIsRefusedNamingTheFileAndTheField() throws Exception {
        String good = notebook(false, new String[] {"1 + 1"}, new String[] {"2\n"});
        record Case(String file, String json, String field) {}
        List<Case> cases = new ArrayList<>(List.of(
                new Case("source-object.ipynb", good.replace("\"source\":\"1 + 1\"", "\"source\":{}"), "cells[1].source"),
                new Case("outputs-object.ipynb", good.replaceFirst("\"outputs\":\\[[^]]*]", "\"outputs\":{}"), "cells[1].outputs"),
                new Case("stream-no-name.ipynb", good.replace("\"name\":\"stdout\",", ""), "cells[1].outputs[0].name"),
                new Case("nbformat-four.ipynb", good.replace("\"nbformat\":4", "\"nbformat\":\"four\""), "nbformat"),
                new Case("cell-number.ipynb", good.replace("\"cell_type\":\"markdown\"", "\"cell_type\":7"), "cells[0].cell_type"),
                new Case("dataset-bytes.ipynb", good.replace("\"kernelspec\":", "\"loopledger\":{\"datasets\":[{\"path\":\"a.csv\",\"bytes\":\"many\",\"sha256\":\"00\"}]},\"kernelspec\":"),
                        "metadata.loopledger.datasets[0].bytes"),
                new Case("deep.ipynb", good.replace("\"metadata\":{\"kernelspec\"", "\"metadata\":{\"deep\":" + "[".repeat(20_000) + "]".repeat(20_000)
                        + ",\"kernelspec\""), "nests deeper than")));
        for (Case c : cases) {
            assertNotEquals(good, c.json(), c.file() + ": the case must change the notebook");
            Path f = dir.resolve(c.file());
            Files.writeString(f, c.json());
            for (String cmd : new String[] {"run", "render", "verify"}) {
                Result r = cli(cmd, f.toString());
                assertEquals(2, r.exit(), cmd + " " + c.file() + "\n" + r.all());
                assertTrue(r.stderr().contains(f.toString()), "names the file: " + r.all());
                assertTrue(r.stderr().contains(c.field()), "names the field " + c.field() + ": " + r.all());
                assertFalse(r.stderr().contains("\tat "), "no stack trace: " + r.all());
            }
            assertEquals(c.json(), Files.readString(f));
            assertFalse(Files.exists(dir.resolve(c.file().replace(".ipynb", ".out.ipynb"))));
        }
    }

    // ---- items 8 and 9: every command takes --help; bad usage is exit 2 ----

    @Test
    void everyCommandAcceptsHelpAndBadUsageExitsWith2() throws Exception {
        for (String cmd : new String[] {"run", "verify", "render", "datasets", "kernel", "install", "convert"}) { // bench: in loopledger-app (BenchSubcommandTest)
            Result r = cli(cmd, "--help");
            assertEquals(0, r.exit(), cmd + " --help\n" + r.all());
            assertTrue(r.stdout().contains("Usage: loopledger " + cmd), r.all());
        }
        Result run = cli("run", "--help");
        for (String must : new String[] {"--allow-errors", "--cell-timeout", "--in-place", "NAME.failed.ipynb", "Exit status", "3"}) {
            assertTrue(run.stdout().replaceAll("\\s+", "").contains(must.replace(" ", "")), "run --help mentions " + must + ":\n" + run.stdout());
        }
        Result verify = cli("verify", "--help");
        assertTrue(verify.stdout().contains("SHA-256") && verify.stdout().contains("--cell-timeout"), "verify checks the datasets and has a cell timeout: " + verify.stdout());
        assertEquals(2, cli("run").exit(), "missing NOTEBOOK");
        assertEquals(2, cli("run", "x.ipynb", "--no-such-option").exit());
        assertEquals(2, cli("run", "x.ipynb", "--cell-timeout", "soon").exit());
        assertEquals(2, cli("no-such-command").exit());
        Result kernel = cli("kernel", dir.resolve("absent-connection.json").toString());
        assertEquals(2, kernel.exit(), kernel.all());
        assertTrue(kernel.stderr().contains("does not exist"), kernel.all());
        Result bench = cli("bench", "kernel");
        assertEquals(2, bench.exit(), "without loopledger-app on the class path there is no bench command: " + bench.all());
    }

    /** The repository's datasets/ (tests run in kernel-lib/ or the root). */
    static Path datasetsFolder() {
        for (Path d = Path.of("").toAbsolutePath(); d != null; d = d.getParent()) {
            if (Files.isRegularFile(d.resolve("datasets/README.md"))) return d.resolve("datasets");
        }
        throw new IllegalStateException("no datasets/ above " + Path.of("").toAbsolutePath());
    }

    // ---- item 10: the promised ./loopledger datasets exists, writes the committed bytes, refuses other files ----

    @Test
    void datasetsRegeneratesTheCommittedFilesAndNeverOverwritesAnotherKind() throws Exception {
        Path out = dir.resolve("data");
        Result r = cli("datasets", out.toString());
        assertEquals(0, r.exit(), r.all());
        Path committed = datasetsFolder();
        for (GantryLoadCase c : GantryLoadCase.values()) {
            assertEquals(sha256(Files.readAllBytes(committed.resolve(c.fileName()))), sha256(Files.readAllBytes(out.resolve(c.fileName()))), c.fileName());
        }
        String scope = org.loopledger.ident.demo.LinearAxisScope.FILE;
        assertEquals(sha256(Files.readAllBytes(committed.resolve(scope))), sha256(Files.readAllBytes(out.resolve(scope))), scope);
        assertEquals(Files.readString(committed.resolve("README.md")), Files.readString(out.resolve("README.md")));
        assertTrue(Files.readString(committed.resolve("README.md")).contains("./loopledger datasets"), "the README names the command that exists");
        // Again over its own files: allowed (same kind).
        assertEquals(0, cli("datasets", out.toString()).exit());
        // A user's own log under a demo name is not a demo log: refused, nothing written.
        Path mine = dir.resolve("mine");
        Files.createDirectories(mine);
        Files.writeString(mine.resolve(GantryLoadCase.HEAVY_HEAD.fileName()), "time_s,current_A\n0,1\n");
        Result refused = cli("datasets", mine.toString());
        assertEquals(2, refused.exit(), refused.all());
        assertTrue(refused.stderr().contains("refusing to overwrite"), refused.all());
        assertEquals("time_s,current_A\n0,1\n", Files.readString(mine.resolve(GantryLoadCase.HEAVY_HEAD.fileName())));
        try (var s = Files.list(mine)) {
            assertEquals(1, s.count(), "nothing else written");
        }
        assertEquals(DemoDatasets.HEADER, Files.readAllLines(out.resolve(GantryLoadCase.EMPTY_CARRIAGE.fileName())).get(0));
    }

    // ---- cases that run cells (each starts one JShell agent JVM) ----

    static JsonObject loopledgerMeta(Path nb) throws IOException {
        return JsonParser.parseString(Files.readString(nb)).getAsJsonObject().getAsJsonObject("metadata").getAsJsonObject("loopledger");
    }

    /** Item 2: a failing --in-place run costs no stored output; --allow-errors runs on and says so in its exit status. */
    @Test
    void aFailedInPlaceRunLeavesTheNotebookAloneAndAllowErrorsRunsEveryCell() throws Exception {
        Path nb = dir.resolve("tuning.ipynb");
        String stored = notebook(true, new String[] {"int a = 1;", "if (a == 1) throw new IllegalStateException(\"gain table missing\");",
                "System.out.println(\"later \" + a);"}, new String[] {null, null, "stored result of an earlier good run\n"});
        Files.writeString(nb, stored);
        Result r = cli("run", nb.toString(), "--in-place");
        assertEquals(1, r.exit(), r.all());
        assertEquals(stored, Files.readString(nb), "the notebook keeps every stored output");
        Path partial = dir.resolve("tuning.failed.ipynb");
        assertTrue(r.stderr().contains("left unchanged") && r.stderr().contains(partial.toString()), "says where the partial result went: " + r.all());
        String p = Files.readString(partial);
        assertTrue(p.contains("gain table missing"), "the error is in the partial result");
        assertEquals(3, loopledgerMeta(partial).getAsJsonArray("failed_cells").get(0).getAsJsonObject().get("cell").getAsInt(),
                "the metadata names the failed notebook cell");

        Path all = dir.resolve("all.ipynb");
        Result allowed = cli("run", nb.toString(), "--allow-errors", "-o", all.toString());
        assertEquals(RunCommand.EXIT_CELLS_FAILED, allowed.exit(), allowed.all());
        assertTrue(allowed.stderr().contains("1 of 3 code cells failed") && allowed.stderr().contains("cell 3 (") && allowed.stderr().contains("IllegalStateException: gain table missing"), allowed.all());
        String out = Files.readString(all);
        assertTrue(out.contains("later 1") && out.contains("gain table missing"), "every cell ran and the error is recorded: " + out);
        assertEquals(stored, Files.readString(nb));
    }

    /**
     * Items 4 and 5: a cell that replaces System.out cannot hide the data read, and verify fails on a changed
     * dataset even when no output depends on the changed column.
     */
    @Test
    void provenanceSurvivesSetOutAndVerifyChecksEveryDatasetDigest() throws Exception {
        Path csv = dir.resolve("axis-log.csv");
        Files.writeString(csv, "position_rad,velocity_rad_s\n1.0,10\n2.0,20\n");
        String path = csv.toString().replace("\\", "\\\\");
        Path nb = dir.resolve("quiet.ipynb");
        Files.writeString(nb, notebook(false, new String[] {
                "System.setOut(new java.io.PrintStream(java.io.OutputStream.nullOutputStream()));",
                "var csv = java.nio.file.Path.of(\"" + path + "\");\norg.loopledger.provenance.Provenance.recordDataset(csv);\n"
                        + "double sum = java.nio.file.Files.readAllLines(csv).stream().skip(1).mapToDouble(l -> Double.parseDouble(l.split(\",\")[0])).sum();",
                "System.err.println(\"sum of positions = \" + sum);"}, null));
        Path out = dir.resolve("quiet.out.ipynb");
        Result r = cli("run", nb.toString());
        assertEquals(0, r.exit(), r.all());
        JsonArray ds = loopledgerMeta(out).getAsJsonArray("datasets");
        assertEquals(1, ds.size(), "the dataset is recorded although System.out was replaced: " + ds);
        assertEquals(sha256(Files.readAllBytes(csv)), ds.get(0).getAsJsonObject().get("sha256").getAsString());
        assertTrue(Files.readString(out).contains("sum of positions = 3.0"));
        // Change only the column no output depends on.
        Files.writeString(csv, "position_rad,velocity_rad_s\n1.0,10\n2.0,21\n");
        Result v = cli("verify", out.toString());
        assertEquals(1, v.exit(), v.all());
        assertTrue(v.stdout().contains("all 3 code cells reproduce"), "the outputs alone would pass: " + v.all());
        assertTrue(v.stdout().contains("DATA DIFFERS") && v.stdout().contains(csv.toString()) && v.stdout().contains("read by cell 3"),
                "names the dataset and the cell that read it: " + v.all());
    }

    /** Item 6: an endless cell is stopped after --cell-timeout, named by index and first line; the run fails. */
    @Test
    void anEndlessCellIsStoppedAfterTheCellTimeoutAndNamed() throws Exception {
        Path nb = dir.resolve("loops.ipynb");
        Files.writeString(nb, notebook(false, new String[] {"int spins = 0;", "while (true) { spins++; }", "System.out.println(\"never\");"}, null));
        long t0 = System.nanoTime();
        Result r = cli("run", nb.toString(), "--cell-timeout", "3s");
        double s = (System.nanoTime() - t0) / 1e9;
        assertEquals(1, r.exit(), r.all());
        assertTrue(r.stderr().contains("code cell 2 (notebook cell 3, first line: while (true) { spins++; })")
                && r.stderr().contains("cell timeout of 3 s"), r.all());
        String out = Files.readString(dir.resolve("loops.out.ipynb"));
        assertTrue(out.contains("CellTimeout") && !out.contains("never\\n"), out);
        assertTrue(s < 120, "the run ended (took " + s + " s)");
    }
}
