package org.spectralsieve.api;

import java.net.URI;
import java.util.List;
import java.util.Map;
import org.spectralsieve.api.MaterialResponses.MaterialSummary;
import org.spectralsieve.api.MaterialResponses.SampleDetail;
import org.spectralsieve.curation.LibraryCuration;
import org.spectralsieve.ingest.SampleCorrectionForm;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.JooqLibraryRevisions.Kind;
import org.spectralsieve.library.JooqLibraryRevisions.Retirement;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialRevision;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.RefractiveIndexJson;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.library.SampleRevision;
import org.spectralsieve.library.StatedThicknessesJson;
import org.spectralsieve.spectrum.Curve;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;

/**
 * Undo without loss over HTTP (docs/undo.md). Nothing here deletes; {@code {kinds}} is {@code samples} or
 * {@code materials}:
 * <ul>
 *   <li>{@code POST /api/{kinds}/{id}/retire}, {@code POST /api/{kinds}/{id}/restore}: 200 with the state
 *       ({@code changed} false when it was already so);</li>
 *   <li>{@code GET /api/{kinds}/{id}/revisions}, {@code GET /api/{kinds}/{id}/revisions/{n}}: every revision
 *       of its metadata, oldest first, the current one marked;</li>
 *   <li>{@code POST /api/{kinds}/{id}/revisions} (JSON: the fields to change, as text or numbers, and
 *       {@code reason}): 201 with the new revision; a bad value is a 400 problem naming the field, and
 *       nothing is stored;</li>
 *   <li>{@code GET /api/samples/{id}}: one sample, retired or not, with its material's state;</li>
 *   <li>{@code GET /api/materials/retired}: the retired materials.</li>
 * </ul>
 */
@RestController
class CurationController {

    private final LibraryCuration curation;
    private final JooqLibraryRevisions revisions;
    private final JooqLibraryRepository library;

    CurationController(LibraryCuration curation, JooqLibraryRevisions revisions, JooqLibraryRepository library) {
        this.curation = curation;
        this.revisions = revisions;
        this.library = library;
    }

    /**
     * @param retiredAt when it was retired, null while in use
     * @param inUse     whether searches and listings see it now (a restored sample of a retired material does not)
     * @param changed   false when it already was in the asked state
     */
    record RetirementJson(String kind, long id, String retiredAt, boolean inUse, boolean changed, String note) {
    }

    /**
     * A sample read by id: its current revision, and whether it or its material is retired. {@code states}: its curves
     * in other states in use (as in {@code sample.states}), {@code retiredStates} those retired (docs/material-states.md).
     */
    record SampleJson(long materialId, String materialName, int materialRevision, String materialRetiredAt,
                      boolean inUse, SampleDetail sample, List<StateResponses.StateSummary> states,
                      List<StateResponses.StateSummary> retiredStates) {
    }

    /** A material's revision: its index and made thicknesses as that revision states them. */
    record MaterialRevisionJson(long materialId, int revision, boolean current, String reason, String revisedAt,
                                Map<String, Object> refractiveIndex, Map<String, Object> madeThicknesses) {
        static MaterialRevisionJson of(MaterialRevision r) {
            return new MaterialRevisionJson(r.materialId(), r.revision(), r.current(), r.reason(),
                    MaterialResponses.instant(r.revisedAt()), RefractiveIndexJson.toJson(r.refractiveIndex()),
                    StatedThicknessesJson.toJson(r.thicknesses()));
        }
    }

    /** A sample's revision: the values a correction may change, as that revision states them. */
    record SampleRevisionJson(long sampleId, int revision, boolean current, String reason, String revisedAt,
                              double thicknessMm, String geometry, String instrument, String measuredOn, String lot,
                              String notes, double detectionLimit) {
        static SampleRevisionJson of(SampleRevision r) {
            return new SampleRevisionJson(r.sampleId(), r.revision(), r.current(), r.reason(),
                    MaterialResponses.instant(r.revisedAt()), r.thicknessMm(), r.geometry().label(), r.instrument(),
                    r.measuredOn() == null ? null : r.measuredOn().toString(), r.lot(), r.notes(), r.detectionLimit());
        }
    }

    record RetiredMaterialJson(String retiredAt, MaterialSummary material) {
    }

