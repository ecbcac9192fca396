package org.loopledger.cli;

import org.loopledger.ident.demo.DemoDatasets;
import org.loopledger.ident.demo.GantryLoadCase;
import org.loopledger.notebook.AtomicFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

/**
 * {@code loopledger datasets [FOLDER]}: regenerates the SYNTHETIC demo logs and their README
 * ({@link DemoDatasets}, fixed seeds: byte for byte the committed files), each written atomically.
 * An existing file is replaced only if it is of the same kind (a drive log with the demo header, the
 * demo README); anything else is refused before a byte is written.
 */
@Command(name = "datasets", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = {"Regenerate the synthetic demo datasets (three gantry load cases) and their README in FOLDER.",
                "Each file is written atomically; an existing file that is not a demo drive log or the demo README is never overwritten."},
        exitCodeListHeading = "Exit status:%n",
        exitCodeList = {"0:the datasets were written", "2:bad usage or a file in the way: nothing was written"})
final class DatasetsCommand implements Callable<Integer> {
    @Parameters(index = "0", arity = "0..1", paramLabel = "FOLDER", defaultValue = "datasets", description = "where to write (default: ${DEFAULT-VALUE}; created if missing)")
    Path folder;

    @Override
    public Integer call() {
        try {
            if (Files.exists(folder) && !Files.isDirectory(folder)) {
                throw new IllegalArgumentException(folder + " exists and is not a folder; choose another FOLDER");
            }
            try {
                Files.createDirectories(folder);
            } catch (IOException e) {
                throw new IllegalArgumentException("cannot create folder " + folder + ": " + e.getMessage());
            }
            for (GantryLoadCase c : GantryLoadCase.values()) {
                OutputTargets.check(folder.resolve(c.fileName()), OutputTargets.Kind.CSV_LOG, "the dataset", false);
            }
            Path scope = folder.resolve(org.loopledger.ident.demo.LinearAxisScope.FILE);
            OutputTargets.check(scope, OutputTargets.Kind.SCOPE_LOG, "the dataset", false);
            OutputTargets.check(folder.resolve("README.md"), OutputTargets.Kind.DATASETS_README, "the README", false);
            for (GantryLoadCase c : GantryLoadCase.values()) {
                Path f = folder.resolve(c.fileName());
                AtomicFiles.writeString(f, DemoDatasets.csv(c));
                System.err.println("loopledger: wrote " + f + " (SYNTHETIC, load case " + c.name().toLowerCase(java.util.Locale.ROOT) + ")");
            }
            AtomicFiles.writeString(scope, org.loopledger.ident.demo.LinearAxisScope.csv());
            System.err.println("loopledger: wrote " + scope + " (SYNTHETIC, linear axis Y, scope export)");
            AtomicFiles.writeString(folder.resolve("README.md"), DemoDatasets.readme());
            System.err.println("loopledger: wrote " + folder.resolve("README.md"));
            return 0;
        } catch (IllegalArgumentException e) {
            System.err.println("loopledger datasets: " + e.getMessage());
            return 2;
        }
    }
}
