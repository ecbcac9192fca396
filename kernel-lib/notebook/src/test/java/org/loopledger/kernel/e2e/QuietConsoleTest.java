package org.loopledger.kernel.e2e;

import com.google.gson.JsonObject;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.PythonOracle;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The routine "serving ConnectionInfo" line goes to the kernel log file, not to the console a Jupyter
 * server shows (the kernel's standard error and output, captured here through Debian's jupyter_client).
 */
class QuietConsoleTest {
    @Test
    void servingLineGoesToTheLogNotTheConsole(@TempDir Path dir) throws Exception {
        PythonOracle.require("jupyter_client", "zmq");
        Path jupyterPath = TestKernelspec.install(dir.resolve("jupyter"));
        Path log = dir.resolve("kernel.log");
        JsonObject r = PythonOracle.run(TestKernelspec.script("quiet_console.py"),
                Map.of("jupyter_path", jupyterPath.toString(), "log", log.toString())).getAsJsonObject();
        assertEquals("ok", r.get("reply").getAsString(), r::toString);
        assertTrue(r.get("stderr").isJsonPrimitive(), "stderr was captured: " + r);
        String console = r.get("stderr").getAsString() + r.get("stdout").getAsString();
        assertFalse(console.contains("serving"), () -> "console: " + console);
        assertTrue(Files.readString(log).contains("serving"), "the log file has the serving line");
    }
}
