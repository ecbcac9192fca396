package org.loopledger.ident.fit;

/** A rigid-body fit: the estimate as a value, and the fit's details. */
public record RigidBodyFit(RigidBodyParameters estimate, FitResult fit) {
    @Override public String toString() { return estimate + "\n" + fit; }
}
