package org.loopledger.kernel.bench;

import jdk.jshell.JShell;
import jdk.jshell.SnippetEvent;

import java.util.Arrays;

/**
 * What JShell alone costs for a trivial cell right after a JVM starts, with no kernel around it: a bare JShell
 * (execution in the same JVM, no class path, no imports) evaluates and drops {@code 1+1} {@value #CELLS} times;
 * prints the median of evaluations 2 to {@value #CELLS} in milliseconds. {@link KernelBench} runs it in fresh JVMs
 * with the kernel's flags, beside ipykernel's round trip: the floor of any kernel built on JShell.
 */
public final class JShellFloor {
    static final int CELLS = 41;

    private JShellFloor() {}

    public static void main(String[] args) {
        try (JShell shell = JShell.builder().executionEngine("local").build()) {
            double[] ms = new double[CELLS];
            for (int i = 0; i < CELLS; i++) {
                long t = System.nanoTime();
                for (SnippetEvent e : shell.eval("1+1")) shell.drop(e.snippet());
                ms[i] = (System.nanoTime() - t) / 1e6;
            }
            double[] rest = Arrays.copyOfRange(ms, 1, CELLS);
            Arrays.sort(rest);
            System.out.println((rest[rest.length / 2 - 1] + rest[rest.length / 2]) / 2);
        }
    }
}
