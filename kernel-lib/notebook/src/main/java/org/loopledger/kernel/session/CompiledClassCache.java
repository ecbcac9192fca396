package org.loopledger.kernel.session;

import jdk.jshell.JShell;
import jdk.jshell.Snippet;

import java.lang.reflect.Field;
import java.lang.reflect.Method;
import java.util.NavigableMap;

/**
 * JShell's in-memory store of the class files it compiled, with a way to forget the classes of snippets that
 * are gone.
 *
 * <p>Why: JShell keeps the class file of every snippet it ever compiled, dropped and replaced ones included
 * (its {@code MemoryFileManager}), and every later javac run lists and enters all of them: each snippet made
 * every later one slower. Measured with a bare JShell on the 2-core build machine (C1, 3,000 evaluations of
 * {@code 1+1}, each dropped): the median evaluation grew from 11-13 ms (first 500) to 30-37 ms (last 500);
 * forgetting each dropped snippet's class kept it at 4-8 ms throughout. A notebook session that runs a few
 * hundred cells hits the same growth.
 *
 * <p>What is forgotten: the class of a dropped statement, expression or expression temporary ({@code $1}), with its
 * nested classes. Each evaluation of those gets a key, and so a class, of its own, which no other snippet imports.
 * Declarations are never forgotten: a redeclaration with the same signature reuses the replaced snippet's class
 * name (seen: {@code int counted = 0;} twice gives {@code REPL.$JShell$1} both times), so forgetting the replaced
 * one would take the live one's class away. Classes that hold several snippets (named with {@code _}) are kept
 * too. The agent JVM keeps the loaded classes; only the compiler stops seeing them.
 *
 * <p>How: JShell has no API for this, so the store is reached by reflection, which needs the host JVM to run with
 * {@value SessionOptions#OPEN_JSHELL}. The launcher, the kernelspec and the build pass it. Without it (or on a JDK whose JShell is
 * built differently) nothing is forgotten, {@link #available()} is false, and cells run as before, only slower in
 * long sessions.
 */
final class CompiledClassCache {
    private final NavigableMap<String, ?> classFiles;
    private final Method classFullName;

    private CompiledClassCache(NavigableMap<String, ?> classFiles, Method classFullName) {
        this.classFiles = classFiles;
        this.classFullName = classFullName;
    }

    /** The store of {@code shell}, or one that forgets nothing when it cannot be reached. */
    static CompiledClassCache of(JShell shell) {
        try {
            Field taskFactory = JShell.class.getDeclaredField("taskFactory");
            taskFactory.setAccessible(true);
            Object factory = taskFactory.get(shell);
            Field fileManager = factory.getClass().getDeclaredField("fileManager");
            fileManager.setAccessible(true);
            Object manager = fileManager.get(factory);
            Field store = manager.getClass().getDeclaredField("classObjects");
            store.setAccessible(true);
            Method name = Snippet.class.getDeclaredMethod("classFullName");
            name.setAccessible(true);
            if (!(store.get(manager) instanceof NavigableMap<?, ?> map)) return new CompiledClassCache(null, null);
            return new CompiledClassCache((NavigableMap<String, ?>) map, name);
        } catch (ReflectiveOperationException | RuntimeException e) {
            return new CompiledClassCache(null, null); // not opened to us, or another JShell layout
        }
    }

    /** Whether classes can be forgotten in this JVM. */
    boolean available() {
        return classFiles != null;
    }

    /** Whether no other snippet can ever have {@code s}'s class name: a statement, an expression or a temporary. */
    static boolean ownsItsClass(Snippet s) {
        return s.kind() == Snippet.Kind.STATEMENT || s.kind() == Snippet.Kind.EXPRESSION
                || s.subKind() == Snippet.SubKind.TEMP_VAR_EXPRESSION_SUBKIND;
    }

    /** How many class files the compiler currently sees from earlier snippets (-1 when not available). */
    int size() {
        return classFiles == null ? -1 : classFiles.size();
    }

    /**
     * Forgets the class of {@code dropped}, a snippet the session has just dropped, when it is a statement, an
     * expression or an expression's temporary; does nothing for any other snippet. Call on the thread that evaluates
     * (JShell is not thread-safe).
     */
    void forget(Snippet dropped) {
        if (classFiles == null || !ownsItsClass(dropped)) return;
        String name;
        try {
            name = (String) classFullName.invoke(dropped);
        } catch (ReflectiveOperationException | RuntimeException e) {
            return; // a snippet that was never wrapped in a class (rejected, import)
        }
        if (name == null) return;
        String simple = name.substring(name.lastIndexOf('.') + 1);
        if (simple.contains("_")) return; // a class shared with other snippets
        classFiles.remove(name);
        // nested classes: NAME$... ('%' is the character after '$')
        classFiles.subMap(name + "$", true, name + "%", false).clear();
    }

}
