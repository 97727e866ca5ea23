package org.spectralsieve.api;

import java.io.IOException;
import java.net.URI;
import java.util.List;
import org.spectralsieve.api.ImportForms.AxisForm;
import org.spectralsieve.api.ImportForms.KeepForm;
import org.spectralsieve.api.ImportForms.ReadForm;
import org.spectralsieve.api.StateResponses.SampleStates;
import org.spectralsieve.api.StateResponses.StateCurveJson;
import org.spectralsieve.api.StateResponses.StateRetirementJson;
import org.spectralsieve.api.StateResponses.StateSummary;
import org.spectralsieve.api.StateResponses.StoredStateJson;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.ImportOptions;
import org.spectralsieve.ingest.OptionText;
import org.spectralsieve.ingest.StateCurveService;
import org.spectralsieve.ingest.StateFields;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.NewStateCurve;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.StoredStateCurve;
import org.spectralsieve.states.MaterialState;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.ModelAttribute;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestPart;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.multipart.MultipartFile;

/**
 * A sample's curves in other states (aged, printed; docs/material-states.md):
 * <ul>
 *   <li>{@code POST /api/samples/{id}/states} ({@code multipart/form-data}): the file in part {@code file}, read with
 *       the import's reading fields, and the {@link StateForm}; 201 with the stored state curve, 200 with
 *       {@code duplicate: true} when the same file is already stored for the sample in that state;</li>
 *   <li>{@code GET /api/samples/{id}/states}: those in use and those retired;</li>
 *   <li>{@code GET /api/samples/{id}/states/{stateId}}: one state curve's points (never rescaled);
 *       {@code .../source-file}: the file it was read from;</li>
 *   <li>{@code POST /api/state-curves/{id}/retire}, {@code .../restore}: as a sample's retire and restore.</li>
 * </ul>
 */
@RestController
class StateController {

    private final StateCurveService states;
    private final JooqLibraryRepository library;

    StateController(StateCurveService states, JooqLibraryRepository library) {
        this.states = states;
        this.library = library;
    }

    /**
     * The state of the curve in the file, all text so that a bad value is refused naming the field: {@code state}
     * (aged | printed); aged: {@code hours} and {@code source} (an emitter's name, free text), or {@code doseJPerCm2}
     * and {@code doseNm}; printed: {@code inkLoadPercent} and/or {@code statedDensity}; optional {@code thicknessMm}
     * (default: the sample's own) and {@code notes}.
     */
    record StateForm(String state, String hours, String source, String doseJPerCm2, String doseNm,
                     String inkLoadPercent, String statedDensity, String thicknessMm, String notes) {
        MaterialState materialState() {
            return StateFields.parse(state, hours, source, doseJPerCm2, doseNm, inkLoadPercent, statedDensity);
        }
    }

    @PostMapping(path = "/api/samples/{id}/states", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    ResponseEntity<StoredStateJson> store(@PathVariable("id") long id, @RequestPart("file") MultipartFile file,
                                          @ModelAttribute StateForm form, @ModelAttribute ReadForm read,
                                          @ModelAttribute KeepForm keep, @ModelAttribute AxisForm axes)
            throws ImportException, IOException {
        // the form is checked before the file is read: a mistake in it costs no parsing
        MaterialState state = form.materialState();
        Double thickness = OptionText.thicknessOrNull("thicknessMm", form.thicknessMm());
        String notes = OptionText.paragraph("notes", form.notes(), NewStateCurve.MAX_NOTES);
        ImportOptions options = axes.applyTo(keep.applyTo(read.options()));
        StateCurveService.Result r = states.store(id, file.getOriginalFilename(), file.getBytes(), options, state,
                thickness, notes);
        StoredStateJson body = new StoredStateJson(r.sampleId(), r.materialId(), r.duplicate(),
                StateSummary.of(r.stored()), r.preview().fileName(), r.preview().format().label(),
                r.preview().pointCount(), r.preview().sha256(), r.warnings());
        if (r.duplicate()) {
            return ResponseEntity.ok(body);
        }
        return ResponseEntity.created(URI.create(body.state().curve())).body(body);
    }

    @GetMapping("/api/samples/{id}/states")
    SampleStates list(@PathVariable("id") long id) {
        library.findSample(id).orElseThrow(() -> new NotFoundException("sample", id));
        List<StoredStateCurve> all = library.findStoredStateCurves(id, true);
        return new SampleStates(id, all.stream().filter(s -> !s.retired()).map(StateSummary::of).toList(),
                all.stream().filter(StoredStateCurve::retired).map(StateSummary::of).toList());
    }

    @GetMapping("/api/samples/{id}/states/{stateId}")
    StateCurveJson curve(@PathVariable("id") long id, @PathVariable("stateId") long stateId) {
        return StateCurveJson.of(ofSample(id, stateId));
    }

    @GetMapping("/api/samples/{id}/states/{stateId}/source-file")
    ResponseEntity<byte[]> sourceFile(@PathVariable("id") long id, @PathVariable("stateId") long stateId) {
        ofSample(id, stateId);
        SourceFile f = library.findStateCurveSourceFile(stateId)
                .orElseThrow(() -> new NotFoundException("source file of state curve", stateId));
        return SourceFileDownload.of(f);
    }

    @PostMapping("/api/state-curves/{id}/retire")
    StateRetirementJson retire(@PathVariable("id") long id) {
        return json(states.setRetired(id, true));
    }

    @PostMapping("/api/state-curves/{id}/restore")
    StateRetirementJson restore(@PathVariable("id") long id) {
        return json(states.setRetired(id, false));
    }

    /** The state curve, when it is one of this sample's (a state curve asked for under another sample is not found). */
    private StoredStateCurve ofSample(long sampleId, long stateId) {
        return library.findStateCurve(stateId).filter(s -> s.sampleId() == sampleId)
                .orElseThrow(() -> new NotFoundException("state curve of sample " + sampleId + ",", stateId));
    }

    private StateRetirementJson json(JooqLibraryRepository.StateCurveRetirement r) {
        SampleInfo s = library.findSample(r.sampleId()).orElseThrow();
        boolean inUse = r.retiredAt() == null && !s.retired();
        return new StateRetirementJson("state-curve", r.id(), r.sampleId(), MaterialResponses.instant(r.retiredAt()),
                inUse, r.changed());
    }
}
