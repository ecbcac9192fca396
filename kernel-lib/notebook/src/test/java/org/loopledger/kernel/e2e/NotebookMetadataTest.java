package org.loopledger.kernel.e2e;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopledger.testing.PythonOracle;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Saving a notebook from Jupyter must not change its metadata: {@code loopledger run} writes the same
 * {@code language_info} as Debian's {@code jupyter nbconvert --execute} on our kernel (nbclient copies
 * it from {@code kernel_info_reply}), and the {@code kernelspec} jupyter_client's KernelSpecManager reads
 * from our kernel.json (what JupyterLab writes on saving). Outside references: nbconvert, jupyter_client.
 */
class NotebookMetadataTest {
    @Test
    void runAndNbconvertWriteTheSameKernelMetadata(@TempDir Path dir) throws Exception {
        PythonOracle.require("jupyter_client", "nbformat", "nbconvert");
        Path jupyterPath = TestKernelspec.install(dir.resolve("jupyter"));
        JsonArray argv = new JsonArray();
        List<String> command = new java.util.ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString()));
        command.addAll(org.loopledger.kernel.session.SessionOptions.HOST_FLAGS);
        command.addAll(List.of("-cp", System.getProperty("java.class.path"), "org.loopledger.cli.Main"));
        for (String a : command) argv.add(a);
        JsonObject input = new JsonObject();
        input.addProperty("jupyter_path", jupyterPath.toString());
        input.addProperty("dir", dir.toString());
        input.add("loopledger", argv);
        JsonObject r = PythonOracle.run(TestKernelspec.script("metadata_agree.py"), input).getAsJsonObject();
        JsonObject nbc = r.getAsJsonObject("nbconvert"), run = r.getAsJsonObject("run");
        assertEquals(0, nbc.get("returncode").getAsInt(), () -> nbc.get("stderr").getAsString());
        assertEquals(0, run.get("returncode").getAsInt(), () -> run.get("stderr").getAsString());
        JsonObject nbcMeta = nbc.getAsJsonObject("metadata"), runMeta = run.getAsJsonObject("metadata");
        assertEquals(nbcMeta.get("language_info"), runMeta.get("language_info"), "language_info: nbconvert vs loopledger run");
        assertEquals(r.get("kernelspec"), runMeta.get("kernelspec"), "kernelspec: kernel.json vs loopledger run");
    }
}
