package org.loopledger.cli;

import org.loopledger.notebook.DatasetCheck;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookRunner;
import org.loopledger.notebook.OutputComparison;
import org.loopledger.notebook.RecordInfo;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.concurrent.Callable;

/** {@code loopledger verify NOTEBOOK}: re-executes, compares every output and every dataset digest with the stored ones. */
@Command(name = "verify", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = {"Re-execute a notebook and check that every stored output reproduces and that every dataset it reads",
                "has the SHA-256 recorded in the notebook (the notebook is not modified)."},
        exitCodeListHeading = "Exit status:%n",
        exitCodeList = {"0:every output reproduces and every dataset is the recorded one",
                "1:an output differs, a dataset differs from the record, or a cell failed or ran out of time",
                "2:bad usage or input: nothing was run"})
final class VerifyCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "NOTEBOOK", description = "an executed notebook (.ipynb), or a plain-text notebook (.java) with its executed NAME.ipynb beside it")
    Path notebook;

    @Option(names = "--rtol", paramLabel = "R", defaultValue = "1e-6", description = "relative tolerance for numbers (default ${DEFAULT-VALUE})")
    double rtol;

    @Option(names = "--atol", paramLabel = "A", defaultValue = "1e-12", description = "absolute tolerance for numbers (default ${DEFAULT-VALUE})")
    double atol;

    @Option(names = "--cell-timeout", paramLabel = "DURATION", defaultValue = "10m", converter = CellTimeout.class, description = CellTimeout.DESCRIPTION)
    Duration cellTimeout;

    @Override
    public Integer call() {
        try {
            Notebook stored = NotebookFiles.executed(notebook, "verify");
            OutputComparison cmp = OutputComparison.withTolerance(rtol, atol);
            if (stored.codeCells().stream().allMatch(c -> c.executionCount() == null)) {
                throw new IllegalArgumentException(notebook + " has no stored outputs to compare; run it first with './loopledger run " + notebook + " --in-place'");
            }
            List<RecordInfo.DatasetDigest> recorded = DatasetCheck.recorded(stored);
            NotebookRunner.Outcome out;
            try (SessionEngine engine = SessionEngine.start()) {
                out = NotebookRunner.run(stored, engine, NotebookFiles.libraryVersion(), NotebookFiles.today(), System.err::println,
                        new NotebookRunner.Options(cellTimeout, false));
            }
            OutputComparison.Report report = cmp.compare(stored, out.executed());
            System.out.println(report);
            if (!out.succeeded()) System.out.println("cell " + out.failedCellNumber() + " failed on re-run: " + out.failure());
            List<String> dataProblems = recorded == null
                    ? out.datasets().isEmpty() ? List.of() : List.of("the notebook records no dataset digests (it was not run by Loopledger) but reads "
                    + out.datasets().size() + " dataset(s); run it with './loopledger run " + notebook + " --in-place' to record them")
                    : DatasetCheck.compare(recorded, out.datasets(), out::readersOf);
            // Only a complete re-run has read everything; after a failed cell, "not read" would be noise.
            if (!out.succeeded()) dataProblems = dataProblems.stream().filter(p -> !p.contains("was not read on re-run")).toList();
            for (String p : dataProblems) System.out.println("DATA DIFFERS - " + p);
            if (dataProblems.isEmpty() && !out.datasets().isEmpty()) {
                System.out.println("every dataset read (" + out.datasets().size() + ") has the SHA-256 recorded in the notebook");
            }
            return report.allReproduced() && out.succeeded() && dataProblems.isEmpty() ? 0 : 1;
        } catch (IllegalArgumentException e) {
            System.err.println("loopledger verify: " + e.getMessage());
            return 2;
        }
    }
}
