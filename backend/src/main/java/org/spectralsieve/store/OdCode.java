package org.spectralsieve.store;

/**
 * Optical density packed into 16 bits: the low 15 bits hold OD in steps of {@link #STEP} decades
 * (0 to 6.5532), the top bit marks the value as an upper bound on T (a lower bound on OD). One code,
 * {@link #NOT_MEASURED}, marks grid points outside the curve's measured range.
 *
 * <p>Why OD and not T: requirement thresholds and margins are ratios, i.e. differences in OD, so a
 * uniform OD step gives the same relative precision (0.046 % of T) at 90 % and at 0.001 %.
 */
public final class OdCode {

    /** Decades per code step. */
    public static final double STEP = 2e-4;
    /** Largest OD a code holds; anything denser is stored as a bound at this OD. */
    public static final int MAX_LEVEL = 0x7FFE;
    public static final short NOT_MEASURED = (short) 0xFFFF;
    static final int BOUND_BIT = 0x8000;
    static final int LEVEL_MASK = 0x7FFF;

    private static final double[] TRANSMITTANCE_OF_LEVEL = new double[MAX_LEVEL + 1];

    static {
        for (int level = 0; level <= MAX_LEVEL; level++) {
            TRANSMITTANCE_OF_LEVEL[level] = Math.pow(10, -level * STEP);
        }
    }

    private OdCode() {
    }

    /** Encodes a transmittance; T above 1 (measurement noise) is stored as OD 0. */
    public static short encode(double transmittance, boolean upperBound) {
        double od = transmittance <= 0 ? Double.POSITIVE_INFINITY : -Math.log10(transmittance);
        long level = Math.round(Math.max(0, od) / STEP);
        boolean bound = upperBound;
        if (level > MAX_LEVEL) {
            level = MAX_LEVEL;
            bound = true; // denser than the code can say: all we keep is "at least this OD"
        }
        return (short) (level | (bound ? BOUND_BIT : 0));
    }

    public static boolean isMeasured(short code) {
        return code != NOT_MEASURED;
    }

    public static boolean isBound(short code) {
        return (code & BOUND_BIT) != 0;
    }

    /** OD level in steps of {@link #STEP}. */
    public static int level(short code) {
        return code & LEVEL_MASK;
    }

    public static double opticalDensity(short code) {
        return level(code) * STEP;
    }

    public static double transmittance(short code) {
        return TRANSMITTANCE_OF_LEVEL[level(code)];
    }

    /** The threshold T as a level, rounded so that comparing levels agrees with comparing T. */
    public static double levelOf(double transmittance) {
        return -Math.log10(transmittance) / STEP;
    }
}
