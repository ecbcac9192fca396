package org.loopledger.kernel.session.agent;

import jdk.jshell.execution.DirectExecutionControl;
import jdk.jshell.spi.ExecutionControl;
import org.loopledger.display.Bundles;

import java.lang.reflect.Field;
import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import java.util.HashMap;
import java.util.Map;

/**
 * The execution control inside the remote agent JVM: JShell's direct control plus
 * <ul>
 *   <li>stopping the snippet's thread even in a tight loop ({@link #stopClientCode});</li>
 *   <li>the extension command {@value #RENDER_LAST}, which renders the value of the last variable whose
 *       value JShell asked for as a MIME bundle (JSON) with {@link Bundles#json}, so rich values
 *       never cross the JVM boundary and no second snippet needs compiling;</li>
 *   <li>the extension command {@value #PROVENANCE}, the datasets the session read (as JSON), so the
 *       runner learns them even when a cell has replaced {@code System.out};</li>
 *   <li>the extension command {@value #RENDER_NEXT}, after which the next snippet's value, when it is a
 *       temporary variable, is rendered at once and sent on the result channel before the answer
 *       ({@link #invoke(String, String)}), so a cell's value costs no round trip of its own, and</li>
 *   <li>releasing the values of temporary variables the session dropped (the argument of
 *       {@value #RENDER_LAST} and {@value #FORGET_LAST}).</li>
 * </ul>
 */
final class AgentControl extends DirectExecutionControl {
    static final String RENDER_LAST = "loopledger.renderLast";
    static final String FORGET_LAST = "loopledger.forgetLast";
    /** Argument {@code true}: render the value of the next snippet run, when it is a temporary variable ({@link #invoke(String, String)}). */
    static final String RENDER_NEXT = "loopledger.renderNext";
    /** Answers {@link org.loopledger.provenance.Provenance#datasetsJson()}: on the command stream, which a cell cannot redirect. */
    static final String PROVENANCE = "loopledger.provenance";

    private final Object lock = new Object();
    private Thread clientThread;
    private volatile boolean stopping;
    private volatile Object lastValue;
    private volatile boolean hasLastValue;
    private volatile java.io.OutputStream resultChannel;
    /** Set by {@value #RENDER_NEXT}; read and cleared by the next {@link #invoke(String, String)} (command thread only). */
    private boolean renderNext;
    /** Variable name to the wrapper class that holds its current definition. */
    private final Map<String, Class<?>> definitions = new HashMap<>();

    @Override
    protected void clientCodeEnter() {
        synchronized (lock) {
            clientThread = Thread.currentThread();
        }
    }

    @Override
    protected void clientCodeLeave() {
        synchronized (lock) {
            clientThread = null;
        }
    }

    /** Stops the snippet now running, if any (JDK 17: {@code Thread.stop} works on any thread at a safepoint). */
    @SuppressWarnings({"deprecation", "removal"})
    void stopClientCode() {
        synchronized (lock) {
            if (clientThread != null) {
                stopping = true;
                clientThread.stop();
            }
        }
    }

    @Override
    protected String throwConvertedInvocationException(Throwable cause) throws RunException, InternalException {
        if (cause instanceof ThreadDeath && stopping) {
            stopping = false;
            throw new StoppedException();
        }
        return super.throwConvertedInvocationException(cause);
    }

    @Override
    protected String throwConvertedOtherException(Throwable ex) throws RunException, InternalException {
        if (ex instanceof ThreadDeath && stopping) {
            stopping = false;
            throw new StoppedException();
        }
        return super.throwConvertedOtherException(ex);
    }

    /** Where {@link #invoke(String, String)} sends a value rendered at once (the launcher's result channel). */
    void resultChannel(java.io.OutputStream out) {
        resultChannel = out;
    }

    /**
     * Runs a snippet; after {@value #RENDER_NEXT} and when the snippet is an expression kept as a temporary
     * variable, also renders its value as {@value #RENDER_LAST} would and sends the bundle on the result channel
     * before the answer, so the launcher needs no further round trip. The rendering happens after the snippet
     * has left client code, as {@value #RENDER_LAST}'s does (a stop does not reach it).
     */
    @Override
    public String invoke(String className, String methodName) throws RunException, EngineTerminationException, InternalException {
        boolean render = renderNext;
        renderNext = false;
        String result = super.invoke(className, methodName);
        java.io.OutputStream channel = resultChannel;
        if (render && hasLastValue && channel != null && declaresTemporary(className)) {
            byte[] frame;
            try {
                frame = org.loopledger.display.DisplayChannel.frame(Bundles.of(lastValue));
            } catch (Throwable t) {
                return result; // left for RENDER_LAST, which reports the failure
            }
            lastValue = null;
            hasLastValue = false;
            try {
                synchronized (channel) {
                    channel.write(frame);
                    channel.flush();
                }
            } catch (java.io.IOException e) {
                throw new EngineTerminationException("the result channel closed: " + e.getMessage());
            }
        }
        return result;
    }

