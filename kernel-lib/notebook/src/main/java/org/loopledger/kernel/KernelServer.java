package org.loopledger.kernel;

import org.loopledger.kernel.protocol.ConnectionInfo;
import org.loopledger.kernel.protocol.Message;
import org.loopledger.kernel.protocol.MessageSigner;
import org.loopledger.kernel.protocol.WireCodec;
import org.loopledger.kernel.session.CellSession;
import org.loopledger.kernel.session.SessionOptions;
import org.zeromq.SocketType;
import org.zeromq.ZContext;
import org.zeromq.ZMQ;

import java.util.Optional;
import java.util.UUID;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutionException;

/**
 * A Jupyter kernel (messaging specification 5.3) over JeroMQ: binds shell, control, iopub, stdin and
 * heartbeat to exactly the connection file's transport, address and ports, and serves until a
 * {@code shutdown_request}. Each channel has its own thread; the shell thread runs cells one at a
 * time, the control thread stays free to interrupt them. Every request is bracketed by
 * {@code status: busy} and {@code status: idle} on iopub with the request as parent. The kernel ends with
 * the process that started it ({@link ParentWatch}); its agent JVM ends with the kernel.
 */
public final class KernelServer implements AutoCloseable {
    private static final int POLL_MS = 200;
    /** How soon a read waiting for {@code input_reply} notices an interrupt or shutdown. */
    private static final int STDIN_POLL_MS = 50;

    private final ConnectionInfo connection;
    private final ZContext context = new ZContext();
    private final CompletableFuture<CellSession> session;
    private final CountDownLatch stopped = new CountDownLatch(1);
    private volatile boolean running = true;
    private Iopub iopub;

    private KernelServer(ConnectionInfo connection, SessionOptions options) {
        this.connection = connection;
        this.session = CompletableFuture.supplyAsync(() -> {
            CellSession s = CellSession.start(options);
            if (!s.forgetsDroppedClasses()) {
                KernelLog.warn("this JVM was started without " + SessionOptions.OPEN_JSHELL
                        + ": cells will get slower as the session grows; reinstall the kernelspec (./loopledger install --user)");
            }
            return s;
        });
    }

    /** Binds the sockets and starts serving; the session starts in the background meanwhile. */
    public static KernelServer start(ConnectionInfo connection, SessionOptions options) {
        ParentWatch.start().ifPresent(pid -> KernelLog.debug("the kernel ends when process " + pid + " ends"));
        KernelServer k = new KernelServer(connection, options);
        k.bindAndServe();
        return k;
    }

    private void bindAndServe() {
        WireCodec codec = new WireCodec(MessageSigner.forKey(connection.key()));
        Replies replies = new Replies(UUID.randomUUID().toString());
        ZMQ.Socket shellSocket = bind(SocketType.ROUTER, connection.shellPort());
        ZMQ.Socket controlSocket = bind(SocketType.ROUTER, connection.controlPort());
        ZMQ.Socket iopubSocket = bind(SocketType.PUB, connection.iopubPort());
        ZMQ.Socket stdinSocket = bind(SocketType.ROUTER, connection.stdinPort());
        stdinSocket.setReceiveTimeOut(STDIN_POLL_MS);
        ZMQ.Socket hbSocket = bind(SocketType.REP, connection.hbPort());
        iopub = new Iopub(new Channel("iopub", iopubSocket, codec), replies);
        StdinChannel stdin = new StdinChannel(new Channel("stdin", stdinSocket, codec), replies);
        RequestHandler handler = new RequestHandler(this::session, iopub, stdin, this::shutdownSoon);
        startThread("loopledger-shell", () -> serve(new Channel("shell", shellSocket, codec), handler, replies));
        startThread("loopledger-control", () -> serve(new Channel("control", controlSocket, codec), handler, replies));
        startThread("loopledger-heartbeat", () -> heartbeat(hbSocket));
        installInterruptSignal();
        KernelLog.debug("serving " + connection);
    }

    private ZMQ.Socket bind(SocketType type, int port) {
        ZMQ.Socket s = context.createSocket(type);
        s.setLinger(1000);
        s.setReceiveTimeOut(POLL_MS);
        // a larger frame closes the sender's connection inside ZeroMQ before the kernel holds it in memory
        s.setMaxMsgSize(Channel.MAX_MESSAGE_BYTES);
        s.bind(connection.endpoint(port));
        return s;
    }

    private static void startThread(String name, Runnable body) {
        Thread t = new Thread(body, name);
        t.setDaemon(true);
        t.start();
    }

