package org.spectralsieve.api;

import java.io.IOException;
import java.net.URI;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.spectra.ImportedSpectrum;
import org.spectralsieve.spectra.ImportedSpectrumLookup;
import org.spectralsieve.spectra.ReferenceSpectrum;
import org.spectralsieve.spectra.ReferenceSpectrumRepository;
import org.spectralsieve.spectra.SpectrumImportOptions;
import org.spectralsieve.spectra.SpectrumImportService;
import org.spectralsieve.spectra.SpectrumKind;
import org.spectralsieve.spectra.UnknownSpectrumException;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.DeleteMapping;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.ModelAttribute;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestPart;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.multipart.MultipartFile;

/**
 * Imported emitters and responses over HTTP ({@code {kinds}} is {@code emitters} or {@code responses};
 * the listings themselves are {@code GET /api/emitters} and {@code GET /api/responses} in
 * {@link WeightingController}):
 * <ul>
 *   <li>{@code POST /api/{kinds}} (multipart: {@code file}, {@code name}, optional {@code description},
 *       {@code provenance} and the {@link SpectrumForm} read options): 201 with the stored spectrum;</li>
 *   <li>{@code GET /api/{kinds}/{name}}: one spectrum's summary, built-in or imported;</li>
 *   <li>{@code GET /api/{kinds}/{name}/points}: the stored points of an imported one, or a built-in one
 *       sampled on its integration step;</li>
 *   <li>{@code GET /api/{kinds}/{name}/source-file}: the original file of an imported one;</li>
 *   <li>{@code DELETE /api/{kinds}/{name}}: 204 for an imported one; 400 for a built-in one; 404 unknown.</li>
 * </ul>
 */
@RestController
class ReferenceSpectrumController {

    private static final String KINDS = "/api/{kinds:emitters|responses}";

    private final SpectrumImportService imports;
    private final ReferenceSpectrumRepository stored;
    private final ImportedSpectrumLookup spectra;

    ReferenceSpectrumController(SpectrumImportService imports, ReferenceSpectrumRepository stored,
                                ImportedSpectrumLookup spectra) {
        this.imports = imports;
        this.stored = stored;
        this.spectra = spectra;
    }

    /**
     * The import form; every field text, so a bad value is refused naming the field.
     *
     * @param valueColumn the file's value column by header name or 1-based number (needed when it has several)
     * @param xUnit       nm, um, angstrom or cm-1 instead of the header's unit
     * @param block       the JCAMP-DX block index
     */
    record SpectrumForm(String name, String description, String provenance, String format, String valueColumn,
                        String xUnit, String decimalMark, String mergeDuplicates, String block) {

        SpectrumImportOptions options() {
            return SpectrumImportOptions.parse(format, decimalMark, xUnit, valueColumn, mergeDuplicates, block);
        }
    }

    /**
     * @param rangeNm       where it counts (an emitter is cut to the tool's 100–1100 nm)
     * @param storedRangeNm the stored points' range, as imported; null for a built-in
     * @param points        stored points; null for a built-in
     */
    record SpectrumJson(String name, String kind, String origin, double[] rangeNm, double[] storedRangeNm,
                        Integer points, String description, String provenance, String valueColumn,
                        String sourceFileName, String sourceFormat, String sha256, String createdAt,
                        List<String> warnings) {

        static SpectrumJson imported(ReferenceSpectrum s, double[] rangeNm, List<String> warnings) {
            return new SpectrumJson(s.name(), s.kind().label(), "imported", rangeNm, new double[] {s.minNm(), s.maxNm()},
                    s.pointCount(), s.description(), s.provenanceNote(), s.valueColumn(), s.sourceFileName(),
                    s.sourceFormat(), s.sourceSha256(), s.createdAt() == null ? null : s.createdAt().toString(),
                    warnings);
        }

        static SpectrumJson builtIn(SpectrumKind kind, String name, double[] rangeNm, String description) {
            return new SpectrumJson(name, kind.label(), "built-in", rangeNm, null, null, description, null, null, null,
                    null, null, null, List.of());
        }
    }

    /** sampled: false when these are the stored points, true for a built-in read at {@code stepNm}. */
    record PointsJson(String name, String kind, String origin, boolean sampled, Double stepNm, double[] wavelengthsNm,
                      double[] values) {
    }

