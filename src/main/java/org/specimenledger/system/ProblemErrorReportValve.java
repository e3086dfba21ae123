package org.specimenledger.system;

import java.io.IOException;
import java.io.Writer;
import java.util.concurrent.atomic.AtomicBoolean;
import org.apache.catalina.connector.Request;
import org.apache.catalina.connector.Response;
import org.apache.catalina.valves.ErrorReportValve;
import org.apache.coyote.ActionCode;

/**
 * Tomcat's last word on a request it refused before the application saw it (a request line or header
 * too long, characters a URL may not hold, an encoded slash): a short problem response instead of Tomcat's
 * HTML page, which names the server and its version.
 */
public class ProblemErrorReportValve extends ErrorReportValve {

    public ProblemErrorReportValve() {
        setShowReport(false);
        setShowServerInfo(false);
    }

    @Override
    protected void report(Request request, Response response, Throwable throwable) {
        int status = response.getStatus();
        if (status < 400 || response.getContentWritten() > 0) {
            return;
        }
        AtomicBoolean ioAllowed = new AtomicBoolean(true);
        response.getCoyoteResponse().action(ActionCode.IS_IO_ALLOWED, ioAllowed);
        if (!ioAllowed.get()) {
            return;
        }
        String title = status == 400 ? "Malformed request" : "Request refused";
        String detail = status == 400
                ? "the request line, a header or the path could not be read (too long, or characters a URL may not hold)"
                : "the server refused the request before reading it";
        String body = "{\"type\":\"" + ProblemResponses.TYPE_PREFIX + "http-" + status + "\",\"title\":\"" + title
                + "\",\"status\":" + status + ",\"detail\":\"" + detail + "\"}";
        try {
            response.setContentType("application/problem+json");
            response.setCharacterEncoding("UTF-8");
            Writer writer = response.getReporter();
            if (writer != null) {
                writer.write(body);
                response.finishResponse();
            }
        } catch (IOException | IllegalStateException e) {
            // the client is gone or the response is closed: nothing more can be said
        }
    }
}
