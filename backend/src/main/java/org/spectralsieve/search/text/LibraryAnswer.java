package org.spectralsieve.search.text;

import java.util.List;
import java.util.Map;

/**
 * The index's answer: the best materials first, how many matched in all, and for every facet dimension the
 * count of each value. A dimension with values chosen is counted as if its own choice were not made
 * (drill sideways), so its other values show how many a wider choice would add; every other dimension is
 * counted over the matching materials.
 *
 * @param generation the library's change counter the index was built at (docs/freshness.md)
 */
public record LibraryAnswer(long total, List<Hit> hits, Map<String, List<FacetCount>> facets, long generation) {

    public LibraryAnswer {
        hits = List.copyOf(hits);
        facets = Map.copyOf(facets);
    }

    /**
     * One material. {@code samples} are the ids of its samples in use that meet every sample facet chosen
     * (geometry, provenance, thickness band) — all of them when none is chosen. Facets hold per material, so
     * the list can be empty when different samples meet different choices (docs/library-search.md).
     */
    public record Hit(long materialId, String name, String materialClass, float score, List<Long> samples) {
        public Hit {
            samples = List.copyOf(samples);
        }
    }

    public record FacetCount(String value, long count) {
    }
}
