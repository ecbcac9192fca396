package org.loopledger.kernel.e2e;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.PythonOracle;

import java.nio.file.Path;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/** Debian's jupyter-nbconvert executes a notebook on our kernel; nbformat validates the result (the outside references). */
class NbconvertTest {
    @Test
    void executesAndValidates(@TempDir Path dir) throws Exception {
        PythonOracle.require("jupyter_client", "nbformat", "nbconvert");
        Path jupyterPath = TestKernelspec.install(dir.resolve("jupyter"));
        JsonObject r = PythonOracle.run(TestKernelspec.script("nbconvert_run.py"), Map.of("jupyter_path", jupyterPath.toString(), "dir", dir.toString())).getAsJsonObject();
        assertEquals(0, r.get("returncode").getAsInt(), () -> r.get("stderr").getAsString());
        assertTrue(r.get("valid").getAsBoolean(), r::toString);
        JsonArray outputs = r.getAsJsonArray("outputs");
        JsonObject printed = outputs.get(0).getAsJsonArray().get(0).getAsJsonObject();
        assertEquals("stream", printed.get("output_type").getAsString());
        assertEquals("hello from java\n", printed.get("text").getAsString());
        JsonObject result = outputs.get(1).getAsJsonArray().get(0).getAsJsonObject();
        assertEquals("execute_result", result.get("output_type").getAsString());
        assertEquals("42", result.getAsJsonObject("data").get("text/plain").getAsString());
        JsonObject shown = outputs.get(2).getAsJsonArray().get(0).getAsJsonObject();
        assertEquals("display_data", shown.get("output_type").getAsString());
        assertEquals("**bold**", shown.getAsJsonObject("data").get("text/markdown").getAsString());
    }
}
