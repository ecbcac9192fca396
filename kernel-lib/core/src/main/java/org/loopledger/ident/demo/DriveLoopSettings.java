package org.loopledger.ident.demo;

/**
 * The synthetic drive's velocity loop and measurement chain (SYNTHETIC, invented numbers):
 * velocity PI i<sub>cmd</sub> = K<sub>p</sub>·e + K<sub>p</sub>ω<sub>i</sub>·∫e (backward-Euler integral) on the
 * velocity error after a first-order low-pass on the measured velocity, the PRBS added to the current
 * command, one sample of computation delay before the current is applied, an ideal current loop with a
 * current limit, and one sample of delay in the velocity (and position) measurement.
 *
 * @param sampleRateHz            drive control rate
 * @param velocityGainAsPerRad    K<sub>p</sub>, A per rad/s
 * @param integralCornerHz        ω<sub>i</sub>/2π of the PI
 * @param feedbackFilterHz        corner of the velocity-feedback low-pass (discrete pole e<sup>-2πf/fs</sup>)
 * @param currentLimitA           the command is clipped to ±this
 * @param prbsOrder               O.150 order of the injected PRBS
 * @param prbsSamplesPerBit       bit-rate divider
 * @param prbsAmplitudeA          PRBS level, A
 * @param prbsPeriods             periods recorded
 * @param torqueNoiseA            RMS of the white torque disturbance, as a current (A)
 * @param velocityNoiseRadPerS    RMS of the white velocity measurement noise
 * @param currentNoiseA           RMS of the white current measurement noise
 * @param encoderCountsPerRev     position quantisation
 */
public record DriveLoopSettings(double sampleRateHz, double velocityGainAsPerRad, double integralCornerHz, double feedbackFilterHz,
                                double currentLimitA, int prbsOrder, int prbsSamplesPerBit, double prbsAmplitudeA, int prbsPeriods,
                                double torqueNoiseA, double velocityNoiseRadPerS, double currentNoiseA, int encoderCountsPerRev) {

    /** The demo's settings: 16 kHz, PI tuned for about 50 Hz on the empty carriage, PRBS11 with divider 2 at 1 A, 10 periods. */
    public static DriveLoopSettings demo() {
        return new DriveLoopSettings(16_000, 0.17, 10, 600, 10, 11, 2, 1.0, 10, 0.05, 0.02, 0.005, 1 << 20);
    }

    public double sampleTimeS() { return 1 / sampleRateHz; }

    /** The velocity-measurement delay, one sample. */
    public double measurementDelayS() { return 1 / sampleRateHz; }
}
