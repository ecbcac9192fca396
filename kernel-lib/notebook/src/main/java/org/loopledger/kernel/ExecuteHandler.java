package org.loopledger.kernel;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import com.google.gson.JsonParseException;
import com.google.gson.JsonParser;
import org.loopledger.display.MimeBundle;
import org.loopledger.kernel.protocol.Message;
import org.loopledger.kernel.session.CellOutput;
import org.loopledger.kernel.session.CellResult;
import org.loopledger.kernel.session.CellSession;
import org.loopledger.kernel.session.OutputListener;
import org.loopledger.kernel.session.StandardInput;

import java.util.function.Supplier;

/**
 * {@code execute_request} (Jupyter messaging specification 5.3): counts executions when
 * {@code store_history} is true and {@code silent} false; broadcasts {@code execute_input} and the
 * outputs only when not silent; reads of {@code System.in} go to the front-end when it allows stdin
 * ({@link StdinChannel}); replies {@code ok} or {@code error} with ename, evalue and traceback.
 */
final class ExecuteHandler {
    private final Supplier<CellSession> session;
    private final Iopub iopub;
    private final StdinChannel stdin;
    private int executionCount;

    ExecuteHandler(Supplier<CellSession> session, Iopub iopub, StdinChannel stdin) {
        this.session = session;
        this.iopub = iopub;
        this.stdin = stdin;
    }

    JsonObject execute(Message request) {
        JsonObject c = request.content();
        String code = c.has("code") ? c.get("code").getAsString() : "";
        boolean silent = c.has("silent") && c.get("silent").getAsBoolean();
        boolean storeHistory = !silent && (!c.has("store_history") || c.get("store_history").getAsBoolean());
        if (storeHistory) executionCount++;
        int count = executionCount;
        JsonObject parent = request.header();
        if (!silent) {
            JsonObject input = new JsonObject();
            input.addProperty("code", code);
            input.addProperty("execution_count", count);
            iopub.publish(parent, "execute_input", input);
        }
        OutputListener listener = silent ? OutputListener.IGNORE : o -> broadcast(parent, count, o);
        // allow_stdin absent means false, as in ipykernel: input_request only to front-ends that asked for it
        boolean allowStdin = c.has("allow_stdin") && c.get("allow_stdin").isJsonPrimitive() && c.get("allow_stdin").getAsBoolean();
        StandardInput input = allowStdin ? stdin.forRequest(request) : CellSession.NO_STANDARD_INPUT;
        CellResult result = session.get().execute(code, "cell [" + count + "]", listener, input);
        iopub.flush();
        JsonObject reply = new JsonObject();
        reply.addProperty("execution_count", count);
        result.error().ifPresentOrElse(e -> {
            reply.addProperty("status", "error");
            reply.addProperty("ename", e.name());
            reply.addProperty("evalue", e.value());
            reply.add("traceback", lines(e));
        }, () -> {
            reply.addProperty("status", "ok");
            reply.add("payload", new JsonArray());
            reply.add("user_expressions", new JsonObject());
        });
        return reply;
    }

    private void broadcast(JsonObject parent, int count, CellOutput o) {
        if (o instanceof CellOutput.Stream s) {
            iopub.stream(parent, s.name(), s.text());
        } else if (o instanceof CellOutput.Display d) {
            JsonObject c = new JsonObject();
            c.add("data", wireData(d.bundle()));
            c.add("metadata", new JsonObject());
            c.add("transient", new JsonObject());
            iopub.publish(parent, "display_data", c);
        } else if (o instanceof CellOutput.Result r) {
            JsonObject c = new JsonObject();
            c.addProperty("execution_count", count);
            c.add("data", wireData(r.bundle()));
            c.add("metadata", new JsonObject());
            iopub.publish(parent, "execute_result", c);
        } else if (o instanceof CellOutput.Error e) {
            JsonObject c = new JsonObject();
            c.addProperty("ename", e.name());
            c.addProperty("evalue", e.value());
            c.add("traceback", lines(e));
            iopub.publish(parent, "error", c);
        }
    }

    /**
     * A bundle as the {@code data} of {@code display_data} / {@code execute_result}: JSON MIME types
     * ({@code application/json}, {@code application/...+json}) as JSON values, as the messaging
     * specification asks and nbformat stores them; a value that is not valid JSON stays a string.
     */
    static JsonObject wireData(MimeBundle bundle) {
        JsonObject o = new JsonObject();
        bundle.data().forEach((mime, value) -> {
            if (mime.equals("application/json") || (mime.startsWith("application/") && mime.endsWith("+json"))) {
                try {
                    o.add(mime, JsonParser.parseString(value));
                    return;
                } catch (JsonParseException e) {
                    KernelLog.warn(mime + " output is not valid JSON; sent as a string: " + e.getMessage());
                }
            }
            o.addProperty(mime, value);
        });
        return o;
    }

    private static JsonArray lines(CellOutput.Error e) {
        JsonArray a = new JsonArray();
        e.traceback().forEach(a::add);
        return a;
    }
}
