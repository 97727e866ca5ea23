package org.spectralsieve.states;

import java.util.Objects;

/**
 * How much light an aged curve had seen: either {@code hours} under a named source ({@code source} free text, may be
 * empty), or a radiant exposure {@code doseJPerCm2} at {@code doseNm}. Exactly one of the two forms is set; the
 * other's numbers are NaN. Amounts of the two forms are never compared with each other: hours under an unstated
 * irradiance say nothing about J/cm².
 */
public record Exposure(double hours, String source, double doseJPerCm2, double doseNm) {

    /** The most hours a curve may state: over a century of continuous running, past any real test. */
    public static final double MAX_HOURS = 1_000_000;
    /** The largest dose a curve may state, in J/cm². */
    public static final double MAX_DOSE_J_PER_CM2 = 1_000_000;

    public Exposure {
        source = Objects.requireNonNullElse(source, "").strip();
        boolean byHours = !Double.isNaN(hours);
        boolean byDose = !Double.isNaN(doseJPerCm2);
        if (byHours == byDose) {
            throw new IllegalArgumentException("an exposure is stated either in hours or as a dose in J/cm² at a"
                    + " wavelength, not " + (byHours ? "both" : "neither"));
        }
        if (byHours && !(hours > 0 && hours <= MAX_HOURS)) {
            throw new IllegalArgumentException("exposure hours must lie above 0 and at most " + (long) MAX_HOURS
                    + ", got " + hours);
        }
        if (byDose && !(doseJPerCm2 > 0 && doseJPerCm2 <= MAX_DOSE_J_PER_CM2)) {
            throw new IllegalArgumentException("an exposure dose must lie above 0 and at most "
                    + (long) MAX_DOSE_J_PER_CM2 + " J/cm², got " + doseJPerCm2);
        }
        if (byDose && !(doseNm >= 100 && doseNm <= 3000)) {
            throw new IllegalArgumentException("a dose needs the wavelength it was given at, 100 to 3000 nm, got "
                    + doseNm);
        }
        if (byHours && !Double.isNaN(doseNm)) {
            throw new IllegalArgumentException("a wavelength belongs to a dose, not to hours under a source");
        }
    }

    public static Exposure hours(double hours, String source) {
        return new Exposure(hours, source, Double.NaN, Double.NaN);
    }

    public static Exposure dose(double jPerCm2, double nm) {
        return new Exposure(Double.NaN, "", jPerCm2, nm);
    }

    public boolean inHours() {
        return !Double.isNaN(hours);
    }

    /** Hours, or J/cm²: the amount in the exposure's own unit. */
    public double amount() {
        return inHours() ? hours : doseJPerCm2;
    }

    /** Whether two exposures are on one scale, so their amounts can be ordered: hours with hours under the same source, or doses at the same wavelength. */
    public boolean sameScale(Exposure other) {
        if (inHours() != other.inHours()) {
            return false;
        }
        return inHours() ? source.equalsIgnoreCase(other.source) : doseNm == other.doseNm;
    }

    /** "2000 h under lamp bank A", "50 J/cm² at 365 nm". */
    public String describe() {
        if (inHours()) {
            return number(hours) + " h" + (source.isEmpty() ? "" : " under " + source);
        }
        return number(doseJPerCm2) + " J/cm² at " + number(doseNm) + " nm";
    }

    static String number(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
    }
}
