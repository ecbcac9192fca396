package org.loopledger.display;

import org.loopledger.frf.Frf;
import org.loopledger.plot.BodePlot;
import org.loopledger.plot.CoherencePlot;
import org.loopledger.plot.Figure;

import java.io.IOException;

/**
 * An {@link Frf} as a Bode figure (magnitude and phase over Hz), with the coherence panel below when
 * the FRF carries coherence; rendered by {@link FigureRenderer} (SVG, PNG and the plotted data).
 * The plain text is the FRF's own description, so a terminal shows its band and point count.
 */
public final class FrfRenderer {
    /** Legend label of the curve. */
    static final String LABEL = "FRF";

    private FrfRenderer() {}

    public static MimeBundle render(Frf frf) throws IOException {
        Figure f = figure(frf);
        MimeBundle fig = FigureRenderer.render(f);
        MimeBundle.Builder b = MimeBundle.builder(frf.toString());
        fig.data().forEach((mime, v) -> { if (!mime.equals(MimeBundle.TEXT_PLAIN)) b.put(mime, v); });
        return b.build();
    }

    /** The figure the renderer draws: Bode panels, then coherence when present. */
    public static Figure figure(Frf frf) {
        Figure bode = BodePlot.of(LABEL, frf);
        if (!frf.hasCoherence()) return bode;
        return Figure.stacked(bode.title(), bode, CoherencePlot.of(LABEL, frf));
    }
}
