package org.loopledger.lti;

/**
 * Whether an axis turns or travels, and the one place that knows the unit strings that follow from it.
 * Inside the library every quantity stays in SI for its kind of motion: a rotary axis in rad, rad/s,
 * N·m, kg·m²; a linear axis (linear motor, belt, or a screw axis measured at the carriage) in m, m/s,
 * N, kg. The numbers are computed the same way; only names and units at the edges differ:
 *
 * <table>
 *   <caption>units by kind of motion</caption>
 *   <tr><th>quantity</th><th>rotary</th><th>linear</th></tr>
 *   <tr><td>position, velocity</td><td>rad, rad/s</td><td>m, m/s</td></tr>
 *   <tr><td>force</td><td>torque, N·m</td><td>force, N</td></tr>
 *   <tr><td>motor constant</td><td>torque constant, N·m/A</td><td>force constant, N/A</td></tr>
 *   <tr><td>moving inertia</td><td>inertia, kg·m²</td><td>mass, kg</td></tr>
 *   <tr><td>viscous friction</td><td>N·m·s/rad</td><td>N·s/m</td></tr>
 *   <tr><td>stiffness</td><td>N·m/rad</td><td>N/m</td></tr>
 *   <tr><td>velocity gain K<sub>v</sub></td><td>per rad/s</td><td>per m/s (and per mm/s)</td></tr>
 *   <tr><td>position gain K<sub>p</sub></td><td>1/s</td><td>1/s (and (m/min)/mm)</td></tr>
 * </table>
 *
 * Conventional linear-axis forms (common practice on machine tools): a position gain in (m/min)/mm is
 * K<sub>p</sub>·60/1000, a velocity gain per mm/s is K<sub>v</sub>/1000.
 */
public enum Motion {
    ROTARY("rad", "rad/s", "torque", "N·m", "torque constant", "N·m/A", "inertia", "kg·m²", "N·m·s/rad", "N·m/rad"),
    LINEAR("m", "m/s", "force", "N", "force constant", "N/A", "mass", "kg", "N·s/m", "N/m");

    private final String position, velocity, forceName, force, constantName, constant, inertiaName, inertia, damping, stiffness;

    Motion(String position, String velocity, String forceName, String force, String constantName, String constant, String inertiaName,
           String inertia, String damping, String stiffness) {
        this.position = position;
        this.velocity = velocity;
        this.forceName = forceName;
        this.force = force;
        this.constantName = constantName;
        this.constant = constant;
        this.inertiaName = inertiaName;
        this.inertia = inertia;
        this.damping = damping;
        this.stiffness = stiffness;
    }

    /** "rad" or "m". */
    public String positionUnit() { return position; }

    /** "rad/s" or "m/s". */
    public String velocityUnit() { return velocity; }

    /** "torque" or "force". */
    public String forceName() { return forceName; }

    /** "N·m" or "N". */
    public String forceUnit() { return force; }

    /** "torque constant" or "force constant". */
    public String motorConstantName() { return constantName; }

    /** "N·m/A" or "N/A". */
    public String motorConstantUnit() { return constant; }

    /** "inertia" or "mass". */
    public String inertiaName() { return inertiaName; }

    /** "kg·m²" or "kg". */
    public String inertiaUnit() { return inertia; }

    /** Unit of viscous friction: "N·m·s/rad" or "N·s/m". */
    public String dampingUnit() { return damping; }

    /** Unit of a stiffness: "N·m/rad" or "N/m". */
    public String stiffnessUnit() { return stiffness; }

    /** Unit of a velocity gain, output in plant-input units: "per rad/s" or "per m/s". */
    public String velocityGainUnit() { return "per " + velocity; }

    /** Symbol of the moving inertia in formulas: "J" or "m". */
    public String inertiaSymbol() { return this == ROTARY ? "J" : "m"; }

    /** A velocity gain per m/s expressed per mm/s (K<sub>v</sub>/1000); only meaningful for {@link #LINEAR}. */
    public static double perMmPerS(double velocityGainPerMPerS) { return velocityGainPerMPerS / 1000; }

    /** A position gain in 1/s expressed in (m/min)/mm (K<sub>p</sub>·60/1000, common practice). */
    public static double metresPerMinutePerMm(double positionGainPerS) { return positionGainPerS * 60 / 1000; }

    /**
     * The unit of a plant from {@code inputUnit} (e.g. "A") to position ({@code integrators} = 2), velocity (1)
     * or acceleration (0): "rad/A", "(rad/s)/A", "(rad/s²)/A" or "m/A", "(m/s)/A", "(m/s²)/A".
     */
    public String plantUnit(int integrators, String inputUnit) {
        String out = switch (integrators) {
            case 2 -> position;
            case 1 -> "(" + velocity + ")";
            case 0 -> "(" + velocity + "²)";
            default -> throw new IllegalArgumentException("a plant to position (2 integrators), velocity (1) or acceleration (0), got " + integrators);
        };
        return out + "/" + inputUnit;
    }

    /** "rotary" or "linear". */
    public String label() { return this == ROTARY ? "rotary" : "linear"; }
}