    @GetMapping("/api/samples/{id}")
    SampleJson sample(@PathVariable("id") long id) {
        SampleInfo s = library.findSample(id).orElseThrow(() -> new NotFoundException("sample", id));
        Material m = library.findMaterial(s.materialId()).orElseThrow(() -> new NotFoundException("material", s.materialId()));
        Curve curve = library.findCurve(id).orElseThrow(() -> new NotFoundException("curve of sample", id));
        List<org.spectralsieve.library.StoredStateCurve> all = library.findStoredStateCurves(id, true);
        var inUse = all.stream().filter(c -> !c.retired()).toList();
        SampleDetail detail = SampleDetail.of(s, curve, SampleRescaling.of(m, s), inUse);
        return new SampleJson(m.id(), m.name(), m.revision(), MaterialResponses.instant(m.retiredAt()),
                !s.retired() && !m.retired(), detail, detail.states(),
                all.stream().filter(c -> c.retired()).map(StateResponses.StateSummary::of).toList());
    }

    @PostMapping("/api/{kinds:samples|materials}/{id}/retire")
    RetirementJson retire(@PathVariable("kinds") String kinds, @PathVariable("id") long id) {
        return json(curation.retire(kind(kinds), id));
    }

    @PostMapping("/api/{kinds:samples|materials}/{id}/restore")
    RetirementJson restore(@PathVariable("kinds") String kinds, @PathVariable("id") long id) {
        return json(curation.restore(kind(kinds), id));
    }

    @GetMapping("/api/samples/{id}/revisions")
    List<SampleRevisionJson> sampleRevisions(@PathVariable("id") long id) {
        return revisions.sampleRevisions(id).stream().map(SampleRevisionJson::of).toList();
    }

    @GetMapping("/api/samples/{id}/revisions/{n}")
    SampleRevisionJson sampleRevision(@PathVariable("id") long id, @PathVariable("n") int n) {
        return revisions.sampleRevision(id, n).map(SampleRevisionJson::of)
                .orElseThrow(() -> new NotFoundException("revision " + n + " of sample", id));
    }

    @PostMapping("/api/samples/{id}/revisions")
    ResponseEntity<SampleRevisionJson> correctSample(@PathVariable("id") long id,
                                                     @RequestBody Map<String, Object> body) {
        SampleRevision r = curation.correct(id, SampleCorrectionForm.sample(SampleCorrectionForm.ofValues(body)));
        return ResponseEntity.created(URI.create("/api/samples/" + id + "/revisions/" + r.revision()))
                .body(SampleRevisionJson.of(r));
    }

    @GetMapping("/api/materials/{id}/revisions")
    List<MaterialRevisionJson> materialRevisions(@PathVariable("id") long id) {
        return revisions.materialRevisions(id).stream().map(MaterialRevisionJson::of).toList();
    }

    @GetMapping("/api/materials/{id}/revisions/{n}")
    MaterialRevisionJson materialRevision(@PathVariable("id") long id, @PathVariable("n") int n) {
        return revisions.materialRevision(id, n).map(MaterialRevisionJson::of)
                .orElseThrow(() -> new NotFoundException("revision " + n + " of material", id));
    }

    @PostMapping("/api/materials/{id}/revisions")
    ResponseEntity<MaterialRevisionJson> correctMaterial(@PathVariable("id") long id,
                                                         @RequestBody Map<String, Object> body) {
        MaterialRevision r = curation.correct(id, SampleCorrectionForm.material(SampleCorrectionForm.ofValues(body)));
        return ResponseEntity.created(URI.create("/api/materials/" + id + "/revisions/" + r.revision()))
                .body(MaterialRevisionJson.of(r));
    }

    @GetMapping("/api/materials/retired")
    List<RetiredMaterialJson> retiredMaterials() {
        return revisions.retiredMaterials().stream()
                .map(m -> new RetiredMaterialJson(MaterialResponses.instant(m.retiredAt()), MaterialSummary.of(m)))
                .toList();
    }

    private RetirementJson json(Retirement r) {
        boolean inUse = r.retiredAt() == null;
        String note = null;
        if (r.kind() == Kind.SAMPLE) {
            SampleInfo s = library.findSample(r.id()).orElseThrow();
            Material m = library.findMaterial(s.materialId()).orElseThrow();
            if (inUse && m.retired()) {
                inUse = false;
                note = "restored, but still hidden: its material " + m.id() + " (" + m.name() + ") is retired;"
                        + " restore the material to bring it back";
            }
        }
        return new RetirementJson(r.kind().label(), r.id(), MaterialResponses.instant(r.retiredAt()), inUse, r.changed(),
                note);
    }

    private static Kind kind(String kinds) {
        return kinds.equals("samples") ? Kind.SAMPLE : Kind.MATERIAL;
    }
}
