package org.loopledger.notebook;

import java.util.List;

/** A notebook cell (nbformat v4): code, Markdown or raw. Cell metadata is kept as JSON text. */
public sealed interface Cell permits Cell.Code, Cell.Markdown, Cell.Raw {

    String id();

    String source();

    /** Cell metadata as JSON object text ("{}" when empty). */
    String metadataJson();

    /** A code cell; {@code executionCount} is null when the cell has not run. */
    record Code(String id, String source, Integer executionCount, List<Output> outputs, String metadataJson) implements Cell {
        public Code {
            outputs = List.copyOf(outputs);
            metadataJson = metadataJson == null ? "{}" : metadataJson;
        }

        /** Same cell with new outputs and execution count. */
        public Code withResults(Integer count, List<Output> newOutputs) { return new Code(id, source, count, newOutputs, metadataJson); }
    }

    record Markdown(String id, String source, String metadataJson) implements Cell {
        public Markdown { metadataJson = metadataJson == null ? "{}" : metadataJson; }
    }

    record Raw(String id, String source, String metadataJson) implements Cell {
        public Raw { metadataJson = metadataJson == null ? "{}" : metadataJson; }
    }
}
