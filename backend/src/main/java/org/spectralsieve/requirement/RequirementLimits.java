package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.util.List;
import java.util.regex.Pattern;

/**
 * The ranges a requirement's numbers must lie in, shared by the text parser and the JSON reader so that
 * whatever one accepts the other can express. The limits are wide on purpose: they catch slips such as
 * "3650 nm" or a percentage over 100 rather than judge designs.
 */
public final class RequirementLimits {

    /** UV-C to near infrared; below 100 nm is vacuum UV, which no window in this library is measured in. */
    public static final double MIN_WAVELENGTH_NM = 100;
    public static final double MAX_WAVELENGTH_NM = 3000;
    /** One metre: anything thicker is a typing slip for a sheet, window or film. */
    public static final double MAX_THICKNESS_MM = 1000;
    /** Spectrophotometers read to OD 6-8 at best; OD 10 leaves margin without admitting nonsense. */
    public static final double MAX_OPTICAL_DENSITY = 10;
    public static final List<String> GEOMETRIES = List.of("regular", "total", Requirement.ANY_GEOMETRY);
    /** Longest material phrase of a fixed layer: a slug or a few words of a material's name. */
    public static final int MAX_MATERIAL_WORDS_LENGTH = 80;
    /**
     * Longest requirement text read. The longest sensible requirement (several weighted and spectral
     * clauses, a thickness range, a class, a geometry and a fixed layer) is under 400 characters; 2000
     * leaves room for wordy phrasing while parsing stays a matter of microseconds.
     */
    public static final int MAX_TEXT_LENGTH = 2000;
    /**
     * Most clauses in one requirement. Every clause is judged on every candidate sample (and solved for
     * thickness), so the search's work grows with their number; a design brief rarely has more than ten.
     */
    public static final int MAX_CLAUSES = 24;

    private static final Pattern CLASS_LABEL = Pattern.compile("[a-z][a-z0-9 \\-]{0,38}[a-z0-9]");
    private static final Pattern MATERIAL_WORDS = Pattern.compile("[\\p{Ll}\\p{Lo}0-9][\\p{Ll}\\p{Lo}0-9 .\\-]*");
    private static final Pattern AND_WORD = Pattern.compile("(^|\\s)and(\\s|$)");

    private RequirementLimits() {
    }

    /** Refuses a text longer than {@link #MAX_TEXT_LENGTH} before anything reads it. */
    public static void checkTextLength(String text) {
        if (text != null && text.length() > MAX_TEXT_LENGTH) {
            throw new RequirementTooLargeException(RequirementTooLargeException.Measure.CHARACTERS, text.length(),
                    MAX_TEXT_LENGTH);
        }
    }

    /** Refuses more than {@link #MAX_CLAUSES} clauses, counted before they are read one by one. */
    public static void checkClauseCount(int clauses) {
        if (clauses > MAX_CLAUSES) {
            throw new RequirementTooLargeException(RequirementTooLargeException.Measure.CLAUSES, clauses, MAX_CLAUSES);
        }
    }

    public static boolean isWavelength(double nm) {
        return nm >= MIN_WAVELENGTH_NM && nm <= MAX_WAVELENGTH_NM;
    }

    public static boolean isThickness(double mm) {
        return mm > 0 && mm <= MAX_THICKNESS_MM;
    }

    public static boolean isThreshold(double t) {
        return t > 0 && t <= 1;
    }

    public static boolean isCutoffLevel(double t) {
        return t > 0 && t < 1;
    }

    public static boolean isOpticalDensity(double od) {
        return od > 0 && od <= MAX_OPTICAL_DENSITY;
    }

    /**
     * A stored class label the text language can also write: 2-40 lower-case letters, digits, spaces or
     * hyphens (as {@code library.MaterialClass}), and no word "and", which would end the label in text.
     */
    public static boolean isClassLabel(String label) {
        return label != null && CLASS_LABEL.matcher(label).matches() && !AND_WORD.matcher(label).find();
    }

    /**
     * The words naming a fixed layer's material as the text language writes them: lower-case letters,
     * digits, spaces, points and hyphens, starting with a letter or digit, at most
     * {@link #MAX_MATERIAL_WORDS_LENGTH} characters, single spaces, and no word "and" (which would end the
     * phrase in text).
     */
    public static boolean isMaterialWords(String words) {
        return words != null && words.length() <= MAX_MATERIAL_WORDS_LENGTH && MATERIAL_WORDS.matcher(words).matches()
                && !words.contains("  ") && words.equals(words.strip()) && !AND_WORD.matcher(words).find();
    }

    /**
     * Transmittance for an optical density, T = 10^-OD. Whole densities are converted exactly in decimal
     * so that "OD 3" gives the same double as "0.1%".
     */
    public static double transmittanceForDensity(BigDecimal od) {
        BigDecimal stripped = od.stripTrailingZeros();
        if (stripped.scale() <= 0 && stripped.compareTo(BigDecimal.valueOf(400)) < 0) {
            return BigDecimal.ONE.movePointLeft(stripped.intValueExact()).doubleValue();
        }
        return Math.pow(10, -od.doubleValue());
    }

    /** The optical density of a transmittance, OD = -log10 T. */
    public static double densityForTransmittance(double t) {
        return -Math.log10(t);
    }
}
