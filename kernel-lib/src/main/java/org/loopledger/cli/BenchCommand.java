package org.loopledger.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

import java.util.concurrent.Callable;

/** {@code loopledger bench kernel}: kernel latency against ipykernel (see {@link org.loopledger.kernel.bench.KernelBench}). */
@Command(name = "bench", description = "Benchmarks: 'kernel' compares start-up and cell latency with ipykernel.")
final class BenchCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "WHAT", description = "kernel")
    String what;

    @Override
    public Integer call() throws Exception {
        if (!"kernel".equals(what)) {
            System.err.println("unknown benchmark '" + what + "'; available: kernel");
            return 2;
        }
        return org.loopledger.kernel.bench.KernelBench.run(System.out);
    }
}
