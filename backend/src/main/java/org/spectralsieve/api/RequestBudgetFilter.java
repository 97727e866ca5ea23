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
    private static final JsonMapper JSON = JsonMapper.builder().build();

    private final ImportGate gate;

    RequestBudgetFilter(ImportGate gate) {
        this.gate = gate;
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        if (!"POST".equals(request.getMethod())) {
            chain.doFilter(request, response);
            return;
        }
        String type = request.getContentType();
        if (type != null && type.toLowerCase(java.util.Locale.ROOT).contains("json")
                && request.getContentLengthLong() > MAX_JSON_BYTES) {
            refuse(response, 413, "JSON body too large", "the request body has " + request.getContentLengthLong()
                    + " bytes; at most " + MAX_JSON_BYTES + " are read", "request-too-large", Map.of("limit", MAX_JSON_BYTES));
            return;
        }
        if (!IMPORT_PATHS.contains(request.getRequestURI())) {
            chain.doFilter(request, response);
            return;
        }
        ImportGate.Turn turn;
        try {
            turn = gate.enter();
        } catch (ImportGate.Busy busy) {
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
        // the body of a refused upload is not read; the connection is closed rather than drained
        response.setHeader(HttpHeaders.CONNECTION, "close");
        response.getWriter().write(JSON.writeValueAsString(problem));
    }
}
