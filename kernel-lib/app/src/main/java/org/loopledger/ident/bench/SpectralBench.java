package org.loopledger.ident.bench;

import org.loopledger.ident.spectral.FrfEstimate;
import org.loopledger.ident.spectral.WelchOptions;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Benchmark (not a test): Welch H1 + coherence (nperseg 4096, Hann, 50 %) on 1e5, 1e6 and 1e7 samples,
 * against {@code scipy.signal.csd} + {@code welch} (x and y) on the same data in the same run (handed
 * over as raw little-endian doubles in a temporary file). Prints the best of a few repetitions, the
 * throughput ratio, and the bytes allocated during one estimate (all threads), which should not grow
 * with N since segments are streamed.
 *
 * <p>Run: {@code java -cp <classes and dependencies> org.loopledger.ident.bench.SpectralBench [python]}.
 */
public final class SpectralBench {
    private SpectralBench() {}

    public static void main(String[] args) throws Exception {
        String python = args.length > 0 ? args[0] : "/usr/bin/python3";
        WelchOptions o = WelchOptions.hann(4096);
        int[] sizes = {100_000, 1_000_000, 10_000_000};
        System.out.printf(Locale.ROOT, "H1 + coherence, %s, %d processors%n", o, Runtime.getRuntime().availableProcessors());
        // warm-up
        double[][] w = data(1_000_000, 1);
        for (int i = 0; i < 5; i++) FrfEstimate.welch(w[0], w[1], 16000, o);
        for (int n : sizes) {
            double[][] d = data(n, 42);
            int reps = n >= 10_000_000 ? 3 : 5;
            long best = Long.MAX_VALUE;
            long alloc = 0;
            double check = 0;
            for (int r = 0; r < reps; r++) {
                long a0 = allocatedBytes();
                long t0 = System.nanoTime();
                FrfEstimate e = FrfEstimate.welch(d[0], d[1], 16000, o);
                long t = System.nanoTime() - t0;
                alloc = allocatedBytes() - a0;
                best = Math.min(best, t);
                check = e.coherence()[100];
            }
            double javaS = best / 1e9;
            double pyS = scipy(python, d, reps);
            System.out.printf(Locale.ROOT, "N = %,11d: Java %8.4f s (%6.1f Msamples/s), SciPy %8.4f s, ratio %5.2fx, allocated %.2f MB (input %.0f MB), coherence[100] %.6f%n",
                    n, javaS, n / javaS / 1e6, pyS, pyS / javaS, alloc / 1e6, 16.0 * n / 1e6, check);
        }
    }

    private static double[][] data(int n, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] x = new double[n], y = new double[n];
        double s = 0;
        for (int i = 0; i < n; i++) {
            x[i] = r.nextDouble() - 0.5;
            s = 0.9 * s + x[i];
            y[i] = s + 0.1 * (r.nextDouble() - 0.5);
        }
        return new double[][] {x, y};
    }

    /** Bytes allocated by all live threads (HotSpot's extension), or 0 when unsupported. */
    private static long allocatedBytes() {
        if (ManagementFactory.getThreadMXBean() instanceof com.sun.management.ThreadMXBean t && t.isThreadAllocatedMemorySupported()) {
            long sum = 0;
            for (long b : t.getThreadAllocatedBytes(t.getAllThreadIds())) if (b > 0) sum += b;
            return sum;
        }
        return 0;
    }

    private static double scipy(String python, double[][] d, int reps) throws IOException, InterruptedException {
        Path f = Files.createTempFile("loopledger-bench", ".f8");
        try {
            try (FileChannel ch = FileChannel.open(f, StandardOpenOption.WRITE)) {
                for (double[] a : d) {
                    ByteBuffer b = ByteBuffer.allocate(a.length * 8).order(ByteOrder.LITTLE_ENDIAN);
                    b.asDoubleBuffer().put(a);
                    ch.write(b);
                }
            }
            String script = String.join("\n",
                    "import sys, time, numpy as np",
                    "from scipy import signal",
                    "d = np.fromfile(sys.argv[1], dtype='<f8'); n = d.size // 2; x, y = d[:n], d[n:]",
                    "best = 1e9",
                    "for _ in range(int(sys.argv[2])):",
                    "    t = time.perf_counter()",
                    "    kw = dict(fs=16000.0, window='hann', nperseg=4096, noverlap=2048)",
                    "    f, pxy = signal.csd(x, y, **kw); _, pxx = signal.welch(x, **kw); _, pyy = signal.welch(y, **kw)",
                    "    h1 = pxy / pxx; coh = np.abs(pxy)**2 / (pxx * pyy)",
                    "    best = min(best, time.perf_counter() - t)",
                    "print(best)");
            Process p = new ProcessBuilder(python, "-c", script, f.toString(), Integer.toString(reps)).redirectErrorStream(true).start();
            String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
            if (p.waitFor() != 0) throw new IOException("SciPy run failed: " + out);
            String[] lines = out.split("\n");
            return Double.parseDouble(lines[lines.length - 1]);
        } finally {
            Files.deleteIfExists(f);
        }
    }
}
