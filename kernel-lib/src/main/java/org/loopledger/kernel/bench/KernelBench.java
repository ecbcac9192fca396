package org.loopledger.kernel.bench;

import com.google.gson.Gson;
import com.google.gson.JsonObject;
import org.loopledger.kernel.Kernelspec;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * Benchmark (not a test): our kernel against Debian's ipykernel in the same run, both driven by
 * {@code /usr/bin/python3} with jupyter_client: cold start to the first {@code 1+1} result and the
 * median round trip of a trivial cell, printed with ratios. Targets (issue 5): cold start no worse
 * than 2x ipykernel, trivial cell under 30 ms median.
 */
public final class KernelBench {
    private KernelBench() {}

    public static void main(String[] args) throws Exception {
        System.exit(run(System.out));
    }

    public static int run(PrintStream out) throws IOException, InterruptedException {
        Path dir = Files.createTempDirectory("loopledger-bench");
        Kernelspec.write(dir.resolve("kernels"), Kernelspec.argvForThisJvm());
        String script;
        try (InputStream in = KernelBench.class.getResourceAsStream("bench.py")) {
            script = new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
        Map<String, Object> input = Map.of("jupyter_path", dir.toString(), "rounds", 60,
                "kernels", List.of(List.of("python3", "1+1"), List.of(Kernelspec.NAME, "1+1")));
        Process p = new ProcessBuilder("/usr/bin/python3", "-c", script).redirectError(ProcessBuilder.Redirect.INHERIT).start();
        try (OutputStream os = p.getOutputStream()) {
            os.write(new Gson().toJson(input).getBytes(StandardCharsets.UTF_8));
        }
        String json = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        if (!p.waitFor(10, TimeUnit.MINUTES) || p.exitValue() != 0) {
            out.println("benchmark failed (needs Debian's python3-jupyter-client and python3-ipykernel): " + json);
            return 1;
        }
        JsonObject r = new Gson().fromJson(json, JsonObject.class);
        JsonObject py = r.getAsJsonObject("python3");
        JsonObject ours = r.getAsJsonObject(Kernelspec.NAME);
        out.printf("%-12s %14s %16s %12s%n", "kernel", "cold start s", "median cell ms", "p90 ms");
        for (String k : List.of("python3", Kernelspec.NAME)) {
            JsonObject o = r.getAsJsonObject(k);
            out.printf("%-12s %14.2f %16.1f %12.1f%n", k, o.get("cold_start_s").getAsDouble(), o.get("median_ms").getAsDouble(), o.get("p90_ms").getAsDouble());
        }
        out.printf("ratio loopledger/ipykernel: cold start %.2fx (target <= 2), trivial cell %.2fx; trivial cell median %.1f ms (target < 30)%n",
                ours.get("cold_start_s").getAsDouble() / py.get("cold_start_s").getAsDouble(),
                ours.get("median_ms").getAsDouble() / py.get("median_ms").getAsDouble(), ours.get("median_ms").getAsDouble());
        return 0;
    }
}
