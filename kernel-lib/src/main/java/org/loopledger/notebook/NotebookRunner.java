package org.loopledger.notebook;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;

/**
 * Executes a notebook's code cells in order on a {@link CellEngine}, stopping at the first cell that
 * fails, and returns the executed notebook with outputs, execution counts and, in the notebook
 * metadata under {@code loopledger}, the library version, the run date and the datasets read.
 * The input notebook value is not modified (values are immutable); writing is the caller's choice.
 */
public final class NotebookRunner {
    /** Expression the runner evaluates at the end to learn which datasets the session read. */
    static final String PROVENANCE_EXPRESSION = "org.loopledger.provenance.Provenance.datasetsJson()";

    /** Outcome of a run. {@code failedCellNumber} is 0 when every cell ran. */
    public record Outcome(Notebook executed, int failedCellNumber, String failure, List<RecordInfo.DatasetDigest> datasets, Duration elapsed) {
        public Outcome { datasets = List.copyOf(datasets); }

        public boolean succeeded() { return failedCellNumber == 0; }
    }

    private NotebookRunner() {}

    /**
     * Runs every code cell. {@code progress} receives one line per cell ("cell 3 of 12 ...") as it
     * starts and finishes.
     */
    public static Outcome run(Notebook nb, CellEngine engine, String libraryVersion, String runDate, Consumer<String> progress) {
        long t0 = System.nanoTime();
        List<Cell> out = new ArrayList<>();
        int total = nb.codeCells().size();
        int count = 0, cellNumber = 0, failed = 0;
        String failure = "";
        for (Cell c : nb.cells()) {
            cellNumber++;
            if (!(c instanceof Cell.Code code) || failed != 0) {
                out.add(c instanceof Cell.Code code2 && failed != 0 ? code2.withResults(null, List.of()) : c);
                continue;
            }
            count++;
            long tc = System.nanoTime();
            progress.accept(String.format(java.util.Locale.ROOT, "cell %d of %d (notebook cell %d) ...", count, total, cellNumber));
            List<Output> outputs = engine.execute(code.source(), count);
            out.add(code.withResults(count, outputs));
            double s = (System.nanoTime() - tc) / 1e9, all = (System.nanoTime() - t0) / 1e9;
            for (Output o : outputs) {
                if (o instanceof Output.Error e) {
                    failed = cellNumber;
                    failure = e.ename() + ": " + e.evalue();
                }
            }
            progress.accept(String.format(java.util.Locale.ROOT, "cell %d of %d %s in %.2f s (%.1f s elapsed)", count, total,
                    failed == cellNumber ? "FAILED" : "done", s, all));
        }
        List<RecordInfo.DatasetDigest> datasets = readProvenance(engine);
        String meta = withRunMetadata(nb.metadataJson(), libraryVersion, runDate, datasets);
        Notebook executed = new Notebook(nb.nbformatMinor(), meta, out);
        return new Outcome(executed, failed, failure, datasets, Duration.ofNanos(System.nanoTime() - t0));
    }

    private static List<RecordInfo.DatasetDigest> readProvenance(CellEngine engine) {
        List<RecordInfo.DatasetDigest> r = new ArrayList<>();
        String json;
        try {
            json = engine.evaluateQuietly(PROVENANCE_EXPRESSION);
        } catch (RuntimeException e) {
            return r;
        }
        if (json == null || json.isBlank()) return r;
        for (JsonElement e : JsonParser.parseString(json).getAsJsonArray()) {
            JsonObject o = e.getAsJsonObject();
            r.add(new RecordInfo.DatasetDigest(o.get("path").getAsString(), o.get("bytes").getAsLong(), o.get("sha256").getAsString()));
        }
        return r;
    }

    /** The notebook metadata with a {@code loopledger} entry describing this run (other entries kept). */
    static String withRunMetadata(String metadataJson, String libraryVersion, String runDate, List<RecordInfo.DatasetDigest> datasets) {
        JsonObject meta = JsonParser.parseString(metadataJson).getAsJsonObject();
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
