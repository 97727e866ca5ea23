package org.spectralsieve.api;

import java.util.List;
import org.spectralsieve.api.MaterialResponses.MaterialDetail;
import org.spectralsieve.api.MaterialResponses.MaterialSummary;
import org.spectralsieve.api.MaterialResponses.SampleDetail;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.spectrum.Curve;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** The library's materials: a filtered list, and one material with its samples' key figures. */
@RestController
@RequestMapping("/api/materials")
class MaterialController {

    private final JooqLibraryRepository library;
    private final JooqLibraryRevisions revisions;

    MaterialController(JooqLibraryRepository library, JooqLibraryRevisions revisions) {
        this.library = library;
        this.revisions = revisions;
    }

    @GetMapping
    List<MaterialSummary> list(@RequestParam(name = "class", required = false) String materialClass,
                               @RequestParam(name = "q", required = false) String text) {
        if (text != null && text.length() > 200) {
            throw new BadParameterException("q", "at most 200 characters");
        }
        return library.findMaterials(materialClass, text).stream().map(MaterialSummary::of).toList();
    }

    @GetMapping("/{id}")
    MaterialDetail one(@PathVariable("id") long id) {
        Material material = library.findMaterial(id).orElseThrow(() -> new NotFoundException("material", id));
        // every sample's state curves in one query, not one per sample
        var states = library.findStoredStateCurves(material.samples().stream().map(s -> s.id()).toList());
        List<SampleDetail> samples = material.samples().stream().map(s -> {
            Curve curve = library.findCurve(s.id()).orElseThrow(() -> new NotFoundException("curve of sample", s.id()));
            return SampleDetail.of(s, curve, SampleRescaling.of(material, s), states.getOrDefault(s.id(), List.of()));
        }).toList();
        return MaterialDetail.of(material, samples, revisions.retiredSamplesOf(id));
    }
}
