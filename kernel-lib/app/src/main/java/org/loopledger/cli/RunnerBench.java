package org.loopledger.cli;

import org.loopledger.kernel.Kernelspec;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

/**
 * Benchmark (not a test), issues 6 and 11: wall time and peak memory of exactly the commands a user types,
 * {@code ./loopledger run NB --html OUT} and {@code ./loopledger verify NB.out.ipynb} (the launcher script with
 * the JVM flags it chooses), against {@code jupyter nbconvert --to notebook --execute} of the same notebook on our
 * kernel (kernelspec installed into a temporary JUPYTER_PATH), all in the same run, each a fresh process, from
 * the current folder as a user would run them, interleaved round by round so that machine load hits all three
 * alike. Peak memory is the largest sum of resident set sizes over the whole process tree (the runner and its
 * agent JVM; nbconvert, its kernel and the kernel's agent), sampled from /proc every
 * {@value #SAMPLE_MS} ms, since {@code /usr/bin/time} sees the parent only. Prints medians and ratios.
 * Targets: {@code run} faster than nbconvert; {@code run}'s peak at most {@value #PEAK_TARGET_MB} MB.
 */
final class RunnerBench {
    static final long SAMPLE_MS = 20;
    static final long PEAK_TARGET_MB = 1024;

    private RunnerBench() {}

    /** Median and spread of one command's wall times, and its largest peak of tree memory. */
    record Timing(String what, double[] seconds, long[] peakKb) {
        double median() {
            double[] s = seconds.clone();
            Arrays.sort(s);
            return s.length % 2 == 1 ? s[s.length / 2] : 0.5 * (s[s.length / 2 - 1] + s[s.length / 2]);
        }

        double min() { return Arrays.stream(seconds).min().orElse(Double.NaN); }

        double max() { return Arrays.stream(seconds).max().orElse(Double.NaN); }

        double peakMb() { return Arrays.stream(peakKb).max().orElse(0) / 1024.0; }
    }

    /** One run of a command: wall seconds and the peak of the summed RSS of its process tree in kB. */
    record Measured(double seconds, long peakKb) {}

    /** The launcher script of the checkout this jar was built in ({@code kernel-lib/app/target/loopledger.jar}). */
    static Path launcher() throws IOException {
        try {
            Path jar = Path.of(RunnerBench.class.getProtectionDomain().getCodeSource().getLocation().toURI());
            for (Path d = jar.toAbsolutePath().getParent(); d != null; d = d.getParent()) {
                Path script = d.resolve("loopledger");
                if (Files.isExecutable(script) && Files.isDirectory(d.resolve("kernel-lib"))) return script;
            }
        } catch (java.net.URISyntaxException | RuntimeException e) {
            // fall through
        }
        throw new IOException("bench runner times the launcher script ./loopledger; start it from a checkout: ./loopledger bench runner NOTEBOOK.ipynb");
    }

