package org.loopledger.kernel.session.agent;

import jdk.jshell.spi.ExecutionControl;

import java.io.IOException;
import java.io.OutputStream;
import java.net.Socket;

/** The kernel side of one agent JVM: its process, its stop channel and its execution control. */
public final class AgentConnection {
    private final Process process;
    private final Socket stopSocket;
    private final OutputStream stopOut;
    private volatile ExecutionControl control;

    AgentConnection(Process process, Socket stopSocket, OutputStream stopOut) {
        this.process = process;
        this.stopSocket = stopSocket;
        this.stopOut = stopOut;
    }

    void control(ExecutionControl control) {
        this.control = control;
    }

    /** True while the agent JVM runs. */
    public boolean alive() {
        return process.isAlive();
    }

    /** Asks the agent to stop the running snippet; harmless when none runs. Thread-safe. */
    public synchronized void stopRunning() {
        try {
            stopOut.write(1);
            stopOut.flush();
        } catch (IOException e) {
            // agent gone: nothing to stop
        }
    }

    /**
     * Renders the value of the last expression in the agent as MIME bundle JSON; null if none.
     *
     * @param dropped names of temporary variables the session has dropped, whose values the agent may release
     */
    public String renderLast(java.util.List<String> dropped) throws ExecutionControl.ExecutionControlException {
        Object r = control.extensionCommand(AgentControl.RENDER_LAST, releaseArgument(dropped));
        return r instanceof String s ? s : null;
    }

    /**
     * Lets the agent drop its reference to the last value (when the cell shows no result); sent without waiting
     * for the answer.
     *
     * @param dropped names of temporary variables the session has dropped, whose values the agent may release
     */
    public void forgetLast(java.util.List<String> dropped) {
        launcher().sendWithoutWaiting(AgentControl.FORGET_LAST, releaseArgument(dropped));
    }

    /**
     * Asks the agent to render the value of the next snippet it runs when that snippet is an expression kept as
     * a temporary variable ({@code $1}, ...), and to send the bundle on the result channel
     * ({@link AgentLauncher#RESULT_CHANNEL}) before it answers: the value then needs no round trip of its own.
     * Sent without waiting; {@code false} withdraws the request (the snippet did not run).
     */
    public void renderNext(boolean render) {
        launcher().sendWithoutWaiting(AgentControl.RENDER_NEXT, render);
    }

    private LauncherControl launcher() {
        return (LauncherControl) control;
    }

    private static String[] releaseArgument(java.util.List<String> dropped) {
        return dropped.isEmpty() ? null : dropped.toArray(new String[0]);
    }

    /** The datasets the agent's cells read, as {@link org.loopledger.provenance.Provenance#datasetsJson()} JSON. */
    public String provenanceJson() throws ExecutionControl.ExecutionControlException {
        Object r = control.extensionCommand(AgentControl.PROVENANCE, null);
        return r instanceof String s ? s : "[]";
    }

    void close() {
        try {
            stopSocket.close();
        } catch (IOException e) {
            // closing anyway
        }
        process.destroy();
    }

    /** Ends the agent JVM at once (SIGKILL); a running cell then ends with an error. */
    public void kill() {
        process.destroyForcibly();
    }
}
