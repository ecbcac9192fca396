package org.loopledger.kernel.session.agent;

import jdk.jshell.execution.Util;
import org.loopledger.display.DisplayChannel;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.InputStream;
import java.io.PrintStream;
import java.net.InetAddress;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import java.util.function.Consumer;

/**
 * Entry point of the JShell remote agent JVM that {@link AgentLauncher} starts.
 *
 * <p>Arguments: the loopback port of the launcher. The agent opens two connections to it: the JShell
 * command stream (with {@code TCP_NODELAY}, which alone takes a trivial snippet from about 200 ms to
 * about 25 ms), a stop channel on which each byte means "stop the running snippet", and an input
 * connection for {@code System.in} ({@link StdinProtocol}).
 * Standard output, standard error and the display channel are multiplexed on the command stream by
 * {@link Util#forwardExecutionControlAndIO}, so their order is the order in which the cell wrote them.
 *
 * <p>The agent never outlives the kernel or runner that started it, even in the middle of a cell (a cell
 * in a tight loop never returns to read the command stream): it halts at once when the stop channel
 * reaches its end (the launcher closed it or died, whatever the signal) and, as a second guard, when its
 * parent process is gone (polled every {@value #PARENT_POLL_MS} ms through {@link ProcessHandle}).
 */
public final class AgentMain {
    static final long PARENT_POLL_MS = 500;

    private AgentMain() {}

    public static void main(String[] args) throws Exception {
        int port = Integer.parseInt(args[0]);
        InetAddress loopback = InetAddress.getLoopbackAddress();
        Socket commands = new Socket(loopback, port);
        commands.setTcpNoDelay(true);
        Socket stop = new Socket(loopback, port);
        stop.setTcpNoDelay(true);
        Socket input = new Socket(loopback, port);
        input.setTcpNoDelay(true);
        System.setIn(new AgentStdin(input));
        AgentControl control = new AgentControl();
        Thread stopper = new Thread(() -> listenForStops(stop, control), "loopledger-stop");
        stopper.setDaemon(true);
        stopper.start();
        Thread parentWatch = new Thread(AgentMain::watchParent, "loopledger-parent-watch");
        parentWatch.setDaemon(true);
        parentWatch.start();
        Map<String, Consumer<java.io.OutputStream>> outputs = Map.of(
                "out", st -> System.setOut(new PrintStream(st, true, StandardCharsets.UTF_8)),
                "err", st -> System.setErr(new PrintStream(st, true, StandardCharsets.UTF_8)),
                AgentLauncher.DISPLAY_CHANNEL, DisplayChannel::install,
                AgentLauncher.RESULT_CHANNEL, control::resultChannel);
        // System.in is ours (AgentStdin, one line per request), not JShell's byte-by-byte remote input
        Map<String, Consumer<InputStream>> inputs = Map.of();
        // Buffered: JShell's multiplexer writes output in packets of at most 127 bytes and flushes its
        // delegate at the end of every write, so the buffer only turns a write's packets into one system call.
        Util.forwardExecutionControlAndIO(control, new BufferedInputStream(commands.getInputStream(), 1 << 16),
                new BufferedOutputStream(commands.getOutputStream(), 1 << 16), outputs, inputs);
        System.exit(0);
    }

    private static void listenForStops(Socket stop, AgentControl control) {
        try (InputStream in = stop.getInputStream()) {
            while (in.read() >= 0) control.stopClientCode();
        } catch (Throwable e) {
            // the launcher went away
        }
        // End of the stop channel: the launcher closed the session or is gone. Nobody can read a result
        // any more, so end without waiting for the running cell (exit would wait for shutdown hooks a cell
        // may have added).
        Runtime.getRuntime().halt(0);
    }

    private static void watchParent() {
        long parent = ProcessHandle.current().parent().map(ProcessHandle::pid).orElse(1L);
        if (parent <= 1) return;
        while (true) {
            try {
                Thread.sleep(PARENT_POLL_MS);
            } catch (InterruptedException e) {
                return;
            }
            long now = ProcessHandle.current().parent().map(ProcessHandle::pid).orElse(1L);
            if (now != parent || ProcessHandle.of(parent).map(p -> !p.isAlive()).orElse(true)) Runtime.getRuntime().halt(1);
        }
    }
}
