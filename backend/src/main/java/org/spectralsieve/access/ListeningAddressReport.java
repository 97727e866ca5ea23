package org.spectralsieve.access;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.web.server.context.WebServerInitializedEvent;
import org.springframework.context.ApplicationListener;

/**
 * Says in the log where the server can be reached once it listens; warns when it was opened beyond the
 * loopback interface, since the embedded tool has no accounts and anyone who reaches it can change the
 * library (in server mode it only says where it listens). Only a started web server reports, so command-line runs stay quiet.
 */
final class ListeningAddressReport implements ApplicationListener<WebServerInitializedEvent> {

    private static final Logger log = LoggerFactory.getLogger(ListeningAddressReport.class);

    private final ListeningAddress address;
    private final boolean serverMode;

    ListeningAddressReport(ListeningAddress address, boolean serverMode) {
        this.address = address;
        this.serverMode = serverMode;
    }

    @Override
    public void onApplicationEvent(WebServerInitializedEvent event) {
        int port = event.getWebServer().getPort();
        if (address.isLoopback()) {
            log.info("Listening on {} port {}: reachable from this machine only (set SIEVE_ADDRESS to open it)",
                    address.describe(), port);
            return;
        }
        if (serverMode) {
            log.info("Listening on {} port {} in server mode: every request needs a signed-in account",
                    address.describe(), port);
            return;
        }
        log.warn("Listening on {} port {}: anyone who can reach this machine can read, import into and change this"
                        + " library; there are no accounts. To share a library, run server mode (SIEVE_SERVER_MODE=true,"
                        + " on by default with the PostgreSQL profile; docs/accounts-and-roles.md), or unset"
                        + " SIEVE_ADDRESS to listen on 127.0.0.1 only.", address.describe(), port);
    }
}
