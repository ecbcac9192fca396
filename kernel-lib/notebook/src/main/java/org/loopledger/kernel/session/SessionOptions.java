package org.loopledger.kernel.session;

import java.util.List;

/**
 * How to start a {@link CellSession}.
 *
 * @param classPath      class path for compiling and running cells; by default the running JVM's
 *                       {@code java.class.path} (the shaded jar, or the test class path)
 * @param agentVmOptions extra options of the agent JVM that runs the cells, e.g. {@code -Xmx4g}
 * @param warmUp         whether to compile a few throw-away snippets at start so the first cell is fast
 */
public record SessionOptions(String classPath, List<String> agentVmOptions, boolean warmUp) {
    public SessionOptions {
        if (classPath == null || classPath.isBlank()) throw new IllegalArgumentException("classPath is empty; pass System.getProperty(\"java.class.path\")");
        agentVmOptions = List.copyOf(agentVmOptions);
    }

    /** The running JVM's class path, no extra options, warm-up on. */
    public static SessionOptions defaults() {
        return new SessionOptions(System.getProperty("java.class.path"), List.of(), true);
    }
}
