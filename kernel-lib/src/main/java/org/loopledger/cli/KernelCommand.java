package org.loopledger.cli;

import org.loopledger.kernel.KernelServer;
import org.loopledger.kernel.protocol.ConnectionInfo;
import org.loopledger.kernel.session.SessionOptions;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code loopledger kernel CONNECTION_FILE}: the Jupyter kernel, as started from the kernelspec. */
@Command(name = "kernel", description = "Run the Jupyter kernel for a connection file (started by Jupyter).")
final class KernelCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "CONNECTION_FILE", description = "Jupyter connection file (JSON)")
    Path connectionFile;

    @Override
    public Integer call() throws Exception {
        ConnectionInfo info = ConnectionInfo.read(connectionFile);
        try (KernelServer server = KernelServer.start(info, SessionOptions.defaults())) {
            server.awaitShutdown();
        }
        return 0;
    }
}
