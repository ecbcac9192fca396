package org.loopledger.sim;

/** How the velocity integrator behaves while the current command is clamped. */
public enum AntiWindup {
    /**
     * Conditional integration (integrator clamping): in a sample where the filtered command exceeds the limit and
     * the velocity error has the same sign as the command, the integrator is not advanced (K. J. Åström and
     * T. Hägglund, Advanced PID Control, ISA 2006, §3.5 "integrator windup", from memory).
     */
    CONDITIONAL_INTEGRATION,
    /** No protection: the integrator keeps integrating while the output is clamped (to show windup). */
    NONE
}
