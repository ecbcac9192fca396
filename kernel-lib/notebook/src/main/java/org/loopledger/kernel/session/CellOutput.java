package org.loopledger.kernel.session;

import org.loopledger.display.MimeBundle;

import java.util.List;

/**
 * One output of a cell, in the order the cell produced it. These map one to one onto the Jupyter
 * messaging specification 5.3 iopub messages {@code stream}, {@code display_data}, {@code execute_result}
 * and {@code error}, and onto nbformat v4 output types, without depending on either.
 */
public sealed interface CellOutput {
    /** Text written to standard output ({@code "stdout"}) or standard error ({@code "stderr"}). */
    record Stream(String name, String text) implements CellOutput {
        public static final String STDOUT = "stdout";
        public static final String STDERR = "stderr";
    }

    /** A value shown with {@code display(...)} while the cell ran. */
    record Display(MimeBundle bundle) implements CellOutput {}

    /** The value of the cell's last expression. */
    record Result(MimeBundle bundle) implements CellOutput {}

    /**
     * A failure: {@code name} is the exception class or a kind such as {@code CompileError},
     * {@code traceback} the lines to show, with line numbers of the cell.
     */
    record Error(String name, String value, List<String> traceback) implements CellOutput {
        public Error {
            traceback = List.copyOf(traceback);
        }
    }
}
