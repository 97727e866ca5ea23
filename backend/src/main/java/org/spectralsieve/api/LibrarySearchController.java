package org.spectralsieve.api;

import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.search.text.LibraryAnswer;
import org.spectralsieve.search.text.LibraryIndexSchema;
import org.spectralsieve.search.text.LibraryQuery;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/**
 * Words and facets over the library ({@code GET /api/library}): the best materials for the typed words,
 * narrowed by the facet values chosen, with every facet value's count (docs/library-search.md). A facet
 * parameter may repeat ({@code class=film&class=plastic%20sheet}): the values are alternatives. The
 * spectral-summary facets ({@code edge}, {@code luminous}, {@code at254}, {@code at365}, {@code at405}) are read
 * from the samples' stored curves.
 */
@RestController
class LibrarySearchController {

    private final LibraryTextSearch search;

    LibrarySearchController(LibraryTextSearch search) {
        this.search = search;
    }

    @GetMapping("/api/library")
    LibraryAnswer search(@RequestParam(name = "q", required = false) String words,
                         @RequestParam(name = "class", required = false) List<String> classes,
                         @RequestParam(name = "geometry", required = false) List<String> geometries,
                         @RequestParam(name = "provenance", required = false) List<String> provenances,
                         @RequestParam(name = "thickness", required = false) List<String> thicknessBands,
                         @RequestParam(name = "edge", required = false) List<String> edges,
                         @RequestParam(name = "luminous", required = false) List<String> luminous,
                         @RequestParam(name = "at254", required = false) List<String> at254,
                         @RequestParam(name = "at365", required = false) List<String> at365,
                         @RequestParam(name = "at405", required = false) List<String> at405,
                         @RequestParam(name = "limit", required = false) String limit) {
        if (words != null && words.length() > LibraryQuery.MAX_WORDS_LENGTH) {
            throw new BadParameterException("q", "at most " + LibraryQuery.MAX_WORDS_LENGTH + " characters, got "
                    + words.length());
        }
        return search.search(new LibraryQuery(words,
                values("class", classes, label -> MaterialClass.of(label).label()),
                values("geometry", geometries, Geometry::parse),
                values("provenance", provenances, Provenance::parse),
                values("thickness", thicknessBands, LibraryIndexSchema::thicknessBandNamed),
                spectral(Map.of(LibraryIndexSchema.EDGE_FACET, listed(edges), LibraryIndexSchema.LUMINOUS_FACET, listed(luminous),
                        LibraryIndexSchema.AT_254_FACET, listed(at254), LibraryIndexSchema.AT_365_FACET, listed(at365),
                        LibraryIndexSchema.AT_405_FACET, listed(at405))), limit(limit)));
    }

    /** The spectral-summary choices by dimension; the parameter is named as the dimension. */
    private static Map<String, Set<String>> spectral(Map<String, List<String>> given) {
        Map<String, Set<String>> out = new LinkedHashMap<>();
        for (String dimension : LibraryIndexSchema.SPECTRAL_FACETS) {
            out.put(dimension, values(dimension, given.get(dimension),
                    value -> LibraryIndexSchema.spectralValueNamed(dimension, value)));
        }
        return out;
    }

    private static List<String> listed(List<String> given) {
        return given == null ? List.of() : given;
    }

    /** A repeatable facet parameter's values, each parsed; a bad one is a problem naming the parameter. */
    static <T> Set<T> values(String parameter, List<String> given, Function<String, T> parse) {
        if (given == null) {
            return Set.of();
        }
        if (given.size() > LibraryQuery.MAX_VALUES) {
            throw new BadParameterException(parameter, "at most " + LibraryQuery.MAX_VALUES + " values, got " + given.size());
        }
        Set<T> out = new LinkedHashSet<>();
        for (String value : given) {
            if (value == null || value.isBlank()) {
                continue; // an empty choice (class=) chooses nothing, as an untouched facet panel does
            }
            try {
                out.add(parse.apply(value));
            } catch (IllegalArgumentException e) {
                throw new BadParameterException(parameter, e.getMessage());
            }
        }
        return out;
    }

    private static int limit(String text) {
        if (text == null || text.isBlank()) {
            return LibraryQuery.DEFAULT_LIMIT;
        }
        try {
            int limit = Integer.parseInt(text.strip());
            if (limit >= 1 && limit <= LibraryQuery.MAX_LIMIT) {
                return limit;
            }
        } catch (NumberFormatException notANumber) {
            // answered below like any other bad limit
        }
        throw new BadParameterException("limit", "a whole number from 1 to " + LibraryQuery.MAX_LIMIT + ", got '" + text + "'");
    }
}
