package org.loopledger.notebook;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Compares a stored notebook with a re-executed one, cell by cell: text must match exactly except for
 * numbers, which must agree to a relative tolerance; plots are compared through the data they draw
 * ({@value #PLOT_DATA_MIME} when present, otherwise the numbers inside the SVG), never through pixels.
 */
public final class OutputComparison {
    /** MIME type under which a plot carries the data of its series. */
    public static final String PLOT_DATA_MIME = "application/vnd.loopledger.plot-data+json";

    private static final Pattern NUMBER = Pattern.compile("[-+]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][-+]?\\d+)?");

    /** The outcome for one cell. */
    public record CellResult(int cellNumber, boolean reproduced, String detail) {
        @Override public String toString() { return "cell " + cellNumber + ": " + (reproduced ? "reproduces" : "DIFFERS - " + detail); }
    }

    /** The outcome for a notebook: one result per code cell. */
    public record Report(List<CellResult> cells) {
        public Report { cells = List.copyOf(cells); }

        public boolean allReproduced() { return cells.stream().allMatch(CellResult::reproduced); }

        public List<CellResult> differing() { return cells.stream().filter(c -> !c.reproduced()).toList(); }

        @Override public String toString() {
            StringBuilder sb = new StringBuilder();
            for (CellResult c : cells) sb.append(c).append('\n');
            long bad = differing().size();
            sb.append(bad == 0 ? "all " + cells.size() + " code cells reproduce" : bad + " of " + cells.size() + " code cells differ");
            return sb.toString();
        }
    }

    private final double relativeTolerance;
    private final double absoluteTolerance;

    private OutputComparison(double rtol, double atol) {
        if (!(rtol >= 0) || !(atol >= 0)) throw new IllegalArgumentException("tolerances must be non-negative, got rtol " + rtol + ", atol " + atol);
        this.relativeTolerance = rtol;
        this.absoluteTolerance = atol;
    }

    /** Numbers agree when |a - b| &lt;= rtol·max(|a|, |b|) + atol. */
    public static OutputComparison withTolerance(double relativeTolerance, double absoluteTolerance) {
        return new OutputComparison(relativeTolerance, absoluteTolerance);
    }

    /** Compares every code cell of {@code stored} with the same cell of {@code rerun} (same cell list expected). */
    public Report compare(Notebook stored, Notebook rerun) {
        List<CellResult> out = new ArrayList<>();
        List<Cell> a = stored.cells(), b = rerun.cells();
        if (a.size() != b.size()) throw new IllegalArgumentException("notebooks have different cell counts (" + a.size() + " vs " + b.size() + ")");
        for (int i = 0; i < a.size(); i++) {
            if (!(a.get(i) instanceof Cell.Code ca)) continue;
            Cell.Code cb = (Cell.Code) b.get(i);
            out.add(compareCell(i + 1, ca.outputs(), cb.outputs()));
        }
        return new Report(out);
    }

    private CellResult compareCell(int n, List<Output> a, List<Output> b) {
        if (a.size() != b.size()) return new CellResult(n, false, "stored " + a.size() + " output(s), re-run gave " + b.size() + describe(b));
        for (int k = 0; k < a.size(); k++) {
            String d = compareOutput(a.get(k), b.get(k));
            if (d != null) return new CellResult(n, false, "output " + (k + 1) + ": " + d);
        }
        return new CellResult(n, true, "");
    }

    private static String describe(List<Output> outs) {
        for (Output o : outs) if (o instanceof Output.Error e) return " (" + e.ename() + ": " + e.evalue() + ")";
        return "";
    }

    private String compareOutput(Output x, Output y) {
        if (x.getClass() != y.getClass()) return "kind changed from " + kind(x) + " to " + kind(y) + (y instanceof Output.Error e ? " (" + e.ename() + ": " + e.evalue() + ")" : "");
        if (x instanceof Output.Stream s) return text("stream " + s.name(), s.text(), ((Output.Stream) y).text());
        if (x instanceof Output.Error e) {
            Output.Error f = (Output.Error) y;
            return e.ename().equals(f.ename()) ? text("error message", e.evalue(), f.evalue()) : "error changed from " + e.ename() + " to " + f.ename();
        }
        Map<String, String> da = x instanceof Output.DisplayData d ? d.data() : ((Output.ExecuteResult) x).data();
        Map<String, String> db = y instanceof Output.DisplayData d ? d.data() : ((Output.ExecuteResult) y).data();
        return bundle(da, db);
    }

    private String bundle(Map<String, String> a, Map<String, String> b) {
        if (!a.keySet().equals(b.keySet())) return "MIME types changed from " + a.keySet() + " to " + b.keySet();
        boolean plotData = a.containsKey(PLOT_DATA_MIME);
        for (String mime : a.keySet()) {
            if (mime.equals("image/png") && (plotData || a.containsKey("image/svg+xml"))) continue; // pixels are not data
            if (mime.equals("image/svg+xml") && plotData) continue;
            boolean json = mime.equals("application/json") || mime.endsWith("+json");
            String d = json ? text(mime, canonicalJson(a.get(mime)), canonicalJson(b.get(mime))) : text(mime, a.get(mime), b.get(mime));
            if (d != null) return d;
        }
        return null;
    }

    /**
     * JSON text with object keys sorted at every level, so that the order in which a renderer wrote
     * the keys (insertion order) and the order in which a notebook file stores them (sorted) compare
     * equal. Text that is not JSON is returned unchanged.
     */
    static String canonicalJson(String text) {
        try {
            return sorted(JsonParser.parseString(text)).toString();
        } catch (RuntimeException e) {
            return text;
        }
    }

    /** A copy of {@code e} with object keys sorted at every level. */
    static JsonElement sorted(JsonElement e) {
        if (e.isJsonObject()) {
            TreeMap<String, JsonElement> m = new TreeMap<>();
            for (var en : e.getAsJsonObject().entrySet()) m.put(en.getKey(), sorted(en.getValue()));
            JsonObject o = new JsonObject();
            m.forEach(o::add);
            return o;
        }
        if (e.isJsonArray()) {
            JsonArray a = new JsonArray(e.getAsJsonArray().size());
            for (JsonElement x : e.getAsJsonArray()) a.add(sorted(x));
            return a;
        }
        return e;
    }

    /** null when equal under the tolerance, else a description of the first difference. */
    String text(String what, String a, String b) {
        Matcher ma = NUMBER.matcher(a), mb = NUMBER.matcher(b);
        int pa = 0, pb = 0;
        while (true) {
            boolean fa = ma.find(), fb = mb.find();
            String sa = a.substring(pa, fa ? ma.start() : a.length());
            String sb = b.substring(pb, fb ? mb.start() : b.length());
            if (!sa.equals(sb)) return what + ": text differs near \"" + snippet(sa) + "\" vs \"" + snippet(sb) + "\"";
            if (fa != fb) return what + ": a number appears in one version only";
            if (!fa) return null;
            double va = Double.parseDouble(ma.group()), vb = Double.parseDouble(mb.group());
            // identical digits are equal even where they do not fit a double (hex digests, long ids)
            if (!ma.group().equals(mb.group()) && !(Math.abs(va - vb) <= relativeTolerance * Math.max(Math.abs(va), Math.abs(vb)) + absoluteTolerance)) {
                return what + ": " + ma.group() + " became " + mb.group() + " (beyond relative tolerance " + relativeTolerance + ")";
            }
            pa = ma.end();
            pb = mb.end();
        }
    }

    private static String snippet(String s) {
        String t = s.replace("\n", "\\n");
        return t.length() > 60 ? t.substring(0, 60) + "…" : t;
    }

    private static String kind(Output o) {
        if (o instanceof Output.Stream) return "stream";
        if (o instanceof Output.Error) return "error";
        if (o instanceof Output.DisplayData) return "display";
        return "result";
    }
}
