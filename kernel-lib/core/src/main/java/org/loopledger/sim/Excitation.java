package org.loopledger.sim;

import org.loopledger.lti.Motion;

/** What drives a simulated response. */
public enum Excitation {
    /** Position reference step, both loops closed; reference and following error in rad. */
    POSITION_STEP("position step", "rad"),
    /** Position reference ramp r = rate·t, both loops closed; reference and following error in rad. */
    POSITION_RAMP("position ramp", "rad"),
    /** Velocity command step with the position loop open; reference and following error in rad/s. */
    VELOCITY_STEP("velocity step", "rad/s"),
    /** Torque-disturbance step at the plant input (plant-input units, e.g. A), reference 0, both loops closed. */
    TORQUE_DISTURBANCE_STEP("torque-disturbance step", "rad");

    private final String label;
    private final String errorUnit;

    Excitation(String label, String errorUnit) {
        this.label = label;
        this.errorUnit = errorUnit;
    }

    public String label() { return label; }

    /** Unit of the reference and of the following error on a rotary axis. */
    public String errorUnit() { return errorUnit; }

    /** Unit of the reference and of the following error: rad, rad/s on a rotary axis, m, m/s on a linear one. */
    public String errorUnit(Motion motion) {
        return this == VELOCITY_STEP ? motion.velocityUnit() : motion.positionUnit();
    }

    /** The label, with "force" for "torque" on a linear axis. */
    public String label(Motion motion) {
        return this == TORQUE_DISTURBANCE_STEP ? motion.forceName() + "-disturbance step" : label;
    }
}
