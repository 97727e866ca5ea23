package org.spectralsieve.api;

import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.spectralsieve.audit.AuditTrail;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code GET /api/audit}: the audit trail, newest first, a bounded page at a time (docs/audit.md). Parameters, all
 * optional: {@code limit} (1 to {@value AuditTrail#MAX_PAGE}, default {@value #DEFAULT_LIMIT}), {@code before} (an
 * entry id: the page starts below it; the answer's {@code nextBefore} gives the next page's), {@code sampleId} (entries
 * about that sample), {@code materialId} (about that material and its samples). A bad or unknown parameter is a 400
 * problem naming it. Who may read it is the security configuration's business ({@code /api/audit/**}).
 */
@RestController
class AuditController {

    static final int DEFAULT_LIMIT = 100;

    private static final Set<String> PARAMETERS = Set.of("limit", "before", "sampleId", "materialId");

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private final AuditTrail trail;

    AuditController(AuditTrail trail) {
        this.trail = trail;
    }

    /**
     * One entry. {@code before} and {@code after} are the subject's values as JSON objects, null where they do not apply.
     */
    record EntryJson(long id, String recordedAt, String actor, String action, String subjectKind, Long subjectId,
                     Long materialId, String summary, JsonNode before, JsonNode after) {
    }

    /** @param nextBefore the {@code before} of the next (older) page; null when this page is the last */
    record PageJson(List<EntryJson> entries, Long nextBefore) {
    }

    @GetMapping("/api/audit")
    PageJson page(@RequestParam Map<String, String> all,
                  @RequestParam(required = false) Integer limit,
                  @RequestParam(required = false) Long before,
                  @RequestParam(required = false) Long sampleId,
                  @RequestParam(required = false) Long materialId) {
        Set<String> unknown = new TreeSet<>(all.keySet());
        unknown.removeAll(PARAMETERS);
        if (!unknown.isEmpty()) {
            String first = unknown.iterator().next();
            throw new BadParameterException(first, "not a parameter of /api/audit; it takes " + new TreeSet<>(PARAMETERS));
        }
        int size = limit == null ? DEFAULT_LIMIT : limit;
        if (size < 1 || size > AuditTrail.MAX_PAGE) {
            throw new BadParameterException("limit", "must be 1 to " + AuditTrail.MAX_PAGE + ", got " + size);
        }
        positive("before", before);
        positive("sampleId", sampleId);
        positive("materialId", materialId);
        List<AuditTrail.Stored> rows = trail.page(new AuditTrail.Query(before, size, sampleId, materialId));
        List<EntryJson> entries = rows.stream().map(AuditController::toJson).toList();
        Long next = rows.size() == size ? rows.get(rows.size() - 1).id() : null;
        return new PageJson(entries, next);
    }

    private static void positive(String name, Long value) {
        if (value != null && value < 1) {
            throw new BadParameterException(name, "must be an id, 1 or more, got " + value);
        }
    }

    private static EntryJson toJson(AuditTrail.Stored s) {
        return new EntryJson(s.id(), s.recordedAt().toString(), s.actor(), s.action(), s.subjectKind(), s.subjectId(),
                s.materialId(), s.summary(), tree(s.beforeJson()), tree(s.afterJson()));
    }

    private static JsonNode tree(String json) {
        return json == null ? null : JSON.readTree(json);
    }
}
