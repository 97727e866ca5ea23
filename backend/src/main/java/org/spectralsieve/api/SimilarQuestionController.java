package org.spectralsieve.api;

import java.io.IOException;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.api.ImportForms.AxisForm;
import org.spectralsieve.api.ImportForms.KeepForm;
import org.spectralsieve.api.ImportForms.ReadForm;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.FilePreview;
import org.spectralsieve.ingest.ImportService;
import org.spectralsieve.ingest.OptionText;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.SimilarQuestions;
import org.spectralsieve.search.SimilarSamples;
import org.spectralsieve.search.WordedSearch;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.spectralsieve.similarity.ComparedBand;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.http.MediaType;
import org.springframework.web.bind.annotation.ModelAttribute;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RequestPart;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.multipart.MultipartFile;

/**
 * {@code POST /api/similar} ({@code multipart/form-data}): the stored samples whose curves look like an unsaved
 * file's ({@code file}, read exactly as {@code POST /api/imports/preview} reads it, with the same optional
 * reading fields, and never stored) or a stored sample's ({@code sampleId}); optionally over a {@code band},
 * with the uploaded piece's {@code thicknessMm} and {@code bulk}, and filtered by a {@code requirement}
 * ("find a substitute"). See docs/similar-curves.md.
 */
@RestController
class SimilarQuestionController {

    private final SimilarQuestions questions;
    private final ImportService imports;
    private final SearchService search;
    private final SpectrumLookup spectra;
    private final WordedSearch worded;

    SimilarQuestionController(SimilarQuestions questions, ImportService imports, SearchService search,
                              SpectrumLookup spectra, LibraryTextSearch text) {
        this.questions = questions;
        this.imports = imports;
        this.search = search;
        this.spectra = spectra;
        this.worded = new WordedSearch(search, text);
    }

    @PostMapping(path = "/api/similar", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    AnswerJson similar(@RequestPart(name = "file", required = false) MultipartFile file,
                       @RequestParam(name = "sampleId", required = false) String sampleId,
                       @RequestParam(name = "thicknessMm", required = false) String thicknessMm,
                       @RequestParam(name = "bulk", required = false) String bulk,
                       @RequestParam(name = "band", required = false) String band,
                       @RequestParam(name = "metric", required = false) String metric,
                       @RequestParam(name = "limit", required = false) String limit,
                       @RequestParam(name = "requirement", required = false) String requirement,
                       @ModelAttribute ReadForm read, @ModelAttribute KeepForm keep, @ModelAttribute AxisForm axes)
            throws ImportException, IOException {
        // every field is checked before the file is read: a form mistake costs no parsing
        Optional<ComparedBand> asked = SimilarController.band(band);
        int n = SimilarController.limit(limit);
        ShapeMetric named = metric == null || metric.isBlank() ? null : SimilarController.metric(metric);
        Double thickness = OptionText.thicknessOrNull("thicknessMm", thicknessMm);
        Boolean isBulk = blank(bulk) ? null : OptionText.bool("bulk", bulk);
        // read as the requirement search reads it: words and terms about the stock beside the clauses
        Optional<WordedSearch.Read> written = requirement == null || requirement.isBlank() ? Optional.empty()
                : Optional.of(worded.read(requirement, spectra, search.materialClasses()));
        Optional<Requirement> wanted = written.map(WordedSearch.Read::requirement);
        Optional<Set<Long>> admitted = written.flatMap(worded::admitted);
        SimilarQuestions.Query query = query(file, sampleId, thickness, isBulk, read, keep, axes);
        ShapeMetric chosen = named == null ? SimilarQuestions.defaultMetric(query) : named;
        if (!SimilarQuestions.canRank(query, chosen)) {
            throw new BadParameterException("metric", SimilarSamples.metricName(chosen) + " compares absorbance at the"
                    + " query's thickness: give thicknessMm, or use correlation (blind to thickness)");
        }
        return AnswerJson.of(questions.ask(query, chosen, asked, n, wanted, wanted.isPresent() ? requirement.strip() : null,
                admitted));
    }

    private SimilarQuestions.Query query(MultipartFile file, String sampleId, Double thickness, Boolean bulk,
                                         ReadForm read, KeepForm keep, AxisForm axes)
            throws ImportException, IOException {
        boolean hasFile = file != null && !file.isEmpty();
        boolean hasSample = !blank(sampleId);
        if (hasFile == hasSample) {
            throw new BadParameterException(hasFile ? "sampleId" : "file", "give either file (an unsaved curve) or"
                    + " sampleId (a stored sample), not " + (hasFile ? "both" : "neither"));
        }
        if (hasSample) {
            long id;
            try {
                id = Long.parseLong(sampleId.strip());
            } catch (NumberFormatException e) {
                throw new BadParameterException("sampleId", "'" + sampleId + "' is not a whole number");
            }
            if (thickness != null || bulk != null) {
                throw new BadParameterException(thickness != null ? "thicknessMm" : "bulk", "a stored sample is"
                        + " compared at its own thickness and scaling; these fields describe an uploaded piece");
            }
            return questions.sample(id);
        }
        FilePreview preview = imports.preview(file.getOriginalFilename(), file.getBytes(),
                axes.applyTo(keep.applyTo(read.options())));
        try {
            return SimilarQuestions.file(preview.fileName(), preview.curve(), thickness, bulk, preview.warnings());
        } catch (IllegalArgumentException e) {
            throw new BadParameterException("bulk", e.getMessage());
        }
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }

    /** The answer as the page reads it; {@code hits} are the same objects as {@code GET /api/samples/{id}/similar}'s. */
    record AnswerJson(QueryJson query, String metric, SimilarController.BandJson band, List<String> warnings,
                      RequirementCountJson requirement, List<SimilarController.HitJson> hits) {

        static AnswerJson of(SimilarQuestions.Answer a) {
            SimilarQuestions.Query q = a.query();
            QueryJson query = new QueryJson(q.sampleId().isPresent() ? q.sampleId().getAsLong() : null, q.fileName(),
                    q.thicknessMm(), q.bulk(), a.quality().coveredPoints(), a.quality().resolvedPoints());
            RequirementCountJson requirement = a.requirement()
                    .map(r -> new RequirementCountJson(r.text(), r.looked(), r.met(), r.admitted())).orElse(null);
            return new AnswerJson(query, SimilarSamples.metricName(a.metric()), SimilarController.BandJson.of(a.band()),
                    a.warnings(), requirement, a.hits().stream().map(SimilarController::json).toList());
        }
    }

    /**
     * @param pointsCovered  grid points of the compared band where the query has a reading
     * @param pointsResolved of those, readings above the detection limit
     */
    record QueryJson(Long sampleId, String fileName, Double thicknessMm, boolean bulk, int pointsCovered,
                     int pointsResolved) {
    }

    /**
     * @param looked   the nearest curves looked at
     * @param met      how many of them belong to a material meeting it (and admitted by its words)
     * @param admitted how many materials the requirement's words admitted; null when it has no words
     */
    record RequirementCountJson(String text, int looked, int met, Integer admitted) {
    }
}
