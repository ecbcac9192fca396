package org.loopledger.lti;

import java.util.OptionalDouble;

/**
 * A structured warning inside a result: what kind of finding, where in frequency when it has a place, and what it
 * means in words. Results carry warnings as values of this shape (for instance {@code analysis.LoopWarning},
 * {@code ident.fit.FitWarning}, {@code tune.ResonanceWarning}, {@code control.PidWarning}), so a display can tabulate
 * and a test can select them by kind rather than by matching text.
 */
public interface Warning {
    /** What the check found, a constant of the warning's own {@code Kind} enum. */
    Enum<?> kind();

    /** Where in frequency, in Hz, when the finding has a place. */
    OptionalDouble frequencyHz();

    /** What it means and what to do, in words. */
    String message();
}
