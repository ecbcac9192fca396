package org.loopledger.cli;

import org.loopledger.notebook.AtomicFiles;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookJson;
import org.loopledger.notebook.NotebookRunner;
import org.loopledger.notebook.RecordRenderer;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code loopledger run NOTEBOOK [-o OUT] [--html RECORD] [--in-place]}: headless execution. */
@Command(name = "run", description = "Execute a notebook headlessly and write its outputs (and optionally its HTML tuning record).")
final class RunCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "NOTEBOOK", description = "nbformat 4 notebook (.ipynb) written for the Loopledger kernel")
    Path notebook;

    @Option(names = {"-o", "--output"}, paramLabel = "OUT.ipynb", description = "where to write the executed notebook (default: NAME.out.ipynb beside the input)")
    Path output;

    @Option(names = "--in-place", description = "write the outputs back into NOTEBOOK itself (atomically)")
    boolean inPlace;

    @Option(names = "--html", paramLabel = "RECORD.html", description = "also write the self-contained HTML tuning record")
    Path html;

    @Override
    public Integer call() {
        Notebook nb;
        try {
            nb = NotebookJson.read(notebook);
            if (inPlace && output != null) throw new IllegalArgumentException("give either -o OUT.ipynb or --in-place, not both");
            Path target = inPlace ? notebook : output != null ? output : NotebookFiles.sibling(notebook, ".out.ipynb");
            requireFolder(target);
            if (html != null) requireFolder(html);
            System.err.println("loopledger: running " + notebook + " (" + nb.codeCells().size() + " code cells)");
            NotebookRunner.Outcome out;
            try (SessionEngine engine = SessionEngine.start()) {
                out = NotebookRunner.run(nb, engine, NotebookFiles.libraryVersion(), NotebookFiles.today(), System.err::println);
            }
            NotebookJson.write(out.executed(), target);
            System.err.println("loopledger: wrote " + target);
            if (html != null) {
                var info = NotebookRunner.recordInfo(out.executed(), notebook.getFileName().toString(), System.getProperty("java.version"));
                AtomicFiles.writeString(html, RecordRenderer.render(out.executed(), info, notebook.toAbsolutePath().getParent()));
                System.err.println("loopledger: wrote record " + html);
            }
            if (!out.succeeded()) {
                System.err.println("loopledger: cell " + out.failedCellNumber() + " failed: " + out.failure());
                return 1;
            }
            System.err.printf(java.util.Locale.ROOT, "loopledger: all cells ran in %.1f s%n", out.elapsed().toMillis() / 1000.0);
            return 0;
        } catch (IllegalArgumentException e) {
            System.err.println("loopledger run: " + e.getMessage());
            return 2;
        }
    }

    static void requireFolder(Path file) {
        Path dir = file.toAbsolutePath().getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new IllegalArgumentException("the folder of " + file + " does not exist; create it first or choose another path");
        }
    }
}
