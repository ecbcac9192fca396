package org.loopledger.display.bench;

import org.loopledger.display.Bundles;
import org.loopledger.display.MimeBundle;
import org.loopledger.frf.FrequencyGrid;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;
import org.loopledger.plot.BodePlot;
import org.loopledger.plot.Figure;
import org.loopledger.plot.TimePlot;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.io.PrintStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.function.Supplier;

/**
 * Benchmark (not a test): time and stored size of two figures, against Debian's matplotlib drawing the
 * same data in the same run (Agg, PNG, as a notebook would store it):
 * <ul>
 *   <li>a Bode plot of three noisy 2,000-point FRFs (two-mass plants, invented, for timing only) with
 *       two markers, 640 x 544 px;</li>
 *   <li>a two-panel time plot of a 40,940-sample log (current injected and measured; velocity) from
 *       {@code datasets/gantry-x-empty.csv}, 640 x 464 px.</li>
 * </ul>
 * Time: building the figure and rendering its MIME bundle (ours) or building the figure and saving
 * a PNG (matplotlib), best of several warm runs, as wall time and as CPU time of the rendering thread
 * (process CPU time for Python; both single-threaded), since the CPU time holds still on a shared machine. Size: the bundle as a notebook stores it (JSON of all
 * MIME entries) against matplotlib's base64 PNG plus its text/plain.
 */
public final class FigureBench {
    /**
     * Warm repetitions of the Bode figure, the same for both sides: best of 20, since on a shared machine (load above
     * the core count) the best of 10 still caught most runs waiting for a core.
     */
    private static final int BODE_REPS = 20;

    private FigureBench() {}

    public static void main(String[] args) throws Exception { System.exit(run(System.out, Path.of("datasets/gantry-x-empty.csv"), "/usr/bin/python3")); }

    public static int run(PrintStream out, Path log, String python) throws IOException, InterruptedException {
        double[] hz = FrequencyGrid.logSpacedRadPerS(2, 7000, 2000); // rad/s, turned into Hz below
        for (int i = 0; i < hz.length; i++) hz[i] /= 2 * Math.PI;
        List<double[][]> bode = new ArrayList<>(); // per curve: hz, magDb, phaseDeg
        List<Frf> frfs = new ArrayList<>();
        double[][] cases = {{2e-4, 180, 260}, {2.5e-4, 150, 230}, {3e-4, 130, 210}};
        SplittableRandom rnd = new SplittableRandom(11);
        for (double[] c : cases) {
            Frf model = Frf.ofModel(twoMass(c[0], c[1], c[2]), FrequencyGrid.logSpacedRadPerS(2, 7000, 2000));
            double[] re = model.real(), im = model.imag();
            for (int i = 0; i < re.length; i++) {
                double g = 1 + 0.03 * (rnd.nextDouble() - 0.5), p = 0.03 * (rnd.nextDouble() - 0.5);
                double r = re[i] * g, m = im[i] * g;
                re[i] = r * Math.cos(p) - m * Math.sin(p);
                im[i] = r * Math.sin(p) + m * Math.cos(p);
            }
            Frf f = Frf.ofParts(model.omegaRadPerS(), re, im);
            frfs.add(f);
            bode.add(new double[][] {f.frequencyHz(), f.magnitudeDb(), f.phaseDegUnwrapped()});
        }
        Supplier<Figure> bodeFigure = () -> {
            BodePlot b = BodePlot.create().title("Plant: current to velocity, three load cases");
            for (int i = 0; i < frfs.size(); i++) b.add("case " + (i + 1), frfs.get(i));
            return b.mark("crossover", 100, 0, -130).figure();
        };
        double[][] t = readLog(log);
        Supplier<Figure> timeFigure = () -> TimePlot.over(t[0]).title("Excitation log, 40,940 samples")
                .panel("Current (A)").signal("injected", t[1]).signal("measured", t[2])
                .panel("Velocity (rad/s)").signal("velocity", t[3]).figure();

        double[] ourBode = measure(bodeFigure, BODE_REPS);
        double[] ourTime = measure(timeFigure, 5);
        double[][] mpl = matplotlib(python, bode, t);
        out.printf(Locale.ROOT, "%-37s | %-31s | %-31s | ratio (ours / matplotlib)%n", "figure", "Loopledger: wall, CPU, stored", "matplotlib (Agg PNG): wall, CPU, stored");
        row(out, "Bode, 3 x 2,000 points", ourBode, mpl[0]);
        row(out, "time plot, 2 panels, 40,940 samples", ourTime, mpl[1]);
        target(out, "Bode figure", ourBode, 0.100);
        out.printf(Locale.ROOT, "Loopledger bundle entries: %s%n", Bundles.of(bodeFigure.get()).data().keySet());
        return 0;
    }

