package org.spectralsieve.api;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.spectralsieve.requirement.ClauseResult;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluation;
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

    static final int DEFAULT_LIMIT = 20;
    static final int MAX_LIMIT = 500;

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
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("requirement", RequirementJson.toJson(requirement));
        json.put("results", shortlist.rows().stream().map(SearchController::row).toList());
        json.put("evaluatedSamples", shortlist.evaluatedSamples());
        json.put("tookMs", Math.round(shortlist.tookMs() * 1000) / 1000.0);
        return json;
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

    private static Map<String, Object> row(RankedRow row) {
        SampleEvaluation e = row.evaluation();
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("rank", row.position());
        json.put("materialId", row.materialId());
        json.put("materialName", row.materialName());
        json.put("sampleId", e.sampleId());
        json.put("verdict", e.verdict().name().toLowerCase(java.util.Locale.ROOT));
        json.put("thicknessMm", finiteOrNull(e.thicknessMm()));
        json.put("thicknessRangeMm", e.feasibleMm() == null ? null : List.of(e.feasibleMm().loMm(), e.feasibleMm().hiMm()));
        json.put("worstMarginDecades", finiteOrNull(e.worstMarginDecades()));
        json.put("bindingClause", e.bindingClauseIndex() < 0 ? null : e.clauses().get(e.bindingClauseIndex()).clause().text());
        List<Map<String, Object>> clauses = new ArrayList<>();
        for (ClauseResult c : e.clauses()) {
            Map<String, Object> clause = new LinkedHashMap<>();
            clause.put("text", c.clause().text());
            clause.put("value", finiteOrNull(c.value()));
            clause.put("valueIsBound", c.valueIsBound());
            clause.put("threshold", c.threshold());
            clause.put("marginDecades", finiteOrNull(c.marginDecades()));
            clause.put("verdict", c.verdict().name().toLowerCase(java.util.Locale.ROOT));
            clause.put("explanation", c.explanation());
            clauses.add(clause);
        }
        json.put("clauses", clauses);
        return json;
    }

    private static Double finiteOrNull(double value) {
        return Double.isFinite(value) ? value : null;
    }
}
