package org.loopledger.notebook;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;

import java.time.Duration;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.Consumer;

/**
 * Executes a notebook's code cells in order on a {@link CellEngine}, stopping at the first cell that
 * fails (or, with {@link Options#allowErrors}, running on and recording every failure), and returns the
 * executed notebook with outputs, execution counts and, in the notebook metadata under
 * {@code loopledger}, the library version, the run date, the datasets read and the cells that failed.
 * A cell that runs longer than {@link Options#cellTimeout} is interrupted; one that ignores the
 * interrupt for {@link Options#forceStopGrace} is ended by {@link CellEngine#forceStop}.
 * The input notebook value is not modified (values are immutable); writing is the caller's choice.
 */
public final class NotebookRunner {
    /** How long a timed-out cell may take to stop after the interrupt before the engine is forced. */
    static final Duration FORCE_STOP_GRACE = Duration.ofSeconds(10);
    /** The default per-cell timeout of {@code run} and {@code verify}. */
    public static final Duration DEFAULT_CELL_TIMEOUT = Duration.ofMinutes(10);

    /**
     * How to run.
     *
     * @param cellTimeout    longest time one cell may run; zero means no limit
     * @param allowErrors    keep running after a failing cell (its error is recorded) instead of stopping
     * @param forceStopGrace how long a timed-out cell may take to end after the interrupt before
     *                       {@link CellEngine#forceStop} ({@link #FORCE_STOP_GRACE} by default)
     */
    public record Options(Duration cellTimeout, boolean allowErrors, Duration forceStopGrace) {
        public Options {
            if (cellTimeout == null || cellTimeout.isNegative()) throw new IllegalArgumentException("cell timeout must be zero (no limit) or positive, got " + cellTimeout);
            if (forceStopGrace == null || forceStopGrace.isNegative()) throw new IllegalArgumentException("force-stop grace must be positive, got " + forceStopGrace);
        }

        public Options(Duration cellTimeout, boolean allowErrors) { this(cellTimeout, allowErrors, FORCE_STOP_GRACE); }

        /** Stop at the first failure, {@link #DEFAULT_CELL_TIMEOUT} per cell. */
        public static Options defaults() { return new Options(DEFAULT_CELL_TIMEOUT, false); }
    }

    /** A cell that failed: its number among all notebook cells (1-based) and "Name: message". */
    public record CellFailure(int cellNumber, String failure) {}

    /**
     * Outcome of a run. {@code failedCellNumber} is the first failed cell (0 when every cell ran
     * cleanly), {@code failures} lists every failed cell, {@code datasetReaders} maps each dataset path
     * to the notebook cells (1-based) that read it.
     */
    public record Outcome(Notebook executed, int failedCellNumber, String failure, List<RecordInfo.DatasetDigest> datasets, Duration elapsed,
                          List<CellFailure> failures, Map<String, List<Integer>> datasetReaders) {
        public Outcome {
            datasets = List.copyOf(datasets);
            failures = List.copyOf(failures);
            Map<String, List<Integer>> m = new LinkedHashMap<>();
            datasetReaders.forEach((k, v) -> m.put(k, List.copyOf(v)));
            datasetReaders = Collections.unmodifiableMap(m);
        }

        public boolean succeeded() { return failures.isEmpty(); }

        /** The notebook cells that read {@code path} (empty when unknown). */
        public List<Integer> readersOf(String path) { return datasetReaders.getOrDefault(path, List.of()); }
    }

    private NotebookRunner() {}

    /** {@link #run(Notebook, CellEngine, String, String, Consumer, Options)} with {@link Options#defaults()}. */
    public static Outcome run(Notebook nb, CellEngine engine, String libraryVersion, String runDate, Consumer<String> progress) {
        return run(nb, engine, libraryVersion, runDate, progress, Options.defaults());
    }

