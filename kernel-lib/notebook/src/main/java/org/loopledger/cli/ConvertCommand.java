package org.loopledger.cli;

import org.loopledger.notebook.AtomicFiles;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookFile;
import org.loopledger.notebook.NotebookJson;
import org.loopledger.notebook.PlainTextNotebook;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

/**
 * {@code loopledger convert NOTEBOOK [-o OUT]}: between a notebook (.ipynb) and its plain-text form (.java).
 */
@Command(name = "convert", mixinStandardHelpOptions = true,
        description = {"Convert a notebook between .ipynb and its plain-text form (.java: cells separated by '//## code' and "
                + "'//## markdown' lines, Markdown in '// ' comments), which diffs like code.",
                "Sources convert both ways without loss. The plain-text form holds no outputs; converting it into an existing "
                + ".ipynb keeps the stored outputs of every code cell whose source did not change."})
final class ConvertCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "NOTEBOOK", description = "a notebook: NAME.ipynb or NAME.java (plain-text form)")
    Path input;

    @Option(names = {"-o", "--output"}, paramLabel = "OUT", description = "output file (default: NAME.java beside an .ipynb input, NAME.ipynb beside a .java input)")
    Path output;

    @Override
    public Integer call() {
        try {
            boolean toText = !NotebookFile.isPlainText(input);
            if (toText && !input.getFileName().toString().endsWith(".ipynb")) {
                throw new IllegalArgumentException(input + ": convert reads NAME.ipynb or NAME.java (plain-text form); rename the file or check the path");
            }
            Notebook nb = NotebookFile.read(input);
            Path target = output != null ? output : sibling(input, toText ? PlainTextNotebook.SUFFIX : ".ipynb");
            if (toText != NotebookFile.isPlainText(target)) {
                throw new IllegalArgumentException("output " + target + " must end in " + (toText ? ".java" : ".ipynb")
                        + " (converting " + (toText ? "a notebook into its plain-text form" : "a plain-text notebook into .ipynb") + ")");
            }
            if (Files.exists(target) && Files.isSameFile(input, target)) {
                throw new IllegalArgumentException("output " + target + " is the input itself; choose another output path");
            }
            Path dir = target.toAbsolutePath().getParent();
            if (dir == null || !Files.isDirectory(dir)) throw new IllegalArgumentException("the folder of " + target + " does not exist; create it first");
            if (toText) {
                if (Files.exists(target) && !startsWithFormatLine(target)) {
                    throw new IllegalArgumentException(target + " exists and is not a Loopledger plain-text notebook; refusing to write over it. "
                            + "Choose another output with -o or move that file away");
                }
                for (String note : PlainTextNotebook.droppedOnFormat(nb)) System.err.println("loopledger convert: note: " + note);
                AtomicFiles.writeString(target, PlainTextNotebook.format(nb));
            } else {
                Notebook out = nb;
                if (Files.exists(target)) {
                    Notebook stored;
                    try {
                        stored = NotebookJson.read(target);
                    } catch (IllegalArgumentException e) {
                        throw new IllegalArgumentException(target + " exists and is not a readable notebook (" + e.getMessage()
                                + "); refusing to write over it. Choose another output with -o or move that file away");
                    }
                    out = PlainTextNotebook.withOutputsOf(nb, stored);
                    long kept = out.codeCells().stream().filter(c -> c.executionCount() != null || !c.outputs().isEmpty()).count();
                    System.err.println("loopledger convert: " + target + " existed: kept the stored outputs of " + kept + " of "
                            + out.codeCells().size() + " code cells (those whose source is unchanged)");
                }
                NotebookJson.write(out, target);
            }
            System.err.println("loopledger convert: wrote " + target);
            return 0;
        } catch (IllegalArgumentException e) {
            System.err.println("loopledger convert: " + e.getMessage());
            return 2;
        } catch (IOException e) {
            System.err.println("loopledger convert: " + e.getMessage());
            return 2;
        }
    }

    private static boolean startsWithFormatLine(Path file) throws IOException {
        try (var r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String first = r.readLine();
            return first != null && first.replace("\uFEFF", "").equals(PlainTextNotebook.FORMAT_LINE);
        } catch (java.nio.charset.MalformedInputException e) {
            return false;
        }
    }

    private static Path sibling(Path in, String suffix) {
        String name = in.getFileName().toString();
        int dot = name.lastIndexOf('.');
        String stem = dot > 0 ? name.substring(0, dot) : name;
        return in.toAbsolutePath().getParent().resolve(stem + suffix);
    }
}
