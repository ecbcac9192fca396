package org.loopledger.cli;

import org.loopledger.kernel.Kernelspec;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

/**
 * Benchmark (not a test), issue 6: wall time of {@code loopledger run} and {@code loopledger verify}
 * on a notebook against {@code jupyter nbconvert --to notebook --execute} of the same notebook on our
 * kernel (kernelspec installed into a temporary JUPYTER_PATH), all in the same run, each a fresh
 * process as a user would start it, in the notebook's folder (so relative dataset paths resolve),
 * interleaved round by round so that machine load hits all three alike. Prints medians and ratios.
 * Target: {@code run} faster than nbconvert.
 */
final class RunnerBench {
    private RunnerBench() {}

    /** Median and spread of one command's wall times. */
    record Timing(String what, double[] seconds) {
        double median() {
            double[] s = seconds.clone();
            Arrays.sort(s);
            return s.length % 2 == 1 ? s[s.length / 2] : 0.5 * (s[s.length / 2 - 1] + s[s.length / 2]);
        }

        double min() { return Arrays.stream(seconds).min().orElse(Double.NaN); }

        double max() { return Arrays.stream(seconds).max().orElse(Double.NaN); }
    }

    static int run(Path notebook, int rounds, PrintStream out) throws IOException, InterruptedException {
        if (!Files.isRegularFile(notebook)) {
            out.println("notebook " + notebook + " does not exist; give the notebook to benchmark, e.g. notebooks/02-tuning.ipynb");
            return 2;
        }
        if (rounds < 1) {
            out.println("--rounds must be at least 1, got " + rounds);
            return 2;
        }
        Path nb = notebook.toAbsolutePath();
        Path folder = nb.getParent();
        Path tmp = Files.createTempDirectory("loopledger-runner-bench");
        try {
            Path jupyterPath = tmp.resolve("jupyter");
            Kernelspec.write(jupyterPath.resolve("kernels"), Kernelspec.argvForThisJvm());
            List<String> java = new ArrayList<>(Kernelspec.argvForThisJvm());
            java = new ArrayList<>(java.subList(0, java.indexOf("org.loopledger.cli.Main") + 1));
            Path executed = tmp.resolve("run.ipynb");
            List<String> runCmd = concat(java, "run", nb.toString(), "-o", executed.toString());
            List<String> verifyCmd = concat(java, "verify", executed.toString());
            List<String> nbconvertCmd = List.of("/usr/bin/jupyter", "nbconvert", "--to", "notebook", "--execute",
                    "--ExecutePreprocessor.kernel_name=" + Kernelspec.NAME, "--ExecutePreprocessor.timeout=600",
                    "--output-dir", tmp.toString(), "--output", "nbconvert.ipynb", nb.toString());
            if (!Files.isExecutable(Path.of("/usr/bin/jupyter"))) {
                out.println("/usr/bin/jupyter not found: install Debian's jupyter-nbconvert to compare with nbconvert");
                return 1;
            }
            double[] run = new double[rounds], verify = new double[rounds], nbc = new double[rounds];
            for (int i = 0; i < rounds; i++) {
                run[i] = time(runCmd, folder, tmp, null, "run");
                verify[i] = time(verifyCmd, folder, tmp, null, "verify");
                nbc[i] = time(nbconvertCmd, folder, tmp, jupyterPath, "nbconvert");
                out.printf(Locale.ROOT, "round %d of %d: run %.2f s, verify %.2f s, nbconvert %.2f s%n", i + 1, rounds, run[i], verify[i], nbc[i]);
            }
            List<Timing> t = List.of(new Timing("loopledger run", run), new Timing("loopledger verify", verify), new Timing("jupyter nbconvert --execute", nbc));
            out.println("notebook: " + nb + " (" + rounds + " rounds, each command a fresh process)");
            out.printf(Locale.ROOT, "%-30s %10s %10s %10s%n", "command", "median s", "min s", "max s");
            for (Timing x : t) out.printf(Locale.ROOT, "%-30s %10.2f %10.2f %10.2f%n", x.what(), x.median(), x.min(), x.max());
            double ratioRun = t.get(0).median() / t.get(2).median(), ratioVerify = t.get(1).median() / t.get(2).median();
            out.printf(Locale.ROOT, "ratio run/nbconvert %.2fx (target < 1: %s), verify/nbconvert %.2fx%n", ratioRun,
                    ratioRun < 1 ? "met" : "NOT met", ratioVerify);
            return 0;
        } finally {
            deleteTree(tmp);
        }
    }

    private static List<String> concat(List<String> head, String... tail) {
        List<String> r = new ArrayList<>(head);
        r.addAll(List.of(tail));
        return r;
    }

    /** Wall time in seconds of one command; a failure is reported with its output (the benchmark stops). */
    private static double time(List<String> cmd, Path cwd, Path tmp, Path jupyterPath, String what) throws IOException, InterruptedException {
        Path log = tmp.resolve(what + ".log");
        ProcessBuilder pb = new ProcessBuilder(cmd).directory(cwd.toFile()).redirectErrorStream(true).redirectOutput(log.toFile());
        if (jupyterPath != null) pb.environment().put("JUPYTER_PATH", jupyterPath.toString());
        long t0 = System.nanoTime();
        Process p = pb.start();
        if (!p.waitFor(30, TimeUnit.MINUTES)) {
            p.descendants().forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            throw new IOException(what + " did not finish within 30 minutes");
        }
        double s = (System.nanoTime() - t0) / 1e9;
        if (p.exitValue() != 0) {
            String text = Files.readString(log);
            throw new IOException(what + " failed with exit code " + p.exitValue() + ": " + (text.length() > 3000 ? text.substring(text.length() - 3000) : text));
        }
        return s;
    }

    private static void deleteTree(Path dir) {
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> { try { Files.deleteIfExists(p); } catch (IOException ignored) { /* best effort */ } });
        } catch (IOException ignored) {
            // best effort: a temp folder
        }
    }
}