    /** The session, its background warm-up ended (JShell serves one thread at a time). */
    private CellSession session() {
        try {
            CellSession s = session.get();
            s.stopWarmUp();
            return s;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while the Java session was starting", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("the Java session failed to start: " + e.getCause(), e.getCause());
        }
    }

    /**
     * The loop of one socket thread. No exception or error ends it: what fails is logged (with a
     * description that cannot fail in turn) and the next message is read.
     */
    private void serve(Channel channel, RequestHandler handler, Replies replies) {
        while (running) {
            Optional<Message> next;
            try {
                next = channel.receive();
            } catch (Throwable e) {
                if (!running) return;
                warnSafely("receive on " + channel.name() + " failed: ", e);
                continue;
            }
            if (next.isEmpty()) continue;
            Message request = next.get();
            try {
                iopub.status(request.header(), "busy");
                Optional<RequestHandler.Reply> reply = handler.handle(request, channel.name());
                reply.ifPresent(r -> channel.send(replies.reply(request, r.type(), r.content())));
                iopub.status(request.header(), "idle");
                if ("shell".equals(channel.name()) && reply.isPresent() && stopsOnError(request, reply.get())) abortQueued(channel, handler, replies);
            } catch (Throwable e) {
                if (!running) return;
                warnSafely("failed to answer " + request + " on " + channel.name() + ": ", e);
            }
        }
    }

    /**
     * An execute request that failed with {@code stop_on_error} (true unless the request says otherwise) and
     * not {@code silent} aborts the execution queue (messaging specification 5.3, {@code execute_request}),
     * as ipykernel does: Run All stops at the first failing cell.
     */
    private static boolean stopsOnError(Message request, RequestHandler.Reply reply) {
        if (!"execute_request".equals(request.type())) return false;
        if (!reply.content().has("status") || !"error".equals(reply.content().get("status").getAsString())) return false;
        var c = request.content();
        boolean silent = c.has("silent") && c.get("silent").isJsonPrimitive() && c.get("silent").getAsBoolean();
        boolean stop = !c.has("stop_on_error") || !c.get("stop_on_error").isJsonPrimitive() || c.get("stop_on_error").getAsBoolean();
        return stop && !silent;
    }

    /**
     * Answers every execute request already queued on the shell socket with {@code status: aborted} without
     * running it; other requests queued meanwhile are answered as usual. Ends when nothing more is queued
     * (ipykernel's default {@code stop_on_error_timeout} of 0).
     */
    private void abortQueued(Channel channel, RequestHandler handler, Replies replies) {
        while (running) {
            Optional<Message> next = channel.receiveQueued();
            if (next.isEmpty()) return;
            Message queued = next.get();
            iopub.status(queued.header(), "busy");
            if ("execute_request".equals(queued.type())) {
                com.google.gson.JsonObject aborted = new com.google.gson.JsonObject();
                aborted.addProperty("status", "aborted");
                channel.send(replies.reply(queued, "execute_reply", aborted));
            } else {
                handler.handle(queued, channel.name()).ifPresent(r -> channel.send(replies.reply(queued, r.type(), r.content())));
            }
            iopub.status(queued.header(), "idle");
        }
    }

    /** Logs a failure; never throws (a broken log must not end a socket thread either). */
    private static void warnSafely(String what, Throwable e) {
        try {
            KernelLog.warn(what + e);
        } catch (Throwable ignored) {
            // nothing left to tell
        }
    }

    private void heartbeat(ZMQ.Socket hb) {
        while (running) {
            try {
                byte[] ping = hb.recv(0);
                if (ping == null) continue;
                hb.send(ping, 0);
            } catch (Throwable e) {
                if (!running) return;
                warnSafely("heartbeat failed: ", e);
            }
        }
    }

    /** SIGINT interrupts the running cell instead of ending the JVM (for clients that signal anyway). */
    private void installInterruptSignal() {
        try {
            sun.misc.Signal.handle(new sun.misc.Signal("INT"), sig -> {
                if (session.isDone()) session().interrupt();
            });
        } catch (RuntimeException | LinkageError e) {
            KernelLog.warn("SIGINT cannot be handled here; use interrupt_mode message: " + e);
        }
    }

    private void shutdownSoon() {
        startThread("loopledger-shutdown", () -> {
            try {
                Thread.sleep(100);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            close();
        });
    }

    /** Blocks until a shutdown request was served. */
    public void awaitShutdown() throws InterruptedException {
        stopped.await();
    }

    @Override
    public void close() {
        if (!running) return;
        running = false;
        try {
            iopub.close();
            session.thenAccept(CellSession::close);
            context.close();
        } finally {
            stopped.countDown();
        }
    }
}
