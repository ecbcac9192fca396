package org.loopledger.cli;

import org.loopledger.kernel.KernelServer;
import org.loopledger.kernel.protocol.ConnectionInfo;
import org.loopledger.kernel.session.SessionOptions;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code loopledger kernel CONNECTION_FILE}: the Jupyter kernel, as started from the kernelspec. */
@Command(name = "kernel", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, description = "Run the Jupyter kernel for a connection file (started by Jupyter).")
final class KernelCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "CONNECTION_FILE", description = "Jupyter connection file (JSON)")
    Path connectionFile;

    @Override
    public Integer call() throws Exception {
        ConnectionInfo info;
        try {
            info = ConnectionInfo.read(connectionFile);
        } catch (java.nio.file.NoSuchFileException e) {
            throw new IllegalArgumentException("connection file " + connectionFile + " does not exist; Jupyter writes it and passes its path");
        } catch (java.io.IOException e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
        try (KernelServer server = KernelServer.start(info, SessionOptions.defaults())) {
            server.awaitShutdown();
        }
        return 0;
    }
}