    /** Whether the wrapper class holds a temporary variable ({@code $1}, {@code $2}, ... as JShell names them). */
    private boolean declaresTemporary(String className) {
        try {
            for (Field f : findClass(className).getFields()) {
                String n = f.getName();
                if (Modifier.isStatic(f.getModifiers()) && n.length() > 1 && n.charAt(0) == '$' && n.substring(1).chars().allMatch(Character::isDigit)) return true;
            }
        } catch (ClassNotFoundException | RuntimeException | LinkageError e) {
            // not ours to render
        }
        return false;
    }

    /** Runs a snippet's wrapper method and keeps its value for {@value #RENDER_LAST}. */
    @Override
    protected String invoke(Method doitMethod) throws Exception {
        Object value = doitMethod.invoke(null);
        Class<?> wrapper = doitMethod.getDeclaringClass();
        for (Field f : wrapper.getFields()) {
            if (Modifier.isStatic(f.getModifiers()) && !f.isSynthetic()) releaseOverwritten(f.getName(), wrapper);
        }
        lastValue = value;
        hasLastValue = true;
        return Bundles.plainText(value);
    }

    @Override
    public String varValue(String className, String varName) throws RunException, EngineTerminationException, InternalException {
        try {
            Class<?> klass = findClass(className);
            Field field = klass.getField(varName);
            Object value = field.get(null);
            releaseOverwritten(varName, klass);
            lastValue = value;
            hasLastValue = true;
            return Bundles.plainText(value);
        } catch (ReflectiveOperationException e) {
            throw new InternalException("cannot read " + className + "." + varName + ": " + e);
        } catch (Throwable t) {
            return throwConvertedInvocationException(t);
        }
    }

    /**
     * A variable declared again lives in a new wrapper class; the old class stays loaded and its static
     * field would keep the old value reachable. Clear it so a redefined large array can be collected.
     */
    private void releaseOverwritten(String varName, Class<?> current) {
        Class<?> previous = definitions.put(varName, current);
        if (previous == null || previous == current) return;
        try {
            clear(previous.getField(varName));
        } catch (ReflectiveOperationException | RuntimeException e) {
            // nothing to release
        }
    }

    /**
     * Clears the static fields of temporary variables ({@code $1}, {@code $2}, ...) the session has dropped, so
     * their values can be collected: a dropped snippet's wrapper class stays loaded. The names come as the
     * argument of {@value #RENDER_LAST} and {@value #FORGET_LAST}, so releasing costs no round trip of its own.
     */
    private void releaseDropped(Object arg) {
        if (!(arg instanceof String[] names)) return;
        for (String name : names) {
            Class<?> wrapper = definitions.remove(name);
            if (wrapper == null) continue;
            try {
                clear(wrapper.getField(name));
            } catch (ReflectiveOperationException | RuntimeException e) {
                // nothing to release
            }
        }
    }

    /**
     * Sets a static reference field to null. JShell's wrapper classes are not public, so the public field is
     * reached with {@code setAccessible} (they live in the unnamed module of JShell's class loader).
     */
    private static void clear(Field f) throws ReflectiveOperationException {
        if (f.getType().isPrimitive() || Modifier.isFinal(f.getModifiers())) return;
        f.setAccessible(true);
        f.set(null, null);
    }

    @Override
    public Object extensionCommand(String command, Object arg) throws RunException, EngineTerminationException, InternalException {
        if (FORGET_LAST.equals(command)) {
            lastValue = null;
            hasLastValue = false;
            releaseDropped(arg);
            return null;
        }
        if (RENDER_NEXT.equals(command)) {
            renderNext = Boolean.TRUE.equals(arg);
            return null;
        }
        if (PROVENANCE.equals(command)) return org.loopledger.provenance.Provenance.datasetsJson();
        if (!RENDER_LAST.equals(command)) return super.extensionCommand(command, arg);
        if (!hasLastValue) {
            releaseDropped(arg);
            return null;
        }
        Object value = lastValue;
        lastValue = null;
        hasLastValue = false;
        releaseDropped(arg); // the value itself stays reachable here until it is rendered
        try {
            return Bundles.json(value);
        } catch (Throwable t) {
            // a renderer failed (even with an Error): fall back to plain text, never kill the agent
            return Bundles.failedJson(value, t);
        }
    }
}
