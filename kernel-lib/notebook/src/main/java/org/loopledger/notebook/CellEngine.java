package org.loopledger.notebook;

import java.util.List;

/**
 * What the runner needs from an evaluation engine: run a cell, get its outputs in nbformat terms.
 * The kernel's JShell session implements it, so the runner and the Jupyter kernel execute cells the
 * same way.
 */
public interface CellEngine extends AutoCloseable {

    /** Runs one cell. A failed cell returns its outputs so far ending with an {@link Output.Error}. */
    List<Output> execute(String source, int executionCount);

    /**
     * The datasets the session has read so far, as a JSON array of objects {@code path, bytes, sha256,
     * reads} ({@code reads} counts the reads of that path), fetched over a channel that cell code cannot
     * redirect (not the cell's standard output). Never recorded as a cell.
     */
    String provenanceJson();

    /** Stops the running cell (called from another thread by the runner's timeout); harmless when none runs. */
    default void interrupt() {}

    /**
     * Ends a cell that an {@link #interrupt} did not stop (a loop that swallows the stop), e.g. by ending
     * the process that runs it; {@link #execute} then returns with an error. Called from another thread.
     */
    default void forceStop() {}

    @Override void close();
}
