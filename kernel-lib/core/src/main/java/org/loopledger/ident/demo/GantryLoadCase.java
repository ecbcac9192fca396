package org.loopledger.ident.demo;

/**
 * The three load cases of the synthetic gantry's X axis (SYNTHETIC, invented numbers): empty carriage,
 * light marking head, heavy marking head. The axis parameters other than the moving mass are shared.
 */
public enum GantryLoadCase {
    EMPTY_CARRIAGE("gantry-x-empty.csv", 12.0, 0xA11CE001L),
    LIGHT_HEAD("gantry-x-light-head.csv", 18.0, 0xA11CE002L),
    HEAVY_HEAD("gantry-x-heavy-head.csv", 32.0, 0xA11CE003L);

    /** Motor torque constant, N·m/A (invented). */
    public static final double TORQUE_CONSTANT_NM_PER_A = 0.45;
    /** Rotor plus coupling hub inertia, kg·m² (invented). */
    public static final double MOTOR_INERTIA_KG_M2 = 1.6e-4;
    /** Ball screw inertia, kg·m² (invented). */
    public static final double SCREW_INERTIA_KG_M2 = 5.0e-5;
    /** Screw lead, m per revolution (10 mm, invented). */
    public static final double LEAD_M = 0.010;
    /** Torsional stiffness of coupling and screw, N·m/rad (invented). */
    public static final double STIFFNESS_NM_PER_RAD = 285.0;
    /** Coupling damping, N·m·s/rad (invented). */
    public static final double DAMPING_NMS_PER_RAD = 0.00908;
    /** Motor-side viscous friction, N·m·s/rad (invented). */
    public static final double VISCOUS_NMS_PER_RAD = 0.002;

    private final String fileName;
    private final double movingMassKg;
    private final long seed;

    GantryLoadCase(String fileName, double movingMassKg, long seed) {
        this.fileName = fileName;
        this.movingMassKg = movingMassKg;
        this.seed = seed;
    }

    public String fileName() { return fileName; }

    public double movingMassKg() { return movingMassKg; }

    /** Seed of this case's noise generator (fixed, so the dataset is reproducible). */
    public long seed() { return seed; }

    public GantryAxis axis() {
        return new GantryAxis(TORQUE_CONSTANT_NM_PER_A, MOTOR_INERTIA_KG_M2, SCREW_INERTIA_KG_M2, LEAD_M, movingMassKg,
                STIFFNESS_NM_PER_RAD, DAMPING_NMS_PER_RAD, VISCOUS_NMS_PER_RAD);
    }
}
