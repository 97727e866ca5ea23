package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.Set;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.similarity.ComparedBand;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.similarity.QueryQuality;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.spectrum.Curve;

/**
 * The similar-curves questions beyond "like this sample": a curve from an unsaved file, compared only over a
 * band, with the uploaded piece's thickness, and "find a substitute" — the similar hits whose material also
 * meets a requirement (docs/similar-curves.md). Shared by {@code POST /api/similar} and the {@code similar}
 * command, so both give the same answer.
 */
public final class SimilarQuestions {

    /**
     * How many nearest curves a substitute search looks at: the most a ranking shows
     * ({@link SimilarSamples#MAX_LIMIT}). Farther curves are not "similar" in any sense a reader would accept,
     * so a requirement met only by them is answered with fewer hits, never with unlike curves.
     */
    public static final int SUBSTITUTE_POOL = SimilarSamples.MAX_LIMIT;

    /**
     * The thickness a curve without one is signed at. It never enters an answer: such a query is a fixed
     * construction (compared as measured) and is ranked only by correlation, which is blind to any scale;
     * a bulk candidate's matching thickness comes from its own thickness.
     */
    static final double NO_THICKNESS_MM = 1;

    private final SimilarSamples similar;
    private final SearchService search;

    public SimilarQuestions(SimilarSamples similar, SearchService search) {
        this.similar = similar;
        this.search = search;
    }

    /**
     * What is asked about: a stored sample, or a curve from a file with (optionally) the piece's thickness.
     *
     * @param sampleId    the stored sample, or empty for a file
     * @param fileName    the file's name, or null for a stored sample
     * @param thicknessMm the query's thickness, or null when not known (a file given without one)
     * @param bulk        compared per mm (Beer–Lambert) rather than as measured
     */
    public record Query(OptionalLong sampleId, String fileName, Double thicknessMm, boolean bulk,
                        CurveSignature signature, List<String> fileWarnings) {
        public Query {
            if (sampleId.isPresent() == (fileName != null)) {
                throw new IllegalArgumentException("a query is a stored sample or a file, not both or neither");
            }
            fileWarnings = List.copyOf(fileWarnings);
        }
    }

    /**
     * What the substitute filter looked at: the nearest {@code looked} curves, of which {@code met} belong to a
     * material that meets the requirement (and that its words admit, when it has words).
     *
     * @param admitted how many materials of the library the requirement's words admitted; null without words
     */
    public record RequirementCount(String text, int looked, int met, Integer admitted) {
        public RequirementCount(String text, int looked, int met) {
            this(text, looked, met, null);
        }
    }

    /**
     * The answer.
     *
     * @param band        the compared band, empty for the whole grid
     * @param warnings    what the reader should know first (query at its detection floor, little coverage, the
     *                    file's reading notes)
     * @param requirement present when the hits were filtered by one
     */
    public record Answer(Query query, QueryQuality quality, ShapeMetric metric, Optional<ComparedBand> band,
                         List<String> warnings, Optional<RequirementCount> requirement, List<SimilarSamples.Hit> hits) {
    }

    /** A stored sample as the query, signed as {@code GET /api/samples/{id}/similar} signs it. */
    public Query sample(long sampleId) {
        CurveSignature signature = similar.signatureOf(sampleId);
        return new Query(OptionalLong.of(sampleId), null, signature.thicknessMm(), signature.bulk(), signature, List.of());
    }

    /**
     * A file's curve as the query.
     *
     * @param thicknessMm the piece's thickness, or null (then it is compared as a fixed construction)
     * @param bulk        a homogeneous absorber (needs a thickness); null = bulk when a thickness is given
     * @throws IllegalArgumentException "bulk" when bulk is asked without a thickness
     */
    public static Query file(String fileName, Curve curve, Double thicknessMm, Boolean bulk, List<String> fileWarnings) {
        boolean isBulk = bulk == null ? thicknessMm != null : bulk;
        if (isBulk && thicknessMm == null) {
            throw new IllegalArgumentException("a bulk piece is compared per mm: give its thickness, or compare it as"
                    + " a fixed construction");
        }
        CurveSignature signature = CurveSignature.of(curve, thicknessMm == null ? NO_THICKNESS_MM : thicknessMm, isBulk);
        return new Query(OptionalLong.empty(), fileName, thicknessMm, isBulk, signature, fileWarnings);
    }

