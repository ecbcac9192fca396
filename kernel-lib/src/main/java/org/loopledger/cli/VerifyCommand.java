package org.loopledger.cli;

import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookJson;
import org.loopledger.notebook.NotebookRunner;
import org.loopledger.notebook.OutputComparison;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code loopledger verify NOTEBOOK}: re-executes and compares every output with the stored one. */
@Command(name = "verify", description = "Re-execute a notebook and check that every stored output reproduces (the notebook is not modified).")
final class VerifyCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "NOTEBOOK", description = "an executed notebook (.ipynb)")
    Path notebook;

    @Option(names = "--rtol", paramLabel = "R", defaultValue = "1e-6", description = "relative tolerance for numbers (default ${DEFAULT-VALUE})")
    double rtol;

    @Option(names = "--atol", paramLabel = "A", defaultValue = "1e-12", description = "absolute tolerance for numbers (default ${DEFAULT-VALUE})")
    double atol;

    @Override
    public Integer call() {
        try {
            Notebook stored = NotebookJson.read(notebook);
            OutputComparison cmp = OutputComparison.withTolerance(rtol, atol);
            if (stored.codeCells().stream().allMatch(c -> c.executionCount() == null)) {
                throw new IllegalArgumentException(notebook + " has no stored outputs to compare; run it first with './loopledger run " + notebook + " --in-place'");
            }
            NotebookRunner.Outcome out;
            try (SessionEngine engine = SessionEngine.start()) {
                out = NotebookRunner.run(stored, engine, NotebookFiles.libraryVersion(), NotebookFiles.today(), System.err::println);
            }
            OutputComparison.Report report = cmp.compare(stored, out.executed());
            System.out.println(report);
            if (!out.succeeded()) System.out.println("cell " + out.failedCellNumber() + " failed on re-run: " + out.failure());
            return report.allReproduced() && out.succeeded() ? 0 : 1;
        } catch (IllegalArgumentException e) {
            System.err.println("loopledger verify: " + e.getMessage());
            return 2;
        }
    }
}
