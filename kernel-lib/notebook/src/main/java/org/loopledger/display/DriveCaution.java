package org.loopledger.display;

/** The one-line caution printed with every number a user would type into a drive (gains, filter coefficients). */
public final class DriveCaution {
    /** These numbers go into a drive that moves real machinery. */
    public static final String TEXT = "Try new gains first with reduced current and speed limits, with guarding and an emergency stop in place.";

    private DriveCaution() {}
}
