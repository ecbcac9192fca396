package org.loopledger.ident.bench;

import org.loopledger.ident.log.DriveLog;
import org.loopledger.ident.log.DriveLogReader;
import org.loopledger.ident.log.LogCheckOptions;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;

/**
 * Benchmark (not a test): reading a drive log of about 100 MB (5 columns, native header, comma separated,
 * 9 significant digits) with {@link DriveLogReader} in a child JVM against Debian Python's
 * {@code numpy.loadtxt} on the same file in the same run. Each side reports its read time and its peak
 * resident memory (VmHWM from /proc, {@code ru_maxrss}); the Java child runs twice: with the JVM's default
 * heap (best of two runs, alternating with numpy's), and with the heap capped at the numeric arrays plus 25 % plus
 * 64 MB, which succeeds only if memory beyond the arrays stays small. Our read includes the log checks and the file's SHA-256.
 *
 * <p>Run: {@code ./loopledger bench logs [MB]}.
 */
public final class LogBench {
    private LogBench() {}

    static final String HEADER = "time_s,current_injected_A,current_measured_A,velocity_rad_s,position_rad";

    public static int run(PrintStream out) throws Exception { return run(out, 100); }

    public static int run(PrintStream out, int megabytes) throws Exception {
        Path dir = Files.createTempDirectory("loopledger-logbench");
        Path file = dir.resolve("log.csv");
        try {
            long rows = write(file, megabytes * 1_000_000L);
            long bytes = Files.size(file);
            long arrays = rows * 5 * 8;
            out.printf(Locale.ROOT, "log: %,d bytes, %,d rows x 5 columns (numeric arrays %.1f MB), %d processors%n", bytes, rows, arrays / 1e6,
                    Runtime.getRuntime().availableProcessors());
            long capMb = (long) Math.ceil(arrays * 1.25 / 1e6 / 1.048576) + 64;
            out.printf(Locale.ROOT, "load average before: %s (the machine is shared: each side runs twice, alternating, best time kept)%n", loadAverage());
            String[] jd = null, py = null;
            for (int round = 0; round < 2; round++) {
                String[] j = child(file, null);
                String[] p = python(file);
                if (jd == null || Double.parseDouble(j[0]) < Double.parseDouble(jd[0])) jd = j;
                if (py == null || Double.parseDouble(p[0]) < Double.parseDouble(py[0])) py = p;
            }
            String[] jc = child(file, "-Xmx" + capMb + "m");
            double jt = Double.parseDouble(jd[0]), jm = Double.parseDouble(jd[1]);
            double pt = Double.parseDouble(py[0]), pm = Double.parseDouble(py[1]);
            double jcpu = Double.parseDouble(jd[3]), pcpu = Double.parseDouble(py[3]);
            out.printf(Locale.ROOT, "Java DriveLogReader, default heap: read %.2f s (CPU %.2f s, all JVM threads), peak RSS %.0f MB (heap used after GC %.0f MB)%n",
                    jt, jcpu, jm, Double.parseDouble(jd[2]));
            if (jc[0].equals("failed")) out.printf(Locale.ROOT, "Java DriveLogReader, -Xmx%dm: FAILED (%s)%n", capMb, jc[1]);
            else out.printf(Locale.ROOT, "Java DriveLogReader, -Xmx%dm (arrays + 25 %% + 64 MB): read %.2f s, peak RSS %.0f MB%n", capMb,
                    Double.parseDouble(jc[0]), Double.parseDouble(jc[1]));
            out.printf(Locale.ROOT, "numpy.loadtxt (%s): read %.2f s (CPU %.2f s), peak RSS %.0f MB%n", py[2], pt, pcpu, pm);
            out.printf(Locale.ROOT, "ratios (numpy / Java): wall time %.2fx, CPU time %.2fx, peak RSS %.2fx; Java peak RSS / numeric arrays %.2f%n",
                    pt / jt, pcpu / jcpu, pm / jm, jm * 1e6 / arrays);
            out.printf(Locale.ROOT, "load average after: %s%n", loadAverage());
            return 0;
        } finally {
            Files.deleteIfExists(file);
            Files.deleteIfExists(dir);
        }
    }

