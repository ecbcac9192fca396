package org.loopledger.cli;

import org.loopledger.notebook.AtomicFiles;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookFile;
import org.loopledger.notebook.NotebookJson;
import org.loopledger.notebook.NotebookRunner;
import org.loopledger.notebook.RecordRenderer;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.time.Duration;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

/** {@code loopledger run NOTEBOOK [-o OUT] [--html RECORD] [--in-place] [--allow-errors] [--cell-timeout T]}: headless execution. */
@Command(name = "run", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = {"Execute a notebook headlessly and write its outputs (and optionally its HTML tuning record).",
                "Never writes over the input (unless --in-place) or over an existing file that is not of the kind written.",
                "A run stops at the first failing cell; cells after it are written without outputs. With --in-place a failed run",
                "leaves the notebook untouched and writes the partial result to NAME.failed.ipynb beside it."},
        exitCodeListHeading = "Exit status:%n",
        exitCodeList = {"0:every cell ran without error", "1:a cell failed or ran out of time (the run stopped there)",
                "2:bad usage or input: nothing was run or written", "3:with --allow-errors: every cell ran, some failed (listed on stderr)"})
final class RunCommand implements Callable<Integer> {
    /** Exit status of a run with {@code --allow-errors} in which some cells failed. */
    static final int EXIT_CELLS_FAILED = 3;

    @Parameters(index = "0", paramLabel = "NOTEBOOK", description = "nbformat 4 notebook (.ipynb) written for the Loopledger kernel, or its plain-text form (.java)")
    Path notebook;

    @Option(names = {"-o", "--output"}, paramLabel = "OUT.ipynb", description = "where to write the executed notebook (default: NAME.out.ipynb beside the input)")
    Path output;

    @Option(names = "--in-place", description = "write the outputs back into NOTEBOOK itself (atomically); if a cell fails, NOTEBOOK is left as it was")
    boolean inPlace;

    @Option(names = "--html", paramLabel = "RECORD.html", description = "also write the self-contained HTML tuning record")
    Path html;

    @Option(names = "--allow-errors", description = "keep running after a failing cell and record its error; exit status 3 if any cell failed")
    boolean allowErrors;

    @Option(names = "--cell-timeout", paramLabel = "DURATION", defaultValue = "10m", converter = CellTimeout.class, description = CellTimeout.DESCRIPTION)
    Duration cellTimeout;

    @Override
    public Integer call() {
        Notebook nb;
        try {
            nb = NotebookFile.read(notebook);
            if (inPlace && output != null) throw new IllegalArgumentException("give either -o OUT.ipynb or --in-place, not both");
            if (inPlace && NotebookFile.isPlainText(notebook)) {
                throw new IllegalArgumentException(notebook + " is a plain-text notebook, which holds no outputs; write the executed notebook with -o "
                        + NotebookFiles.sibling(notebook, ".ipynb").getFileName() + " (or leave -o out for " + NotebookFiles.sibling(notebook, ".out.ipynb").getFileName() + ")");
            }
            if (output != null && NotebookFile.isPlainText(output)) {
                throw new IllegalArgumentException("-o " + output + ": run writes an executed notebook (.ipynb); the plain-text form holds no outputs "
                        + "(make one with './loopledger convert')");
            }
            Path target = inPlace ? notebook : output != null ? output : NotebookFiles.sibling(notebook, ".out.ipynb");
            String targetOption = inPlace ? "--in-place" : output != null ? "-o" : "the output";
            OutputTargets.check(target, OutputTargets.Kind.NOTEBOOK, targetOption, inPlace, notebook);
            if (html != null) {
                OutputTargets.check(html, OutputTargets.Kind.HTML, "--html", false, notebook);
                OutputTargets.requireDistinct(target, targetOption, html, "--html");
            }
            System.err.println("loopledger: running " + notebook + " (" + nb.codeCells().size() + " code cells)");
            NotebookRunner.Outcome out;
            try (SessionEngine engine = SessionEngine.start()) {
                out = NotebookRunner.run(nb, engine, NotebookFiles.libraryVersion(), NotebookFiles.today(), System.err::println,
                        new NotebookRunner.Options(cellTimeout, allowErrors));
            }
            boolean stoppedEarly = !out.succeeded() && !allowErrors;
            if (inPlace && stoppedEarly) {
                writePartialBeside(out.executed());
            } else {
                NotebookJson.write(out.executed(), target);
                System.err.println("loopledger: wrote " + target);
            }
            if (html != null) {
                var info = NotebookRunner.recordInfo(out.executed(), notebook.getFileName().toString(), System.getProperty("java.version"));
                AtomicFiles.writeString(html, RecordRenderer.render(out.executed(), info, notebook.toAbsolutePath().getParent()));
                System.err.println("loopledger: wrote record " + html);
            }
            if (stoppedEarly) {
                System.err.println("loopledger: cell " + out.failedCellNumber() + " failed: " + out.failure());
                return 1;
            }
            if (!out.succeeded()) {
                System.err.println("loopledger: " + out.failures().size() + " of " + nb.codeCells().size() + " code cells failed (run with --allow-errors): "
                        + out.failures().stream().map(f -> "cell " + f.cellNumber() + " (" + f.failure() + ")").collect(Collectors.joining("; ")));
                return EXIT_CELLS_FAILED;
            }
            System.err.printf(Locale.ROOT, "loopledger: all cells ran in %.1f s%n", out.elapsed().toMillis() / 1000.0);
            return 0;
        } catch (IllegalArgumentException e) {
            System.err.println("loopledger run: " + e.getMessage());
            return 2;
        }
    }

    /** A failed in-place run: the notebook keeps every stored output; the partial result goes beside it. */
    private void writePartialBeside(Notebook executed) {
        Path partial = NotebookFiles.sibling(notebook, ".failed.ipynb");
        try {
            OutputTargets.check(partial, OutputTargets.Kind.NOTEBOOK, "the partial result", false, notebook);
            NotebookJson.write(executed, partial);
            System.err.println("loopledger: " + notebook + " was left unchanged (a failed --in-place run writes nothing to it); "
                    + "the partial result is in " + partial);
        } catch (IllegalArgumentException e) {
            System.err.println("loopledger: " + notebook + " was left unchanged (a failed --in-place run writes nothing to it); "
                    + "the partial result was not written: " + e.getMessage());
        }
    }
}
