package org.loopledger.kernel.session;

import jdk.jshell.JShell;

/** Prints whether {@link CompiledClassCache} reaches JShell's store in this JVM; run by {@link CompiledClassCacheTest}. */
public final class CompiledClassCacheProbe {
    private CompiledClassCacheProbe() {}

    public static void main(String[] args) {
        try (JShell shell = JShell.builder().executionEngine("local").build()) {
            System.out.println(CompiledClassCache.of(shell).available());
        }
    }
}
