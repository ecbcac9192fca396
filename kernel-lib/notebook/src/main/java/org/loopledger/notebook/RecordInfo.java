package org.loopledger.notebook;

import java.util.List;

/**
 * What the header of a tuning record states: where the notebook came from, when it ran, with which
 * library and Java, and the SHA-256 of every dataset it read.
 */
public record RecordInfo(String notebookName, String runDate, String libraryVersion, String javaVersion, List<DatasetDigest> datasets) {
    public RecordInfo { datasets = List.copyOf(datasets); }

    /** A dataset as read by the notebook. */
    public record DatasetDigest(String path, long bytes, String sha256) {}
}
