package org.spectralsieve.accounts;

import org.springframework.boot.diagnostics.AbstractFailureAnalyzer;
import org.springframework.boot.diagnostics.FailureAnalysis;

/** Turns the refusal of {@link ServerModeGuard} into Spring Boot's short start-up report instead of a stack trace. */
class ServerModeFailureAnalyzer extends AbstractFailureAnalyzer<ServerModeRequiredException> {

    @Override
    protected FailureAnalysis analyze(Throwable rootFailure, ServerModeRequiredException cause) {
        return new FailureAnalysis(cause.getMessage(), "Start with SIEVE_SERVER_MODE=true, then create the first admin"
                + " with: java -jar backend-*.jar add-account --name NAME --role admin --db-url JDBC-URL", cause);
    }
}
