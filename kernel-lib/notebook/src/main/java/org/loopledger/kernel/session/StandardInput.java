package org.loopledger.kernel.session;

import java.io.IOException;
import java.util.function.BooleanSupplier;

/**
 * Where a cell's {@code System.in} reads come from: one line per call, asked of the user when the cell
 * needs it (for the kernel, an {@code input_request} to the front-end that sent the cell).
 */
@FunctionalInterface
public interface StandardInput {
    /**
     * One line typed by the user, without its line end.
     *
     * @param cancelled becomes true when the cell is interrupted or the session closes: return or throw soon
     * @throws IOException when no line can be had; its message reaches the cell's read
     */
    String readLine(BooleanSupplier cancelled) throws IOException;

    /** No keyboard: every read fails with {@code message}, which names the problem and the fix. */
    static StandardInput unavailable(String message) {
        return cancelled -> {
            throw new IOException(message);
        };
    }
}
