package org.loopledger.kernel.e2e;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.PythonOracle;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The kernel driven by Debian's jupyter_client (the outside reference), per the Jupyter messaging
 * specification, version 5.3. One Python process runs every step (kernel_session.py); the tests below
 * check its record.
 */
class KernelEndToEndTest {
    static JsonObject record;

    @BeforeAll
    static void runSession(@TempDir Path dir) throws Exception {
        PythonOracle.require("jupyter_client", "zmq");
        Path jupyterPath = TestKernelspec.install(dir);
        record = PythonOracle.run(TestKernelspec.script("kernel_session.py"), Map.of("jupyter_path", jupyterPath.toString())).getAsJsonObject();
        System.out.println("kernel ready after " + record.get("ready_seconds") + " s; trivial cell round trip " + record.get("latency"));
    }

    static JsonObject step(String name) {
        JsonObject o = record.getAsJsonObject(name);
        assertNotNull(o, "step " + name + " missing");
        assertFalse(o.has("exception"), () -> name + " failed in Python: " + o.get("exception").getAsString());
        return o;
    }

    static List<String> types(JsonObject run) {
        List<String> t = new ArrayList<>();
        for (JsonElement e : run.getAsJsonArray("iopub")) t.add(e.getAsJsonObject().get("type").getAsString());
        return t;
    }

    static JsonObject first(JsonObject run, String type) {
        for (JsonElement e : run.getAsJsonArray("iopub")) {
            if (e.getAsJsonObject().get("type").getAsString().equals(type)) return e.getAsJsonObject().getAsJsonObject("content");
        }
        fail("no " + type + " in " + types(run));
        return null;
    }

    @Test
    void kernelInfo() {
        JsonObject c = step("kernel_info");
        assertEquals("5.3", c.get("protocol_version").getAsString());
        assertEquals("loopledger", c.get("implementation").getAsString());
        JsonObject lang = c.getAsJsonObject("language_info");
        assertEquals("java", lang.get("name").getAsString());
        assertEquals("text/x-java-source", lang.get("mimetype").getAsString());
        assertEquals(".java", lang.get("file_extension").getAsString());
    }

    @Test
    void executeResultWithBusyIdleAroundIt() {
        JsonObject r = step("one_plus_one");
        assertEquals("ok", r.getAsJsonObject("reply").get("status").getAsString());
        assertEquals(1, r.getAsJsonObject("reply").get("execution_count").getAsInt());
        assertEquals(List.of("status", "execute_input", "execute_result", "status"), types(r));
        JsonArray io = r.getAsJsonArray("iopub");
        assertEquals("busy", io.get(0).getAsJsonObject().getAsJsonObject("content").get("execution_state").getAsString());
        JsonObject result = first(r, "execute_result");
        assertEquals("2", result.getAsJsonObject("data").get("text/plain").getAsString());
        assertEquals(1, result.get("execution_count").getAsInt());
    }

    @Test
    void silentNeitherCountsNorBroadcasts() {
        JsonObject s = step("silent");
        assertEquals(List.of("status", "status"), types(s));
        assertEquals(1, s.getAsJsonObject("reply").get("execution_count").getAsInt());
        JsonObject after = step("after_silent");
        assertEquals(2, after.getAsJsonObject("reply").get("execution_count").getAsInt());
        assertEquals("6", first(after, "execute_result").getAsJsonObject("data").get("text/plain").getAsString());
        assertEquals(2, step("no_history").getAsJsonObject("reply").get("execution_count").getAsInt(), "store_history=false does not count");
    }

    @Test
    void streamArrivesWhileTheCellRuns() {
        JsonObject r = step("stream");
        List<Double> times = new ArrayList<>();
        StringBuilder text = new StringBuilder();
        for (JsonElement e : r.getAsJsonArray("iopub")) {
            JsonObject m = e.getAsJsonObject();
            if (m.get("type").getAsString().equals("stream")) {
                times.add(m.get("t").getAsDouble());
                text.append(m.getAsJsonObject("content").get("text").getAsString());
            }
        }
        assertEquals("tick 0\ntick 1\ntick 2\ntick 3\n", text.toString());
        assertTrue(times.size() >= 3, "expected the text in several batches, got " + times.size());
        assertTrue(times.get(times.size() - 1) - times.get(0) > 0.4, "batches should be spread over the cell's run");
    }

