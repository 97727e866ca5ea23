package org.spectralsieve.api;

import java.util.List;
import org.spectralsieve.spectra.ReferenceSpectrumRepository;
import org.spectralsieve.spectra.SpectrumImportService;
import org.spectralsieve.spectra.SpectrumKind;
import org.spectralsieve.spectra.UnknownSpectrumException;
import org.springframework.http.HttpStatus;
import org.springframework.http.ProblemDetail;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/**
 * Retired imported emitters and responses (docs/undo.md): {@code DELETE /api/{kinds}/{name}} retires one
 * ({@link ReferenceSpectrumController}); here they are listed and restored.
 * <ul>
 *   <li>{@code GET /api/{kinds}/retired}: the retired ones, most recent first, each with its id;</li>
 *   <li>{@code POST /api/{kinds}/{name}/restore} (optional {@code id} when several retired ones had the
 *       name): 200 with the spectrum back in use; 400 naming {@code name} when one in use holds the name.</li>
 * </ul>
 */
@RestController
class RetiredSpectrumController {

    private static final String KINDS = "/api/{kinds:emitters|responses}";

    private final SpectrumImportService imports;
    private final ReferenceSpectrumRepository stored;

    RetiredSpectrumController(SpectrumImportService imports, ReferenceSpectrumRepository stored) {
        this.imports = imports;
        this.stored = stored;
    }

    record RetiredJson(long id, String kind, String name, String description, String sourceFileName, String sha256,
                       String createdAt, String retiredAt) {
        static RetiredJson of(ReferenceSpectrumRepository.Retired r) {
            return new RetiredJson(r.id(), r.kind().label(), r.name(), r.description(), r.sourceFileName(),
                    r.sourceSha256(), String.valueOf(r.createdAt()), String.valueOf(r.retiredAt()));
        }
    }

    record RestoredJson(long id, String kind, String name, String sha256, boolean inUse) {
    }

    @GetMapping(KINDS + "/retired")
    List<RetiredJson> retired(@PathVariable("kinds") String kinds) {
        return stored.findRetired(SpectrumKind.parse(kinds)).stream().map(RetiredJson::of).toList();
    }

    @PostMapping(KINDS + "/{name}/restore")
    RestoredJson restore(@PathVariable("kinds") String kinds, @PathVariable("name") String name,
                         @RequestParam(name = "id", required = false) Long id) {
        var s = imports.restore(SpectrumKind.parse(kinds), name, id);
        return new RestoredJson(s.id(), s.kind().label(), s.name(), s.sourceSha256(), true);
    }

    @ExceptionHandler(UnknownSpectrumException.class)
    ProblemDetail unknownSpectrum(UnknownSpectrumException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.NOT_FOUND, "Not found", e.getMessage(), "not-found");
        problem.setProperty("resource", e.kind().label());
        problem.setProperty("name", e.name());
        return problem;
    }
}
