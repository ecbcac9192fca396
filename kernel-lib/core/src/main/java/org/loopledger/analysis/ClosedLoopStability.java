package org.loopledger.analysis;

import org.loopledger.lti.Units;
import org.apache.commons.math3.complex.Complex;
import org.loopledger.frf.Frf;
import org.loopledger.lti.TransferFunction;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;

/**
 * Closed-loop stability of the unity negative feedback loop around L.
 *
 * <ul>
 *   <li>Delay-free models: the closed-loop poles, roots of D + N (stable when all lie strictly inside
 *       the left half plane or unit circle, by more than {@link ModelLoop#AXIS_TOLERANCE}); the Nyquist
 *       count is computed as well and a disagreement is reported.</li>
 *   <li>Models with a delay: the characteristic equation D + N e<sup>-sτ</sup> = 0 has infinitely many
 *       roots, so no pole list; the Nyquist criterion on the dense grid decides, with P the open-loop
 *       unstable poles of the rational part.</li>
 *   <li>Measured loops: the Nyquist count with the number of open-loop unstable poles stated by the
 *       user; a warning when the band does not cover all crossovers.</li>
 * </ul>
 */
public final class ClosedLoopStability {
    /** How the verdict was reached. */
    public enum Method { CLOSED_LOOP_POLES, NYQUIST }

    private final boolean stable;
    private final Method method;
    private final List<Complex> closedLoopPoles;
    private final int unstableClosedLoopPoles;
    private final int openLoopUnstablePoles;
    private final int clockwiseEncirclements;
    private final List<LoopWarning> notes;

    private ClosedLoopStability(boolean stable, Method method, List<Complex> poles, int z, int p, int n, List<LoopWarning> notes) {
        this.stable = stable;
        this.method = method;
        this.closedLoopPoles = List.copyOf(poles);
        this.unstableClosedLoopPoles = z;
        this.openLoopUnstablePoles = p;
        this.clockwiseEncirclements = n;
        this.notes = List.copyOf(notes);
    }

    /** Stability of a model loop gain (poles when delay-free, Nyquist otherwise). */
    public static ClosedLoopStability of(TransferFunction loopGain) {
        ModelLoop l = ModelLoop.of(loopGain);
        List<LoopWarning> notes = new ArrayList<>();
        int p = l.openLoopUnstablePoles().getAsInt();
        NyquistCount.Count c = nyquist(l);
        if (!loopGain.hasDelay()) {
            TransferFunction cl = loopGain.feedback();
            List<Complex> poles = cl.poles();
            int z = 0, onBoundary = 0;
            for (Complex q : poles) {
                double d = loopGain.isDiscrete() ? q.abs() - 1 : q.getReal();
                double tol = ModelLoop.AXIS_TOLERANCE * Math.max(1, q.abs());
                if (d > tol) z++;
                else if (d >= -tol) onBoundary++;
            }
            if (onBoundary > 0) notes.add(LoopWarning.of(LoopWarning.Kind.MARGINALLY_STABLE, onBoundary + " closed-loop pole(s) on the stability boundary: marginally stable at best"));
            if (c.notes().isEmpty() && p + c.clockwise() != z && onBoundary == 0) {
                notes.add(LoopWarning.of(LoopWarning.Kind.COUNTS_DISAGREE, "the Nyquist count (Z = " + (p + c.clockwise()) + ") disagrees with the pole count (" + z + ")"));
            }
            return new ClosedLoopStability(z == 0 && onBoundary == 0, Method.CLOSED_LOOP_POLES, poles, z, p, c.clockwise(), notes);
        }
        notes.add(LoopWarning.atRadPerS(LoopWarning.Kind.DECIDED_ON_GRID, l.highRadPerS(),
                "the delay makes the number of closed-loop poles infinite: decided by the Nyquist criterion on the grid up to " + Units.formatRadPerSAsHz(l.highRadPerS())));
        notes.addAll(c.notes());
        int z = p + c.clockwise();
        return new ClosedLoopStability(z == 0 && l.openLoopPolesOnAxis() <= Math.max(0, l.netIntegrators()), Method.NYQUIST, List.of(), z, p, c.clockwise(), notes);
    }

