package org.spectralsieve.weighting;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** The named emitters a user can pick without importing a spectrum. */
public final class EmitterCatalogue {

    /**
     * UV LEDs of 10-15 nm FWHM are common practice (no source); 12 nm is taken for all four. The mercury
     * line strengths (254 nm dominant, the others a few per cent) are illustrative, not a measured lamp.
     */
    private static final List<Emitter> ALL = List.of(
            Emitter.led("led-365", 365, 12),
            Emitter.led("led-385", 385, 12),
            Emitter.led("led-395", 395, 12),
            Emitter.led("led-405", 405, 12),
            Emitter.mercury("mercury-low-pressure", 1.0, 0.02, 0.03, 0.04),
            Emitter.uvaTube(),
            Emitter.illuminantA(),
            Emitter.d65(),
            Emitter.flat());

    private EmitterCatalogue() {
    }

    public static List<Emitter> all() {
        return ALL;
    }

    /** The parametric name forms {@link #parametric} reads, as told to a user who named an unknown emitter. */
    public static final String PARAMETRIC_FORMS = "led-<peak nm>-<FWHM nm>, "
            + "led-<peak>-<FWHM short side>-<FWHM long side>, blackbody-<K>k, "
            + "mercury-<s253.7>-<s365>-<s404.7>-<s435.8> (relative line strengths)";

    private static final String NUMBER = "(\\d+(?:\\.\\d+)?)";
    private static final Pattern LED = Pattern.compile("led " + NUMBER + " " + NUMBER + "(?: " + NUMBER + ")?");
    private static final Pattern BLACKBODY = Pattern.compile("blackbody " + NUMBER + " ?k");
    private static final Pattern MERCURY = Pattern.compile("mercury " + NUMBER + " " + NUMBER + " " + NUMBER + " " + NUMBER);
    private static final Pattern LETTER_DIGIT = Pattern.compile("(?<=\\p{L})(?=\\p{N})|(?<=\\p{N})(?=\\p{L})");
    private static final Pattern SEPARATORS = Pattern.compile("[^\\p{L}\\p{N}.]+");

    /** LED peaks and widths, blackbody temperatures a parametric name may ask for; outside: not a name. */
    static final double MIN_PEAK_NM = 200;
    static final double MAX_PEAK_NM = 1100;
    static final double MIN_FWHM_NM = 1;
    static final double MAX_FWHM_NM = 200;
    static final double MIN_TEMPERATURE_K = 500;
    static final double MAX_TEMPERATURE_K = 50000;

    /**
     * An emitter described by its name: {@code led-370-20} (Gaussian, peak 370 nm, FWHM 20 nm; the width is
     * required, so that "led-356" stays a typing slip for the catalogue's led-365 rather than a new LED), {@code led-370-10-16} (asymmetric: 10 nm FWHM on the short side, 16 nm
     * on the long side), {@code blackbody-3000k}, {@code mercury-1-0.5-0.2-0.1} (strengths of the 253.7,
     * 365.0, 404.7 and 435.8 nm lines). Case, and whether words are joined by "-" or blanks, do not matter
     * ("LED 370 20"). The emitter is named in the canonical form ({@code led-370-20}). Empty for anything
     * else, or for numbers outside the ranges above (a 5 nm "LED peak" is a typing slip, not a source).
     */
    public static Optional<Emitter> parametric(String name) {
        String key = key(name == null ? "" : name);
        Matcher m = LED.matcher(key);
        if (m.matches()) {
            double peak = Double.parseDouble(m.group(1));
            double shortSide = Double.parseDouble(m.group(2));
            double longSide = m.group(3) == null ? shortSide : Double.parseDouble(m.group(3));
            if (!within(peak, MIN_PEAK_NM, MAX_PEAK_NM) || !within(shortSide, MIN_FWHM_NM, MAX_FWHM_NM)
                    || !within(longSide, MIN_FWHM_NM, MAX_FWHM_NM)) {
                return Optional.empty();
            }
            String canonical = key.replace(' ', '-');
            return Optional.of(m.group(3) == null ? Emitter.led(canonical, peak, shortSide)
                    : Emitter.ledAsymmetric(canonical, peak, shortSide, longSide));
        }
        m = BLACKBODY.matcher(key);
        if (m.matches()) {
            double kelvin = Double.parseDouble(m.group(1));
            return within(kelvin, MIN_TEMPERATURE_K, MAX_TEMPERATURE_K)
                    ? Optional.of(Emitter.blackbody("blackbody-" + m.group(1) + "k", kelvin)) : Optional.empty();
        }
        m = MERCURY.matcher(key);
        if (m.matches()) {
            double[] s = new double[4];
            for (int i = 0; i < 4; i++) {
                s[i] = Double.parseDouble(m.group(i + 1));
            }
            if (s[0] + s[1] + s[2] + s[3] <= 0) {
                return Optional.empty();
            }
            return Optional.of(Emitter.mercury(key.replace(' ', '-'), s[0], s[1], s[2], s[3]));
        }
        return Optional.empty();
    }

    /** "LED-370" → "led 370"; dots stay, they belong to numbers. */
    private static String key(String name) {
        String spaced = LETTER_DIGIT.matcher(name.toLowerCase(Locale.ROOT)).replaceAll(" ");
        return SEPARATORS.matcher(spaced).replaceAll(" ").strip();
    }

    private static boolean within(double v, double min, double max) {
        return v >= min && v <= max;
    }

    /** Looks an emitter up by name, ignoring case. */
    public static Optional<Emitter> named(String name) {
        String key = name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
        return ALL.stream().filter(e -> e.name().equals(key)).findFirst();
    }
}
