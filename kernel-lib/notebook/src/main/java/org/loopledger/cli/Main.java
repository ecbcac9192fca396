package org.loopledger.cli;

import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * {@code loopledger}: one subcommand per class; add a command by adding it to {@code subcommands}, or, for a command
 * that lives in another module (the benchmarks), by a {@link SubcommandProvider} service.
 *
 * <p>Exit status, every command: 0 success, 1 the work itself failed (a cell, a reproduction, a check),
 * 2 bad usage or input (nothing was run or written), 3 {@code run --allow-errors} with failed cells.
 */
@Command(name = "loopledger", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "Servo loop design: Jupyter kernel and tools.",
        subcommands = {RunCommand.class, VerifyCommand.class, RenderCommand.class, DatasetsCommand.class, KernelCommand.class, InstallCommand.class,
                ConvertCommand.class})
public final class Main implements Runnable {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    public static void main(String[] args) {
        System.exit(commandLine().execute(args));
    }

    /**
     * The command line with Loopledger's error handling: an {@link IllegalArgumentException} escaping
     * a command is bad input (its message, exit 2); any other exception is reported in one line (exit 1).
     */
    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        for (SubcommandProvider extra : java.util.ServiceLoader.load(SubcommandProvider.class)) {
            cl.addSubcommand(extra.name(), extra.command());
        }
        cl.setExecutionExceptionHandler((ex, line, parseResult) -> {
            String cmd = line.getCommandName();
            if (ex instanceof IllegalArgumentException) {
                line.getErr().println("loopledger " + cmd + ": " + ex.getMessage());
                return 2;
            }
            line.getErr().println("loopledger " + cmd + ": failed: " + ex);
            return 1;
        });
        return cl;
    }

    @Override
    public void run() {
        spec.commandLine().usage(System.out);
    }
}