    /** Nyquist count on a measured continuous-time loop gain with the stated number of open-loop unstable poles. */
    public static ClosedLoopStability of(Frf loopGain, int openLoopUnstablePoles) {
        return of(MeasuredLoop.of(loopGain).withOpenLoopUnstablePoles(openLoopUnstablePoles));
    }

    /** Nyquist count on any loop response; measured ones must state their open-loop unstable poles. */
    public static ClosedLoopStability of(LoopResponse l) {
        if (l instanceof ModelLoop ml) return of(ml.model().orElseThrow());
        OptionalInt p = l.openLoopUnstablePoles();
        if (p.isEmpty()) {
            throw new IllegalArgumentException("the Nyquist criterion on measured data needs the number of open-loop unstable poles; "
                    + "state it with MeasuredLoop.withOpenLoopUnstablePoles(n) (0 for a stable plant and controller)");
        }
        List<LoopWarning> notes = new ArrayList<>();
        Margins m = Margins.of(l);
        for (LoopWarning w : m.warnings()) if (BAND_COVERAGE.contains(w.kind())) notes.add(w);
        NyquistCount.Count c = nyquist(l);
        notes.addAll(c.notes());
        int z = p.getAsInt() + c.clockwise();
        if (z < 0) {
            notes.add(LoopWarning.of(LoopWarning.Kind.IMPOSSIBLE_COUNT, "Z = P + N = " + z + " is negative: the stated number of open-loop unstable poles ("
                    + p.getAsInt() + ") cannot be right, or the band misses part of the Nyquist curve"));
        }
        return new ClosedLoopStability(z == 0, Method.NYQUIST, List.of(), z, p.getAsInt(), c.clockwise(), notes);
    }

    /** The margin warnings about the measured band's coverage, which a Nyquist count on data inherits. */
    private static final java.util.Set<LoopWarning.Kind> BAND_COVERAGE = java.util.EnumSet.of(LoopWarning.Kind.CROSSOVER_ABOVE_BAND,
            LoopWarning.Kind.CROSSOVER_BELOW_BAND, LoopWarning.Kind.NO_GAIN_CROSSOVER_IN_BAND, LoopWarning.Kind.NO_PHASE_CROSSOVER_IN_BAND,
            LoopWarning.Kind.PEAK_AT_BAND_EDGE);

    private static NyquistCount.Count nyquist(LoopResponse l) {
        double end = 0;
        if (l.sampleTimeS().isPresent() && Math.abs(l.highRadPerS() - Math.PI / l.sampleTimeS().getAsDouble()) <= 1e-9 * l.highRadPerS()) {
            end = Double.NaN;
        } else if (l.model().isPresent()) {
            double d = l.model().get().highFrequencyGain();
            end = 1 + d < 0 ? Math.PI : 0;
        }
        return NyquistCount.count(l, end);
    }

    public boolean isStable() { return stable; }

    public Method method() { return method; }

    /** Closed-loop poles (delay-free models only; empty otherwise). */
    public List<Complex> closedLoopPoles() { return closedLoopPoles; }

    /** Z: closed-loop poles in the right half plane (outside the unit circle). */
    public int unstableClosedLoopPoles() { return unstableClosedLoopPoles; }

    /** P: open-loop unstable poles (stated for data). */
    public int openLoopUnstablePoles() { return openLoopUnstablePoles; }

    /** N: clockwise encirclements of -1 by the Nyquist curve (Z = N + P). */
    public int clockwiseEncirclements() { return clockwiseEncirclements; }

    /** Notes and warnings (band coverage, grid resolution, marginal cases), structured. */
    public List<LoopWarning> notes() { return notes; }

    /** One line: the verdict, how it was reached and the counts (the full report: {@code display.ClosedLoopStabilityText}). */
    @Override public String toString() {
        return "Closed loop " + (stable ? "STABLE" : "UNSTABLE") + " (" + (method == Method.CLOSED_LOOP_POLES ? "closed-loop poles" : "Nyquist criterion")
                + "): P = " + openLoopUnstablePoles + ", N = " + clockwiseEncirclements + ", Z = " + unstableClosedLoopPoles
                + (notes.isEmpty() ? "" : ", " + notes.size() + (notes.size() == 1 ? " note" : " notes"));
    }
}
