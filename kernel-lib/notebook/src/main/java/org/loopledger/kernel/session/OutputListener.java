package org.loopledger.kernel.session;

/**
 * Receives a cell's outputs as they happen. Stream text may arrive in many small pieces and from
 * JShell's I/O thread; calls are never concurrent for one session.
 */
@FunctionalInterface
public interface OutputListener {
    void output(CellOutput output);

    OutputListener IGNORE = o -> { };
}
