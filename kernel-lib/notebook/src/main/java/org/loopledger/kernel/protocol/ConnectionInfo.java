package org.loopledger.kernel.protocol;

import com.google.gson.Gson;
import com.google.gson.JsonObject;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * A Jupyter connection file (Jupyter messaging specification 5.3, "Kernel specs" / connection files):
 * transport, ip, the five ports, the signature scheme and the key. The key never appears in
 * {@link #toString()}.
 */
public record ConnectionInfo(String transport, String ip, int shellPort, int controlPort, int iopubPort,
                             int stdinPort, int hbPort, String signatureScheme, String key) {

    public ConnectionInfo {
        if (!"tcp".equals(transport) && !"ipc".equals(transport)) {
            throw new IllegalArgumentException("unsupported transport '" + transport + "' in the connection file; use tcp or ipc");
        }
        if (signatureScheme == null || signatureScheme.isEmpty()) signatureScheme = "hmac-sha256";
        if (!"hmac-sha256".equals(signatureScheme)) {
            throw new IllegalArgumentException("unsupported signature_scheme '" + signatureScheme + "'; this kernel signs with hmac-sha256");
        }
        if (key == null) key = "";
    }

    public static ConnectionInfo read(Path file) throws IOException {
        JsonObject o;
        try {
            o = new Gson().fromJson(Files.readString(file, StandardCharsets.UTF_8), JsonObject.class);
        } catch (RuntimeException e) {
            throw new IOException("connection file " + file + " is not valid JSON: " + e.getMessage(), e);
        }
        if (o == null) throw new IOException("connection file " + file + " is empty");
        try {
            return new ConnectionInfo(
                    o.has("transport") ? o.get("transport").getAsString() : "tcp",
                    o.get("ip").getAsString(),
                    o.get("shell_port").getAsInt(), o.get("control_port").getAsInt(), o.get("iopub_port").getAsInt(),
                    o.get("stdin_port").getAsInt(), o.get("hb_port").getAsInt(),
                    o.has("signature_scheme") ? o.get("signature_scheme").getAsString() : "hmac-sha256",
                    o.has("key") ? o.get("key").getAsString() : "");
        } catch (NullPointerException | ClassCastException | IllegalStateException | NumberFormatException e) {
            throw new IOException("connection file " + file + " lacks ip or one of shell_port, control_port, iopub_port, stdin_port, hb_port", e);
        }
    }

    /** The ZeroMQ endpoint for a port: {@code tcp://ip:port}, or {@code ipc://ip-port} for the ipc transport. */
    public String endpoint(int port) {
        return "tcp".equals(transport) ? "tcp://" + ip + ":" + port : "ipc://" + ip + "-" + port;
    }

    @Override
    public String toString() {
        return "ConnectionInfo[" + transport + "://" + ip + " shell=" + shellPort + " control=" + controlPort + " iopub=" + iopubPort
                + " stdin=" + stdinPort + " hb=" + hbPort + " " + signatureScheme + (key.isEmpty() ? " unsigned" : " signed") + "]";
    }
}