    static int run(Path notebook, int rounds, PrintStream out) throws IOException, InterruptedException {
        if (!Files.isRegularFile(notebook)) {
            out.println("notebook " + notebook + " does not exist; give the notebook to benchmark, e.g. notebooks/02-tune-axis-x.ipynb");
            return 2;
        }
        if (rounds < 1) {
            out.println("--rounds must be at least 1, got " + rounds);
            return 2;
        }
        Path executed = NotebookFiles.sibling(notebook, ".out.ipynb");
        if (Files.exists(executed)) {
            out.println(executed + " exists; bench runner writes and deletes it on every round (as './loopledger run " + notebook
                    + "' would write it): move it away first");
            return 2;
        }
        if (!Files.isExecutable(Path.of("/usr/bin/jupyter"))) {
            out.println("/usr/bin/jupyter not found: install Debian's jupyter-nbconvert to compare with nbconvert");
            return 1;
        }
        Path script = launcher();
        Path cwd = Path.of("").toAbsolutePath();
        Path tmp = Files.createTempDirectory("loopledger-runner-bench");
        try {
            Path jupyterPath = tmp.resolve("jupyter");
            Kernelspec.write(jupyterPath.resolve("kernels"), Kernelspec.argvForThisJvm());
            Path record = tmp.resolve("record.html");
            List<String> runCmd = List.of(script.toString(), "run", notebook.toString(), "--html", record.toString());
            List<String> verifyCmd = List.of(script.toString(), "verify", executed.toString());
            List<String> nbconvertCmd = List.of("/usr/bin/jupyter", "nbconvert", "--to", "notebook", "--execute",
                    "--ExecutePreprocessor.kernel_name=" + Kernelspec.NAME, "--ExecutePreprocessor.timeout=600",
                    "--output-dir", tmp.toString(), "--output", "nbconvert.ipynb", notebook.toAbsolutePath().toString());
            Path nbconvertCwd = notebook.toAbsolutePath().getParent();
            double[] run = new double[rounds], verify = new double[rounds], nbc = new double[rounds];
            long[] runPeak = new long[rounds], verifyPeak = new long[rounds], nbcPeak = new long[rounds];
            for (int i = 0; i < rounds; i++) {
                try {
                    Measured r = time(runCmd, cwd, tmp, null, "run");
                    Measured v = time(verifyCmd, cwd, tmp, null, "verify");
                    run[i] = r.seconds();
                    runPeak[i] = r.peakKb();
                    verify[i] = v.seconds();
                    verifyPeak[i] = v.peakKb();
                } finally {
                    Files.deleteIfExists(executed);
                }
                Measured n = time(nbconvertCmd, nbconvertCwd, tmp, jupyterPath, "nbconvert");
                nbc[i] = n.seconds();
                nbcPeak[i] = n.peakKb();
                out.printf(Locale.ROOT, "round %d of %d: run %.2f s, verify %.2f s, nbconvert %.2f s%n", i + 1, rounds, run[i], verify[i], nbc[i]);
            }
            List<Timing> t = List.of(new Timing("./loopledger run --html", run, runPeak), new Timing("./loopledger verify", verify, verifyPeak),
                    new Timing("jupyter nbconvert --execute", nbc, nbcPeak));
            out.println("notebook: " + notebook + " (" + rounds + " rounds, each command a fresh process; launcher " + script + ")");
            out.printf(Locale.ROOT, "%-30s %10s %10s %10s %16s%n", "command", "median s", "min s", "max s", "peak tree MB");
            for (Timing x : t) out.printf(Locale.ROOT, "%-30s %10.2f %10.2f %10.2f %16.0f%n", x.what(), x.median(), x.min(), x.max(), x.peakMb());
            double ratioRun = t.get(0).median() / t.get(2).median(), ratioVerify = t.get(1).median() / t.get(2).median();
            out.printf(Locale.ROOT, "ratio run/nbconvert %.2fx (target < 1: %s), verify/nbconvert %.2fx%n", ratioRun,
                    ratioRun < 1 ? "met" : String.format(Locale.ROOT, "missed by %.0f%%", 100 * (ratioRun - 1)), ratioVerify);
            double peak = t.get(0).peakMb();
            out.printf(Locale.ROOT, "peak tree RSS of run %.0f MB (target <= %d MB: %s), %.2fx nbconvert's %.0f MB%n", peak, PEAK_TARGET_MB,
                    peak <= PEAK_TARGET_MB ? "met" : String.format(Locale.ROOT, "missed by %.0f%%", 100 * (peak / PEAK_TARGET_MB - 1)),
                    peak / t.get(2).peakMb(), t.get(2).peakMb());
            return 0;
        } finally {
            deleteTree(tmp);
        }
    }

    /** Wall time and peak tree memory of one command; a failure is reported with its output (the benchmark stops). */
    private static Measured time(List<String> cmd, Path cwd, Path tmp, Path jupyterPath, String what) throws IOException, InterruptedException {
        Path log = tmp.resolve(what + ".log");
        ProcessBuilder pb = new ProcessBuilder(cmd).directory(cwd.toFile()).redirectErrorStream(true).redirectOutput(log.toFile());
        if (jupyterPath != null) pb.environment().put("JUPYTER_PATH", jupyterPath.toString());
        long t0 = System.nanoTime();
        Process p = pb.start();
        long peak = 0;
        long deadline = t0 + TimeUnit.MINUTES.toNanos(30);
        while (!p.waitFor(SAMPLE_MS, TimeUnit.MILLISECONDS)) {
            peak = Math.max(peak, treeRssKb(p.toHandle()));
            if (System.nanoTime() > deadline) {
                p.descendants().forEach(ProcessHandle::destroyForcibly);
                p.destroyForcibly();
                throw new IOException(what + " did not finish within 30 minutes");
            }
        }
        double s = (System.nanoTime() - t0) / 1e9;
        if (p.exitValue() != 0) {
            String text = Files.readString(log);
            throw new IOException(what + " failed with exit code " + p.exitValue() + ": " + (text.length() > 3000 ? text.substring(text.length() - 3000) : text));
        }
        return new Measured(s, peak);
    }

    /** The sum of VmRSS (kB) of a process and all its descendants now; processes that end meanwhile count 0. */
    static long treeRssKb(ProcessHandle root) {
        long total = rssKb(root.pid());
        for (ProcessHandle h : (Iterable<ProcessHandle>) root.descendants()::iterator) total += rssKb(h.pid());
        return total;
    }

    private static long rssKb(long pid) {
        try {
            for (String line : Files.readAllLines(Path.of("/proc", Long.toString(pid), "status"))) {
                if (line.startsWith("VmRSS:")) return Long.parseLong(line.substring(6).trim().split("\\s+")[0]);
            }
        } catch (IOException | RuntimeException e) {
            // the process ended between listing and reading
        }
        return 0;
    }

    private static void deleteTree(Path dir) {
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> { try { Files.deleteIfExists(p); } catch (IOException ignored) { /* best effort */ } });
        } catch (IOException ignored) {
            // best effort: a temp folder
        }
    }
}
