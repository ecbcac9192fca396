package org.loopledger.cli;

import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * {@code loopledger}: one subcommand per class; add a command by adding it to {@code subcommands}.
 */
@Command(name = "loopledger", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "Servo loop design: Jupyter kernel and tools.",
        subcommands = {RunCommand.class, VerifyCommand.class, RenderCommand.class, KernelCommand.class, InstallCommand.class, BenchCommand.class, ConvertCommand.class})
public final class Main implements Runnable {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    public static void main(String[] args) {
        System.exit(new CommandLine(new Main()).execute(args));
    }

    @Override
    public void run() {
        spec.commandLine().usage(System.out);
    }
}
