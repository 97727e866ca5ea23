package org.spectralsieve.api;

import java.io.IOException;
import java.net.URI;
import org.spectralsieve.api.ImportForms.KeepForm;
import org.spectralsieve.api.ImportForms.AxisForm;
import org.spectralsieve.api.ImportForms.ReadForm;
import org.spectralsieve.api.ImportForms.StoreForm;
import org.spectralsieve.api.ImportResponses.PreviewResponse;
import org.spectralsieve.api.ImportResponses.StoreResponse;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.BatchImport;
import org.spectralsieve.ingest.BatchReport;
import org.spectralsieve.ingest.ImportResult;
import org.spectralsieve.ingest.ImportService;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.SourceFile;
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
 * Imports over HTTP, all {@code multipart/form-data} with the file in part {@code file}:
 * <ul>
 *   <li>{@code POST /api/imports/preview}: read the file with the {@link ReadForm} options and the {@link KeepForm}
 *       range, store nothing;</li>
 *   <li>{@code POST /api/imports}: read and store it with the {@link StoreForm} target and sample fields
 *       (201 with the new sample; 200 with {@code duplicate: true} when the same file is already stored
 *       for that material and thickness);</li>
 *   <li>{@code POST /api/imports/batch}: a zip with manifest.csv, each row in its own transaction; 200 with
 *       the per-file report (refused rows are in the report, not an error);</li>
 *   <li>{@code GET /api/samples/{id}/source-file}: the original bytes a sample was imported from.</li>
 * </ul>
 */
@RestController
class ImportController {

    private final ImportService imports;
    private final BatchImport batch;
    private final JooqLibraryRepository library;

    ImportController(ImportService imports, BatchImport batch, JooqLibraryRepository library) {
        this.imports = imports;
        this.batch = batch;
        this.library = library;
    }

    @PostMapping(path = "/api/imports/preview", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    PreviewResponse preview(@RequestPart("file") MultipartFile file, @ModelAttribute ReadForm read,
                            @ModelAttribute KeepForm keep, @ModelAttribute AxisForm axes)
            throws ImportException, IOException {
        return PreviewResponse.of(imports.preview(file.getOriginalFilename(), file.getBytes(),
                axes.applyTo(keep.applyTo(read.options()))));
    }

    @PostMapping(path = "/api/imports", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    ResponseEntity<StoreResponse> store(@RequestPart("file") MultipartFile file, @ModelAttribute ReadForm read,
                                        @ModelAttribute StoreForm store, @ModelAttribute KeepForm keep,
                                        @ModelAttribute AxisForm axes)
            throws ImportException, IOException {
        // target and fields are checked before the file is read: a form mistake costs no parsing
        var target = store.target();
        var fields = store.fields();
        ImportResult result = imports.store(file.getOriginalFilename(), file.getBytes(), axes.applyTo(keep.applyTo(read.options())),
                target, fields);
        StoreResponse body = StoreResponse.of(result);
        if (result.duplicate()) {
            return ResponseEntity.ok(body);
        }
        return ResponseEntity.created(URI.create("/api/materials/" + result.materialId())).body(body);
    }

    @PostMapping(path = "/api/imports/batch", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    BatchReport batch(@RequestPart("file") MultipartFile zip) throws ImportException, IOException {
        return batch.zip(zip.getOriginalFilename() == null ? "upload.zip" : zip.getOriginalFilename(), zip.getBytes(),
                BatchImport.Progress.NONE);
    }

    @GetMapping("/api/samples/{id}/source-file")
    ResponseEntity<byte[]> sourceFile(@PathVariable("id") long id) {
        SourceFile f = library.findSourceFile(id).orElseThrow(() -> new NotFoundException("source file of sample", id));
        return SourceFileDownload.of(f);
    }
}
