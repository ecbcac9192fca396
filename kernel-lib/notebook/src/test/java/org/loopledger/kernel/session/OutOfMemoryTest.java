package org.loopledger.kernel.session;

import org.junit.jupiter.api.Test;
import org.loopledger.display.MimeBundle;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * A cell that exhausts the heap must not take the kernel down silently (issue 5): the agent JVM runs with
 * a small heap here so the test is quick; the user gets the OutOfMemoryError as the cell's error and the
 * session (restarted if the agent died) answers the next cell.
 */
class OutOfMemoryTest {
    @Test
    void exhaustingTheHeapIsReportedAndTheSessionGoesOn() {
        SessionOptions small = new SessionOptions(System.getProperty("java.class.path"), List.of("-Xmx64m"), false);
        try (CellSession s = CellSession.start(small)) {
            CellResult r = s.execute("java.util.List<long[]> hog = new java.util.ArrayList<>();\nwhile (true) hog.add(new long[1 << 20]);",
                    "cell [1]", OutputListener.IGNORE);
            CellOutput.Error e = r.error().orElseThrow(() -> new AssertionError("no error: " + r));
            assertTrue(e.name().contains("OutOfMemoryError") || e.name().equals("SessionRestarted"), e.toString());
            CellResult next = s.execute("1 + 2", "cell [2]", OutputListener.IGNORE);
            assertEquals(List.of(new CellOutput.Result(MimeBundle.ofText("3"))), next.outputs(), next.toString());
        }
    }
}
