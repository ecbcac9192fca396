package org.loopledger.display;

import org.apache.commons.math3.complex.Complex;
import org.loopledger.analysis.ClosedLoopStability;
import org.loopledger.analysis.LoopWarning;
import org.loopledger.lti.Units;

/** The plain-text report of a {@link ClosedLoopStability}: verdict, counts P, N, Z, closed-loop poles and notes. Deterministic. */
public final class ClosedLoopStabilityText {
    private ClosedLoopStabilityText() {}

    public static String of(ClosedLoopStability s) {
        StringBuilder b = new StringBuilder();
        b.append("Closed loop ").append(s.isStable() ? "STABLE" : "UNSTABLE").append(" (")
                .append(s.method() == ClosedLoopStability.Method.CLOSED_LOOP_POLES ? "closed-loop poles" : "Nyquist criterion").append(")\n");
        b.append("  open-loop unstable poles P = ").append(s.openLoopUnstablePoles()).append(", clockwise encirclements of -1 N = ")
                .append(s.clockwiseEncirclements()).append(", closed-loop unstable poles Z = ").append(s.unstableClosedLoopPoles()).append('\n');
        if (!s.closedLoopPoles().isEmpty()) {
            b.append("  closed-loop poles:");
            for (Complex q : s.closedLoopPoles()) {
                b.append(' ').append(Units.g4(q.getReal()));
                if (q.getImaginary() != 0) b.append(q.getImaginary() < 0 ? " - " : " + ").append(Units.g4(Math.abs(q.getImaginary()))).append('j');
                b.append(';');
            }
            b.append('\n');
        }
        for (LoopWarning n : s.notes()) b.append("  note: ").append(n.message()).append('\n');
        return b.toString().stripTrailing();
    }
}
