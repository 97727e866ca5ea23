package org.spectralsieve.search;

import java.util.List;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;

/** The ranked, explained answer to one requirement. */
public record Shortlist(Requirement requirement, List<RankedRow> rows, int evaluatedSamples, double tookMs) {

    public Shortlist {
        rows = List.copyOf(rows);
    }
}
