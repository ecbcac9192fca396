package org.loopledger.kernel.session;

import java.util.List;

/**
 * Completion candidates replacing {@code [start, end)} of the code (UTF-16 offsets).
 */
public record Completions(List<String> matches, int start, int end) {
    public Completions {
        matches = List.copyOf(matches);
    }
}
