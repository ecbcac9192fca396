package org.loopledger.kernel.session;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The session forgets the compiled classes of dropped and replaced snippets, so that a long session does not make
 * every later cell slower, and nothing a live snippet needs is forgotten. The expected values are plain Java
 * semantics (what the same statements give in a Java program; common practice), not figures of this project.
 */
class CompiledClassCacheTest {
    static CellSession session;

    @BeforeAll
    static void start() {
        session = CellSession.start(new SessionOptions(System.getProperty("java.class.path"),
                SessionOptions.defaults().agentVmOptions(), false));
    }

    @AfterAll
    static void stop() {
        session.close();
    }

    static String value(String code) {
        CellResult r = session.execute(code, "cell [t]", OutputListener.IGNORE);
        assertTrue(r.ok(), () -> code + " -> " + r);
        return r.outputs().stream().filter(o -> o instanceof CellOutput.Result).map(o -> ((CellOutput.Result) o).bundle().get(org.loopledger.display.MimeBundle.TEXT_PLAIN).orElse(""))
                .findFirst().orElse("");
    }

    @Test
    void theBuildOpensJShellToTheSession() {
        assertTrue(session.forgetsDroppedClasses(), "run the JVM with " + SessionOptions.OPEN_JSHELL + " (SessionOptions.HOST_FLAGS)");
    }

    /** Without the flag nothing is forgotten, and nothing fails: the kernel then logs a warning naming the fix. */
    @Test
    void withoutTheFlagTheStoreIsLeftAlone() throws Exception {
        String javaBinary = java.nio.file.Path.of(System.getProperty("java.home"), "bin", "java").toString();
        for (boolean opened : new boolean[]{true, false}) {
            List<String> cmd = new java.util.ArrayList<>(List.of(javaBinary));
            if (opened) cmd.add(SessionOptions.OPEN_JSHELL);
            cmd.addAll(List.of("-cp", System.getProperty("java.class.path"), CompiledClassCacheProbe.class.getName()));
            Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
            String out = new String(p.getInputStream().readAllBytes(), java.nio.charset.StandardCharsets.UTF_8).trim();
            assertEquals(0, p.waitFor(), out);
            assertEquals(Boolean.toString(opened), out);
        }
    }

    /** Before: every evaluated expression left one class behind (300 cells, 300 more classes). */
    @Test
    void repeatedCellsLeaveNoClassesBehind() {
        value("1+1");
        int before = session.compiledClassCount();
        for (int i = 0; i < 300; i++) {
            assertEquals("2", value("1+1"));
            value("System.out.print(\"\");");
            value("new Runnable() { public void run() {} }.hashCode() * 0");
        }
        assertTrue(session.compiledClassCount() <= before, "classes kept: " + before + " -> " + session.compiledClassCount());
    }

    @Test
    void replacedDeclarationsAndTheirUsersStillWork() {
        value("int cccX = 1;");
        value("int cccTwice() { return 2 * cccX; }");
        assertEquals("2", value("cccTwice()"));
        value("int cccX = 5;"); // replaces the variable: its user is recompiled against the new one
        assertEquals("10", value("cccTwice()"));
        value("short cccX = 7;"); // another type (2 * short is an int)
        assertEquals("14", value("cccTwice()"));
        value("class CccBox { int v() { return 3; } }");
        value("CccBox cccB = new CccBox();");
        assertEquals("3", value("cccB.v()"));
        value("class CccBox { int v() { return 4; } }"); // replaced class: the variable's old value is gone, as in JShell
        value("cccB = new CccBox();");
        assertEquals("4", value("cccB.v()"));
        value("java.util.function.IntSupplier cccS = new java.util.function.IntSupplier() { public int getAsInt() { return 9; } };");
        for (int i = 0; i < 5; i++) value("1+" + i);
        assertEquals("9", value("cccS.getAsInt()"));
        value("Runnable cccR = () -> System.out.print(\"\");");
        value("cccR.run();");
        assertEquals("[1, 2]", value("List.of(1, 2)"));
        value("int cccA() { return cccB2(); }\nint cccB2() { return 8; }");
        assertEquals("8", value("cccA()"));
        value("int cccB2() { return 11; }");
        assertEquals("11", value("cccA()"));
    }

    /**
     * A redeclaration with the same signature reuses the replaced snippet's class name: forgetting the replaced
     * snippet's class once took the live variable away ("cannot find symbol ... location: package REPL").
     */
    @Test
    void aRedeclaredVariableKeepsItsClass() {
        value("int cccCounted = 0;");
        value("cccCounted++;");
        value("int cccCounted = 0;");
        value("{ cccCounted++; cccCounted++; }");
        assertEquals("2", value("cccCounted"));
        value("void cccBump() { cccCounted += 10; }");
        value("void cccBump() { cccCounted += 20; }");
        value("cccBump();");
        assertEquals("22", value("cccCounted"));
    }

    @Test
    void reRunningADeclaringCellKeepsWorking() {
        for (int i = 0; i < 20; i++) {
            value("double cccGain = " + i + ".5;\nString cccLabel = \"run \" + cccGain;");
            assertEquals("\"run " + i + ".5\"", value("cccLabel"));
        }
        assertEquals(List.of(), session.execute("double cccGain = 1;", "cell [t]", OutputListener.IGNORE).outputs());
    }
}
