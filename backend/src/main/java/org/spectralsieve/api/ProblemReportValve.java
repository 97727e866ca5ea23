package org.spectralsieve.api;

import java.io.IOException;
import java.io.Writer;
import java.util.concurrent.atomic.AtomicBoolean;
import org.apache.catalina.connector.Request;
import org.apache.catalina.connector.Response;
import org.apache.catalina.valves.ErrorReportValve;
import org.apache.coyote.ActionCode;

/**
 * The servlet container's last word on a failed request, for requests it refuses before the application
 * sees them (an encoded slash in the path, a malformed URI, a bad Host, an unmapped method) or that end
 * in an error no application code answered: instead of the container's HTML page, an RFC 9457 problem
 * detail in JSON, as every other error of the API. No server name, version or stack trace is shown.
 */
public final class ProblemReportValve extends ErrorReportValve {

    public ProblemReportValve() {
        setShowReport(false);
        setShowServerInfo(false);
    }

    @Override
    protected void report(Request request, Response response, Throwable throwable) {
        int status = response.getStatus();
        // the same conditions as the container's own report: an error, nothing written yet, I/O still possible
        if (status < 400 || response.getContentWritten() > 0) {
            return;
        }
        AtomicBoolean ioAllowed = new AtomicBoolean(true);
        response.getCoyoteResponse().action(ActionCode.IS_IO_ALLOWED, ioAllowed);
        if (!ioAllowed.get()) {
            return;
        }
        String json = ContainerProblems.json(status, response.getMessage(), requestPath(request));
        try {
            try {
                response.setContentType(ContainerProblems.MEDIA_TYPE);
                response.setCharacterEncoding("UTF-8");
            } catch (RuntimeException e) {
                // headers may already be fixed; the body still says what happened
            }
            Writer writer = response.getReporter();
            if (writer != null) {
                writer.write(json);
                response.finishResponse();
            }
        } catch (IOException | IllegalStateException e) {
            // the client went away or the response was closed; nothing left to tell it
        }
    }

    private static String requestPath(Request request) {
        try {
            return request.getDecodedRequestURI();
        } catch (RuntimeException e) {
            return null;
        }
    }
}
