package org.loopledger.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/**
 * {@code loopledger bench kernel}: kernel latency against ipykernel (see {@link org.loopledger.kernel.bench.KernelBench});
 * {@code loopledger bench runner NOTEBOOK [--rounds N]}: run and verify against nbconvert (see {@link RunnerBench});
 * {@code loopledger bench tune}: auto-tune speed against the general analysis path;
 * {@code loopledger bench spectral}: H1 + coherence against SciPy;
 * {@code loopledger bench figures}: figure render time and size against matplotlib (see {@link org.loopledger.display.bench.FigureBench}).
 */
@Command(name = "bench", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, description = {"Benchmarks, each against a reference measured in the same run:",
        "'kernel' start-up and cell latency against ipykernel; 'runner NOTEBOOK' run and verify against jupyter nbconvert --execute;",
        "'tune' auto-tune against screening through the general analysis path; 'spectral' H1 + coherence against SciPy;",
        "'figures' render time and stored size of a Bode and a 40,940-sample time plot against matplotlib.",
        "'logs' reading a 100 MB log: time and peak memory against numpy.loadtxt."})
final class BenchCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "WHAT", description = "kernel | runner | tune | spectral | figures | logs")
    String what;

    @Parameters(index = "1", arity = "0..1", paramLabel = "NOTEBOOK", description = "the notebook for 'runner'")
    Path notebook;

    @Option(names = "--rounds", paramLabel = "N", defaultValue = "3", description = "rounds for 'runner' (default ${DEFAULT-VALUE})")
    int rounds;

    @Override
    public Integer call() throws Exception {
        switch (what) {
            case "kernel":
                return org.loopledger.kernel.bench.KernelBench.run(System.out);
            case "runner":
                if (notebook == null) {
                    System.err.println("bench runner needs a notebook: ./loopledger bench runner NOTEBOOK.ipynb [--rounds N]");
                    return 2;
                }
                return RunnerBench.run(notebook, rounds, System.out);
            case "tune":
                return org.loopledger.tune.bench.TuneBench.run(System.out);
            case "figures":
                return org.loopledger.display.bench.FigureBench.run(System.out, java.nio.file.Path.of("datasets/gantry-x-empty.csv"), "/usr/bin/python3");
            case "logs":
                return org.loopledger.ident.bench.LogBench.run(System.out);
            case "spectral":
                org.loopledger.ident.bench.SpectralBench.main(new String[0]);
                return 0;
            default:
                System.err.println("unknown benchmark '" + what + "'; available: kernel, runner, tune, spectral, figures, logs");
                return 2;
        }
    }
}
