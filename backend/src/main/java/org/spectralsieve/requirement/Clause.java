package org.spectralsieve.requirement;

/** One spectral condition of a requirement. {@code text} is the clause as the user wrote it (or a canonical rendering). */
public sealed interface Clause permits TransmittanceClause, CutoffClause {

    String text();
}
