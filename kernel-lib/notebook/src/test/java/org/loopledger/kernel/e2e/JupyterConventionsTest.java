package org.loopledger.kernel.e2e;

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
 * Jupyter conventions (issue 11), through Debian's jupyter_client (the outside reference) and the
 * messaging specification 5.3; one kernel session runs every step (conventions.py).
 */
class JupyterConventionsTest {
    static JsonObject record;

    @BeforeAll
    static void runSession(@TempDir Path dir) throws Exception {
        PythonOracle.require("jupyter_client", "zmq");
        Path jupyterPath = TestKernelspec.install(dir);
        record = PythonOracle.run(TestKernelspec.script("conventions.py"), Map.of("jupyter_path", jupyterPath.toString())).getAsJsonObject();
    }

    static JsonObject step(String name) {
        JsonObject o = record.getAsJsonObject(name);
        assertNotNull(o, "step " + name + " missing");
        assertFalse(o.has("exception"), () -> name + " failed in Python: " + o.get("exception").getAsString());
        return o;
    }

    /** Messaging spec 5.3, display_data: "JSON data ... is sent as a JSON object, not a string" for JSON MIME types. */
    @Test
    void jsonMimeTypesAreJsonObjects() {
        JsonObject s = step("json_mime");
        assertEquals("ok", s.getAsJsonObject("reply").get("status").getAsString(), s::toString);
        assertEquals("dict", s.get("python_type").getAsString(), () -> "jupyter_client decoded " + s.get("value"));
        assertTrue(s.get("value").isJsonObject() && s.getAsJsonObject("value").size() > 0, s::toString);
    }

    /** Messaging spec 5.3, execute_request stop_on_error (default true), as ipykernel aborts its queue. */
    @Test
    void queuedRequestsAreAbortedAfterAnError() {
        JsonObject s = step("stop_on_error");
        List<String> statuses = new ArrayList<>();
        for (JsonElement e : s.getAsJsonArray("statuses")) statuses.add(e.getAsString());
        assertEquals(List.of("error", "aborted", "aborted"), statuses);
        // the aborted cells did not run: the variable they would have changed is unchanged
        JsonObject after = s.getAsJsonObject("after");
        String shown = null;
        for (JsonElement e : after.getAsJsonArray("iopub")) {
            JsonObject m = e.getAsJsonObject();
            if (m.get("type").getAsString().equals("execute_result")) shown = m.getAsJsonObject("content").getAsJsonObject("data").get("text/plain").getAsString();
        }
        assertEquals("0", shown, after::toString);
    }

    /**
     * With {@code allow_stdin: false} (as the headless runner runs), reading System.in fails with a message
     * naming the problem and the fix, instead of a silent end of input (-1) or an input_request.
     */
    @Test
    void readingStandardInputFailsClearlyWithoutStdin() {
        JsonObject r = step("stdin_refused").getAsJsonObject("reply");
        assertEquals("error", r.get("status").getAsString(), r::toString);
        assertTrue(r.get("evalue").getAsString().contains("standard input is not available"), r::toString);
        assertTrue(r.get("evalue").getAsString().contains("allow_stdin is false"), r::toString);
    }

    /**
     * Jupyter messaging specification 5.3, "Messages on the stdin ROUTER/DEALER channel": with
     * {@code allow_stdin: true} a read sends {@code input_request} (prompt, password) whose parent is the
     * execute request; jupyter_client's {@code kc.input()} answers, and the line reaches the cell with its
     * line end (Scanner.nextLine returns it without).
     */
    @Test
    void readingStandardInputAsksTheFrontEnd() {
        JsonObject s = step("stdin_answered");
        JsonObject req = s.getAsJsonObject("request");
        assertEquals("input_request", req.get("type").getAsString(), s::toString);
        assertEquals("", req.getAsJsonObject("content").get("prompt").getAsString(), s::toString);
        assertFalse(req.getAsJsonObject("content").get("password").getAsBoolean(), s::toString);
        assertEquals(s.get("msg_id").getAsString(), req.get("parent_msg_id").getAsString(), s::toString);
        assertEquals("ok", s.getAsJsonObject("reply").get("status").getAsString(), s::toString);
        String shown = null;
        for (JsonElement e : s.getAsJsonArray("iopub")) {
            JsonObject m = e.getAsJsonObject();
            if (m.get("type").getAsString().equals("execute_result")) shown = m.getAsJsonObject("content").getAsJsonObject("data").get("text/plain").getAsString();
        }
        assertEquals("\"hello axis\"", shown, s::toString);
    }

    /** An interrupt while the kernel waits for input_reply ends the cell with an error; the next cell runs. */
    @Test
    void interruptWhileWaitingForInputDoesNotHang() {
        JsonObject s = step("stdin_interrupted");
        assertEquals("input_request", s.get("request_type").getAsString(), s::toString);
        assertEquals("error", s.getAsJsonObject("reply").get("status").getAsString(), s::toString);
        JsonObject after = s.getAsJsonObject("after");
        assertEquals("ok", after.getAsJsonObject("reply").get("status").getAsString(), s::toString);
    }

    /** A shutdown request while the kernel waits for input_reply ends the kernel process without being killed. */
    @Test
    void shutdownWhileWaitingForInputDoesNotHang() {
        JsonObject s = step("stdin_shutdown");
        assertEquals("input_request", s.get("request_type").getAsString(), s::toString);
        assertTrue(s.get("ended_by_itself").getAsBoolean(), s::toString);
    }
}
