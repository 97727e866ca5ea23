package org.spectralsieve.requirement;

import java.util.Objects;
import org.spectralsieve.states.StateKind;

/**
 * A level relative to the same candidate: T at every wavelength of {@code band} compared with {@code fraction} times a
 * reference T. Two forms:
 * <ul>
 *   <li>its own value at {@code referenceNm} ("at 380 nm under 1% of its 550 nm value"): numerator and reference
 *       read on the curve of {@code state};</li>
 *   <li>another state's value at the same wavelength ({@code referenceNm} NaN; "from 350 to 420 nm the printed
 *       black under 0.1% of the base"): the numerator on {@code state}'s curve, the reference on
 *       {@code referenceState}'s.</li>
 * </ul>
 * {@code direction}: BLOCK for "under" (the ratio at most the fraction), PASS for "over". The fraction lies above 0
 * and at most 1 (a ratio over 1 would be asked the other way round).
 */
public record RelativeClause(Direction direction, Band band, double fraction, double referenceNm, StateAsked state,
                             StateAsked referenceState, String text) implements Clause {

    public RelativeClause {
        Objects.requireNonNull(direction, "direction");
        Objects.requireNonNull(band, "band");
        Objects.requireNonNull(state, "state");
        Objects.requireNonNull(referenceState, "referenceState");
        if (!(fraction > 0 && fraction <= 1)) {
            throw new IllegalArgumentException("a relative level is a fraction above 0 and at most 100 %, got " + fraction);
        }
        // the fields are not assigned yet in a compact constructor: read the parameter, not ownWavelength()
        if (!Double.isNaN(referenceNm)) {
            if (!(referenceNm > 0 && Double.isFinite(referenceNm))) {
                throw new IllegalArgumentException("the reference wavelength must be a positive number of nm, got "
                        + referenceNm);
            }
            if (!state.equals(referenceState)) {
                throw new IllegalArgumentException("its own value at a wavelength is read on the same state's curve");
            }
            if (band.isPoint() && band.fromNm() == referenceNm) {
                throw new IllegalArgumentException("a value relative to itself at the same wavelength says nothing");
            }
        } else if (state.equals(referenceState)) {
            throw new IllegalArgumentException("a curve relative to itself at the same wavelength says nothing");
        }
        text = Objects.requireNonNullElse(text, "");
    }

    /** "its 550 nm value": the reference is the same curve at another wavelength. */
    public boolean ownWavelength() {
        return !Double.isNaN(referenceNm);
    }

    @Override
    public boolean readsStates() {
        return state.kind() != StateKind.AS_SUPPLIED || referenceState.kind() != StateKind.AS_SUPPLIED;
    }
}
