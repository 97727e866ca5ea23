package org.spectralsieve.api;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.spectralsieve.requirement.Clause;
import org.spectralsieve.requirement.ClauseResult;
import org.spectralsieve.requirement.RelativeClause;
import org.spectralsieve.requirement.StateClause;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.StockAdvice;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.spectrum.StatedCurve;
import org.spectralsieve.search.Shortlist;

/**
 * The JSON form of a search answer, as {@code POST /api/search} returns it and {@code search --json}
 * prints it: one shape for both, so a script can switch between them without a change.
 * Non-finite numbers (no reading, no margin) become null, since JSON has no NaN. With a fixed layer,
 * {@code layer} names the library sample that stood in every light path; with eye or skin safety figures
 * (erythemal, UV hazard, blue-light weighting) the answer carries the same {@code caution} as the
 * weighted-figures endpoint.
 *
 * <p>Rows come in the order of {@link org.spectralsieve.requirement.RankingOrder}; {@code group} names the
 * row's group ({@code meets}, {@code unverified}, {@code misses}, {@code not-judged}: no clause could be
 * judged at the asked thickness or on the measured range) and {@code worstMarginIsBound} marks a miss
 * shown only by a detection-limit bound, whose margin is an upper bound (the true miss may be larger).
 * A transmittance under OD 12 is given as the bound 1e-12 ({@code valueIsBound}), never as 1e-236 or 0.
 * Each row names the {@code sampleRevision} and {@code materialRevision} it was judged on, and the answer the
 * {@code libraryGeneration} it was computed at, so a result can be reproduced later (docs/audit.md).
 */
public final class ShortlistJson {

    private ShortlistJson() {
    }

    public static Map<String, Object> toJson(Shortlist shortlist) {
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("requirement", RequirementJson.toJson(shortlist.requirement()));
        // every answer says how it took the light to arrive (normal incidence unless the requirement said otherwise)
        json.put("assumedLight", shortlist.requirement().light().describe());
        caution(shortlist.requirement()).ifPresent(c -> json.put("caution", c));
        shortlist.layer().ifPresent(layer -> json.put("layer", layer(layer)));
        json.put("results", shortlist.rows().stream().map(r -> withRevisions(withSampleUsed(row(r, shortlist.geometry(r)),
                shortlist, r), shortlist.revisions(r))).toList());
        json.put("groups", groups(shortlist));
        json.put("evaluatedSamples", shortlist.evaluatedSamples());
        json.put("judgedExactly", shortlist.judgedExactly());
        // with each row's sampleRevision and materialRevision, what the answer was computed from (docs/audit.md)
        json.put("libraryGeneration", shortlist.libraryGeneration() == Shortlist.UNKNOWN_GENERATION ? null
                : shortlist.libraryGeneration());
        json.put("tookMs", Math.round(shortlist.tookMs() * 1000) / 1000.0);
        return json;
    }

    /**
     * The groups present, in order, each with its heading and row count: the page and the command line
     * print these headings over the rows, so a not-judged row is never mistaken for a candidate.
     */
    private static List<Map<String, Object>> groups(Shortlist shortlist) {
        Map<String, Integer> counts = new LinkedHashMap<>();
        for (RankedRow row : shortlist.rows()) {
            counts.merge(row.evaluation().standing().group(), 1, Integer::sum);
        }
        List<Map<String, Object>> groups = new ArrayList<>();
        counts.forEach((group, count) -> {
            Map<String, Object> json = new LinkedHashMap<>();
            json.put("group", group);
            json.put("heading", Standing.heading(group));
            json.put("rows", count);
            groups.add(json);
        });
        return groups;
    }

    /** The screening caution, when the requirement asks for an eye or skin safety figure. */
    public static java.util.Optional<String> caution(Requirement requirement) {
        boolean safety = requirement.clauses().stream()
                .map(c -> c instanceof StateClause s ? s.inner() : c)
                .anyMatch(c -> c instanceof WeightedClause w && w.weighting().safetyFigure());
        return safety ? java.util.Optional.of(WeightingController.CAUTION) : java.util.Optional.empty();
    }

    private static Map<String, Object> layer(StackLayer layer) {
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("materialId", layer.materialId());
        json.put("materialName", layer.materialName());
        json.put("materialSlug", layer.materialSlug());
        json.put("sampleId", layer.sampleId());
        json.put("measuredMm", layer.measuredMm());
        json.put("thicknessMm", layer.spec().thicknessMm());
        json.put("rescaled", layer.rescaled());
        json.put("explanation", "every result is judged as a stack, " + layer.describe()
                + ", with an air gap between the parts");
        return json;
    }

    /** @param geometry how the row's sample was measured: "regular" (direct beam) or "total" (with scatter) */
    /**
     * The revisions of the row's sample and material it was judged on, after the sample id (docs/undo.md);
     * null when not known.
     */
    private static Map<String, Object> withRevisions(Map<String, Object> row, Shortlist.Revisions revisions) {
        Map<String, Object> json = new LinkedHashMap<>();
        row.forEach((key, value) -> {
            json.put(key, value);
            if (key.equals("sampleId")) {
                json.put("sampleRevision", revisions == null ? null : revisions.sample());
                json.put("materialRevision", revisions == null ? null : revisions.material());
            }
        });
        return json;
    }

