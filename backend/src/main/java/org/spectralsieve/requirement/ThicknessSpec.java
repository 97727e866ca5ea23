package org.spectralsieve.requirement;

/**
 * What the requirement says about thickness: nothing (each sample as measured), one thickness to build
 * ("at 3 mm"), or a range within which thickness is a design variable ("thickness 1 to 6 mm").
 */
public record ThicknessSpec(Kind kind, double minMm, double maxMm) {

    public enum Kind { AS_MEASURED, FIXED, RANGE }

    public static final ThicknessSpec AS_MEASURED = new ThicknessSpec(Kind.AS_MEASURED, Double.NaN, Double.NaN);

    public ThicknessSpec {
        if (kind == null) {
            throw new IllegalArgumentException("thickness kind must be given");
        }
        if (kind != Kind.AS_MEASURED) {
            if (!(minMm > 0) || !(maxMm >= minMm) || !Double.isFinite(maxMm)) {
                throw new IllegalArgumentException("thickness must be positive and the range ordered, got " + minMm + " to " + maxMm + " mm");
            }
            if (kind == Kind.FIXED && minMm != maxMm) {
                throw new IllegalArgumentException("a fixed thickness has one value, got " + minMm + " and " + maxMm);
            }
        }
    }

    public static ThicknessSpec at(double mm) {
        return new ThicknessSpec(Kind.FIXED, mm, mm);
    }

    public static ThicknessSpec range(double minMm, double maxMm) {
        return new ThicknessSpec(Kind.RANGE, minMm, maxMm);
    }
}
