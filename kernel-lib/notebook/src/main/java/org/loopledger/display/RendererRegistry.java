package org.loopledger.display;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.ServiceLoader;
import java.util.concurrent.CopyOnWriteArrayList;

/**
 * Finds the renderer for a value: a {@link Displayable} renders itself; otherwise the most recently
 * registered renderer whose type the value is an instance of wins (so a later registration overrides
 * a built-in one). Thread-safe.
 */
public final class RendererRegistry {
    private record Entry<T>(Class<T> type, Renderer<? super T> renderer) {
        MimeBundle render(Object value) throws Exception {
            return renderer.render(type.cast(value));
        }
    }

    private static final RendererRegistry GLOBAL = createGlobal();
    private final List<Entry<?>> entries = new CopyOnWriteArrayList<>();

    /** An empty registry (for tests). */
    public static RendererRegistry empty() {
        return new RendererRegistry();
    }

    /** The registry used by {@link Displays}: built-ins, then every {@link RendererProvider} service. */
    public static RendererRegistry global() {
        return GLOBAL;
    }

    private static RendererRegistry createGlobal() {
        RendererRegistry r = new RendererRegistry();
        BuiltinRenderers.register(r);
        for (RendererProvider p : ServiceLoader.load(RendererProvider.class, RendererRegistry.class.getClassLoader())) {
            p.register(r);
        }
        return r;
    }

    public <T> RendererRegistry register(Class<T> type, Renderer<? super T> renderer) {
        entries.add(new Entry<>(type, renderer));
        return this;
    }

    /** The bundle for {@code value}, or empty when no renderer applies (callers fall back to plain text). */
    public Optional<MimeBundle> render(Object value) throws Exception {
        if (value instanceof Displayable d) return Optional.of(d.toMimeBundle());
        if (value == null) return Optional.empty();
        List<Entry<?>> snapshot = new ArrayList<>(entries);
        for (int i = snapshot.size() - 1; i >= 0; i--) {
            Entry<?> e = snapshot.get(i);
            if (e.type().isInstance(value)) return Optional.of(e.render(value));
        }
        return Optional.empty();
    }
}
