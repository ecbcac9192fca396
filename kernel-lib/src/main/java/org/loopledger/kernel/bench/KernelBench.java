package org.loopledger.kernel.bench;

import java.io.PrintStream;

/** Placeholder until the benchmark lands. */
public final class KernelBench {
    private KernelBench() {}

    public static int run(PrintStream out) {
        out.println("not yet");
        return 1;
    }
}
