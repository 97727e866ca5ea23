package org.spectralsieve.requirement;

import java.util.Objects;
import org.spectralsieve.states.StateKind;

/**
 * A clause read on one of the sample's curves in another state: "after 1000 h passes over 80% at 365 nm",
 * "printed black blocks to OD 3 or more from 350 to 420 nm". The inner clause is judged as it would be on the sample's
 * own curve, on the state's curve as measured (state curves are never rescaled: docs/material-states.md). A clause
 * naming the as-supplied state ("base passes …") is the inner clause itself and never a StateClause.
 */
public record StateClause(StateAsked state, Clause inner, String text) implements Clause {

    public StateClause {
        Objects.requireNonNull(state, "state");
        Objects.requireNonNull(inner, "inner");
        if (state.kind() == StateKind.AS_SUPPLIED) {
            throw new IllegalArgumentException("the as-supplied state is the sample's own curve: use the clause itself");
        }
        if (inner instanceof StateClause || inner instanceof RelativeClause) {
            throw new IllegalArgumentException("a state clause holds a plain, weighted or critical-wavelength clause");
        }
        text = Objects.requireNonNullElse(text, "");
    }

    @Override
    public boolean readsStates() {
        return true;
    }
}