    /**
     * Runs the code cells. {@code progress} receives one line per cell ("cell 3 of 12 ...") as it
     * starts and finishes. Cells after a failure (without {@code allowErrors}) are written without
     * outputs or execution count: they did not run.
     */
    public static Outcome run(Notebook nb, CellEngine engine, String libraryVersion, String runDate, Consumer<String> progress, Options options) {
        long t0 = System.nanoTime();
        List<Cell> out = new ArrayList<>();
        int total = nb.codeCells().size();
        int count = 0, cellNumber = 0;
        List<CellFailure> failures = new ArrayList<>();
        Map<String, RecordInfo.DatasetDigest> datasets = new LinkedHashMap<>();
        Map<String, Long> reads = new LinkedHashMap<>();
        Map<String, List<Integer>> readers = new LinkedHashMap<>();
        ScheduledExecutorService watchdog = Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, "loopledger-cell-timeout");
            t.setDaemon(true);
            return t;
        });
        try {
            boolean stopped = false;
            for (Cell c : nb.cells()) {
                cellNumber++;
                if (!(c instanceof Cell.Code code)) {
                    out.add(c);
                    continue;
                }
                if (stopped) {
                    out.add(code.withResults(null, List.of()));
                    continue;
                }
                count++;
                long tc = System.nanoTime();
                progress.accept(String.format(Locale.ROOT, "cell %d of %d (notebook cell %d) ...", count, total, cellNumber));
                List<Output> outputs = executeWithTimeout(engine, code.source(), count, cellNumber, options, watchdog);
                out.add(code.withResults(count, outputs));
                trackProvenance(engine, cellNumber, datasets, reads, readers);
                double s = (System.nanoTime() - tc) / 1e9, all = (System.nanoTime() - t0) / 1e9;
                String failure = null;
                for (Output o : outputs) if (o instanceof Output.Error e) failure = e.ename() + ": " + e.evalue();
                if (failure != null) {
                    failures.add(new CellFailure(cellNumber, failure));
                    if (!options.allowErrors()) stopped = true;
                }
                progress.accept(String.format(Locale.ROOT, "cell %d of %d %s in %.2f s (%.1f s elapsed)", count, total,
                        failure != null ? "FAILED" : "done", s, all));
            }
        } finally {
            watchdog.shutdownNow();
        }
        List<RecordInfo.DatasetDigest> ds = new ArrayList<>(datasets.values());
        String meta = withRunMetadata(nb.metadataJson(), libraryVersion, runDate, ds, failures);
        Notebook executed = new Notebook(nb.nbformatMinor(), meta, out);
        int first = failures.isEmpty() ? 0 : failures.get(0).cellNumber();
        String firstFailure = failures.isEmpty() ? "" : failures.get(0).failure();
        return new Outcome(executed, first, firstFailure, ds, Duration.ofNanos(System.nanoTime() - t0), failures, readers);
    }

    /** The first non-blank line of a cell, shortened, for messages. */
    static String firstLine(String source) {
        for (String line : source.split("\n")) {
            String t = line.strip();
            if (!t.isEmpty()) return t.length() > 60 ? t.substring(0, 57) + "..." : t;
        }
        return "(empty)";
    }

    private static List<Output> executeWithTimeout(CellEngine engine, String source, int count, int cellNumber, Options options,
                                                   ScheduledExecutorService watchdog) {
        Duration timeout = options.cellTimeout(), grace = options.forceStopGrace();
        if (timeout.isZero()) return engine.execute(source, count);
        AtomicBoolean timedOut = new AtomicBoolean(), forced = new AtomicBoolean();
        ScheduledFuture<?> interrupt = watchdog.schedule(() -> {
            timedOut.set(true);
            engine.interrupt();
        }, timeout.toMillis(), TimeUnit.MILLISECONDS);
        ScheduledFuture<?> force = watchdog.schedule(() -> {
            forced.set(true);
            engine.forceStop();
        }, timeout.plus(grace).toMillis(), TimeUnit.MILLISECONDS);
        List<Output> outputs;
        try {
            outputs = engine.execute(source, count);
        } finally {
            interrupt.cancel(false);
            force.cancel(false);
        }
        if (!timedOut.get()) return outputs;
        // The cell ran out of time: its own interrupt or restart error is replaced by one that says why.
        String what = "code cell " + count + " (notebook cell " + cellNumber + ", first line: " + firstLine(source) + ") ran longer than the cell timeout of "
                + seconds(timeout) + " and was stopped" + (forced.get() ? "; it ignored the interrupt for " + seconds(grace) + ", so its Java session was ended" : "");
        List<Output> kept = new ArrayList<>();
        for (Output o : outputs) if (!(o instanceof Output.Error)) kept.add(o);
        kept.add(new Output.Error("CellTimeout", what, List.of("CellTimeout: " + what,
                "Raise the limit with --cell-timeout (e.g. --cell-timeout 30m, or 0 for none) if the cell needs longer.")));
        return kept;
    }

    private static String seconds(Duration d) {
        return d.toMillis() % 1000 == 0 ? d.toSeconds() + " s" : d.toMillis() / 1000.0 + " s";
    }

    /** Reads the session's provenance after a cell and notes which datasets this cell read. */
    private static void trackProvenance(CellEngine engine, int cellNumber, Map<String, RecordInfo.DatasetDigest> datasets,
                                        Map<String, Long> reads, Map<String, List<Integer>> readers) {
        String json;
        try {
            json = engine.provenanceJson();
        } catch (RuntimeException e) {
            return; // the session ended: what earlier cells read is kept
        }
        if (json == null || json.isBlank()) return;
        JsonArray arr;
        try {
            arr = JsonParser.parseString(json).getAsJsonArray();
        } catch (RuntimeException e) {
            throw new IllegalStateException("the session returned unreadable provenance: " + json, e);
        }
        for (JsonElement e : arr) {
            JsonObject o = e.getAsJsonObject();
            String path = o.get("path").getAsString();
            long n = o.has("reads") ? o.get("reads").getAsLong() : 1;
            RecordInfo.DatasetDigest d = new RecordInfo.DatasetDigest(path, o.get("bytes").getAsLong(), o.get("sha256").getAsString());
            Long before = reads.get(path);
            // A fresh session (after a restart) counts from 1 again: any count below the last one is a new read.
            if (before == null || n != before || !d.equals(datasets.get(path))) {
                List<Integer> cells = readers.computeIfAbsent(path, k -> new ArrayList<>());
                if (!cells.contains(cellNumber)) cells.add(cellNumber);
            }
            reads.put(path, n);
            datasets.put(path, d);
        }
    }

    /** The notebook metadata with a {@code loopledger} entry describing this run (other entries kept). */
    static String withRunMetadata(String metadataJson, String libraryVersion, String runDate, List<RecordInfo.DatasetDigest> datasets,
                                  List<CellFailure> failures) {
        JsonObject meta = JsonParser.parseString(metadataJson).getAsJsonObject();
        // What Jupyter writes when it saves the notebook on our kernel, so a run and a save agree.
        meta.add("kernelspec", KernelIdentity.kernelspec());
        meta.add("language_info", KernelIdentity.languageInfo());
        JsonObject ll = new JsonObject();
        ll.addProperty("library_version", libraryVersion);
        ll.addProperty("run_date", runDate);
        ll.addProperty("java_version", System.getProperty("java.version"));
        JsonArray ds = new JsonArray();
        for (RecordInfo.DatasetDigest d : datasets) {
            JsonObject o = new JsonObject();
            o.addProperty("path", d.path());
            o.addProperty("bytes", d.bytes());
            o.addProperty("sha256", d.sha256());
            ds.add(o);
        }
        ll.add("datasets", ds);
        if (!failures.isEmpty()) {
            // Which cells failed, so a reader of the file (not only of the terminal) knows the run was not clean.
            JsonArray f = new JsonArray();
            for (CellFailure cf : failures) {
                JsonObject o = new JsonObject();
                o.addProperty("cell", cf.cellNumber());
                o.addProperty("error", cf.failure());
                f.add(o);
            }
            ll.add("failed_cells", f);
        }
        meta.add("loopledger", ll);
        return meta.toString();
    }

    /** Reads back what {@link #withRunMetadata} stored, for rendering an already executed notebook. */
    public static RecordInfo recordInfo(Notebook nb, String notebookName, String javaVersion) {
        JsonObject meta = JsonParser.parseString(nb.metadataJson()).getAsJsonObject();
        if (!meta.has("loopledger")) {
            throw new IllegalArgumentException(notebookName + " has not been executed by Loopledger (no 'loopledger' metadata); run it first with './loopledger run "
                    + notebookName + "'");
        }
        JsonObject ll = meta.getAsJsonObject("loopledger");
        List<RecordInfo.DatasetDigest> ds = new ArrayList<>();
        if (ll.has("datasets")) {
            for (JsonElement e : ll.getAsJsonArray("datasets")) {
                JsonObject o = e.getAsJsonObject();
                ds.add(new RecordInfo.DatasetDigest(o.get("path").getAsString(), o.get("bytes").getAsLong(), o.get("sha256").getAsString()));
            }
        }
        String java = ll.has("java_version") ? ll.get("java_version").getAsString() : javaVersion;
        return new RecordInfo(notebookName, ll.has("run_date") ? ll.get("run_date").getAsString() : "unknown",
                ll.has("library_version") ? ll.get("library_version").getAsString() : "unknown", java, ds);
    }
}
