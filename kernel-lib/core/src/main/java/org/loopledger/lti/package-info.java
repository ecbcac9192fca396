/**
 * Linear time-invariant models: {@link org.loopledger.lti.Polynomial} (descending powers),
 * {@link org.loopledger.lti.TransferFunction} (continuous in s or sampled in z, with an optional pure delay
 * kept exact as e<sup>-jωτ</sup>), {@link org.loopledger.lti.StateSpace}, {@link org.loopledger.lti.TimeBase},
 * {@link org.loopledger.lti.Discretization} (zero-order hold, Tustin, matched pole-zero) and
 * {@link org.loopledger.lti.Pade} (delay approximants, for time simulation only).
 *
 * <p><b>Units.</b> Inside the library frequency is rad/s, time s, phase rad, magnitude a ratio;
 * {@link org.loopledger.lti.Units} is the one place that converts to Hz, degrees and dB at the edges.
 * {@link org.loopledger.lti.Motion} says whether an axis is rotary (rad, N·m, kg·m²) or linear (m, N, kg) and
 * owns the unit strings that follow. {@link org.loopledger.lti.Warning} is the shape of every structured warning.
 *
 * <p>Entry points: {@code TransferFunction.continuous(num, den)}, {@code TransferFunction.zpk(...)},
 * {@code TransferFunction.s()}, then {@code times}, {@code feedback}, {@code withDelay}, {@code response}.
 */
package org.loopledger.lti;
