package org.spectralsieve.access;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Map;
import tools.jackson.databind.json.JsonMapper;

/**
 * Writes an RFC 9457 problem detail from a servlet filter, where the MVC exception handlers do not reach
 * (the request is refused before the dispatcher sees it).
 */
public final class EdgeProblems {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private EdgeProblems() {
    }

    /** {@code extra} adds extension members (e.g. which header refused the request). */
    public static void write(HttpServletRequest request, HttpServletResponse response, int status, String type, String title,
                      String detail, Map<String, Object> extra) throws IOException {
        Map<String, Object> problem = new LinkedHashMap<>();
        problem.put("type", "/problems/" + type);
        problem.put("title", title);
        problem.put("status", status);
        problem.put("detail", detail);
        problem.put("instance", request.getRequestURI());
        problem.putAll(extra);
        byte[] body = JSON.writeValueAsBytes(problem);
        response.setStatus(status);
        response.setContentType("application/problem+json");
        response.setCharacterEncoding(StandardCharsets.UTF_8.name());
        response.setContentLength(body.length);
        response.getOutputStream().write(body);
    }
}
