package org.spectralsieve.api;

import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.RequirementTooLargeException;
import org.spectralsieve.search.LayerResolutionException;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
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

    SearchController(SearchService search, SpectrumLookup spectra) {
        this.search = search;
        this.spectra = spectra;
    }

    @PostMapping("/requirements/parse")
    Map<String, Object> parse(@RequestBody JsonNode body) {
        return RequirementJson.toJson(requirementOf(body, spectra, search.materialClasses()));
    }

    @PostMapping("/search")
    Map<String, Object> search(@RequestBody JsonNode body) {
        Requirement requirement = requirementOf(body, spectra, search.materialClasses());
        int limit = limitOf(body);
        Shortlist shortlist;
        try {
            shortlist = search.search(requirement, limit);
        } catch (LayerResolutionException e) {
            throw located(e, body.get("requirement"), requirement);
        }
        return ShortlistJson.toJson(shortlist);
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