    @Test
    void runtimeErrorWithCellLine() {
        JsonObject reply = step("error").getAsJsonObject("reply");
        assertEquals("error", reply.get("status").getAsString());
        assertEquals("java.lang.ArithmeticException", reply.get("ename").getAsString());
        assertTrue(reply.getAsJsonArray("traceback").toString().contains("line 2"), reply.toString());
        assertTrue(types(step("error")).contains("error"));
    }

    @Test
    void compileErrorWithCellLine() {
        JsonObject reply = step("compile_error").getAsJsonObject("reply");
        assertEquals("CompileError", reply.get("ename").getAsString());
        assertTrue(reply.get("evalue").getAsString().startsWith("line 2:"), reply.toString());
    }

    @Test
    void displayDataThenExecuteResult() {
        JsonObject r = step("display");
        assertEquals(List.of("status", "execute_input", "display_data", "execute_result", "status"), types(r));
        JsonObject data = first(r, "display_data").getAsJsonObject("data");
        assertEquals("**hi** <b>x</b>", data.get("text/markdown").getAsString());
        assertTrue(data.get("text/html").getAsString().contains("<strong>hi</strong> &lt;b&gt;x&lt;/b&gt;"), data.toString());
    }

    @Test
    void completeInspectIsComplete() {
        JsonObject c = step("complete");
        assertEquals("ok", c.get("status").getAsString());
        assertTrue(c.getAsJsonArray("matches").toString().contains("toUpperCase("), c.toString());
        assertEquals(9, c.get("cursor_start").getAsInt());
        assertEquals(14, c.get("cursor_end").getAsInt());
        JsonObject i = step("inspect");
        assertTrue(i.get("found").getAsBoolean());
        assertTrue(i.getAsJsonObject("data").get("text/plain").getAsString().contains("max("), i.toString());
        assertEquals("incomplete", step("is_complete_open").get("status").getAsString());
        assertEquals("complete", step("is_complete_done").get("status").getAsString());
        assertEquals(0, step("comm_info").getAsJsonObject("comms").size());
    }

    @Test
    void interruptStopsATightLoop() {
        JsonObject r = step("interrupt");
        assertEquals("Interrupted", r.getAsJsonObject("reply").get("ename").getAsString());
        double waited = r.get("reply_at").getAsDouble() - record.get("interrupt_sent_at").getAsDouble();
        assertTrue(waited < 5, "reply " + waited + " s after the interrupt");
        assertEquals("3", first(step("after_interrupt"), "execute_result").getAsJsonObject("data").get("text/plain").getAsString());
    }

    @Test
    void forgedAndMalformedMessagesAreIgnored() {
        JsonObject f = step("forged");
        assertEquals(0, f.getAsJsonArray("iopub_for_forged").size(), f.toString());
        assertFalse(f.get("forged_reply").getAsBoolean());
        assertEquals("ok", f.get("still_answers").getAsString());
    }

    @Test
    void megabytesOfOutput() {
        JsonObject m = step("megabytes");
        assertEquals("ok", m.getAsJsonObject("reply").get("status").getAsString());
        assertTrue(m.get("chars").getAsInt() > 1_500_000, m.toString());
        assertEquals("line 39999 of a long printout ..................", m.get("last_line").getAsString());
    }

    @Test
    void systemExitRestartsTheSessionAndTellsTheUser() {
        JsonObject r = step("system_exit");
        assertEquals("SessionRestarted", r.getAsJsonObject("reply").get("ename").getAsString());
        assertTrue(first(r, "stream").get("text").getAsString().contains("fresh session"));
        assertEquals("4", first(step("after_exit"), "execute_result").getAsJsonObject("data").get("text/plain").getAsString());
    }

    @Test
    void restartAndShutdown() {
        JsonObject r = step("restart");
        assertEquals(1, r.getAsJsonObject("reply").get("execution_count").getAsInt(), "a restarted kernel counts from 1");
        assertFalse(record.get("alive_after_shutdown").getAsBoolean());
        assertTrue(record.get("shutdown_seconds").getAsDouble() < 5, "clean shutdown, not a kill after the timeout");
    }

    @Test
    void trivialCellLatency() {
        JsonObject l = step("latency");
        // sanity bound only (shared, loaded machine); the benchmark reports the real figure
        assertTrue(l.get("median_ms").getAsDouble() < 1000, l.toString());
    }
}
