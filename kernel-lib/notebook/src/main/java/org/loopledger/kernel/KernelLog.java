package org.loopledger.kernel;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.LocalTime;
import java.time.format.DateTimeFormatter;

/**
 * The kernel's own log. Warnings and what a user must know go to its standard error (Jupyter shows it in
 * the server's console); routine lines ({@link #debug}) go only to the file named by the environment
 * variable {@value #LOG_FILE_ENV}, when set. Never given the key.
 */
final class KernelLog {
    static final String LOG_FILE_ENV = "LOOPLEDGER_KERNEL_LOG";
    private static final DateTimeFormatter TIME = DateTimeFormatter.ofPattern("HH:mm:ss.SSS");

    private KernelLog() {}

    static void info(String message) {
        System.err.println(line(message));
    }

    static void warn(String message) {
        info("WARNING " + message);
    }

    /** A routine line (which ports the kernel serves, whose process it watches): the log file only. */
    static void debug(String message) {
        String file = System.getenv(LOG_FILE_ENV);
        if (file == null || file.isBlank()) return;
        try {
            Files.writeString(Path.of(file), line(message) + System.lineSeparator(), StandardCharsets.UTF_8,
                    StandardOpenOption.CREATE, StandardOpenOption.APPEND, StandardOpenOption.WRITE);
        } catch (IOException | RuntimeException e) {
            warn("cannot write the kernel log " + file + " (" + LOG_FILE_ENV + "): " + e);
        }
    }

    private static String line(String message) {
        return "[loopledger-kernel " + LocalTime.now().format(TIME) + "] " + message;
    }
}
