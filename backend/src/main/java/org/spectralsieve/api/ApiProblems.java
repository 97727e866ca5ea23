package org.spectralsieve.api;

import java.net.URI;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.ImportLimitException;
import org.spectralsieve.ingest.ImportProperties;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.IngestException;
import org.spectralsieve.library.FieldException;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.UnusableRecordException;
import org.spectralsieve.optics.UnusableIndexException;
import org.spectralsieve.library.RetiredException;
import org.spectralsieve.library.NotRescalableException;
import org.spectralsieve.requirement.RequirementSyntaxException;
import org.spectralsieve.requirement.RequirementTooLargeException;
import org.spectralsieve.search.LayerResolutionException;
import org.spectralsieve.spectrum.CurveException;
import org.springframework.beans.TypeMismatchException;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.HttpStatusCode;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.http.converter.HttpMessageNotReadableException;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;
import org.springframework.web.context.request.WebRequest;
import org.springframework.web.method.annotation.MethodArgumentTypeMismatchException;
import org.springframework.web.multipart.MaxUploadSizeExceededException;
import org.springframework.web.servlet.mvc.method.annotation.ResponseEntityExceptionHandler;
import tools.jackson.core.JacksonException;
import tools.jackson.core.TokenStreamLocation;

/**
 * Every error leaves the API as an RFC 9457 problem detail. A user's mistake is a 4xx that says what
 * to change; only a fault of ours becomes a 500, and then without internals.
 */
@RestControllerAdvice
class ApiProblems extends ResponseEntityExceptionHandler {

    private static final Logger log = LoggerFactory.getLogger(ApiProblems.class);

    private final ImportProperties importLimits;

    ApiProblems(ImportProperties importLimits) {
        this.importLimits = importLimits;
    }

