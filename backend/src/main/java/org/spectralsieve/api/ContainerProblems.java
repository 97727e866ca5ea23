package org.spectralsieve.api;

import java.util.LinkedHashMap;
import java.util.Map;
import org.springframework.http.HttpStatus;
import tools.jackson.databind.json.JsonMapper;

/**
 * Problem details for errors that no controller answered: those the servlet container raises itself
 * (rendered by {@link ProblemReportValve}) and those forwarded to the error path
 * ({@link ProblemErrorController}). Built without Spring's message converters, so that they can be written
 * whatever the request asked to accept.
 */
final class ContainerProblems {

    static final String MEDIA_TYPE = "application/problem+json";
    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** The container's own messages are short; anything longer is cut rather than echoed back whole. */
    private static final int MAX_DETAIL = 300;

    private ContainerProblems() {
    }

    static Map<String, Object> body(int status, String message, String path) {
        HttpStatus known = HttpStatus.resolve(status);
        Map<String, Object> problem = new LinkedHashMap<>();
        problem.put("type", "/problems/" + type(status));
        problem.put("title", known == null ? "Error " + status : known.getReasonPhrase());
        problem.put("status", status);
        problem.put("detail", detail(status, message));
        if (path != null && !path.isEmpty() && path.length() <= MAX_DETAIL) {
            problem.put("instance", path);
        }
        return problem;
    }

    static String json(int status, String message, String path) {
        return JSON.writeValueAsString(body(status, message, path));
    }

    private static String type(int status) {
        return switch (status) {
            case 400 -> "bad-request";
            case 404 -> "not-found";
            case 405 -> "method-not-allowed";
            case 413 -> "import-limit";
            case 414, 431 -> "request-too-large";
            case 415 -> "unsupported-media-type";
            default -> status >= 500 ? "internal" : "request-refused";
        };
    }

    /** What the user can change; the container's message when it gave one (it never holds internals). */
    private static String detail(int status, String message) {
        String base = switch (status) {
            case 400 -> "the request cannot be read (a malformed path, an encoded slash '%2F' or backslash in it,"
                    + " a bad Host header, or headers the server does not accept)";
            case 404 -> "there is nothing at this address; the API's addresses start with /api (see the README)";
            case 405 -> "this address does not answer this method";
            case 413 -> "the request body is larger than the server accepts";
            case 414 -> "the request line (address and query string) is longer than the server accepts";
            case 431 -> "the request headers are larger than the server accepts";
            default -> status >= 500 ? "The server failed to answer this request; the failure is logged."
                    : "the request was refused";
        };
        if (status >= 500 || message == null || message.isBlank()) {
            return base;
        }
        String m = message.length() > MAX_DETAIL ? message.substring(0, MAX_DETAIL) + "…" : message;
        return base + ": " + m;
    }
}
