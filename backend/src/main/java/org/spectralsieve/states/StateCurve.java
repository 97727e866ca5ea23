package org.spectralsieve.states;

import java.util.Objects;
import org.spectralsieve.spectrum.Curve;

/**
 * One curve of a sample in a state other than as supplied, measured at {@code thicknessMm} (NaN when not recorded;
 * normally the sample's own thickness). {@code id} is the stored state curve's id, never reused.
 */
public record StateCurve(long id, MaterialState state, Curve curve, double thicknessMm) {

    public StateCurve {
        Objects.requireNonNull(state, "state");
        Objects.requireNonNull(curve, "curve");
        if (state.kind() == StateKind.AS_SUPPLIED) {
            throw new IllegalArgumentException("the sample's own curve is its as-supplied state; a state curve is"
                    + " aged or printed");
        }
        if (!Double.isNaN(thicknessMm) && !(thicknessMm > 0 && Double.isFinite(thicknessMm))) {
            throw new IllegalArgumentException("a state curve's thickness must be above 0 mm or not recorded, got "
                    + thicknessMm);
        }
    }
}
