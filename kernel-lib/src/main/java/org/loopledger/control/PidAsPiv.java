package org.loopledger.control;

import java.util.Objects;
import java.util.Optional;

/**
 * The exact PIV form of a parallel PID: the PIV, followed by a first-order low-pass on its output when
 * the PID has a derivative filter (corner 1/τ). The product C<sub>eq</sub>·lowPass equals the PID's
 * transfer function.
 */
public record PidAsPiv(Piv piv, Optional<LowPass1> lowPass) {
    public PidAsPiv {
        Objects.requireNonNull(piv, "piv");
        Objects.requireNonNull(lowPass, "lowPass");
    }

    @Override public String toString() {
        return piv + lowPass.map(l -> ", followed by " + l.describe()).orElse("");
    }
}