    private static void row(PrintStream out, String name, double[] ours, double[] ref) {
        out.printf(Locale.ROOT, "%-37s | %7.1f ms %7.1f ms %8.1f KB | %7.1f ms %7.1f ms %8.1f KB | wall %5.2fx, CPU %5.2fx, size %5.2fx%n",
                name, ours[0] * 1e3, ours[2] * 1e3, ours[1] / 1e3, ref[0] * 1e3, ref[2] * 1e3, ref[1] / 1e3, ours[0] / ref[0], ours[2] / ref[2], ours[1] / ref[1]);
    }

    /**
     * Issue 11's render-time target, on wall and on CPU time. On a machine with more runnable threads than cores the
     * wall time includes waiting for a core, so the load average is printed beside it.
     */
    private static void target(PrintStream out, String name, double[] ours, double limitS) {
        double load = ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
        int cores = Runtime.getRuntime().availableProcessors();
        out.printf(Locale.ROOT, "target: %s rendered in at most %.0f ms warm: wall %.1f ms (%s), CPU %.1f ms (%s); load average %.1f on %d cores%n",
                name, limitS * 1e3, ours[0] * 1e3, verdict(ours[0], limitS), ours[2] * 1e3, verdict(ours[2], limitS), load, cores);
    }

    private static String verdict(double s, double limitS) {
        return s <= limitS ? "met" : String.format(Locale.ROOT, "missed by %.1f ms", (s - limitS) * 1e3);
    }

    /** Best wall time (s) of building and rendering, the stored size (bytes) of the bundle, best CPU time (s). */
    private static double[] measure(Supplier<Figure> figure, int reps) {
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        MimeBundle b = Bundles.of(figure.get());
        for (int i = 0; i < 3; i++) Bundles.of(figure.get());
        long best = Long.MAX_VALUE, bestCpu = Long.MAX_VALUE;
        for (int i = 0; i < reps; i++) {
            long c0 = mx.getCurrentThreadCpuTime(), t0 = System.nanoTime();
            b = Bundles.of(figure.get());
            best = Math.min(best, System.nanoTime() - t0);
            bestCpu = Math.min(bestCpu, mx.getCurrentThreadCpuTime() - c0);
        }
        return new double[] {best / 1e9, b.toJson().getBytes(StandardCharsets.UTF_8).length, bestCpu / 1e9};
    }

    static TransferFunction twoMass(double j, double fa, double fr) {
        double wa = 2 * Math.PI * fa, wr = 2 * Math.PI * fr;
        return TransferFunction.continuous(new double[] {1}, new double[] {j, 0})
                .times(TransferFunction.continuous(new double[] {1, 2 * 0.03 * wa, wa * wa}, new double[] {1, 2 * 0.02 * wr, wr * wr}))
                .times(wr * wr / (wa * wa));
    }

    /** time_s, current_injected_A, current_measured_A, velocity_rad_s of a demo log. */
    private static double[][] readLog(Path log) throws IOException {
        if (!Files.exists(log)) throw new IOException(log + " not found: run the benchmark from the repository root (it reads the demo log)");
        List<String> lines = Files.readAllLines(log);
        int n = lines.size() - 1;
        double[][] d = new double[4][n];
        for (int i = 0; i < n; i++) {
            String[] f = lines.get(i + 1).split(",");
            for (int k = 0; k < 4; k++) d[k][i] = Double.parseDouble(f[k]);
        }
        return d;
    }

