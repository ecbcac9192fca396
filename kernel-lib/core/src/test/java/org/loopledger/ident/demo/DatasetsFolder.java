package org.loopledger.ident.demo;

import java.nio.file.Files;
import java.nio.file.Path;

/** Test helper: the repository's datasets/ folder, found upwards from the working directory. */
final class DatasetsFolder {
    private DatasetsFolder() {}

    static Path find() {
        Path p = Path.of("").toAbsolutePath();
        while (p != null) {
            Path d = p.resolve("datasets");
            if (Files.isRegularFile(d.resolve("README.md"))) return d;
            p = p.getParent();
        }
        throw new IllegalStateException("no datasets/README.md above " + Path.of("").toAbsolutePath());
    }
}
