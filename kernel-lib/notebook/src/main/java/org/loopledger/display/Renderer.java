package org.loopledger.display;

/** Turns values of one type into MIME bundles; register with {@link RendererRegistry}. */
@FunctionalInterface
public interface Renderer<T> {
    MimeBundle render(T value) throws Exception;
}
