package org.spectralsieve.accounts;

import org.springframework.boot.EnvironmentPostProcessor;
import org.springframework.boot.SpringApplication;
import org.springframework.core.Ordered;
import org.springframework.core.env.ConfigurableEnvironment;
import org.springframework.core.env.Profiles;

/**
 * A shared library (the postgres profile) without accounts would let anyone who reaches it change it, so that
 * combination does not start: the server, and the command line on the same settings, stop with one line
 * ({@link ServerModeFailureAnalyzer}) before any database is opened. Runs once the settings and profiles are
 * read (registered in META-INF/spring.factories).
 */
class ServerModeGuard implements EnvironmentPostProcessor, Ordered {

    @Override
    public void postProcessEnvironment(ConfigurableEnvironment environment, SpringApplication application) {
        if (environment.acceptsProfiles(Profiles.of("postgres"))
                && !environment.getProperty("sieve.server-mode", Boolean.class, false)) {
            throw new ServerModeRequiredException();
        }
    }

    @Override
    public int getOrder() {
        return Ordered.LOWEST_PRECEDENCE; // after the config data (application*.properties) has been read
    }
}
