package org.loopledger.kernel.e2e;

import org.loopledger.kernel.Kernelspec;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;

/** Installs a kernelspec that starts the kernel from the test class path (so tests need no packaged jar). */
final class TestKernelspec {
    private TestKernelspec() {}

    /** Writes {@code dir/kernels/loopledger} and returns {@code dir}, to be used as JUPYTER_PATH. */
    static Path install(Path dir) throws IOException {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        List<String> argv = new java.util.ArrayList<>(List.of(java));
        argv.addAll(org.loopledger.kernel.session.SessionOptions.HOST_FLAGS);
        argv.addAll(List.of("-cp", System.getProperty("java.class.path"), "org.loopledger.cli.Main", "kernel", "{connection_file}"));
        Kernelspec.write(dir.resolve("kernels"), argv);
        return dir;
    }

    static String script(String name) throws IOException {
        try (InputStream in = TestKernelspec.class.getResourceAsStream(name)) {
            if (in == null) throw new IOException("test resource " + name + " missing");
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }
}
