package org.loopledger.cli;

/**
 * A subcommand that lives outside this module, found with {@link java.util.ServiceLoader}: the benchmarks
 * (which start Python) are in the {@code loopledger-app} module so that the notebook artifact does not carry them.
 */
public interface SubcommandProvider {
    /** The subcommand's name on the command line. */
    String name();

    /** A fresh picocli command object (annotated with {@code @Command}). */
    Object command();
}
