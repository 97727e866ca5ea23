package org.spectralsieve.requirement;

/**
 * The one rule for "is this part that thickness": a measured thickness names the asked one when it lies
 * within {@link #RELATIVE} of it or within {@link #ABSOLUTE_MM}, whichever is larger. So a coated glass
 * measured at 4.005 mm is "4 mm" and a 2.013 mm quartz slide is "2 mm", while a 0.025 mm film is not a
 * 0.03 mm one. Used for candidates and for a requirement's fixed layer alike.
 *
 * <p>Why these numbers: sheet and glass stock is sold by nominal thickness with tolerances of several
 * per cent (common practice, no source: float glass of 4 mm is about ±0.2 mm), so 2 % never joins two
 * neighbouring stock sizes, and it changes a Beer–Lambert absorbance by at most 2 %; the 0.002 mm floor is
 * two steps of an ordinary 0.001 mm micrometer, the smallest difference a recorded film thickness can show.
 */
public final class NominalThickness {

    public static final double RELATIVE = 0.02;
    public static final double ABSOLUTE_MM = 0.002;

    private NominalThickness() {
    }

    /** How far a measured thickness may lie from {@code askedMm} and still be that thickness. */
    public static double toleranceMm(double askedMm) {
        return Math.max(ABSOLUTE_MM, RELATIVE * askedMm);
    }

    /** Whether a part measured at {@code measuredMm} is the asked {@code askedMm} part. */
    public static boolean same(double measuredMm, double askedMm) {
        return Math.abs(measuredMm - askedMm) <= toleranceMm(askedMm);
    }

    /** Whether {@code measuredMm} lies in [min, max], each end widened by the tolerance. */
    public static boolean within(double measuredMm, double minMm, double maxMm) {
        return measuredMm >= minMm - toleranceMm(minMm) && measuredMm <= maxMm + toleranceMm(maxMm);
    }
}
