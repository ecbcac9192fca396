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
     * Evaluates a Java expression of type String without recording it as a cell (no output, no
     * execution count) and returns its value; used to read the session's provenance at the end of a run.
     */
    String evaluateQuietly(String expression);

    @Override void close();
}
