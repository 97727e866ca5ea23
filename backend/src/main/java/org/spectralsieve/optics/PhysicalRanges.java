package org.spectralsieve.optics;

/**
 * The ranges a stored number must lie in to describe a real window, sheet, film or coating. They are wide
 * on purpose: they refuse what cannot be a measurement (an index of 10¹⁶, a sheet 10³⁰⁸ mm thick) rather
 * than judge a design. Every write path checks them in the core records; a row stored before they existed
 * is read, flagged and left out of computations that need the bad number (docs/validation.md).
 */
public final class PhysicalRanges {

    /**
     * Real refractive index in air of anything that transmits in the UV, visible or near infrared. Below 1 is
     * not a dielectric window (metals and X-rays aside); the highest such windows stay well under 4 —
     * diamond about 2.4, rutile about 2.9 in the visible, gallium phosphide about 3.3, silicon and
     * germanium 3.4–4.0 where they transmit in the infrared (handbook values, from memory).
     */
    public static final double MIN_INDEX = 1.0;
    public static final double MAX_INDEX = 4.0;

    /**
     * Sample and stock thickness: 1 µm (the thinnest free-standing films; thinner layers are coatings on a
     * carrier, recorded with it) to 1000 mm (one metre; the requirement language's own limit, thicker is a
     * typing slip for any sheet, window or film). Common practice, no source.
     */
    public static final double MIN_THICKNESS_MM = 0.001;
    public static final double MAX_THICKNESS_MM = 1000;

    /**
     * A wavelength a stored curve, index table or validity range may hold: 100 nm (the vacuum-UV edge, the
     * requirement language's lower limit) to 25 000 nm (25 µm, the far end of common mid-infrared
     * transmission scans, from memory), so that a UV-visible-infrared scan is stored whole.
     */
    public static final double MIN_WAVELENGTH_NM = 100;
    public static final double MAX_WAVELENGTH_NM = 25_000;

    private PhysicalRanges() {
    }

    public static boolean isIndex(double n) {
        return n >= MIN_INDEX && n <= MAX_INDEX;
    }

    public static boolean isThicknessMm(double mm) {
        return mm >= MIN_THICKNESS_MM && mm <= MAX_THICKNESS_MM;
    }

    public static boolean isWavelengthNm(double nm) {
        return nm >= MIN_WAVELENGTH_NM && nm <= MAX_WAVELENGTH_NM;
    }

    /** @throws IllegalArgumentException naming {@code what} and the range */
    public static double requireThicknessMm(String what, double mm) {
        if (!isThicknessMm(mm)) {
            throw new IllegalArgumentException(what + " must be from " + MIN_THICKNESS_MM + " mm (1 µm) to "
                    + plain(MAX_THICKNESS_MM) + " mm, was " + mm);
        }
        return mm;
    }

    /** @throws IllegalArgumentException naming {@code what} and the range */
    public static double requireWavelengthNm(String what, double nm) {
        if (!isWavelengthNm(nm)) {
            throw new IllegalArgumentException(what + " must be from " + plain(MIN_WAVELENGTH_NM) + " to "
                    + plain(MAX_WAVELENGTH_NM) + " nm, was " + nm);
        }
        return nm;
    }

    /** @throws IllegalArgumentException naming {@code what} and the range */
    public static double requireIndex(String what, double n) {
        if (!isIndex(n)) {
            throw new IllegalArgumentException(what + " must be from " + MIN_INDEX + " to " + MAX_INDEX + ", was " + n);
        }
        return n;
    }

    static String plain(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
    }
}
