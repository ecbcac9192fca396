package org.loopledger.cli;

import org.loopledger.notebook.AtomicFiles;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookJson;
import org.loopledger.notebook.NotebookRunner;
import org.loopledger.notebook.RecordRenderer;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code loopledger render NOTEBOOK [-o RECORD.html]}: the HTML record of an executed notebook, without re-running it. */
@Command(name = "render", description = "Render an executed notebook into its self-contained HTML tuning record.")
final class RenderCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "NOTEBOOK", description = "a notebook executed by 'loopledger run'")
    Path notebook;

    @Option(names = {"-o", "--output"}, paramLabel = "RECORD.html", description = "output file (default: NAME.html beside the notebook)")
    Path output;

    @Override
    public Integer call() {
        try {
            Notebook nb = NotebookJson.read(notebook);
            Path target = output != null ? output : NotebookFiles.sibling(notebook, ".html");
            RunCommand.requireFolder(target);
            var info = NotebookRunner.recordInfo(nb, notebook.getFileName().toString(), System.getProperty("java.version"));
            AtomicFiles.writeString(target, RecordRenderer.render(nb, info, notebook.toAbsolutePath().getParent()));
            System.err.println("loopledger: wrote record " + target);
            return 0;
        } catch (IllegalArgumentException e) {
            System.err.println("loopledger render: " + e.getMessage());
            return 2;
        }
    }
}
