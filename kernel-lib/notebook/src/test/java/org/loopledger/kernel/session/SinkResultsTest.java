package org.loopledger.kernel.session;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.loopledger.display.MimeBundle;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** A cell ending in a printf shows what it printed, not {@code java.io.PrintStream@...} (issue 10, section 2). */
class SinkResultsTest {
    static CellSession session;

    @BeforeAll
    static void start() { session = CellSession.start(SessionOptions.defaults()); }

    @AfterAll
    static void stop() { session.close(); }

    static CellResult run(String code) { return session.execute(code, "cell [t]", OutputListener.IGNORE); }

    @Test
    void lastCallNameSkipsArgumentsAndLiterals() {
        assertEquals("append", SinkResults.lastCallName("sb.append(\"(\").append(x);"));
        assertEquals("append", SinkResults.lastCallName("sb.append(')')"));
        assertEquals("append", SinkResults.lastCallName("sb.append(\"a\\\")(\")"));
        assertEquals("reverse", SinkResults.lastCallName("sb.append(\"x\").reverse()"));
        assertEquals("", SinkResults.lastCallName("sb"));
        assertEquals("printf", SinkResults.lastCallName("System.out.printf(\"%d%n\", f(2))"));
    }

    @Test
    void ruleOnTypesAndSources() {
        assertTrue(SinkResults.hides("PrintStream", "System.out.printf(\"x\")"));
        assertTrue(SinkResults.hides("java.io.PrintWriter", "w.format(\"x\")"));
        assertTrue(SinkResults.hides("StringBuilder", "sb.append(1)"));
        assertFalse(SinkResults.hides("StringBuilder", "sb"), "asking for the builder shows its text");
        assertFalse(SinkResults.hides("String", "String.format(\"%d\", 3)"), "a formatted string is a value worth showing");
        assertFalse(SinkResults.hides("com.example.PrintStream", "p.printf(\"x\")"), "only the JDK's sinks");
    }

    @Test
    void printfAsTheLastLineShowsOnlyThePrintedText() {
        CellResult r = run("int n = 3;\nSystem.out.printf(\"n = %d%n\", n)");
        assertTrue(r.ok(), r.toString());
        assertEquals(List.of(new CellOutput.Stream("stdout", "n = 3\n")), r.outputs());
        CellResult w = run("var sw = new java.io.StringWriter(); var pw = new java.io.PrintWriter(sw);\npw.printf(\"%d\", 4)");
        assertEquals(List.of(), w.outputs(), w.toString());
    }

    @Test
    void builderAppendIsHiddenButTheBuilderItselfShows() {
        assertEquals(List.of(), run("StringBuilder sb = new StringBuilder(\"ab\");\nsb.append(\"c\")").outputs());
        assertEquals(List.of(new CellOutput.Result(MimeBundle.ofText("abc"))), run("sb").outputs());
        assertEquals(List.of(new CellOutput.Result(MimeBundle.ofText("\"x=1\""))), run("String.format(\"x=%d\", 1)").outputs());
    }
}
