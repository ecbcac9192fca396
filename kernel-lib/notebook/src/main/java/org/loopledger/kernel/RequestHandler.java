package org.loopledger.kernel;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import org.loopledger.kernel.protocol.Message;
import org.loopledger.kernel.session.CellSession;
import org.loopledger.kernel.session.Completeness;
import org.loopledger.kernel.session.Completions;

import java.util.Optional;
import java.util.function.Supplier;

/**
 * Answers the requests of the shell and control channels (Jupyter messaging specification 5.3).
 * Returns the reply type and content, or empty for messages that get no reply (comm messages,
 * unknown types). Never throws: a failure becomes an error reply.
 */
final class RequestHandler {
    record Reply(String type, JsonObject content) {}

    private final Supplier<CellSession> session;
    private final ExecuteHandler execute;
    private final Runnable onShutdown;

    RequestHandler(Supplier<CellSession> session, Iopub iopub, StdinChannel stdin, Runnable onShutdown) {
        this.session = session;
        this.execute = new ExecuteHandler(session, iopub, stdin);
        this.onShutdown = onShutdown;
    }

    /**
     * Requests that use the JShell session, which runs one thing at a time: they belong on the shell
     * channel. Sent on the control channel (which must stay free to interrupt a running cell) they get an
     * error reply and the session is left alone.
     */
    static final java.util.Set<String> SHELL_ONLY = java.util.Set.of("execute_request", "complete_request", "inspect_request", "is_complete_request");

    Optional<Reply> handle(Message m, String channel) {
        String type = m.type();
        if ("control".equals(channel) && SHELL_ONLY.contains(type)) {
            KernelLog.warn("refused " + type + " on the control channel");
            JsonObject c = new JsonObject();
            c.addProperty("status", "error");
            c.addProperty("ename", "WrongChannel");
            c.addProperty("evalue", type + " belongs on the shell channel; the control channel takes kernel_info_request, interrupt_request and shutdown_request");
            c.add("traceback", new JsonArray());
            return Optional.of(new Reply(type.replace("_request", "_reply"), c));
        }
        try {
            return Optional.ofNullable(switch (type) {
                case "kernel_info_request" -> new Reply("kernel_info_reply", KernelInfo.content());
                case "execute_request" -> new Reply("execute_reply", execute.execute(m));
                case "complete_request" -> new Reply("complete_reply", complete(m.content()));
                case "inspect_request" -> new Reply("inspect_reply", inspect(m.content()));
                case "is_complete_request" -> new Reply("is_complete_reply", isComplete(m.content()));
                case "comm_info_request" -> new Reply("comm_info_reply", ok("comms", new JsonObject()));
                case "history_request" -> new Reply("history_reply", ok("history", new JsonArray()));
                case "interrupt_request" -> {
                    session.get().interrupt();
                    yield new Reply("interrupt_reply", ok());
                }
                case "shutdown_request" -> {
                    JsonObject c = ok();
                    c.addProperty("restart", m.content().has("restart") && m.content().get("restart").getAsBoolean());
                    onShutdown.run();
                    yield new Reply("shutdown_reply", c);
                }
                case "comm_open", "comm_msg", "comm_close" -> null;
                default -> {
                    KernelLog.warn("ignored a message of unknown type '" + type + "'");
                    yield null;
                }
            });
        } catch (RuntimeException | Error e) {
            KernelLog.warn("handling " + type + " failed: " + e);
            JsonObject c = new JsonObject();
            c.addProperty("status", "error");
            c.addProperty("ename", e.getClass().getName());
            c.addProperty("evalue", String.valueOf(e.getMessage()));
            c.add("traceback", new JsonArray());
            String replyType = type.endsWith("_request") ? type.substring(0, type.length() - "_request".length()) + "_reply" : type + "_reply";
            return Optional.of(new Reply(replyType, c));
        }
    }

    private JsonObject complete(JsonObject c) {
        String code = c.get("code").getAsString();
        int cursor = CodePoints.toUtf16(code, c.get("cursor_pos").getAsInt());
        Completions r = session.get().complete(code, cursor);
        JsonArray matches = new JsonArray();
        r.matches().forEach(matches::add);
        JsonObject reply = ok("matches", matches);
        reply.addProperty("cursor_start", CodePoints.fromUtf16(code, r.start()));
        reply.addProperty("cursor_end", CodePoints.fromUtf16(code, r.end()));
        reply.add("metadata", new JsonObject());
        return reply;
    }

    private JsonObject inspect(JsonObject c) {
        String code = c.get("code").getAsString();
        int cursor = CodePoints.toUtf16(code, c.get("cursor_pos").getAsInt());
        Optional<CellSession.Inspection> doc = session.get().inspection(code, cursor);
        JsonObject reply = ok();
        reply.addProperty("found", doc.isPresent());
        JsonObject data = new JsonObject();
        doc.ifPresent(d -> {
            data.addProperty("text/plain", d.plainText());
            data.addProperty("text/markdown", d.markdown());
        });
        reply.add("data", data);
        reply.add("metadata", new JsonObject());
        return reply;
    }

    private JsonObject isComplete(JsonObject c) {
        Completeness r = session.get().isComplete(c.get("code").getAsString());
        JsonObject reply = new JsonObject();
        reply.addProperty("status", r.status());
        if ("incomplete".equals(r.status())) reply.addProperty("indent", r.indent());
        return reply;
    }

    private static JsonObject ok() {
        JsonObject o = new JsonObject();
        o.addProperty("status", "ok");
        return o;
    }

    private static JsonObject ok(String key, com.google.gson.JsonElement value) {
        JsonObject o = ok();
        o.add(key, value);
        return o;
    }
}
