package org.spectralsieve.api;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.RequirementTooLargeException;
import org.spectralsieve.requirement.RequirementWords;
import org.spectralsieve.search.LayerResolutionException;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.WordedSearch;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;
import tools.jackson.databind.JsonNode;

/** Requirement search: text or structured requirement in, ranked and explained shortlist out. */
@RestController
@RequestMapping("/api")
class SearchController {

    static final int DEFAULT_LIMIT = SearchService.DEFAULT_LIMIT;
    static final int MAX_LIMIT = SearchService.MAX_LIMIT;

    /** The material words after "behind 4 mm " / "on 3mm " in a layer's own text. */
    private static final Pattern LAYER_WORDS = Pattern.compile("(?i)^(?:behind|on)\\s+[0-9.]+\\s*mm\\s+(.+)$");

    private final SearchService search;
    private final SpectrumLookup spectra;
    private final WordedSearch worded;

    SearchController(SearchService search, SpectrumLookup spectra, LibraryTextSearch text) {
        this.search = search;
        this.spectra = spectra;
        this.worded = new WordedSearch(search, text);
    }

    @PostMapping("/requirements/parse")
    Map<String, Object> parse(@RequestBody JsonNode body) {
        WordedSearch.Read read = worded(body);
        if (read == null) {
            return RequirementJson.toJson(requirementOf(body, spectra, search.materialClasses()));
        }
        if (!read.words().any()) {
            return RequirementJson.toJson(read.requirement());
        }
        Map<String, Object> json = new LinkedHashMap<>(RequirementJson.toJson(read.requirement()));
        json.put("words", Map.of("text", read.words().words(), "provenance", read.words().provenances()));
        return json;
    }

    @PostMapping("/search")
    Map<String, Object> search(@RequestBody JsonNode body) {
        WordedSearch.Read read = worded(body);
        Requirement requirement = read != null ? read.requirement() : requirementOf(body, spectra, search.materialClasses());
        int limit = limitOf(body);
        WordedSearch.Answer answer;
        try {
            answer = worded.search(read != null ? read : new WordedSearch.Read(requirement, NO_WORDS), limit);
        } catch (LayerResolutionException e) {
            throw located(e, body.get("requirement"), requirement);
        }
        if (answer.words().isEmpty()) {
            return ShortlistJson.toJson(answer.shortlist());
        }
        WordedSearch.Words words = answer.words().get();
        Map<String, Object> json = new LinkedHashMap<>(ShortlistJson.toJson(answer.shortlist()));
        json.put("words", Map.of("text", words.text(), "provenance", words.provenances(), "admitted", words.admitted()));
        return json;
    }

    private static final RequirementWords NO_WORDS = new RequirementWords("", List.of(), "", List.of());

    /**
     * A text requirement, read with any words or terms beside its clauses split off (a text without them is
     * parsed exactly as before); null for any other body (a structured requirement, or none), which
     * {@link #requirementOf} reads or refuses.
     */
    private WordedSearch.Read worded(JsonNode body) {
        JsonNode node = body == null ? null : body.get("requirement");
        if (node == null || !node.isString()) {
            return null;
        }
        return worded.read(node.asString(), spectra, search.materialClasses());
    }

    /** Points a layer problem at the material words of a text requirement, so the page can mark them. */
    private static LayerResolutionException located(LayerResolutionException e, JsonNode node, Requirement requirement) {
        if (node == null || !node.isString() || requirement.layer().isEmpty()) {
            return e;
        }
        String raw = node.asString();
        FixedLayer layer = requirement.layer().get();
        int start = raw.indexOf(layer.text());
        Matcher words = LAYER_WORDS.matcher(layer.text());
        if (start < 0 || !words.matches()) {
            return e;
        }
        return e.at(start + words.start(1), words.end(1) - words.start(1));
    }

    /**
     * The requirement as text ({@code "passes over 80% at 365 nm"}) or in its structured form; a class filter
     * must name one of {@code classes}, the library's.
     */
    static Requirement requirementOf(JsonNode body, SpectrumLookup spectra, List<String> classes) {
        JsonNode node = body == null ? null : body.get("requirement");
        if (node == null || node.isNull()) {
            throw new BadParameterException("requirement", "give the requirement as text or in its structured form");
        }
        if (node.isString()) {
            return RequirementParser.parse(node.asString(), spectra, classes);
        }
        if (node.isObject()) {
            try {
                return RequirementJson.fromJson(node, spectra, classes);
            } catch (RequirementTooLargeException e) {
                throw e;
            } catch (IllegalArgumentException e) {
                throw new BadParameterException("requirement." + e.getMessage().split(" ", 2)[0], e.getMessage());
            }
        }
        throw new BadParameterException("requirement", "must be a string or an object, got " + node.getNodeType());
    }

    private static int limitOf(JsonNode body) {
        JsonNode node = body.get("limit");
        if (node == null || node.isNull()) {
            return DEFAULT_LIMIT;
        }
        // canConvertToInt first: 2147483648 or 1e30 must be refused, not overflow on the way to the check
        if (!node.isIntegralNumber() || !node.canConvertToInt() || node.intValue() < 1 || node.intValue() > MAX_LIMIT) {
            throw new BadParameterException("limit", "must be a whole number from 1 to " + MAX_LIMIT + ", got " + node);
        }
        return node.intValue();
    }
}
