package org.loopledger.kernel;

import java.time.LocalTime;
import java.time.format.DateTimeFormatter;

/** The kernel's own log, on its standard error (Jupyter shows it in the server's console). Never given the key. */
final class KernelLog {
    private static final DateTimeFormatter TIME = DateTimeFormatter.ofPattern("HH:mm:ss.SSS");

    private KernelLog() {}

    static void info(String message) {
        System.err.println("[loopledger-kernel " + LocalTime.now().format(TIME) + "] " + message);
    }

    static void warn(String message) {
        info("WARNING " + message);
    }
}
