package org.spectralsieve.weighting;

import java.util.Locale;
import java.util.OptionalDouble;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.Figure.Bound;

/**
 * The most a figure may claim: OD 12 (T = 10⁻¹², {@link Curve#ABSORBANCE_FLOOR_T}). No transmittance
 * measurement states less (the highest laser-eyewear scale number, LB10, states OD ≥ 10: reference sheet
 * §6, EN 207), and a smaller number only arises from rescaling a curve far beyond its thickness or from
 * multiplying detection limits; printed, it reads as precision (a "protection factor ≥ 2.86e29"). So a
 * transmittance below 10⁻¹² is stated as "at most 10⁻¹²", a factor above 10¹² as "at least 10¹²", an OD
 * above 12 as "at least 12", and the note says the figure was capped and what was computed. Both
 * statements stay true: the capped one is only weaker.
 */
public final class StatedLimits {

    /** Smallest transmittance a figure states: OD 12. */
    public static final double MIN_STATED_T = Curve.ABSORBANCE_FLOOR_T;
    /** Largest protection factor a figure states: 1 / {@link #MIN_STATED_T}. */
    public static final double MAX_STATED_FACTOR = 1 / MIN_STATED_T;
    /** Largest optical density a figure states. */
    public static final double MAX_STATED_OD = -Math.log10(MIN_STATED_T);

    private static final String WHY = "no transmittance measurement states more than OD 12";

    private StatedLimits() {
    }

    /** A transmittance-type figure (unit "fraction"), capped below at OD 12. */
    public static Figure transmittance(Figure f) {
        if (!f.available()) {
            return f;
        }
        double v = f.value().getAsDouble();
        OptionalDouble other = f.otherEnd();
        if (other.isPresent() && other.getAsDouble() < MIN_STATED_T) {
            // "between 0 and U" is the same statement without a number no instrument can give
            other = OptionalDouble.of(0);
        }
        if (v >= MIN_STATED_T) {
            return other.equals(f.otherEnd()) ? f : f.restated(v, f.bound(), f.note(), other);
        }
        return f.restated(MIN_STATED_T, Bound.AT_MOST, f.note() + "; capped: computed " + number(v)
                + ", stated as at most 1e-12 (OD 12), since " + WHY, OptionalDouble.empty());
    }

    /** A protection factor or UPF (1 / transmittance), capped above at 10¹². */
    public static Figure factor(Figure f) {
        if (!f.available()) {
            return f;
        }
        double v = f.value().getAsDouble();
        OptionalDouble other = f.otherEnd();
        if (other.isPresent() && !(other.getAsDouble() <= MAX_STATED_FACTOR)) {
            other = OptionalDouble.empty();
        }
        if (v <= MAX_STATED_FACTOR) {
            return other.equals(f.otherEnd()) ? f : f.restated(v, f.bound(), f.note(), other);
        }
        return f.restated(MAX_STATED_FACTOR, Bound.AT_LEAST, f.note() + "; capped: computed " + number(v)
                + ", stated as at least 1e12 (OD 12), since " + WHY, OptionalDouble.empty());
    }

    /** An optical density: at T = 0 or below 10⁻¹² the OD is read as 12, which is then only a lower bound. */
    public static Figure opticalDensity(Figure f, double transmittance) {
        if (!f.available() || transmittance > MIN_STATED_T) {
            return f;
        }
        return f.restated(MAX_STATED_OD, Bound.AT_LEAST, f.note() + "; capped: T is "
                + (transmittance > 0 ? number(transmittance) : "0") + ", stated as OD at least 12, since " + WHY,
                OptionalDouble.empty());
    }

    private static String number(double v) {
        return String.format(Locale.ROOT, "%.3g", v);
    }
}
