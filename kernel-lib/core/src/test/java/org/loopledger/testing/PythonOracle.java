package org.loopledger.testing;

import com.google.gson.Gson;
import com.google.gson.JsonElement;
import org.junit.jupiter.api.Assumptions;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;

/**
 * Runs a reference computation in Debian's Python ({@code /usr/bin/python3} with {@code python3-scipy})
 * and returns its JSON answer.
 *
 * <p>One call is one Python process: batch every case of a test class into one request (build a
 * JSON list of cases, let the script loop over them, print one JSON document).
 *
 * <p>Where Python or a module is missing, the test is skipped on a developer machine and fails
 * under {@code CI=true}, so a green CI always means the reference was actually consulted.
 */
public final class PythonOracle {
    private static final Gson GSON = new Gson();

    private PythonOracle() {}

    /** The interpreter: {@code LOOPLEDGER_PYTHON} if set, else {@code /usr/bin/python3}. */
    public static String python() {
        String p = System.getenv("LOOPLEDGER_PYTHON");
        return p == null || p.isBlank() ? "/usr/bin/python3" : p;
    }

    /** Skips (or fails under CI=true) unless every named module imports. */
    public static void require(String... modules) {
        StringBuilder code = new StringBuilder();
        for (String m : modules) code.append("import ").append(m).append('\n');
        String why = null;
        if (!Files.isExecutable(Path.of(python()))) {
            why = python() + " not found; install Debian's python3-scipy (see .ci/run)";
        } else {
            try {
                Process p = new ProcessBuilder(python(), "-c", code.toString()).redirectErrorStream(true).start();
                String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
                if (!p.waitFor(60, TimeUnit.SECONDS) || p.exitValue() != 0) {
                    why = "Python modules " + String.join(", ", modules) + " missing: " + out.strip();
                }
            } catch (IOException | InterruptedException e) {
                why = "cannot start " + python() + ": " + e.getMessage();
            }
        }
        if (why != null) {
            if ("true".equals(System.getenv("CI"))) throw new AssertionError("reference tool missing under CI: " + why);
            Assumptions.assumeTrue(false, why);
        }
    }

    /**
     * Runs {@code script} with {@code input} (serialised to JSON) on standard input; the script reads it
     * with {@code json.load(sys.stdin)} and prints one JSON document on standard output.
     */
    public static JsonElement run(String script, Object input) {
        try {
            Process p = new ProcessBuilder(python(), "-c", script).redirectError(ProcessBuilder.Redirect.PIPE).start();
            try (OutputStream os = p.getOutputStream()) {
                os.write(GSON.toJson(input).getBytes(StandardCharsets.UTF_8));
            }
            byte[] out = p.getInputStream().readAllBytes();
            byte[] err = p.getErrorStream().readAllBytes();
            if (!p.waitFor(600, TimeUnit.SECONDS) || p.exitValue() != 0) {
                throw new AssertionError("reference script failed: " + new String(err, StandardCharsets.UTF_8));
            }
            return GSON.fromJson(new String(out, StandardCharsets.UTF_8), JsonElement.class);
        } catch (IOException e) {
            throw new AssertionError("cannot run " + python(), e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError("interrupted", e);
        }
    }

    /** Convenience: a JSON array of numbers as {@code double[]}. */
    public static double[] doubles(JsonElement e) {
        var a = e.getAsJsonArray();
        double[] r = new double[a.size()];
        for (int i = 0; i < r.length; i++) r[i] = a.get(i).getAsDouble();
        return r;
    }
}
