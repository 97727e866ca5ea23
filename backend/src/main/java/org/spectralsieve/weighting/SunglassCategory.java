package org.spectralsieve.weighting;

import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.weighting.Figure.Bound;

/**
 * The sunglare-filter category of ISO 12312-1:2013 that a luminous transmittance τv falls in (ranges as
 * quoted by the College of Optometrists' guidance; reference sheet §5). Each range is open below and
 * closed above: τv = 80 % exactly is category 1, 43 % is 2, 18 % is 3, 8 % is 4, and 3 % or less is in
 * no category. A τv above 100 % (noise on a clear sample) counts as category 0.
 *
 * <p>Only τv decides here; the standard's further rules (UV limits, signal-light quotients, the driving
 * restrictions) are not checked. A screening estimate from a stored curve, not a certification.
 */
public enum SunglassCategory {
    CATEGORY_0(0, "clear or very light tint", 0.80, 1.00),
    CATEGORY_1(1, "light tint", 0.43, 0.80),
    CATEGORY_2(2, "medium tint", 0.18, 0.43),
    CATEGORY_3(3, "dark tint", 0.08, 0.18),
    CATEGORY_4(4, "very dark tint", 0.03, 0.08);

    public static final String STANDARD = "ISO 12312-1:2013";

    /**
     * A τv less than this above a boundary counts as on it, so that a filter of exactly 80 % does not land
     * in category 0 through the last bits of a floating-point sum; far below any measurement's resolution.
     */
    private static final double ON_BOUNDARY = 1e-9;

    private final int number;
    private final String description;
    private final double aboveFraction;
    private final double upToFraction;

    SunglassCategory(int number, String description, double aboveFraction, double upToFraction) {
        this.number = number;
        this.description = description;
        this.aboveFraction = aboveFraction;
        this.upToFraction = upToFraction;
    }

    public int number() {
        return number;
    }

    public String description() {
        return description;
    }

    /** Lower end of the range, excluded. */
    public double aboveFraction() {
        return aboveFraction;
    }

    /** Upper end of the range, included. */
    public double upToFraction() {
        return upToFraction;
    }

    /** E.g. "ISO 12312-1:2013 category 1 (light tint): τv > 43 % to 80 %". */
    public String rangeText() {
        return STANDARD + " category " + number + " (" + description + "): τv > " + percent(aboveFraction)
                + " % to " + percent(upToFraction) + " %";
    }

    private static String percent(double fraction) {
        return String.valueOf(Math.round(fraction * 100));
    }

    /** The category of a τv given as a fraction; empty at or below 3 %. */
    public static Optional<SunglassCategory> of(double luminousTransmittance) {
        if (Double.isNaN(luminousTransmittance)) {
            throw new IllegalArgumentException("luminous transmittance is NaN");
        }
        for (SunglassCategory c : values()) {
            if (luminousTransmittance > c.aboveFraction + ON_BOUNDARY) {
                return Optional.of(c);
            }
        }
        return Optional.empty();
    }

    /**
     * The category of a computed τv. When τv is only an upper bound, the true category is this one or a
     * darker one, which {@link Rating#bound()} {@code AT_LEAST} says (on the category number).
     */
    public static Rating rate(Figure luminousTransmittance) {
        Objects.requireNonNull(luminousTransmittance, "luminousTransmittance");
        if (!luminousTransmittance.available()) {
            return new Rating(Optional.empty(), Bound.VALUE, "no luminous transmittance: "
                    + luminousTransmittance.note());
        }
        double tv = luminousTransmittance.value().getAsDouble();
        Optional<SunglassCategory> category = of(tv);
        boolean upper = luminousTransmittance.bound() == Bound.AT_MOST;
        String note = String.format(Locale.ROOT, "τv = %.2f %%", 100 * tv) + "; "
                + category.map(SunglassCategory::rangeText)
                        .orElse("at or below 3 %: darker than the five " + STANDARD + " categories")
                + "; ranges open below, closed above (80 % is category 1); τv alone decides here, the standard's"
                + " UV and signal-light rules are not checked; a screening estimate, not a certification";
        if (upper) {
            note += "; τv is an upper bound (points below the detection limit), so the filter is in this"
                    + " category or a darker one";
        }
        return new Rating(category, upper ? Bound.AT_LEAST : Bound.VALUE, note);
    }

    /** A category (empty when τv is unknown or at most 3 %), how sure it is, and how it was reached. */
    public record Rating(Optional<SunglassCategory> category, Bound bound, String note) {

        public Rating {
            Objects.requireNonNull(category, "category");
            Objects.requireNonNull(bound, "bound");
            Objects.requireNonNull(note, "note");
        }
    }
}