    /** {time s, stored bytes} for the Bode and the time plot drawn by matplotlib. */
    private static double[][] matplotlib(String python, List<double[][]> bode, double[][] t) throws IOException, InterruptedException {
        Path f = Files.createTempFile("loopledger-figure-bench", ".f8");
        try {
            try (FileChannel ch = FileChannel.open(f, StandardOpenOption.WRITE)) {
                for (double[][] c : bode) for (double[] a : c) write(ch, a);
                for (double[] a : t) write(ch, a);
            }
            String script = String.join("\n",
                    "import sys, io, time, base64, json, numpy as np",
                    "import matplotlib; matplotlib.use('Agg'); import matplotlib.pyplot as plt",
                    "d = np.fromfile(sys.argv[1], dtype='<f8'); m = int(sys.argv[2]); n = int(sys.argv[3])",
                    "curves = [d[3*m*k:3*m*(k+1)].reshape(3, m) for k in range(3)]; t = d[9*m:].reshape(4, n)",
                    "def bode():",
                    "    fig, (a, b) = plt.subplots(2, 1, sharex=True, figsize=(6.4, 5.44), dpi=100)",
                    "    fig.suptitle('Plant: current to velocity, three load cases')",
                    "    for k, c in enumerate(curves):",
                    "        a.semilogx(c[0], c[1], label='case %d' % (k + 1)); b.semilogx(c[0], c[2])",
                    "    a.plot([100], [0], 'o'); b.plot([100], [-130], 'o')",
                    "    a.axhline(0, ls='--', c='grey'); b.axhline(-180, ls='--', c='grey')",
                    "    a.set_ylabel('Magnitude (dB)'); b.set_ylabel('Phase (deg)'); b.set_xlabel('Frequency (Hz)')",
                    "    a.grid(True); b.grid(True); a.legend()",
                    "    return fig",
                    "def timeplot():",
                    "    fig, (a, b) = plt.subplots(2, 1, sharex=True, figsize=(6.4, 4.64), dpi=100)",
                    "    fig.suptitle('Excitation log, 40,940 samples')",
                    "    a.plot(t[0], t[1], label='injected'); a.plot(t[0], t[2], label='measured'); b.plot(t[0], t[3], label='velocity')",
                    "    a.set_ylabel('Current (A)'); b.set_ylabel('Velocity (rad/s)'); b.set_xlabel('Time (s)')",
                    "    a.grid(True); b.grid(True); a.legend(); b.legend()",
                    "    return fig",
                    "res = []",
                    "for make, reps in ((bode, " + BODE_REPS + "), (timeplot, 5)):",
                    "    best = bestcpu = 1e9",
                    "    for r in range(reps + 2):",
                    "        t0 = time.perf_counter(); c0 = time.process_time(); fig = make(); buf = io.BytesIO(); fig.savefig(buf, format='png'); plt.close(fig)",
                    "        if r >= 2: best = min(best, time.perf_counter() - t0); bestcpu = min(bestcpu, time.process_time() - c0)",
                    "    stored = json.dumps({'image/png': base64.b64encode(buf.getvalue()).decode(), 'text/plain': '<Figure size 640x544 with 2 Axes>'})",
                    "    res.append('%r %d %r' % (best, len(stored), bestcpu))",
                    "print(' '.join(res))");
            Process p = new ProcessBuilder(python, "-c", script, f.toString(), Integer.toString(bode.get(0)[0].length), Integer.toString(t[0].length))
                    .redirectErrorStream(true).start();
            String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
            if (p.waitFor() != 0) throw new IOException("matplotlib run failed (install python3-matplotlib): " + text);
            String[] lines = text.split("\n");
            String[] v = lines[lines.length - 1].split(" ");
            return new double[][] {{Double.parseDouble(v[0]), Double.parseDouble(v[1]), Double.parseDouble(v[2])},
                    {Double.parseDouble(v[3]), Double.parseDouble(v[4]), Double.parseDouble(v[5])}};
        } finally {
            Files.deleteIfExists(f);
        }
    }

    private static void write(FileChannel ch, double[] a) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(a.length * 8).order(ByteOrder.LITTLE_ENDIAN);
        b.asDoubleBuffer().put(a);
        ch.write(b);
    }
}
