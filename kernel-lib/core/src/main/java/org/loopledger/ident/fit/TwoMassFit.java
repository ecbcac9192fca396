package org.loopledger.ident.fit;

/** A two-mass fit: the estimate as a value, and the fit's details. */
public record TwoMassFit(TwoMassParameters estimate, FitResult fit) {
    @Override public String toString() { return estimate + "\n" + fit; }
}
