package org.loopledger.cli;

import java.nio.file.Path;
import java.time.LocalDate;
import java.time.ZoneOffset;

/** Small helpers shared by the notebook commands. */
final class NotebookFiles {
    private NotebookFiles() {}

    static String libraryVersion() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "0.1.0-SNAPSHOT" : v;
    }

    /** Today's date in UTC (day precision: a record states the day it ran, not a timestamp). */
    static String today() { return LocalDate.now(ZoneOffset.UTC).toString(); }

    /** {@code dir/name.suffix} for an input {@code dir/name.ipynb}. */
    static Path sibling(Path input, String suffix) {
        String name = input.getFileName().toString();
        String stem = name.endsWith(".ipynb") ? name.substring(0, name.length() - 6) : name;
        Path dir = input.toAbsolutePath().getParent();
        return dir.resolve(stem + suffix);
    }
}
