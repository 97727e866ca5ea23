package org.spectralsieve.api;

import org.spectralsieve.presets.PresetNameTakenException;
import org.spectralsieve.presets.PresetNotFoundException;
import org.spectralsieve.presets.PresetRefusedException;
import org.spectralsieve.presets.PresetTextException;
import org.spectralsieve.requirement.RequirementSyntaxException;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.http.HttpStatus;
import org.springframework.http.ProblemDetail;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;

/**
 * RFC 9457 problems for presets, each naming the field ({@code text}, {@code presets[3].name}). Ordered before
 * {@link ApiProblems}, whose catch-all would otherwise answer these as internal errors.
 */
@RestControllerAdvice
@Order(Ordered.HIGHEST_PRECEDENCE)
class PresetProblems {

    /** The parser's own account, as the search answers it, but naming the preset's field. */
    @ExceptionHandler(PresetTextException.class)
    ProblemDetail text(PresetTextException e) {
        RequirementSyntaxException s = e.syntax();
        ProblemDetail problem = ApiProblems.problem(HttpStatus.BAD_REQUEST, "Requirement not understood",
                "parameter '" + e.field() + "': " + s.getMessage(), "requirement-syntax");
        problem.setProperty("parameter", e.field());
        problem.setProperty("position", s.position());
        problem.setProperty("expected", s.expected());
        s.suggestion().ifPresent(x -> problem.setProperty("suggestion", x));
        if (!s.suggestions().isEmpty()) {
            problem.setProperty("suggestions", s.suggestions());
        }
        if (s.length() > 0) {
            problem.setProperty("length", s.length());
        }
        return problem;
    }

    @ExceptionHandler(PresetNameTakenException.class)
    ProblemDetail nameTaken(PresetNameTakenException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.CONFLICT, "Preset name taken", e.getMessage(), "preset-name-taken");
        problem.setProperty("parameter", e.field());
        problem.setProperty("name", e.name());
        return problem;
    }

    @ExceptionHandler(PresetNotFoundException.class)
    ProblemDetail notFound(PresetNotFoundException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.NOT_FOUND, "Not found", e.getMessage(), "not-found");
        problem.setProperty("resource", "preset");
        problem.setProperty("key", e.key());
        return problem;
    }

    @ExceptionHandler(PresetRefusedException.class)
    ProblemDetail refused(PresetRefusedException e) {
        ProblemDetail problem = ApiProblems.problem(HttpStatus.FORBIDDEN, "Preset cannot be changed", e.getMessage(),
                "preset-read-only");
        if (e.requiredRole() != null) {
            problem.setProperty("requiredRole", e.requiredRole());
        }
        return problem;
    }
}
