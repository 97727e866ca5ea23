package org.spectralsieve.requirement;

/** One spectral condition of a requirement. {@code text} is the clause as the user wrote it (or a canonical rendering). */
public sealed interface Clause permits TransmittanceClause, CutoffClause, WeightedClause, CriticalWavelengthClause,
        RelativeClause, StateClause {

    String text();

    /**
     * Whether the clause reads the curve only at wavelengths of its own band or window (a transmittance or
     * cutoff clause), as the in-memory store can judge it; weighted figures integrate over a whole source.
     */
    default boolean plain() {
        return this instanceof TransmittanceClause || this instanceof CutoffClause;
    }

    /** Whether the clause reads a curve of another state than the sample's own (aged, printed black). */
    default boolean readsStates() {
        return false;
    }
}
