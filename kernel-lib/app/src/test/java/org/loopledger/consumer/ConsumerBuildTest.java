package org.loopledger.consumer;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Another Maven project uses the domain library, offline, as the README shows: the README's consumer pom and Java
 * program are built with {@code mvn -o} against a local repository laid out as {@code mvn install} leaves it (our
 * three POMs and the core jar; everything else from the build's own local repository). The consumer's test runs the
 * program and checks that none of the notebook side's libraries (JeroMQ, Gson, Tablesaw, picocli, jsoup, XChart)
 * reached its class path.
 */
class ConsumerBuildTest {
    private static final String VERSION = System.getProperty("loopledger.version", "0.1.0-SNAPSHOT");

    static Path repositoryRoot() {
        for (Path d = Path.of("").toAbsolutePath(); d != null; d = d.getParent()) {
            if (Files.isRegularFile(d.resolve("README.md")) && Files.isDirectory(d.resolve("kernel-lib/core"))) return d;
        }
        throw new AssertionError("repository root not found from " + Path.of("").toAbsolutePath());
    }

    /** The fenced block that follows {@code <!-- marker -->} in the README. */
    static String readmeBlock(Path readme, String marker) throws IOException {
        String text = Files.readString(readme);
        Matcher m = Pattern.compile("<!-- " + Pattern.quote(marker) + " -->\\s*```[a-z]*\\n(.*?)```", Pattern.DOTALL).matcher(text);
        if (!m.find()) throw new AssertionError("README.md has no block marked <!-- " + marker + " -->");
        return m.group(1);
    }

    @Test
    void theReadmeProgramBuildsAndRunsFromTheInstalledLibraryOffline(@TempDir Path tmp) throws Exception {
        Path root = repositoryRoot();
        Path coreJar = root.resolve("kernel-lib/core/target/loopledger-core-" + VERSION + ".jar");
        if (!Files.isRegularFile(coreJar)) coreJar = jarOf(root.resolve("kernel-lib/core/target/classes"), tmp.resolve("core.jar")); // `mvn test`: no jar yet
        Path outerRepo = Path.of(System.getProperty("loopledger.localRepository", System.getProperty("user.home") + "/.m2/repository"));
        assertTrue(Files.isDirectory(outerRepo), "the build's local repository: " + outerRepo);

        // A local repository as `mvn install` leaves it: our POMs and jar, the rest linked from the build's repository.
        Path repo = tmp.resolve("repository");
        Files.createDirectories(repo);
        try (Stream<Path> top = Files.list(outerRepo)) {
            for (Path e : top.toList()) {
                if (e.getFileName().toString().equals("org")) {
                    Files.createDirectories(repo.resolve("org"));
                    try (Stream<Path> org = Files.list(e)) {
                        for (Path c : org.toList()) {
                            if (!c.getFileName().toString().equals("loopledger")) Files.createSymbolicLink(repo.resolve("org").resolve(c.getFileName()), c);
                        }
                    }
                } else {
                    Files.createSymbolicLink(repo.resolve(e.getFileName()), e);
                }
            }
        }
        install(repo, "loopledger-parent", root.resolve("pom.xml"), null);
        install(repo, "kernel-lib", root.resolve("kernel-lib/pom.xml"), null);
        install(repo, "loopledger-core", root.resolve("kernel-lib/core/pom.xml"), coreJar);

        // The consumer project: the README's pom and program, and a test that runs the program.
        Path project = tmp.resolve("consumer");
        Path main = project.resolve("src/main/java/example");
        Path test = project.resolve("src/test/java/example");
        Files.createDirectories(main);
        Files.createDirectories(test);
        Files.writeString(project.resolve("pom.xml"), readmeBlock(root.resolve("README.md"), "consumer-pom"));
        Files.writeString(main.resolve("LoopCheck.java"), readmeBlock(root.resolve("README.md"), "consumer-program"));
        Files.writeString(test.resolve("LoopCheckTest.java"), """
                package example;

                import org.junit.jupiter.api.Test;
                import java.io.ByteArrayOutputStream;
                import java.io.PrintStream;
                import static org.junit.jupiter.api.Assertions.*;

                class LoopCheckTest {
                    @Test
                    void printsTheTextbookMargin() throws Exception {
                        PrintStream o = System.out;
                        ByteArrayOutputStream out = new ByteArrayOutputStream();
                        System.setOut(new PrintStream(out, true, "UTF-8"));
                        try { LoopCheck.main(new String[0]); } finally { System.setOut(o); }
                        String text = out.toString("UTF-8");
                        System.out.println("consumer printed: " + text);
                        // L(s) = 1/(s(s+1)): |L| = 1 where w^4 + w^2 - 1 = 0, w = 0.786 rad/s, PM = 90 - atan(0.786) = 51.8 deg
                        // (textbook worked example, e.g. Franklin, Powell, Emami-Naeini, Feedback Control of Dynamic Systems; from memory)
                        assertTrue(text.contains("51.8 deg") && text.contains("0.786 rad/s"), text);
                        for (String absent : new String[] {"org.zeromq.ZMQ", "com.google.gson.Gson", "tech.tablesaw.api.Table",
                                "picocli.CommandLine", "org.jsoup.Jsoup", "org.knowm.xchart.XYChart", "org.loopledger.display.Displays"}) {
                            assertThrows(ClassNotFoundException.class, () -> Class.forName(absent), absent + " must not reach a library user");
                        }
                    }
                }
                """);
        Path log = tmp.resolve("mvn.log");
        List<String> cmd = new ArrayList<>(List.of("mvn", "-o", "-B", "-Dstyle.color=never", "-Dmaven.repo.local=" + repo, "test"));
        Process p = new ProcessBuilder(cmd).directory(project.toFile()).redirectErrorStream(true).redirectOutput(log.toFile()).start();
        if (!p.waitFor(10, TimeUnit.MINUTES)) { // a backstop against a hung build, not a speed check
            p.destroyForcibly();
            fail("the consumer build hung; its log:\n" + Files.readString(log));
        }
        String output = Files.readString(log, StandardCharsets.UTF_8);
        assertEquals(0, p.exitValue(), "the consumer build failed:\n" + output);
        assertTrue(output.contains("Tests run: 1, Failures: 0, Errors: 0"), output);
        assertTrue(output.contains("consumer printed: phase margin"), output);
    }

    /** The classes folder packed as a jar (what `mvn package` would make of it). */
    private static Path jarOf(Path classes, Path jar) throws IOException {
        assertTrue(Files.isDirectory(classes.resolve("org/loopledger/lti")), "loopledger-core is compiled before this module's tests: " + classes);
        try (var out = new java.util.jar.JarOutputStream(Files.newOutputStream(jar)); Stream<Path> files = Files.walk(classes)) {
            for (Path f : files.filter(Files::isRegularFile).sorted().toList()) {
                out.putNextEntry(new java.util.jar.JarEntry(classes.relativize(f).toString().replace('\\', '/')));
                Files.copy(f, out);
                out.closeEntry();
            }
        }
        return jar;
    }

    private static void install(Path repo, String artifactId, Path pom, Path jar) throws IOException {
        Path dir = repo.resolve("org/loopledger").resolve(artifactId).resolve(VERSION);
        Files.createDirectories(dir);
        Files.copy(pom, dir.resolve(artifactId + "-" + VERSION + ".pom"), StandardCopyOption.REPLACE_EXISTING);
        if (jar != null) Files.copy(jar, dir.resolve(artifactId + "-" + VERSION + ".jar"), StandardCopyOption.REPLACE_EXISTING);
    }
}
