package org.loopledger.cli;

import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The benchmarks live in loopledger-app and join the command line through {@link SubcommandProvider}. */
class BenchSubcommandTest {
    private record Result(int exit, String stdout, String stderr) {}

    private static Result cli(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream(), err = new ByteArrayOutputStream();
        PrintStream o = System.out, e = System.err;
        try {
            System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
            System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
            int exit = Main.commandLine().execute(args);
            return new Result(exit, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
        } finally {
            System.setOut(o);
            System.setErr(e);
        }
    }

    @Test
    void benchIsRegisteredAndTakesHelp() {
        Result help = cli("bench", "--help");
        assertEquals(0, help.exit(), help.stderr());
        assertTrue(help.stdout().contains("Usage: loopledger bench"), help.stdout());
        Result top = cli("--help");
        assertTrue(top.stdout().contains("bench"), "the top-level help lists bench: " + top.stdout());
    }

    @Test
    void badUsageExitsWith2() {
        assertEquals(2, cli("bench", "runner").exit(), "runner without a notebook");
        assertEquals(2, cli("bench", "no-such-benchmark").exit());
    }
}
