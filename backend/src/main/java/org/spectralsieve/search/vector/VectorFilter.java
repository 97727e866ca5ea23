package org.spectralsieve.search.vector;

import java.util.Set;

/**
 * Facet values a vector search is narrowed to: within one dimension the values are alternatives, all
 * non-empty dimensions must hold (as in the library panel). Empty sets: no narrowing.
 */
public record VectorFilter(Set<String> classes, Set<String> geometries, Set<String> provenances) {

    public static final VectorFilter NONE = new VectorFilter(Set.of(), Set.of(), Set.of());

    public VectorFilter {
        classes = Set.copyOf(classes);
        geometries = Set.copyOf(geometries);
        provenances = Set.copyOf(provenances);
    }

    public boolean isEmpty() {
        return classes.isEmpty() && geometries.isEmpty() && provenances.isEmpty();
    }
}
