package org.loopledger.kernel.e2e;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.PythonOracle;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Shift-Tab inspection shows the library's Javadoc (summary, parameters with their units), not only the signature:
 * asked through Debian's jupyter_client ({@code KernelClient.inspect}, the client Jupyter itself uses), one kernel
 * for every case (inspect_docs.py). The expected words are the doc comments in the library's own sources.
 */
class InspectDocsTest {
    /** A line before the inspected one: the kernel inspects the snippet under the cursor, not the cell's first. */
    static final String PREFIX = "int unrelated = 1;\n";
    static JsonArray replies;

    static final List<String> CODES = List.of(
            "FrfFromLogs.currentToVelocity().bandHz(",                 // 0: a method of a library class, imported in the cell
            "org.loopledger.tune.PlantCase",                            // 1: a record by its qualified name
            "FrfDetection.none",                                        // 2: nothing known there
            "Math.max(",                                                // 3: a JDK method: the signature as before
            "Spec.builder().minPhaseMarginDeg(",                        // 4: a pre-imported package (analysis), builder method
            "new org.loopledger.tune.PlantCase(",                       // 5: a record's canonical constructor
            "org.loopledger.ident.estimate.LoadCaseEstimate",           // 6: a record with @param lines
            "probe.sampleRateHz(");                                     // 7: a record component's accessor

    @BeforeAll
    static void inspect(@TempDir Path dir) throws Exception {
        PythonOracle.require("jupyter_client", "zmq");
        Path jupyterPath = TestKernelspec.install(dir);
        List<List<Object>> cases = CODES.stream().map(c -> List.<Object>of(PREFIX + c, (PREFIX + c).length())).toList();
        JsonObject r = PythonOracle.run(TestKernelspec.script("inspect_docs.py"), Map.of("jupyter_path", jupyterPath.toString(),
                "setup", List.of("import org.loopledger.ident.estimate.*;", "LoadCaseEstimate probe = null;"), "cases", cases))
                .getAsJsonObject();
        replies = r.getAsJsonArray("replies");
        assertEquals(CODES.size(), replies.size());
    }

    static JsonObject reply(int i) {
        JsonObject o = replies.get(i).getAsJsonObject();
        assertFalse(o.has("exception"), () -> CODES.get(i) + ": " + o.get("exception").getAsString());
        assertEquals("ok", o.get("status").getAsString(), o.toString());
        return o;
    }

    static String plain(int i) { return reply(i).getAsJsonObject("data").get("text/plain").getAsString(); }

    @Test
    void methodShowsSummaryAndParametersWithUnits() {
        String t = plain(0);
        assertTrue(t.contains("bandHz(double lowHz, double highHz)"), t);              // the signature, as before
        assertTrue(t.contains("Keeps the excited lines from lowHz to highHz (inclusive)"), t); // summary, {@code} unwrapped
        JsonObject data = reply(0).getAsJsonObject("data");
        assertTrue(data.has("text/markdown"), data.toString());
        assertTrue(data.get("text/markdown").getAsString().contains("`lowHz`"), data.toString());
    }

    @Test
    void recordShowsItsDescriptionAndComponents() {
        String t = plain(1);
        assertTrue(t.contains("One load case for the tuner"), t);
        assertTrue(t.contains("rad/s") && t.contains("m/s"), t); // the units the doc states
        String c = plain(5);
        assertTrue(c.contains("PlantCase(String label"), c);
    }

    @Test
    void recordParametersAndComponentAccessorsCarryTheirUnits() {
        String t = plain(6);
        assertTrue(t.contains("Parameters:"), t);
        assertTrue(t.contains("sampleRateHz - the log's sample rate, Hz"), t);
        assertTrue(reply(6).getAsJsonObject("data").get("text/markdown").getAsString().contains("- `sampleRateHz`: the log's sample rate, Hz"), reply(6).toString());
        String a = plain(7);
        assertTrue(a.contains("sampleRateHz()") && a.contains("the log's sample rate, Hz"), a);
    }

    @Test
    void builderMethodOfAPreimportedPackage() {
        String t = plain(4);
        assertTrue(t.contains("minPhaseMarginDeg(double"), t);
        assertTrue(t.length() > t.indexOf(')') + 20, "a description after the signature: " + t);
    }

    @Test
    void unknownNameIsNotFoundAndJdkStillShowsItsSignature() {
        assertFalse(reply(2).get("found").getAsBoolean(), reply(2).toString());
        assertTrue(plain(3).contains("max(int"), plain(3));
    }
}
