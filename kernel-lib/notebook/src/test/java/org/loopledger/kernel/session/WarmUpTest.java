package org.loopledger.kernel.session;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The background warm-up compiles throw-away snippets only while the session is left alone after its start, stops for
 * good at the first request, and leaves nothing a user can see: no variable, method or class, no output.
 */
class WarmUpTest {
    private static CellResult run(CellSession s, String code) {
        return s.execute(code, "cell [t]", OutputListener.IGNORE);
    }

    private static void awaitWarmUp(CellSession s, int atLeast) throws InterruptedException {
        long end = System.nanoTime() + 120_000_000_000L;
        while (s.warmUpSnippetsRun() < atLeast && System.nanoTime() < end) Thread.sleep(50);
        assertTrue(s.warmUpSnippetsRun() >= atLeast, "warm-up ran " + s.warmUpSnippetsRun() + " snippets in 120 s");
    }

    @Test
    void runsWhileIdleAndLeavesNothingBehind() throws Exception {
        try (CellSession s = CellSession.start(SessionOptions.defaults())) {
            awaitWarmUp(s, 2 * CellSession.WARM_UP_SNIPPETS.size()); // every kind of snippet, twice
            assertTrue(run(s, "int userGain = 5;").ok());
            int stoppedAt = s.warmUpSnippetsRun();
            CellResult r = run(s, "userGain * 2");
            assertEquals(List.of(new CellOutput.Result(org.loopledger.display.MimeBundle.ofText("10"))), r.outputs(), r.toString());
            for (String name : List.of("ll$warm", "ll$f(1)", "new Ll$Warm()", "ll$a")) {
                CellResult gone = run(s, name);
                assertEquals("CompileError", gone.error().map(CellOutput.Error::name).orElse("none"), name + " -> " + gone);
            }
            Thread.sleep(2 * CellSession.WARM_UP_DELAY_MS + 500);
            assertEquals(stoppedAt, s.warmUpSnippetsRun(), "the warm-up does not resume after cells");
            assertTrue(stoppedAt <= CellSession.WARM_UP_BUDGET, "budget " + CellSession.WARM_UP_BUDGET + ", ran " + stoppedAt);
        }
    }

    @Test
    void offWhenNotAsked() throws Exception {
        try (CellSession s = CellSession.start(new SessionOptions(System.getProperty("java.class.path"), List.of(), false))) {
            assertTrue(run(s, "1+1").ok());
            Thread.sleep(2 * CellSession.WARM_UP_DELAY_MS + 500);
            assertEquals(0, s.warmUpSnippetsRun());
        }
    }
}