    /** Writes a log of about {@code targetBytes}; returns the rows. Seeded; numbers as a drive log prints them. */
    static long write(Path file, long targetBytes) throws IOException {
        SplittableRandom r = new SplittableRandom(9);
        long rows = 0, written = 0;
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(HEADER);
            w.write('\n');
            StringBuilder sb = new StringBuilder(128);
            double pos = 0;
            while (written < targetBytes) {
                sb.setLength(0);
                double v = r.nextGaussian();
                pos += v / 16000;
                sb.append(String.format(Locale.ROOT, "%.7f", rows / 16000.0)).append(',').append(r.nextBoolean() ? "1" : "-1").append(',')
                        .append(String.format(Locale.ROOT, "%.9g,%.9g,%.9g", 0.3 * r.nextGaussian(), v, pos)).append('\n');
                w.append(sb);
                written += sb.length();
                rows++;
            }
        }
        return rows;
    }

    /** Child entry: reads the file, prints "seconds peakRssMb heapAfterGcMb cpuSeconds" (CPU of all the JVM's threads: parse, JIT, GC). */
    public static void main(String[] args) throws Exception {
        Path f = Path.of(args[0]);
        var os = (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        long c0 = os.getProcessCpuTime();
        long t0 = System.nanoTime();
        DriveLog log = DriveLogReader.read(f, LogCheckOptions.defaults().withSampleRateHz(16000));
        double s = (System.nanoTime() - t0) / 1e9;
        double cpu = (os.getProcessCpuTime() - c0) / 1e9;
        if (log.rows() < 1) throw new IllegalStateException();
        System.gc();
        Runtime rt = Runtime.getRuntime();
        double used = (rt.totalMemory() - rt.freeMemory()) / 1e6;
        System.out.printf(Locale.ROOT, "%.4f %.1f %.1f %.4f%n", s, vmHwmMb(), used, cpu);
    }

    static String loadAverage() {
        try {
            String[] f = Files.readString(Path.of("/proc/loadavg")).trim().split(" ");
            return f[0] + " " + f[1] + " " + f[2];
        } catch (IOException | RuntimeException e) {
            return "unknown";
        }
    }

    static double vmHwmMb() throws IOException {
        for (String l : Files.readAllLines(Path.of("/proc/self/status"))) {
            if (l.startsWith("VmHWM:")) return Long.parseLong(l.replaceAll("[^0-9]", "")) / 1024.0 * 1.048576;
        }
        return Double.NaN;
    }

    private static String[] child(Path file, String heap) throws Exception {
        List<String> cmd = new ArrayList<>();
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        if (heap != null) cmd.add(heap);
        cmd.add("-cp");
        cmd.add(System.getProperty("java.class.path"));
        cmd.add(LogBench.class.getName());
        cmd.add(file.toString());
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        if (!p.waitFor(20, TimeUnit.MINUTES) || p.exitValue() != 0) {
            String last = out.lines().filter(l -> l.contains("Error") || l.contains("Exception")).findFirst().orElse(out);
            return new String[] {"failed", last};
        }
        String[] lines = out.split("\n");
        return lines[lines.length - 1].trim().split(" ");
    }

    private static String[] python(Path file) throws Exception {
        String script = """
                import sys, time, resource, numpy as np
                def cpu():
                    u = resource.getrusage(resource.RUSAGE_SELF)
                    return u.ru_utime + u.ru_stime
                c0 = cpu(); t0 = time.perf_counter()
                a = np.loadtxt(sys.argv[1], delimiter=',', skiprows=1)
                t = time.perf_counter() - t0; c = cpu() - c0
                print('%.4f %.1f numpy %s %.4f' % (t, resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024 * 1.048576, np.__version__, c))
                """;
        Process p = new ProcessBuilder("/usr/bin/python3", "-c", script, file.toString()).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        if (!p.waitFor(20, TimeUnit.MINUTES) || p.exitValue() != 0) throw new IllegalStateException("numpy.loadtxt failed: " + out);
        String[] f = out.lines().reduce((a, b) -> b).orElse("").split(" ");
        return new String[] {f[0], f[1], f[2] + " " + f[3], f[4]};
    }
}
