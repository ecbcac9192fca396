package org.loopledger.control;

/**
 * Which of the two real zeros of a PID's numerator becomes the velocity-integral corner ω<sub>i</sub>
 * when converting to a PIV (the other becomes the position gain K<sub>p</sub>). The zeros are
 * interchangeable in the single-loop transfer function, so the choice must be stated.
 */
public enum ZeroAssignment {
    /** ω<sub>i</sub> = the slower zero, K<sub>p</sub> = the faster one. */
    INTEGRAL_CORNER_IS_LOWER_ZERO,
    /** K<sub>p</sub> = the slower zero, ω<sub>i</sub> = the faster one. */
    POSITION_GAIN_IS_LOWER_ZERO
}
