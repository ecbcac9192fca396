package org.loopledger.notebook;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One output of a code cell, as nbformat v4 defines them (nbformat 4 schema, output types
 * {@code stream}, {@code display_data}, {@code execute_result}, {@code error}).
 *
 * <p>MIME data maps a MIME type to its text: the string itself for text types, base64 for images,
 * the JSON text for {@code application/json}-like types. Maps keep insertion order and are unmodifiable.
 */
public sealed interface Output permits Output.Stream, Output.DisplayData, Output.ExecuteResult, Output.Error {

    /** Text on {@code stdout} or {@code stderr}. */
    record Stream(String name, String text) implements Output {
        public Stream {
            if (!"stdout".equals(name) && !"stderr".equals(name)) {
                throw new IllegalArgumentException("stream name must be stdout or stderr, got '" + name + "'");
            }
        }
    }

    /** A rich display (plots, tables) emitted while the cell ran. */
    record DisplayData(Map<String, String> data, Map<String, String> metadataJson) implements Output {
        public DisplayData { data = frozen(data); metadataJson = frozen(metadataJson); }
    }

    /** The value of the cell's last expression. */
    record ExecuteResult(int executionCount, Map<String, String> data, Map<String, String> metadataJson) implements Output {
        public ExecuteResult { data = frozen(data); metadataJson = frozen(metadataJson); }
    }

    /** An exception that ended the cell. */
    record Error(String ename, String evalue, List<String> traceback) implements Output {
        public Error { traceback = List.copyOf(traceback); }
    }

    private static Map<String, String> frozen(Map<String, String> m) {
        return m == null ? Map.of() : Collections.unmodifiableMap(new LinkedHashMap<>(m));
    }
}
