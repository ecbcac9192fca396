package org.loopledger.kernel.session.agent;

import jdk.jshell.execution.Util;
import jdk.jshell.spi.ExecutionControl;
import jdk.jshell.spi.ExecutionControlProvider;
import jdk.jshell.spi.ExecutionEnv;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Starts the JShell remote agent as a plain child JVM ({@link AgentMain}) and connects JShell to it.
 *
 * <p>Why not JShell's default JDI launch: its command socket lacks {@code TCP_NODELAY}, so every
 * snippet pays several delayed-ACK waits (measured 170 to 210 ms for {@code 1+1} against 20 to 30 ms
 * here), and the remote JVM runs with a debugger agent. Why not local execution: a cell calling
 * {@code System.exit} or exhausting the heap would take the kernel down with it. Stopping a running
 * snippet goes over a second loopback connection ({@link AgentMain}).
 *
 * <p>The display side channel is a named output of JShell's multiplexed stream, so a display frame can
 * only come from {@link org.loopledger.display.DisplayChannel}, never from text a cell prints.
 */
public final class AgentLauncher implements ExecutionControlProvider {
    /** Name of the multiplexed output stream carrying display frames. */
    public static final String DISPLAY_CHANNEL = "loopledger-display";
    /** Name of the multiplexed output stream carrying the bundle of a value rendered as it was computed ({@link AgentConnection#renderNext}). */
    public static final String RESULT_CHANNEL = "loopledger-result";

    private final String javaBinary;
    private final String classPath;
    private final List<String> vmOptions;
    private final OutputStream displaySink;
    private final OutputStream resultSink;
    private final LineSource stdin;
    private volatile AgentConnection connection;

    /**
     * @param classPath   class path of the agent JVM (the library and its dependencies)
     * @param vmOptions   extra JVM options for the agent, e.g. {@code -Xmx2g}; not modified
     * @param displaySink receives the raw bytes of the display channel (length-prefixed frames)
     * @param resultSink  receives the raw bytes of the result channel (length-prefixed frames, as the display channel's)
     * @param stdin       answers the cell's {@code System.in} reads, one line each, on a thread of its own
     */
    public AgentLauncher(String classPath, List<String> vmOptions, OutputStream displaySink, OutputStream resultSink, LineSource stdin) {
        this.javaBinary = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        this.classPath = classPath;
        this.vmOptions = List.copyOf(vmOptions);
        this.displaySink = displaySink;
        this.resultSink = resultSink;
        this.stdin = stdin;
    }

    /** Answers the agent's standard input requests. */
    @FunctionalInterface
    public interface LineSource {
        /** One line without its line end; an exception's message reaches the cell's read. */
        String readLine() throws IOException;
    }

    @Override
    public String name() {
        return "loopledger";
    }

    /** The connection made by the last {@link #generate} call, or null before the first. */
    public AgentConnection connection() {
        return connection;
    }

    @Override
    public ExecutionControl generate(ExecutionEnv env, Map<String, String> parameters) throws Throwable {
        try (ServerSocket listener = new ServerSocket(0, 2, InetAddress.getLoopbackAddress())) {
            listener.setSoTimeout(30_000);
            List<String> command = new ArrayList<>();
            command.add(javaBinary);
            command.addAll(vmOptions);
            command.addAll(env.extraRemoteVMOptions());
            command.add("-Djava.awt.headless=true");
            command.add("--class-path");
            command.add(classPath);
            command.add(AgentMain.class.getName());
            command.add(Integer.toString(listener.getLocalPort()));
            Process process = new ProcessBuilder(command)
                    .redirectOutput(ProcessBuilder.Redirect.INHERIT)
                    .redirectError(ProcessBuilder.Redirect.INHERIT)
                    .start();
            Socket commands;
            Socket stop;
            Socket input;
            try {
                commands = listener.accept();
                stop = listener.accept();
                input = listener.accept();
            } catch (IOException e) {
                process.destroyForcibly();
                throw new IOException("the JShell agent JVM did not connect within 30 s (" + String.join(" ", command.subList(0, 1)) + "): " + e.getMessage(), e);
            }
            commands.setTcpNoDelay(true);
            stop.setTcpNoDelay(true);
            input.setTcpNoDelay(true);
            serveInput(input);
            OutputStream stopOut = stop.getOutputStream();
            Map<String, OutputStream> outputs = Map.of("out", env.userOut(), "err", env.userErr(), DISPLAY_CHANNEL, displaySink, RESULT_CHANNEL, resultSink);
            Map<String, InputStream> inputs = Map.of(); // System.in goes over the input connection
            AgentConnection made = new AgentConnection(process, stop, stopOut);
            // buffered: the agent's output arrives in packets of at most 127 bytes, read a few bytes at a time
            ExecutionControl control = Util.remoteInputOutput(new java.io.BufferedInputStream(commands.getInputStream(), 1 << 16),
                    commands.getOutputStream(), outputs, inputs,
                    (objIn, objOut) -> new LauncherControl(objOut, objIn, made));
            made.control(control);
            process.onExit().thenRun(env::closeDown);
            connection = made;
            return control;
        }
    }

    /** Answers each input request of the agent with one line from {@link #stdin}, until the agent is gone. */
    private void serveInput(Socket input) throws IOException {
        java.io.DataInputStream requests = new java.io.DataInputStream(input.getInputStream());
        java.io.DataOutputStream answers = new java.io.DataOutputStream(new java.io.BufferedOutputStream(input.getOutputStream()));
        Thread t = new Thread(() -> {
            try (input) {
                while (true) {
                    int sequence = requests.readInt();
                    String line = null;
                    String failure = null;
                    try {
                        line = stdin.readLine();
                    } catch (IOException | RuntimeException e) {
                        failure = String.valueOf(e.getMessage());
                    }
                    StdinProtocol.writeAnswer(answers, sequence, line, failure);
                }
            } catch (IOException e) {
                // the agent ended
            }
        }, "loopledger-stdin-server");
        t.setDaemon(true);
        t.start();
    }
}
