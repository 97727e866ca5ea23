package org.spectralsieve.api;

import java.util.Arrays;
import java.util.List;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.requirement.RequirementGuide;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * The requirement language's guide, built on each request from what the parser reads a text against here:
 * this library's classes and the spectra it knows (built-in and imported), so the page's guide lists exactly
 * the names a search accepts.
 */
@RestController
class RequirementGuideController {

    /** Where scripts find the description of every endpoint (ApiDescription). */
    static final String API_DESCRIPTION = "/api/openapi.json";
    private static final List<String> PROVENANCES = Arrays.stream(Provenance.values()).map(Provenance::label).toList();

    private final SearchService search;
    private final SpectrumLookup spectra;

    RequirementGuideController(SearchService search, SpectrumLookup spectra) {
        this.search = search;
        this.spectra = spectra;
    }

    /** @param apiDescription the address of the OpenAPI document, for the page's link */
    record GuideJson(RequirementGuide guide, String apiDescription) {
    }

    @GetMapping("/api/requirements/guide")
    GuideJson guide() {
        return new GuideJson(RequirementGuide.of(spectra, search.materialClasses(), PROVENANCES), API_DESCRIPTION);
    }
}
