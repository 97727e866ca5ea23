package org.spectralsieve.api;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import org.spectralsieve.ingest.ImportGate;
import org.spectralsieve.ingest.ImportProperties;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.http.HttpHeaders;
import org.springframework.stereotype.Component;
import org.springframework.web.filter.OncePerRequestFilter;
import tools.jackson.databind.json.JsonMapper;

/**
 * Bounds the work a request may bring before any of it is done: an import (single file, batch or
 * light-source/response spectrum) needs a turn from the {@link ImportGate}, taken before its upload is
 * parsed, and a JSON body is refused by its declared length before it is read. Refusals are problem
 * details: 429 with {@code Retry-After} when the imports are busy, 413 for an oversized JSON body.
 */
@Component
@Order(Ordered.HIGHEST_PRECEDENCE + 10)
class RequestBudgetFilter extends OncePerRequestFilter {

    /** A requirement is at most 2000 characters; 64 KB holds any request body the JSON endpoints read. */
    static final long MAX_JSON_BYTES = 64 * 1024;
    private static final Set<String> IMPORT_PATHS = Set.of("/api/imports", "/api/imports/preview",
            "/api/imports/batch", "/api/emitters", "/api/responses");
    /** A file stored as a sample's curve in another state (docs/material-states.md): an import like the others. */
    private static final java.util.regex.Pattern STATE_IMPORT_PATH = java.util.regex.Pattern.compile("/api/samples/[^/]+/states");
    private static final JsonMapper JSON = JsonMapper.builder().build();

    private final ImportGate gate;
    private final long maxUploadBytes;

    RequestBudgetFilter(ImportGate gate, ImportProperties limits) {
        this.gate = gate;
        // the multipart limits follow max-file-bytes; allow for the form's boundaries and fields
        this.maxUploadBytes = limits.maxFileBytes() + 1024 * 1024;
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        if (!"POST".equals(request.getMethod())) {
            chain.doFilter(request, response);
            return;
        }
        String type = request.getContentType();
        if (type != null && type.toLowerCase(java.util.Locale.ROOT).contains("json")) {
            if (request.getContentLengthLong() > MAX_JSON_BYTES) {
                refuse(response, 413, "JSON body too large", "the request body has " + request.getContentLengthLong()
                        + " bytes; at most " + MAX_JSON_BYTES + " are read", "request-too-large", Map.of("limit", MAX_JSON_BYTES));
                return;
            }
            // a body without a length (chunked) is counted as it is read instead
            chain.doFilter(new CappedBodyRequest(request, MAX_JSON_BYTES), response);
            return;
        }
        if (!IMPORT_PATHS.contains(request.getRequestURI())
                && !STATE_IMPORT_PATH.matcher(request.getRequestURI()).matches()) {
            chain.doFilter(request, response);
            return;
        }
        ImportGate.Turn turn;
        try {
            turn = gate.enter();
        } catch (ImportGate.Busy busy) {
            drain(request, response);
            response.setHeader(HttpHeaders.RETRY_AFTER, String.valueOf(busy.retryAfterSeconds()));
            refuse(response, 429, "Too many imports at once", busy.getMessage(), "imports-busy",
                    Map.of("retryAfterSeconds", busy.retryAfterSeconds(), "inFlight", busy.inFlight(),
                            "waiting", busy.waiting()));
            return;
        }
        try (turn) {
            chain.doFilter(request, response);
        }
    }

    /**
     * Reads and discards the upload of a turned-away import (up to the upload limit, through a small buffer),
     * so that a client still sending its body receives the 429 instead of a reset connection; beyond the
     * limit the connection is closed.
     */
    private void drain(HttpServletRequest request, HttpServletResponse response) {
        byte[] buffer = new byte[64 * 1024];
        long read = 0;
        try (var in = request.getInputStream()) {
            for (int n = in.read(buffer); n >= 0; n = in.read(buffer)) {
                read += n;
                if (read > maxUploadBytes) {
                    response.setHeader(HttpHeaders.CONNECTION, "close");
                    return;
                }
            }
        } catch (IOException e) {
            response.setHeader(HttpHeaders.CONNECTION, "close");
        }
    }

    private static void refuse(HttpServletResponse response, int status, String title, String detail, String type,
                               Map<String, ?> extra) throws IOException {
        Map<String, Object> problem = new LinkedHashMap<>();
        problem.put("type", "/problems/" + type);
        problem.put("title", title);
        problem.put("status", status);
        problem.put("detail", detail);
        problem.putAll(extra);
        response.setStatus(status);
        response.setContentType(ContainerProblems.MEDIA_TYPE);
        response.setCharacterEncoding(StandardCharsets.UTF_8.name());
        response.getWriter().write(JSON.writeValueAsString(problem));
    }
}
