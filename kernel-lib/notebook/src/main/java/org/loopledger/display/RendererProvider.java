package org.loopledger.display;

/**
 * A service (listed in {@code META-INF/services/org.loopledger.display.RendererProvider}) through which
 * packages register renderers for their types without {@code display} knowing them.
 */
public interface RendererProvider {
    void register(RendererRegistry registry);
}
