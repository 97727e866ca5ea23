package org.spectralsieve.search.text;

import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Provenance;

/**
 * What a user asks the library's text index: words (possibly half typed), the facet values chosen in each
 * dimension (values within one dimension are alternatives; dimensions must all hold), and how many hits.
 * Checked here so that no caller can hand the index an unbounded question; the HTTP edge turns the
 * refusals into problems naming the parameter.
 *
 * @param words     the typed words, "" for none (then every material matches, ordered by name)
 * @param classes   material class labels; an unknown but well-formed class simply matches nothing
 * @param spectral  values chosen in the spectral-summary dimensions ({@link LibraryIndexSchema#SPECTRAL_FACETS}),
 *                  by dimension; each value must be one the dimension has
 */
public record LibraryQuery(String words, Set<String> classes, Set<Geometry> geometries, Set<Provenance> provenances,
                           Set<String> thicknessBands, Map<String, Set<String>> spectral, int limit) {

    public static final int DEFAULT_LIMIT = 20;
    public static final int MAX_LIMIT = 200;
    /** Longer than any name or phrase anyone types, short enough that a query stays a handful of terms. */
    public static final int MAX_WORDS_LENGTH = 200;
    /** More chosen values than any facet panel shows: a bound on the drill-down query's size. */
    public static final int MAX_VALUES = 20;

    public LibraryQuery {
        words = Objects.requireNonNullElse(words, "").strip();
        if (words.length() > MAX_WORDS_LENGTH) {
            throw new IllegalArgumentException("at most " + MAX_WORDS_LENGTH + " characters, got " + words.length());
        }
        classes = Set.copyOf(classes);
        geometries = Set.copyOf(geometries);
        provenances = Set.copyOf(provenances);
        thicknessBands = Set.copyOf(thicknessBands);
        thicknessBands.forEach(LibraryIndexSchema::thicknessBandNamed);
        Map<String, Set<String>> copied = new TreeMap<>();
        for (Map.Entry<String, Set<String>> chosen : Objects.requireNonNullElse(spectral, Map.<String, Set<String>>of()).entrySet()) {
            chosen.getValue().forEach(v -> LibraryIndexSchema.spectralValueNamed(chosen.getKey(), v));
            if (!chosen.getValue().isEmpty()) {
                copied.put(chosen.getKey(), Set.copyOf(chosen.getValue()));
            }
        }
        spectral = Collections.unmodifiableMap(copied);
        if (limit < 1 || limit > MAX_LIMIT) {
            throw new IllegalArgumentException("limit must be 1 to " + MAX_LIMIT + ", got " + limit);
        }
    }

    /** No spectral-summary value chosen. */
    public LibraryQuery(String words, Set<String> classes, Set<Geometry> geometries, Set<Provenance> provenances,
                        Set<String> thicknessBands, int limit) {
        this(words, classes, geometries, provenances, thicknessBands, Map.of(), limit);
    }

    /** The values chosen in a spectral-summary dimension (none when that dimension has no choice). */
    public Set<String> spectral(String dimension) {
        return spectral.getOrDefault(dimension, Set.of());
    }

    /** Words only, no facet chosen. */
    public static LibraryQuery words(String words, int limit) {
        return new LibraryQuery(words, Set.of(), Set.of(), Set.of(), Set.of(), limit);
    }

    List<String> chosen(String dimension) {
        return switch (dimension) {
            case LibraryIndexSchema.CLASS_FACET -> classes.stream().sorted().toList();
            case LibraryIndexSchema.GEOMETRY_FACET -> geometries.stream().map(Geometry::label).sorted().toList();
            case LibraryIndexSchema.PROVENANCE_FACET -> provenances.stream().map(Provenance::label).sorted().toList();
            case LibraryIndexSchema.THICKNESS_FACET -> thicknessBands.stream().sorted().toList();
            case LibraryIndexSchema.EDGE_FACET, LibraryIndexSchema.LUMINOUS_FACET, LibraryIndexSchema.AT_254_FACET,
                 LibraryIndexSchema.AT_365_FACET, LibraryIndexSchema.AT_405_FACET ->
                    spectral(dimension).stream().sorted().toList();
            default -> throw new IllegalArgumentException("no facet " + dimension);
        };
    }
}