    /** A file that cannot be read: where exactly, so the user can open it at that line. */
    @ExceptionHandler(ImportException.class)
    ProblemDetail unreadable(ImportException e) {
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "File cannot be read", e.getMessage(), "bad-file");
        problem.setProperty("file", e.sourceName());
        problem.setProperty("line", e.line() == 0 ? null : e.line());
        problem.setProperty("field", e.field());
        problem.setProperty("problem", e.problem());
        return problem;
    }

    @ExceptionHandler(ImportLimitException.class)
    ProblemDetail beyondLimit(ImportLimitException e) {
        HttpStatus status = e.kind() == ImportLimitException.Kind.SIZE || e.kind() == ImportLimitException.Kind.RATIO
                ? HttpStatus.CONTENT_TOO_LARGE : HttpStatus.BAD_REQUEST;
        String type = e.kind() == ImportLimitException.Kind.PATH ? "unsafe-path" : "import-limit";
        ProblemDetail problem = problem(status, e.kind() == ImportLimitException.Kind.PATH ? "Path outside the upload"
                : "Import limit exceeded", e.getMessage(), type);
        problem.setProperty("file", e.sourceName());
        problem.setProperty("setting", e.setting());
        return problem;
    }

    @ExceptionHandler(ImportRequestException.class)
    ProblemDetail badImportField(ImportRequestException e) {
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Bad parameter", "parameter " + e.getMessage(), "bad-parameter");
        problem.setProperty("parameter", e.field());
        return problem;
    }

    /** Thrown by the multipart parser before any controller runs; the cap is ours, so name it. */
    @Override
    protected ResponseEntity<Object> handleMaxUploadSizeExceededException(MaxUploadSizeExceededException e,
            HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        ProblemDetail problem = problem(HttpStatus.CONTENT_TOO_LARGE, "Upload too large", "the upload is larger than the "
                + importLimits.maxFileBytes() + " bytes allowed (sieve.imports.max-file-bytes)", "import-limit");
        problem.setProperty("setting", "sieve.imports.max-file-bytes");
        problem.setProperty("maxBytes", importLimits.maxFileBytes());
        return ResponseEntity.status(HttpStatus.CONTENT_TOO_LARGE).body(problem);
    }

    @ExceptionHandler(NotFoundException.class)
    ProblemDetail notFound(NotFoundException e) {
        ProblemDetail problem = problem(HttpStatus.NOT_FOUND, "Not found", e.getMessage(), "not-found");
        problem.setProperty("resource", e.what());
        problem.setProperty("id", e.id());
        return problem;
    }

    /** Acting on something retired (importing into a retired material): restore it first (docs/undo.md). */
    @ExceptionHandler(RetiredException.class)
    ProblemDetail retired(RetiredException e) {
        ProblemDetail problem = problem(HttpStatus.CONFLICT, "Retired", e.getMessage(), "retired");
        problem.setProperty("resource", e.what());
        problem.setProperty("id", e.key());
        problem.setProperty("retiredAt", e.retiredAt().toString());
        return problem;
    }

    @ExceptionHandler(BadParameterException.class)
    ProblemDetail badParameter(BadParameterException e) {
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Bad parameter", e.getMessage(), "bad-parameter");
        problem.setProperty("parameter", e.parameter());
        return problem;
    }

    /** Light at an angle asked of a sample whose normal-incidence curve cannot say how it behaves there. */
    @ExceptionHandler(NotAtAngleException.class)
    ProblemDetail notAtAngle(NotAtAngleException e) {
        ProblemDetail problem = problem(HttpStatus.valueOf(422), "Not computed at an angle", e.getMessage(), "not-at-angle");
        problem.setProperty("parameter", e.parameter());
        return problem;
    }

    @ExceptionHandler(NotRescalableException.class)
    ProblemDetail notRescalable(NotRescalableException e) {
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Sample cannot be rescaled", e.getMessage(), "not-rescalable");
        problem.setProperty("parameter", "thicknessMm");
        return problem;
    }

    @ExceptionHandler(IngestException.class)
    ProblemDetail unreadableFile(IngestException e) {
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "File cannot be stored", e.getMessage(), "bad-file");
        problem.setProperty("file", e.sourceName());
        problem.setProperty("field", e.field());
        return problem;
    }

    @ExceptionHandler(RequirementSyntaxException.class)
    ProblemDetail requirementSyntax(RequirementSyntaxException e) {
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Requirement not understood", e.getMessage(), "requirement-syntax");
        problem.setProperty("parameter", "requirement");
        problem.setProperty("position", e.position());
        problem.setProperty("expected", e.expected());
        e.suggestion().ifPresent(s -> problem.setProperty("suggestion", s));
        if (!e.suggestions().isEmpty()) {
            problem.setProperty("suggestions", e.suggestions());
        }
        if (e.length() > 0) {
            problem.setProperty("length", e.length());
        }
        return problem;
    }

    /** Refused before parsing or searching: says which bound and how far over it the request is. */
    @ExceptionHandler(RequirementTooLargeException.class)
    ProblemDetail requirementTooLarge(RequirementTooLargeException e) {
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Requirement too large", e.getMessage(), "requirement-too-large");
        problem.setProperty("parameter", "requirement");
        problem.setProperty("measure", e.measure().name().toLowerCase(java.util.Locale.ROOT));
        problem.setProperty("limit", e.limit());
        problem.setProperty("actual", e.actual());
        return problem;
    }

    /** A fixed layer naming no single library sample: the choices, and a slug to write when one is likely. */
    @ExceptionHandler(LayerResolutionException.class)
    ProblemDetail layerUnresolved(LayerResolutionException e) {
        String title = switch (e.reason()) {
            case UNKNOWN -> "Layer material not found";
            case AMBIGUOUS -> "Layer material ambiguous";
            case THICKNESS -> "Layer not measured at that thickness";
        };
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, title, e.getMessage(), "layer-material");
        problem.setProperty("parameter", "requirement.layer");
        problem.setProperty("layer", e.words());
        problem.setProperty("choices", e.choices().stream().map(c -> java.util.Map.of("slug", c.slug(), "name", c.name(),
                "detail", c.detail())).toList());
        if (e.reason() != LayerResolutionException.Reason.THICKNESS && !e.choices().isEmpty()) {
            problem.setProperty("suggestions", e.choices().stream().map(LayerResolutionException.Choice::slug).toList());
            if (e.reason() == LayerResolutionException.Reason.UNKNOWN) {
                problem.setProperty("suggestion", e.choices().get(0).slug());
            }
        }
        if (e.position() >= 0) {
            problem.setProperty("position", e.position());
            problem.setProperty("length", e.length());
        }
        return problem;
    }

    /** The core refuses a computation on request data, e.g. a resampling grid beyond the measured range. */
    @ExceptionHandler(CurveException.class)
    ProblemDetail curveRefused(CurveException e) {
        return problem(HttpStatus.BAD_REQUEST, "Curve cannot be computed as asked", e.getMessage(), "curve-refused");
    }

    /**
     * A stored record the request needs fails today's checks (docs/validation.md): 409, the state of the
     * library conflicts with the request, and the detail names the record and why; the record stays readable.
     */
    @ExceptionHandler({UnusableRecordException.class, UnusableIndexException.class})
    ProblemDetail unusableRecord(RuntimeException e) {
        return problem(HttpStatus.CONFLICT, "Stored record cannot be used", e.getMessage(), "stored-record-unusable");
    }

    /** A value of a record to be stored lies outside what may be stored; names the field. */
    @ExceptionHandler(FieldException.class)
    ProblemDetail badStoredField(FieldException e) {
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Bad parameter", "parameter '" + e.field() + "': "
                + e.getMessage(), "bad-parameter");
        problem.setProperty("parameter", e.field());
        return problem;
    }

    /**
     * A body that is not JSON, or JSON of the wrong shape: where the parser stopped (line and column of
     * the body, from the parser's own location) and what it expected there.
     */
    @Override
    protected ResponseEntity<Object> handleHttpMessageNotReadable(HttpMessageNotReadableException e, HttpHeaders headers,
                                                                  HttpStatusCode status, WebRequest request) {
        JacksonException parse = null;
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof JsonBodyTooLargeException tooLarge) {
                ProblemDetail problem = problem(HttpStatus.CONTENT_TOO_LARGE, "JSON body too large", tooLarge.getMessage(),
                        "request-too-large");
                problem.setProperty("limit", RequestBudgetFilter.MAX_JSON_BYTES);
                return ResponseEntity.status(HttpStatus.CONTENT_TOO_LARGE).body(problem);
            }
            if (parse == null && t instanceof JacksonException j) {
                parse = j;
            }
        }
        if (parse == null) {
            ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Body cannot be read",
                    "the request body is missing or cannot be read as JSON", "bad-json");
            return ResponseEntity.badRequest().body(problem);
        }
        TokenStreamLocation where = parse.getLocation();
        String what = parse.getOriginalMessage() == null ? "not valid JSON" : parse.getOriginalMessage();
        // the parser's message may quote a long stretch of the body; the position says enough
        what = what.length() > 300 ? what.substring(0, 300) + "…" : what;
        boolean located = where != null && where.getLineNr() > 0;
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Body is not valid JSON",
                (located ? "line " + where.getLineNr() + ", column " + where.getColumnNr() + ": " : "") + what, "bad-json");
        if (located) {
            problem.setProperty("line", where.getLineNr());
            problem.setProperty("column", where.getColumnNr());
        }
        String pointer = parse.getPathReference();
        if (pointer != null && !pointer.isEmpty() && parse.getPath() != null && !parse.getPath().isEmpty()) {
            problem.setProperty("field", pointer);
        }
        return ResponseEntity.badRequest().body(problem);
    }

    @ExceptionHandler(Exception.class)
    ProblemDetail unexpected(Exception e) {
        log.error("Unexpected failure while answering a request", e);
        return problem(HttpStatus.INTERNAL_SERVER_ERROR, "Internal error",
                "The server failed to answer this request; the failure is logged.", "internal");
    }

    @Override
    protected ResponseEntity<Object> handleTypeMismatch(TypeMismatchException e, HttpHeaders headers,
                                                        HttpStatusCode status, WebRequest request) {
        String name = e instanceof MethodArgumentTypeMismatchException m ? m.getName() : e.getPropertyName();
        String expected = e.getRequiredType() == null ? "another type" : describe(e.getRequiredType());
        ProblemDetail problem = problem(HttpStatus.BAD_REQUEST, "Bad parameter",
                "parameter '" + name + "': expected " + expected + ", got '" + e.getValue() + "'", "bad-parameter");
        problem.setProperty("parameter", name);
        return ResponseEntity.badRequest().body(problem);
    }

    private static String describe(Class<?> type) {
        if (type == Double.class || type == double.class) {
            return "a number";
        }
        if (type == Long.class || type == long.class || type == Integer.class || type == int.class) {
            return "a whole number";
        }
        return type.getSimpleName();
    }

    static ProblemDetail problem(HttpStatus status, String title, String detail, String type) {
        ProblemDetail problem = ProblemDetail.forStatusAndDetail(status, detail);
        problem.setTitle(title);
        problem.setType(URI.create("/problems/" + type));
        return problem;
    }
}