    /**
     * The sample behind the row, after its thickness (docs/result-rows.md): {@code measuredMm}, the thickness the
     * row's sample was measured at (null when not recorded), and {@code rescaled}, true when the row was judged on
     * that sample's curve rescaled to {@code thicknessMm}, false when on the measured curve itself, null when no
     * clause could be judged (no curve stands behind the row) or a thickness is not recorded.
     */
    private static Map<String, Object> withSampleUsed(Map<String, Object> row, Shortlist shortlist, RankedRow r) {
        Map<String, Object> json = new LinkedHashMap<>();
        row.forEach((key, value) -> {
            json.put(key, value);
            if (key.equals("thicknessMm")) {
                json.put("measuredMm", finiteOrNull(shortlist.measuredMm(r)));
                json.put("rescaled", shortlist.rescaled(r).orElse(null));
            }
        });
        return json;
    }

    static Map<String, Object> row(RankedRow row, String geometry) {
        SampleEvaluation e = row.evaluation();
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("rank", row.position());
        json.put("materialId", row.materialId());
        json.put("materialName", row.materialName());
        json.put("sampleId", e.sampleId());
        json.put("geometry", geometry);
        json.put("verdict", e.verdict().name().toLowerCase(Locale.ROOT));
        json.put("group", e.standing().group());
        json.put("thicknessMm", finiteOrNull(e.thicknessMm()));
        json.put("thicknessRangeMm", e.feasibleMm() == null ? null : List.of(e.feasibleMm().loMm(), e.feasibleMm().hiMm()));
        json.put("stockThicknesses", stock(e.stockAdvice()));
        json.put("worstMarginDecades", finiteOrNull(e.worstMarginDecades()));
        json.put("worstMarginIsBound", e.standing().marginIsBound());
        json.put("bindingClause", e.bindingClauseIndex() < 0 ? null : e.clauses().get(e.bindingClauseIndex()).clause().text());
        // the binding clause's confidence (0–1), the row's own standing in one number; null when unknown
        json.put("bindingClauseConfidence", e.confidence().isPresent() ? e.confidence().getAsDouble() : null);
        List<Map<String, Object>> clauses = new ArrayList<>();
        for (ClauseResult c : e.clauses()) {
            Map<String, Object> clause = new LinkedHashMap<>();
            clause.put("text", c.clause().text());
            boolean beyond = isTransmittance(c) && c.value() < StatedCurve.SMALLEST_STATED_T;
            clause.put("value", beyond ? Double.valueOf(StatedCurve.SMALLEST_STATED_T) : finiteOrNull(c.value()));
            clause.put("valueIsBound", beyond || c.valueIsBound());
            clause.put("threshold", c.threshold());
            clause.put("marginDecades", finiteOrNull(c.marginDecades()));
            clause.put("verdict", c.verdict().name().toLowerCase(Locale.ROOT));
            clause.put("explanation", c.explanation());
            // the probability (0–1) that the true value meets the threshold; null when it cannot be said
            clause.put("confidence", c.confidence().isPresent() ? c.confidence().getAsDouble() : null);
            clauses.add(clause);
        }
        json.put("clauses", clauses);
        return json;
    }

    /**
     * The stock sizes to buy when thickness was a design variable: those proven to meet, best margin first,
     * or the one closest to meeting and how far it lies from the feasible interval; null when the material
     * states no stock size in the asked range.
     */
    static Map<String, Object> stock(StockAdvice advice) {
        if (!advice.any()) {
            return null;
        }
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("meeting", advice.inside().stream().map(ShortlistJson::fit).toList());
        json.put("closestMiss", advice.closestMiss() == null ? null : fit(advice.closestMiss()));
        json.put("closestMissOutsideMm", finiteOrNull(advice.missMm()));
        json.put("otherSamplesFeasibleMm", advice.elsewhere().stream().map(p -> List.of(p.loMm(), p.hiMm())).toList());
        json.put("explanation", advice.describe());
        return json;
    }

    private static Map<String, Object> fit(StockAdvice.StockFit f) {
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("thicknessMm", f.thicknessMm());
        json.put("verdict", f.verdict().name().toLowerCase(Locale.ROOT));
        json.put("worstMarginDecades", finiteOrNull(f.worstMarginDecades()));
        return json;
    }

    /** Whether the clause's value is a transmittance (not a wavelength in nm). */
    private static boolean isTransmittance(ClauseResult c) {
        Clause clause = c.clause() instanceof StateClause s ? s.inner() : c.clause();
        return clause instanceof TransmittanceClause || clause instanceof WeightedClause
                || clause instanceof RelativeClause;
    }

    private static Double finiteOrNull(double value) {
        return Double.isFinite(value) ? value : null;
    }
}
