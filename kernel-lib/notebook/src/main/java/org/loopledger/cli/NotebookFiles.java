package org.loopledger.cli;

import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookFile;
import org.loopledger.notebook.NotebookJson;
import org.loopledger.notebook.PlainTextNotebook;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.time.LocalDate;
import java.time.ZoneOffset;

/** Small helpers shared by the notebook commands. */
final class NotebookFiles {
    private NotebookFiles() {}

    /**
     * The executed notebook that goes with {@code input}: the input itself when it is an .ipynb; for a plain-text
     * notebook (.java, which holds no outputs) the NAME.ipynb beside it, which must exist and have the same sources.
     *
     * @param command the command, for messages
     */
    static Notebook executed(Path input, String command) {
        Notebook nb = NotebookFile.read(input);
        if (!NotebookFile.isPlainText(input)) return nb;
        Path paired = sibling(input, ".ipynb");
        String name = input.getFileName().toString();
        if (!Files.isRegularFile(paired)) {
            throw new IllegalArgumentException(name + " is a plain-text notebook and holds no outputs; '" + command + "' reads them from "
                    + paired.getFileName() + " beside it, which does not exist. Make it with './loopledger run " + input + " -o " + paired + "'");
        }
        Notebook stored = NotebookJson.read(paired);
        List<String> a = PlainTextNotebook.sourcesOf(nb), b = PlainTextNotebook.sourcesOf(stored);
        for (int i = 0; i < Math.max(a.size(), b.size()); i++) {
            if (i >= a.size() || i >= b.size() || !a.get(i).equals(b.get(i))) {
                throw new IllegalArgumentException(name + " and " + paired.getFileName() + " differ at cell " + (i + 1) + "; bring the .ipynb up to date with "
                        + "'./loopledger convert " + input + "' (keeps the outputs of unchanged cells), then './loopledger run " + paired + " --in-place'");
            }
        }
        System.err.println("loopledger " + command + ": " + name + " is a plain-text notebook; using the stored outputs of " + paired.getFileName()
                + " (same sources)");
        return stored;
    }

    static String libraryVersion() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "0.1.0-SNAPSHOT" : v;
    }

    /** Today's date in UTC (day precision: a record states the day it ran, not a timestamp). */
    static String today() { return LocalDate.now(ZoneOffset.UTC).toString(); }

    /** {@code dir/name.suffix} for an input {@code dir/name.ipynb} or {@code dir/name.java} (plain-text form). */
    static Path sibling(Path input, String suffix) {
        String name = input.getFileName().toString();
        String stem = name.endsWith(".ipynb") ? name.substring(0, name.length() - 6)
                : name.endsWith(PlainTextNotebook.SUFFIX) ? name.substring(0, name.length() - PlainTextNotebook.SUFFIX.length()) : name;
        Path dir = input.toAbsolutePath().getParent();
        return dir.resolve(stem + suffix);
    }
}
