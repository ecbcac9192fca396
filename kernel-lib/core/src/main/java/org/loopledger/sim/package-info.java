/**
 * Time responses: {@link org.loopledger.sim.ServoSimulation} runs the drive's discrete PIV controller on a
 * continuous plant model (position or velocity step, ramp, torque-disturbance step, with a current limit and
 * {@link org.loopledger.sim.AntiWindup}) into a {@link org.loopledger.sim.TimeResponse};
 * {@link org.loopledger.sim.ResponseMetrics} and {@link org.loopledger.sim.StepMetrics} read its figures;
 * {@link org.loopledger.sim.TimeSpec} checks them into a {@link org.loopledger.analysis.SpecReport}.
 * {@link org.loopledger.sim.LinearResponse} gives step, impulse and forced responses of any
 * {@link org.loopledger.lti.TransferFunction} as {@link org.loopledger.sim.TimeSeries}.
 *
 * <p><b>Units.</b> Time in s; position in rad (m on a linear axis), velocity in rad/s (m/s), current and disturbances
 * in plant-input units (e.g. A).
 */
package org.loopledger.sim;
