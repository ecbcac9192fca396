package org.loopledger.notebook;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A notebook cell (nbformat v4): code, Markdown or raw. Cell metadata is kept as JSON text.
 *
 * <p>Markdown and raw cells carry their attachments (nbformat 4 schema, {@code attachments}): a map from
 * file name (as referenced by {@code attachment:NAME} in the Markdown) to a MIME bundle, MIME type to
 * data as stored (base64 for images). Both maps keep insertion order and are unmodifiable.
 */
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

    record Markdown(String id, String source, String metadataJson, Map<String, Map<String, String>> attachments) implements Cell {
        public Markdown {
            metadataJson = metadataJson == null ? "{}" : metadataJson;
            attachments = frozen(attachments);
        }

        /** A Markdown cell without attachments. */
        public Markdown(String id, String source, String metadataJson) { this(id, source, metadataJson, Map.of()); }
    }

    record Raw(String id, String source, String metadataJson, Map<String, Map<String, String>> attachments) implements Cell {
        public Raw {
            metadataJson = metadataJson == null ? "{}" : metadataJson;
            attachments = frozen(attachments);
        }

        /** A raw cell without attachments. */
        public Raw(String id, String source, String metadataJson) { this(id, source, metadataJson, Map.of()); }
    }

    private static Map<String, Map<String, String>> frozen(Map<String, Map<String, String>> a) {
        if (a == null || a.isEmpty()) return Map.of();
        Map<String, Map<String, String>> m = new LinkedHashMap<>();
        a.forEach((name, bundle) -> m.put(name, Collections.unmodifiableMap(new LinkedHashMap<>(bundle))));
        return Collections.unmodifiableMap(m);
    }
}
