package org.loopledger.notebook;

import java.util.ArrayList;
import java.util.List;

/**
 * A notebook independent of its file format: cells in order plus notebook metadata (as JSON text).
 * Read and written as nbformat v4 by {@link NotebookJson}; a plain-text form could sit beside it.
 */
public record Notebook(int nbformatMinor, String metadataJson, List<Cell> cells) {
    public Notebook {
        cells = List.copyOf(cells);
        metadataJson = metadataJson == null ? "{}" : metadataJson;
    }

    /** The code cells, in order. */
    public List<Cell.Code> codeCells() {
        List<Cell.Code> r = new ArrayList<>();
        for (Cell c : cells) if (c instanceof Cell.Code code) r.add(code);
        return r;
    }

    /** Same notebook with the given cells. */
    public Notebook withCells(List<Cell> newCells) { return new Notebook(nbformatMinor, metadataJson, newCells); }
}
