package org.loopledger.kernel;

import java.time.Instant;
import java.util.Optional;

/**
 * Ends this process when the process that started it has ended, whatever signal ended that one (the idea of
 * ipykernel's parent poller; a kernel whose client is gone serves nobody and would keep its agent JVM too).
 *
 * <p>Which process: the one named by {@code JPY_PARENT_PID} (jupyter_client sets it when it launches a
 * kernel), otherwise the original parent. PID 1 is never watched (it does not go away, it adopts). The
 * watched process counts as gone when it no longer exists, when its PID now belongs to a process started
 * at another time (PID reuse), or, when it is our parent, when we have been re-parented.
 *
 * <p>On its end: every descendant (the agent JVM) is killed and this JVM halts, without waiting for a
 * cell that may be stuck in a loop.
 */
final class ParentWatch {
    static final long POLL_MS = 250;

    private ParentWatch() {}

    /** Starts the daemon watcher thread when there is a process to watch; returns its PID. */
    static Optional<Long> start() {
        Optional<ProcessHandle> parent = ProcessHandle.current().parent();
        long parentPid = parent.map(ProcessHandle::pid).orElse(1L);
        long watched = fromEnv().orElse(parentPid);
        if (watched <= 1) return Optional.empty();
        Optional<ProcessHandle> handle = ProcessHandle.of(watched);
        if (handle.isEmpty()) {
            KernelLog.warn("the process that started the kernel (pid " + watched + ") has already ended");
            endNow(watched);
        }
        Optional<Instant> started = handle.flatMap(h -> h.info().startInstant());
        boolean isOurParent = watched == parentPid;
        Thread t = new Thread(() -> {
            while (true) {
                try {
                    Thread.sleep(POLL_MS);
                } catch (InterruptedException e) {
                    return;
                }
                if (gone(watched, started, isOurParent)) endNow(watched);
            }
        }, "loopledger-parent-watch");
        t.setDaemon(true);
        t.start();
        return Optional.of(watched);
    }

    private static Optional<Long> fromEnv() {
        String v = System.getenv("JPY_PARENT_PID");
        if (v == null || v.isBlank()) return Optional.empty();
        try {
            return Optional.of(Long.parseLong(v.trim()));
        } catch (NumberFormatException e) {
            KernelLog.warn("JPY_PARENT_PID='" + v + "' is not a process id; watching the parent process instead");
            return Optional.empty();
        }
    }

    private static boolean gone(long pid, Optional<Instant> started, boolean isOurParent) {
        if (isOurParent && ProcessHandle.current().parent().map(ProcessHandle::pid).orElse(1L) != pid) return true;
        Optional<ProcessHandle> h = ProcessHandle.of(pid);
        if (h.isEmpty() || !h.get().isAlive()) return true;
        Optional<Instant> now = h.get().info().startInstant();
        return started.isPresent() && now.isPresent() && !started.get().equals(now.get());
    }

    private static void endNow(long pid) {
        try {
            KernelLog.info("the process that started the kernel (pid " + pid + ") has ended; the kernel and its Java session stop now");
            ProcessHandle.current().descendants().forEach(ProcessHandle::destroyForcibly);
        } finally {
            Runtime.getRuntime().halt(0);
        }
    }
}
