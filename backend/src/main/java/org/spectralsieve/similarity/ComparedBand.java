package org.spectralsieve.similarity;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The wavelength band two curves are compared over, nm: only the similarity grid's points inside it
 * ({@code fromNm ≤ λ ≤ toNm}) count. Lies inside the grid ({@link CurveSignature#FROM_NM}–{@link CurveSignature#TO_NM})
 * and holds at least {@link SimilarCurves#MIN_COMMON_POINTS} grid points: a narrower band cannot tell one
 * shape from another, so it is refused rather than answered with a ranking that means nothing.
 */
public record ComparedBand(double fromNm, double toNm) {

    /** The whole grid: what a comparison without a band uses. */
    public static final ComparedBand WHOLE_GRID = new ComparedBand(CurveSignature.FROM_NM, CurveSignature.TO_NM);

    /** "300-400", "300–400", "300 - 400 nm", decimals allowed. */
    private static final Pattern TEXT = Pattern.compile(
            "\\s*(\\d+(?:\\.\\d+)?)\\s*(?:-|–|to)\\s*(\\d+(?:\\.\\d+)?)\\s*(?:nm)?\\s*", Pattern.CASE_INSENSITIVE);

    public ComparedBand {
        if (!Double.isFinite(fromNm) || !Double.isFinite(toNm)) {
            throw new IllegalArgumentException("the band's ends must be numbers of nm");
        }
        if (!(fromNm < toNm)) {
            throw new IllegalArgumentException("the band must run from a shorter to a longer wavelength, got "
                    + nm(fromNm) + "–" + nm(toNm) + " nm");
        }
        if (fromNm < CurveSignature.FROM_NM || toNm > CurveSignature.TO_NM) {
            throw new IllegalArgumentException("the band must lie inside the compared grid, " + nm(CurveSignature.FROM_NM)
                    + "–" + nm(CurveSignature.TO_NM) + " nm, got " + nm(fromNm) + "–" + nm(toNm) + " nm");
        }
        int points = countGridPoints(fromNm, toNm);
        if (points < SimilarCurves.MIN_COMMON_POINTS) {
            throw new IllegalArgumentException("the band " + nm(fromNm) + "–" + nm(toNm) + " nm holds " + points
                    + " grid points (every " + nm(CurveSignature.STEP_NM) + " nm); at least "
                    + SimilarCurves.MIN_COMMON_POINTS + " are needed, a band of "
                    + nm((SimilarCurves.MIN_COMMON_POINTS - 1) * CurveSignature.STEP_NM) + " nm or more");
        }
    }

    /**
     * Reads {@code FROM-TO} in nm ("300-400"; an en dash, "to" and a trailing "nm" are read too).
     *
     * @throws IllegalArgumentException naming what is wrong, for the caller to attach to its parameter
     */
    public static ComparedBand parse(String text) {
        Matcher m = TEXT.matcher(text == null ? "" : text);
        if (!m.matches()) {
            throw new IllegalArgumentException("must be FROM-TO in nm, e.g. 300-400, got '" + text + "'");
        }
        return new ComparedBand(Double.parseDouble(m.group(1)), Double.parseDouble(m.group(2)));
    }

    /** Whether grid point i lies inside the band. */
    public boolean holds(int i) {
        double nm = CurveSignature.wavelengthNm(i);
        return nm >= fromNm && nm <= toNm;
    }

    /** How many grid points lie inside the band. */
    public int gridPoints() {
        return countGridPoints(fromNm, toNm);
    }

    public boolean wholeGrid() {
        return fromNm <= CurveSignature.FROM_NM && toNm >= CurveSignature.TO_NM;
    }

    private static int countGridPoints(double fromNm, double toNm) {
        int n = 0;
        for (int i = 0; i < CurveSignature.DIMENSION; i++) {
            double nm = CurveSignature.wavelengthNm(i);
            if (nm >= fromNm && nm <= toNm) {
                n++;
            }
        }
        return n;
    }

    private static String nm(double v) {
        return v == Math.rint(v) ? String.valueOf((long) v) : String.format(Locale.ROOT, "%s", v);
    }

    @Override
    public String toString() {
        return nm(fromNm) + "–" + nm(toNm) + " nm";
    }
}