    /** The metric used when none is asked: centred Euclidean when the query's thickness is known, else correlation. */
    public static ShapeMetric defaultMetric(Query query) {
        return query.thicknessMm() == null ? ShapeMetric.CORRELATION : SimilarSamples.DEFAULT_METRIC;
    }

    /**
     * Whether {@code metric} can rank {@code query}: centred Euclidean compares absorbance at the query's
     * thickness, so it needs one.
     */
    public static boolean canRank(Query query, ShapeMetric metric) {
        return metric != ShapeMetric.CENTRED_EUCLIDEAN || query.thicknessMm() != null;
    }

    /**
     * The similar curves, nearest first; with a requirement, only those whose material meets it.
     *
     * @param band empty = the whole grid
     */
    public Answer ask(Query query, ShapeMetric metric, Optional<ComparedBand> band, int limit,
                      Optional<Requirement> requirement, String requirementText) {
        return ask(query, metric, band, limit, requirement, requirementText, Optional.empty());
    }

    /**
     * As {@link #ask(Query, ShapeMetric, Optional, int, Optional, String)}, for a requirement written with words
     * about the stock: a substitute's material must also be one the words admit ({@link WordedSearch#admitted}),
     * as the requirement search narrows its candidates.
     *
     * @param admitted the materials the words admit; empty when the requirement has no words (none is left out)
     */
    public Answer ask(Query query, ShapeMetric metric, Optional<ComparedBand> band, int limit,
                      Optional<Requirement> requirement, String requirementText, Optional<Set<Long>> admitted) {
        if (!canRank(query, metric)) {
            throw new IllegalArgumentException(SimilarSamples.metricName(metric) + " needs the query's thickness");
        }
        ComparedBand compared = band.orElse(ComparedBand.WHOLE_GRID);
        QueryQuality quality = QueryQuality.of(query.signature(), compared);
        List<String> warnings = new ArrayList<>(quality.warnings());
        query.fileWarnings().forEach(w -> warnings.add("file (read as an import reads it; nothing is stored here): " + w));
        if (requirement.isEmpty()) {
            List<SimilarSamples.Hit> hits = similar.similarTo(query.signature(), query.sampleId(), metric, compared, limit);
            return new Answer(query, quality, metric, band, warnings, Optional.empty(), hits);
        }
        List<SimilarSamples.Hit> pool = similar.similarTo(query.signature(), query.sampleId(), metric, compared,
                SUBSTITUTE_POOL);
        // a substitute is another material: a stored query's own stock is left out
        OptionalLong own = query.sampleId().isPresent()
                ? OptionalLong.of(similar.materialOf(query.sampleId().getAsLong())) : OptionalLong.empty();
        List<SimilarSamples.Hit> looked = pool.stream()
                .filter(h -> own.isEmpty() || h.materialId() != own.getAsLong()).toList();
        // only materials the words admit are judged: the others cannot be substitutes whatever their curves
        Set<Long> materials = new LinkedHashSet<>();
        looked.stream().filter(h -> admitted.isEmpty() || admitted.get().contains(h.materialId()))
                .forEach(h -> materials.add(h.materialId()));
        Map<Long, SearchService.SampleEvaluationRow> rows = search.judgeMaterials(requirement.get(), materials);
        List<SimilarSamples.Hit> met = looked.stream()
                .filter(h -> materials.contains(h.materialId()) && meets(rows.get(h.materialId()))).toList();
        return new Answer(query, quality, metric, band, warnings,
                Optional.of(new RequirementCount(requirementText, looked.size(), met.size(),
                        admitted.map(Set::size).orElse(null))),
                met.subList(0, Math.min(limit, met.size())));
    }

    /** Meets = the search would put the material in its first group: every clause proven. */
    private static boolean meets(SearchService.SampleEvaluationRow row) {
        return row != null && row.evaluation().standing() == Standing.MEETS;
    }
}
