package org.spectralsieve.api;

import java.util.Map;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
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

    private final SearchService search;

    SearchController(SearchService search) {
        this.search = search;
    }

    @PostMapping("/requirements/parse")
    Map<String, Object> parse(@RequestBody JsonNode body) {
        return RequirementJson.toJson(requirementOf(body));
    }

    @PostMapping("/search")
    Map<String, Object> search(@RequestBody JsonNode body) {
        Requirement requirement = requirementOf(body);
        int limit = limitOf(body);
        Shortlist shortlist = search.search(requirement, limit);
        return ShortlistJson.toJson(shortlist);
    }

    /** The requirement as text ({@code "passes over 80% at 365 nm"}) or in its structured form. */
    static Requirement requirementOf(JsonNode body) {
        JsonNode node = body == null ? null : body.get("requirement");
        if (node == null || node.isNull()) {
            throw new BadParameterException("requirement", "give the requirement as text or in its structured form");
        }
        if (node.isString()) {
            return RequirementParser.parse(node.asString());
        }
        if (node.isObject()) {
            try {
                return RequirementJson.fromJson(node);
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
        if (!node.isIntegralNumber() || node.asInt() < 1 || node.asInt() > MAX_LIMIT) {
            throw new BadParameterException("limit", "must be a whole number from 1 to " + MAX_LIMIT + ", got " + node);
        }
        return node.asInt();
    }
}
