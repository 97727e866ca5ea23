package org.spectralsieve.weighting;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * One computed figure: a value with its unit, whether it is exact or only a bound, and a note that says
 * how it was obtained or, when there is no value, why not.
 *
 * <p>A bounded figure (points below the detection limit) may also carry its {@link #otherEnd()}: the same
 * figure with those points at 0 instead of at their limit. The true figure lies between the two, so
 * answers state both ends, never a one-sided sign that another answer contradicts (see
 * {@link FigureText#ends}). {@link #outsideShare()} is the share of the weighted power the figure left
 * out because it lay outside the curve's or the response's range (0 when nothing was left out).
 */
public record Figure(String name, OptionalDouble value, String unit, Bound bound, String note,
                     OptionalDouble otherEnd, double outsideShare) {

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
        Objects.requireNonNull(otherEnd, "otherEnd");
        if (value.isPresent() && Double.isNaN(value.getAsDouble())) {
            throw new IllegalArgumentException("figure '" + name + "' value is NaN");
        }
        if (otherEnd.isPresent() && (bound == Bound.VALUE || Double.isNaN(otherEnd.getAsDouble()))) {
            throw new IllegalArgumentException("figure '" + name + "': only a bounded figure has another end, and"
                    + " it must be a number");
        }
        if (!(outsideShare >= 0 && outsideShare <= 1)) {
            throw new IllegalArgumentException("figure '" + name + "' outside share " + outsideShare
                    + " must lie in 0..1");
        }
    }

    public Figure(String name, OptionalDouble value, String unit, Bound bound, String note) {
        this(name, value, unit, bound, note, OptionalDouble.empty(), 0);
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

    /** This figure with the other end of its bounded span (ignored for an unbounded figure). */
    public Figure withOtherEnd(double end) {
        return bound == Bound.VALUE || Double.isNaN(end) ? this
                : new Figure(name, value, unit, bound, note, OptionalDouble.of(end), outsideShare);
    }

    /** This figure with the share of the weighted power it left out. */
    public Figure withOutsideShare(double share) {
        return new Figure(name, value, unit, bound, note, otherEnd, share);
    }

    /** This figure with a new value, bound and note, keeping the rest (used by {@link StatedLimits}). */
    Figure restated(double newValue, Bound newBound, String newNote, OptionalDouble newOtherEnd) {
        return new Figure(name, OptionalDouble.of(newValue), unit, newBound, newNote, newOtherEnd, outsideShare);
    }
}
