package org.loopledger.cli;

import com.google.gson.stream.JsonReader;
import com.google.gson.stream.JsonToken;
import org.loopledger.ident.demo.DemoDatasets;
import org.loopledger.notebook.AtomicFiles;

import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Checks an output path before anything runs, so a command never writes over its input or over a file
 * of another kind, and a folder it cannot write into is reported before the first cell, not after the
 * last. Every refusal is an {@link IllegalArgumentException} naming the file and the way out.
 *
 * <p>"Same file" is {@link Files#isSameFile}: symbolic links, hard links and {@code ./} spellings of
 * the input count as the input.
 */
final class OutputTargets {
    /** What a command writes. */
    enum Kind {
        NOTEBOOK("notebook (.ipynb)"), HTML("HTML file"), CSV_LOG("drive log CSV with header " + DemoDatasets.HEADER),
        SCOPE_LOG("demo scope export with first line '" + org.loopledger.ident.demo.LinearAxisScope.FIRST_LINE + "'"),
        DATASETS_README("demo datasets README (first line '" + DemoDatasets.readmeTitle() + "')");

        final String description;

        Kind(String description) { this.description = description; }
    }

    private OutputTargets() {}

    /**
     * Refuses {@code target} unless it can take the output: its folder exists and is writable, it is not
     * a folder, not one of {@code inputs} (unless {@code mayReplaceInput}), and, if it exists, of
     * {@code kind} already (or empty). Removes stale temporary files of earlier killed writes beside it.
     *
     * @param option how the user named this output in the command, for messages ("-o", "--html")
     */
    static void check(Path target, Kind kind, String option, boolean mayReplaceInput, Path... inputs) {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new IllegalArgumentException("the folder of " + target + " does not exist; create it first or choose another path");
        }
        if (Files.isDirectory(target)) {
            throw new IllegalArgumentException(option + " " + target + " is a folder; give a file name, e.g. " + target.resolve("record." + (kind == Kind.HTML ? "html" : "ipynb")));
        }
        for (Path input : inputs) {
            if (input != null && sameFile(input, target)) {
                if (mayReplaceInput) continue;
                throw new IllegalArgumentException(option + " " + target + " is the input " + input + " itself; refusing to overwrite it"
                        + (kind == Kind.NOTEBOOK ? ". Use --in-place to replace the notebook's outputs on purpose, or choose another output path"
                        : ". Choose another path for the " + kind.description));
            }
        }
        if (Files.exists(target) && !isOfKind(target, kind)) {
            throw new IllegalArgumentException(option + " " + target + " exists and is not a " + kind.description
                    + "; refusing to overwrite it. Choose another path, or move that file away first");
        }
        AtomicFiles.requireWritableFolder(dir, target);
        AtomicFiles.cleanStaleTemps(abs);
    }

    /** Two outputs of one command must differ. */
    static void requireDistinct(Path a, String optionA, Path b, String optionB) {
        if (a != null && b != null && sameFile(a, b)) {
            throw new IllegalArgumentException(optionA + " " + a + " and " + optionB + " " + b + " are the same file; give them different paths");
        }
    }

    /** Same file on disk (links followed) when both exist; same normalised real location otherwise. */
    static boolean sameFile(Path a, Path b) {
        try {
            if (Files.exists(a) && Files.exists(b)) return Files.isSameFile(a, b);
            return canonical(a).equals(canonical(b));
        } catch (IOException e) {
            return canonical(a).equals(canonical(b));
        }
    }

    private static Path canonical(Path p) {
        Path abs = p.toAbsolutePath().normalize();
        Path dir = abs.getParent();
        try {
            return dir == null ? abs : dir.toRealPath().resolve(abs.getFileName());
        } catch (IOException e) {
            return abs;
        }
    }

    /** Whether an existing file already holds output of {@code kind} (an empty file counts as any kind). */
    static boolean isOfKind(Path file, Kind kind) {
        if (!Files.isRegularFile(file)) return false;
        try {
            if (Files.size(file) == 0) return true;
            return switch (kind) {
                case HTML -> looksLikeHtml(file);
                case NOTEBOOK -> looksLikeNotebook(file);
                case CSV_LOG -> firstLine(file).equals(DemoDatasets.HEADER);
                case SCOPE_LOG -> firstLine(file).equals(org.loopledger.ident.demo.LinearAxisScope.FIRST_LINE);
                case DATASETS_README -> firstLine(file).equals(DemoDatasets.readmeTitle());
            };
        } catch (IOException | RuntimeException e) {
            return false;
        }
    }

    private static boolean looksLikeHtml(Path file) throws IOException {
        byte[] head;
        try (InputStream in = Files.newInputStream(file)) {
            head = in.readNBytes(512);
        }
        String s = new String(head, StandardCharsets.UTF_8).replace("\uFEFF", "").stripLeading().toLowerCase(Locale.ROOT);
        return s.startsWith("<!doctype html") || s.startsWith("<html");
    }

    /** A JSON object with a top-level {@code nbformat} member (read as a stream: any size, bounded nesting). */
    private static boolean looksLikeNotebook(Path file) throws IOException {
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8); JsonReader json = new JsonReader(r)) {
            if (json.peek() != JsonToken.BEGIN_OBJECT) return false;
            json.beginObject();
            while (json.hasNext()) {
                if (json.nextName().equals("nbformat")) return true;
                json.skipValue();
            }
            return false;
        }
    }

    private static String firstLine(Path file) throws IOException {
        try (var r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String line = r.readLine();
            return line == null ? "" : line.replace("\uFEFF", "").strip();
        }
    }
}
