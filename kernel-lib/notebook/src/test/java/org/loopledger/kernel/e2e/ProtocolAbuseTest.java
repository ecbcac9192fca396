package org.loopledger.kernel.e2e;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.PythonOracle;

import java.nio.file.Path;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Correctly signed but hostile traffic (issue 12), sent by protocol_abuse.py next to a Debian
 * jupyter_client that checks afterwards that the kernel still answers (Jupyter messaging specification 5.3).
 * Replays are dropped as jupyter_client's own {@code Session} drops them (its digest history); an
 * {@code execute_request} on the control channel gets an error and leaves the session alone; oversized
 * messages are dropped unread; a few thousand seeded mutations end no socket thread.
 */
class ProtocolAbuseTest {
    static JsonObject record;

    @BeforeAll
    static void runSession(@TempDir Path dir) throws Exception {
        PythonOracle.require("jupyter_client", "zmq");
        Path jupyterPath = TestKernelspec.install(dir);
        record = PythonOracle.run(TestKernelspec.script("protocol_abuse.py"), Map.of("jupyter_path", jupyterPath.toString(),
                "seed", 12, "mutations", 3000, "oversize_bytes", 80 << 20)).getAsJsonObject();
        System.out.println("protocol abuse: " + record);
    }

    static JsonObject step(String name) {
        JsonObject o = record.getAsJsonObject(name);
        assertNotNull(o, "step " + name + " missing");
        assertFalse(o.has("exception"), () -> name + " failed in Python: " + o.get("exception").getAsString());
        return o;
    }

    @Test
    void aReplayedMessageRunsOnce() {
        JsonObject r = step("replay");
        assertEquals(1, r.getAsJsonArray("replies").size(), r.toString());
        assertEquals("1", r.get("counter").getAsString(), "the cell ran once: " + r);
    }

    @Test
    void executeOnTheControlChannelIsRefusedAndTheSessionKept() {
        JsonObject r = step("control_execute");
        JsonArray replies = r.getAsJsonArray("control_replies");
        assertEquals(1, replies.size(), r.toString());
        assertEquals("error", replies.get(0).getAsJsonObject().get("status").getAsString());
        assertEquals("WrongChannel", replies.get(0).getAsJsonObject().get("ename").getAsString());
        assertEquals("ok", r.get("sleep_status").getAsString(), "the running cell was not disturbed: " + r);
        assertEquals("42", r.get("kept_plus_one").getAsString(), "variables survive: " + r);
    }

    @Test
    void oversizedMessagesAreDroppedAndTheKernelAnswers() {
        JsonObject r = step("oversize");
        assertEquals(0, r.getAsJsonArray("signed_replies").size(), "a signed 80 MiB message is not executed: " + r);
        assertEquals(0, r.getAsJsonArray("more_replies").size(), r.toString());
        assertEquals("1", r.get("counter").getAsString(), "neither oversized cell ran: " + r);
    }

    @Test
    void thousandsOfSignedMutationsLeaveTheKernelAnswering() {
        JsonObject r = step("fuzz");
        assertEquals("2", r.get("one_plus_one").getAsString(), r.toString());
        assertEquals("ok", r.get("kernel_info").getAsString(), r.toString());
        assertEquals("[\"ok\"]", r.getAsJsonArray("control_kernel_info").toString(), "the control thread answers: " + r);
        assertTrue(r.get("heartbeat").getAsBoolean(), r.toString());
        assertTrue(r.get("same_process").getAsBoolean(), "no restart: " + r);
        assertEquals("1", r.get("counter").getAsString(), "no session restart: " + r);
    }
}
