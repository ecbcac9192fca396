package org.loopledger.kernel.session;

import java.util.List;

/**
 * How to start a {@link CellSession}.
 *
 * @param classPath      class path for compiling and running cells; by default the running JVM's
 *                       {@code java.class.path} (the shaded jar, or the test class path)
 * @param agentVmOptions extra options of the agent JVM that runs the cells, e.g. {@code -Xmx4g}
 * @param warmUp         whether to compile a few throw-away snippets in the background after the start, until
 *                       the session is first used, so that the first cell is fast
 */
public record SessionOptions(String classPath, List<String> agentVmOptions, boolean warmUp) {
    public SessionOptions {
        if (classPath == null || classPath.isBlank()) throw new IllegalArgumentException("classPath is empty; pass System.getProperty(\"java.class.path\")");
        agentVmOptions = List.copyOf(agentVmOptions);
    }

    /**
     * The one of {@link #HOST_FLAGS} that lets a session reach JShell's store of compiled classes, to forget the classes
     * of dropped snippets ({@link CompiledClassCache}).
     */
    public static final String OPEN_JSHELL = "--add-opens=jdk.jshell/jdk.jshell=ALL-UNNAMED";

    /**
     * The flags of a JVM that compiles cells (kernel, {@code run}, {@code verify}; the launcher script repeats them):
     * C1 only and the serial collector (cells are compiled by javac there, where C2 never pays back within a
     * notebook run, and the serial collector keeps the footprint small), and the opening of JShell's package that
     * lets the session forget the classes of dropped snippets ({@link CompiledClassCache}).
     */
    public static final List<String> HOST_FLAGS = List.of("-XX:TieredStopAtLevel=1", "-XX:+UseSerialGC", SessionOptions.OPEN_JSHELL);

    /**
     * The agent JVM's own flags: the serial collector (one collector thread, the smallest footprint, no
     * concurrent threads competing with the cell on a small machine); full tiered compilation stays, since the
     * agent runs the numerical work of the cells.
     */
    static final List<String> AGENT_FLAGS = List.of("-XX:+UseSerialGC");

    /**
     * The running JVM's class path, warm-up on, and the agent's options: the system property
     * {@code loopledger.agentJavaOptions} (space-separated) when set, else {@link #AGENT_FLAGS} and the agent's
     * class data archive ({@link ClassDataArchives}) when there is one.
     */
    public static SessionOptions defaults() {
        String override = System.getProperty("loopledger.agentJavaOptions");
        List<String> agent = new java.util.ArrayList<>();
        if (override != null && !override.isBlank()) {
            agent.addAll(List.of(override.trim().split("\\s+")));
        } else {
            agent.addAll(AGENT_FLAGS);
            agent.addAll(ClassDataArchives.useOptions(ClassDataArchives.AGENT));
        }
        return new SessionOptions(System.getProperty("java.class.path"), agent, true);
    }
}
