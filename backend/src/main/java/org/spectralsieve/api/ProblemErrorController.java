package org.spectralsieve.api;

import jakarta.servlet.RequestDispatcher;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.webmvc.error.ErrorController;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * Replaces the framework's error page: whatever the container forwards to the error path (a
 * {@code sendError} from a filter, a failure outside any controller) leaves as a problem detail in JSON.
 * Asked for directly ({@code GET /error}) there is no error to show, so it answers 404 like any unknown
 * address rather than inventing a 500.
 */
@RestController
class ProblemErrorController implements ErrorController {

    private static final Logger log = LoggerFactory.getLogger(ProblemErrorController.class);

    @RequestMapping("${server.error.path:/error}")
    void error(HttpServletRequest request, HttpServletResponse response) throws IOException {
        Object code = request.getAttribute(RequestDispatcher.ERROR_STATUS_CODE);
        int status = code instanceof Integer i && i >= 400 ? i : 404;
        String message = code == null ? null : (String) request.getAttribute(RequestDispatcher.ERROR_MESSAGE);
        String path = code == null ? request.getRequestURI() : (String) request.getAttribute(RequestDispatcher.ERROR_REQUEST_URI);
        Object failure = request.getAttribute(RequestDispatcher.ERROR_EXCEPTION);
        if (status >= 500 && failure instanceof Throwable t) {
            log.error("Unexpected failure while answering {}", path, t);
        }
        if (response.isCommitted()) {
            return;
        }
        response.resetBuffer();
        response.setStatus(status);
        response.setContentType(ContainerProblems.MEDIA_TYPE);
        response.setCharacterEncoding(StandardCharsets.UTF_8.name());
        response.getWriter().write(ContainerProblems.json(status, message, path));
    }
}