    @PostMapping(path = KINDS, consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    ResponseEntity<SpectrumJson> importSpectrum(@PathVariable("kinds") String kinds,
                                                @RequestPart(name = "file", required = false) MultipartFile file,
                                                @ModelAttribute SpectrumForm form) throws ImportException, IOException {
        SpectrumKind kind = SpectrumKind.parse(kinds);
        SpectrumImportOptions options = form.options(); // a bad option costs no parsing of the file
        if (file == null) {
            throw new ImportRequestException("file", "required: the spectrum file in multipart part 'file'");
        }
        ImportedSpectrum result = imports.importSpectrum(kind, form.name(), form.description(), form.provenance(),
                file.getOriginalFilename(), file.getBytes(), options);
        ReferenceSpectrum s = result.spectrum();
        return ResponseEntity.created(URI.create("/api/" + kind.plural() + "/" + s.name()))
                .body(SpectrumJson.imported(s, new double[] {result.usedFromNm(), result.usedToNm()}, result.warnings()));
    }

    @GetMapping(KINDS + "/{name}")
    SpectrumJson spectrum(@PathVariable("kinds") String kinds, @PathVariable("name") String name) {
        SpectrumKind kind = SpectrumKind.parse(kinds);
        String key = key(name);
        if (!spectra.isBuiltIn(kind, key)) {
            var imported = stored.find(kind, key);
            if (imported.isPresent()) {
                return SpectrumJson.imported(imported.get(), usedRange(kind, key), List.of());
            }
        }
        if (kind == SpectrumKind.EMITTER) {
            Emitter e = spectra.emitter(key).orElseThrow(() -> unknown(kind, key));
            return SpectrumJson.builtIn(kind, e.name(), new double[] {e.minNm(), e.maxNm()}, e.description());
        }
        Response r = spectra.response(key).orElseThrow(() -> unknown(kind, key));
        return SpectrumJson.builtIn(kind, r.name(), new double[] {r.minNm(), r.maxNm()}, r.description());
    }

    @GetMapping(KINDS + "/{name}/points")
    PointsJson points(@PathVariable("kinds") String kinds, @PathVariable("name") String name) {
        SpectrumKind kind = SpectrumKind.parse(kinds);
        String key = key(name);
        if (!spectra.isBuiltIn(kind, key)) {
            var imported = stored.find(kind, key);
            if (imported.isPresent()) {
                ReferenceSpectrum s = imported.get();
                return new PointsJson(s.name(), kind.label(), "imported", false, null, s.wavelengthsNm(), s.values());
            }
        }
        if (kind == SpectrumKind.EMITTER) {
            Emitter e = spectra.emitter(key).orElseThrow(() -> unknown(kind, key));
            return sampled(kind, e.name(), e.minNm(), e.maxNm(), e.stepNm(), e::powerAt);
        }
        Response r = spectra.response(key).orElseThrow(() -> unknown(kind, key));
        return sampled(kind, r.name(), r.minNm(), r.maxNm(), 1.0, r::weightAt);
    }

    @GetMapping(KINDS + "/{name}/source-file")
    ResponseEntity<byte[]> sourceFile(@PathVariable("kinds") String kinds, @PathVariable("name") String name) {
        SpectrumKind kind = SpectrumKind.parse(kinds);
        String key = key(name);
        SourceFile f = stored.findSourceFile(kind, key).orElseThrow(() -> new UnknownSpectrumException(kind, key,
                spectra.isBuiltIn(kind, key) ? "it is built in and has no source file" : ""));
        return SourceFileDownload.of(f);
    }

    @DeleteMapping(KINDS + "/{name}")
    ResponseEntity<Void> delete(@PathVariable("kinds") String kinds, @PathVariable("name") String name) {
        imports.delete(SpectrumKind.parse(kinds), name);
        return ResponseEntity.noContent().build();
    }

    @ExceptionHandler(UnknownSpectrumException.class)
    ProblemDetail unknownSpectrum(UnknownSpectrumException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.NOT_FOUND, "Not found", e.getMessage(), "not-found");
        problem.setProperty("resource", e.kind().label());
        problem.setProperty("name", e.name());
        return problem;
    }

    private double[] usedRange(SpectrumKind kind, String key) {
        if (kind == SpectrumKind.EMITTER) {
            return spectra.emitter(key).map(e -> new double[] {e.minNm(), e.maxNm()}).orElse(null);
        }
        return spectra.response(key).map(r -> new double[] {r.minNm(), r.maxNm()}).orElse(null);
    }

    private static PointsJson sampled(SpectrumKind kind, String name, double from, double to, double step,
                                      java.util.function.DoubleUnaryOperator value) {
        int n = Math.max(1, (int) Math.ceil((to - from) / step - 1e-9));
        double[] nm = new double[n + 1];
        double[] v = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            nm[i] = i == n ? to : from + i * (to - from) / n;
            v[i] = value.applyAsDouble(nm[i]);
        }
        return new PointsJson(name, kind.label(), "built-in", true, (to - from) / n, nm, v);
    }

    private UnknownSpectrumException unknown(SpectrumKind kind, String key) {
        List<String> names = new ArrayList<>();
        if (kind == SpectrumKind.EMITTER) {
            spectra.emitters().forEach(e -> names.add(e.name()));
        } else {
            spectra.responses().forEach(r -> names.add(r.name()));
        }
        return new UnknownSpectrumException(kind, key, "known: " + String.join(", ", names));
    }

    private static String key(String name) {
        return name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
    }
}
