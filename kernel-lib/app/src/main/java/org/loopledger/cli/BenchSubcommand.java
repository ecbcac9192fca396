package org.loopledger.cli;

/** Registers {@code loopledger bench} with the command line (see {@link SubcommandProvider}). */
public final class BenchSubcommand implements SubcommandProvider {
    @Override
    public String name() {
        return "bench";
    }

    @Override
    public Object command() {
        return new BenchCommand();
    }
}
