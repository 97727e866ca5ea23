package org.spectralsieve.weighting;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * One computed figure: a value with its unit, whether it is exact or only a bound, and a note that says
 * how it was obtained or, when there is no value, why not.
 */
public record Figure(String name, OptionalDouble value, String unit, Bound bound, String note) {

    /** How far the value can be trusted when stored points lay below the detection limit. */
    public enum Bound {
        /** Computed from values only. */
        VALUE,
        /** Some input was an upper bound, so the true figure is at most this. */
        AT_MOST,
        /** Some input was an upper bound on T, so the true figure is at least this. */
        AT_LEAST
    }

    public Figure {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(value, "value");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(bound, "bound");
        Objects.requireNonNull(note, "note");
        if (value.isPresent() && Double.isNaN(value.getAsDouble())) {
            throw new IllegalArgumentException("figure '" + name + "' value is NaN");
        }
    }

    public static Figure of(String name, double value, String unit, Bound bound, String note) {
        return new Figure(name, OptionalDouble.of(value), unit, bound, note);
    }

    public static Figure unavailable(String name, String unit, String reason) {
        return new Figure(name, OptionalDouble.empty(), unit, Bound.VALUE, reason);
    }

    public boolean available() {
        return value.isPresent();
    }
}
