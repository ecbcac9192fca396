package org.loopledger.control;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The exact PIV form of a parallel PID: the PIV, followed by a first-order low-pass on its output when
 * the PID has a derivative filter (corner 1/τ). The product C<sub>eq</sub>·lowPass equals the PID's
 * transfer function. {@code warnings} say what the conversion had to choose (which zero is the position
 * gain) and what the other choice would have given: read them before typing the gains into a drive.
 */
public record PidAsPiv(Piv piv, Optional<LowPass1> lowPass, List<PidWarning> warnings) {
    public PidAsPiv {
        Objects.requireNonNull(piv, "piv");
        Objects.requireNonNull(lowPass, "lowPass");
        warnings = List.copyOf(warnings);
    }

    public PidAsPiv(Piv piv, Optional<LowPass1> lowPass) { this(piv, lowPass, List.of()); }

    @Override public String toString() {
        return piv + lowPass.map(l -> ", followed by " + l.describe()).orElse("")
                + (warnings.isEmpty() ? "" : "\n  warning: " + String.join("\n  warning: ", warnings.stream().map(PidWarning::message).toList()));
    }
}
