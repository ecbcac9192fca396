package org.loopledger.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

import java.util.concurrent.Callable;

/** {@code loopledger bench kernel}: kernel latency against ipykernel (see {@link org.loopledger.kernel.bench.KernelBench}). */
@Command(name = "bench", description = "Benchmarks: 'kernel' (start-up and cell latency against ipykernel), 'tune' (auto-tune speed against the general analysis path), 'spectral' (H1 + coherence against SciPy).")
final class BenchCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "WHAT", description = "kernel, tune or spectral")
    String what;

    @Override
    public Integer call() throws Exception {
        switch (what) {
            case "kernel": return org.loopledger.kernel.bench.KernelBench.run(System.out);
            case "tune": return org.loopledger.tune.bench.TuneBench.run(System.out);
            case "spectral":
                org.loopledger.ident.bench.SpectralBench.main(new String[0]);
                return 0;
            default:
                System.err.println("unknown benchmark '" + what + "'; available: kernel, tune, spectral");
                return 2;
        }
    }
}
