package org.loopledger.kernel;

import org.junit.jupiter.api.Test;
import org.loopledger.kernel.session.SessionOptions;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The launcher script and the kernelspec start the compiling JVM with the same flags: the script cannot read
 * {@link SessionOptions#HOST_FLAGS}, so this test reads the script.
 */
class LauncherFlagsTest {
    @Test
    void launcherAndKernelspecAgree() throws Exception {
        Path script = Path.of("..", "loopledger");
        assertTrue(Files.isRegularFile(script), "tests run from kernel-lib/: " + script.toAbsolutePath());
        String line = Files.readAllLines(script).stream().filter(l -> l.startsWith("host_flags=(")).findFirst()
                .orElseThrow(() -> new AssertionError("no host_flags=(...) line in " + script));
        List<String> flags = Arrays.asList(line.substring("host_flags=(".length(), line.lastIndexOf(')')).trim().split("\\s+"));
        assertEquals(SessionOptions.HOST_FLAGS, flags);
        List<String> argv = Kernelspec.argvForThisJvm();
        assertEquals(SessionOptions.HOST_FLAGS, argv.subList(1, 1 + SessionOptions.HOST_FLAGS.size()));
    }
}
