package org.spectralsieve.api;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.Map;
import org.spectralsieve.backup.ArchiveRefusedException;
import org.spectralsieve.backup.LibraryBackup;
import org.spectralsieve.backup.LibraryNotEmptyException;
import org.spectralsieve.backup.LibraryRestore;
import org.spectralsieve.backup.RestoreFailedException;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestPart;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.multipart.MultipartFile;
import org.springframework.web.servlet.mvc.method.annotation.StreamingResponseBody;

/**
 * Backup and restore over HTTP (see docs/backup.md):
 * <ul>
 *   <li>{@code GET /api/backup}: the whole library as one zip archive, streamed as it is read;</li>
 *   <li>{@code POST /api/restore}: an archive into an empty library, either {@code multipart/form-data} with
 *       the archive in part {@code file} (within the upload limit, {@code sieve.imports.max-file-bytes}) or
 *       the archive itself as the body with {@code Content-Type: application/zip} (up to
 *       {@code sieve.backup.max-restore-bytes}, for archives larger than an upload).</li>
 * </ul>
 * Either way the archive is kept in a temporary file while it is checked and loaded, never in memory.
 */
@RestController
class BackupController {

    private final LibraryBackup backup;
    private final LibraryRestore restore;
    private final long maxRestoreBytes;

    BackupController(LibraryBackup backup, LibraryRestore restore,
                     @Value("${sieve.backup.max-restore-bytes:4294967296}") long maxRestoreBytes) {
        this.backup = backup;
        this.restore = restore;
        this.maxRestoreBytes = maxRestoreBytes;
    }

    @GetMapping("/api/backup")
    ResponseEntity<StreamingResponseBody> download() {
        String fileName = LibraryBackup.suggestedFileName(Instant.now());
        return ResponseEntity.ok()
                .contentType(MediaType.parseMediaType("application/zip"))
                .header(HttpHeaders.CONTENT_DISPOSITION, ContentDisposition.attachment().filename(fileName).build().toString())
                .body(backup::write);
    }

    @PostMapping(path = "/api/restore", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    Map<String, Object> restoreUpload(@RequestPart("file") MultipartFile file) throws IOException {
        Path archive = Files.createTempFile("sieve-restore-", ".zip");
        try {
            file.transferTo(archive);
            return answer(restore.restore(archive));
        } finally {
            Files.deleteIfExists(archive);
        }
    }

    @PostMapping(path = "/api/restore", consumes = "application/zip")
    Map<String, Object> restoreBody(InputStream body) throws IOException {
        Path archive = Files.createTempFile("sieve-restore-", ".zip");
        try {
            copyAtMost(body, archive);
            return answer(restore.restore(archive));
        } finally {
            Files.deleteIfExists(archive);
        }
    }

    private void copyAtMost(InputStream body, Path archive) throws IOException {
        byte[] buffer = new byte[64 * 1024];
        long total = 0;
        try (OutputStream out = Files.newOutputStream(archive)) {
            for (int n = body.read(buffer); n >= 0; n = body.read(buffer)) {
                total += n;
                if (total > maxRestoreBytes) {
                    throw new ArchiveTooLargeException(maxRestoreBytes);
                }
                out.write(buffer, 0, n);
            }
        }
    }

    private static Map<String, Object> answer(LibraryRestore.Summary summary) {
        Map<String, Object> body = new LinkedHashMap<>();
        body.put("restored", true);
        body.put("schemaVersion", summary.schemaVersion());
        body.put("rows", summary.rowsByTable());
        body.put("curvesChecked", summary.curves());
        return body;
    }

    static final class ArchiveTooLargeException extends RuntimeException {
        final long maxBytes;

        ArchiveTooLargeException(long maxBytes) {
            super("the archive is larger than the " + maxBytes + " bytes allowed (sieve.backup.max-restore-bytes)");
            this.maxBytes = maxBytes;
        }
    }

    @ExceptionHandler(ArchiveRefusedException.class)
    ProblemDetail refused(ArchiveRefusedException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.BAD_REQUEST, "Archive refused", e.getMessage(),
                "archive-refused");
        problem.setProperty("entry", e.entry());
        if (e.line() > 0) {
            problem.setProperty("line", e.line());
        }
        return problem;
    }

    @ExceptionHandler(LibraryNotEmptyException.class)
    ProblemDetail notEmpty(LibraryNotEmptyException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.CONFLICT, "Library not empty", e.getMessage()
                + ". Start the server on a new database with --sieve.seed.load-on-empty=false and restore before"
                + " importing anything.", "library-not-empty");
        problem.setProperty("rows", e.rowsByTable());
        return problem;
    }

    @ExceptionHandler(RestoreFailedException.class)
    ProblemDetail failed(RestoreFailedException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.UNPROCESSABLE_CONTENT, "Archive not restored",
                e.getMessage(), "restore-failed");
        problem.setProperty("entry", e.entry());
        if (e.line() > 0) {
            problem.setProperty("line", e.line());
        }
        return problem;
    }

    @ExceptionHandler(ArchiveTooLargeException.class)
    ProblemDetail tooLarge(ArchiveTooLargeException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.CONTENT_TOO_LARGE, "Archive too large", e.getMessage(),
                "restore-limit");
        problem.setProperty("setting", "sieve.backup.max-restore-bytes");
        problem.setProperty("maxBytes", e.maxBytes);
        return problem;
    }
}
