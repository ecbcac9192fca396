package org.loopledger.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/**
 * {@code loopledger bench kernel}: kernel latency against ipykernel (see {@link org.loopledger.kernel.bench.KernelBench});
 * {@code loopledger bench runner NOTEBOOK [--rounds N]}: run and verify against nbconvert (see {@link RunnerBench}).
 */
@Command(name = "bench", description = {"Benchmarks: 'kernel' compares start-up and cell latency with ipykernel;",
        "'runner NOTEBOOK' compares the wall time of run and verify with jupyter nbconvert --execute on our kernel."})
final class BenchCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "WHAT", description = "kernel | runner")
    String what;

    @Parameters(index = "1", arity = "0..1", paramLabel = "NOTEBOOK", description = "the notebook for 'runner'")
    Path notebook;

    @Option(names = "--rounds", paramLabel = "N", defaultValue = "3", description = "rounds for 'runner' (default ${DEFAULT-VALUE})")
    int rounds;

    @Override
    public Integer call() throws Exception {
        if ("kernel".equals(what)) return org.loopledger.kernel.bench.KernelBench.run(System.out);
        if ("runner".equals(what)) {
            if (notebook == null) {
                System.err.println("bench runner needs a notebook: ./loopledger bench runner NOTEBOOK.ipynb [--rounds N]");
                return 2;
            }
            return RunnerBench.run(notebook, rounds, System.out);
        }
        System.err.println("unknown benchmark '" + what + "'; available: kernel, runner");
        return 2;
    }
}
