package org.loopledger.cli;

import org.loopledger.notebook.AtomicFiles;
import org.loopledger.notebook.Notebook;
import org.loopledger.notebook.NotebookRunner;
import org.loopledger.notebook.RecordRenderer;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code loopledger render NOTEBOOK [-o RECORD.html]}: the HTML record of an executed notebook, without re-running it. */
@Command(name = "render", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = {"Render an executed notebook into its self-contained HTML tuning record.",
                "Never writes over the notebook or over an existing file that is not HTML."},
        exitCodeListHeading = "Exit status:%n",
        exitCodeList = {"0:the record was written", "2:bad usage or input: nothing was written"})
final class RenderCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "NOTEBOOK", description = "a notebook executed by 'loopledger run' (.ipynb), or a plain-text notebook (.java) with its executed NAME.ipynb beside it")
    Path notebook;

    @Option(names = {"-o", "--output"}, paramLabel = "RECORD.html", description = "output file (default: NAME.html beside the notebook)")
    Path output;

    @Override
    public Integer call() {
        try {
            Notebook nb = NotebookFiles.executed(notebook, "render");
            Path target = output != null ? output : NotebookFiles.sibling(notebook, ".html");
            OutputTargets.check(target, OutputTargets.Kind.HTML, output != null ? "-o" : "the output", false, notebook);
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
