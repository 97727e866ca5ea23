package org.spectralsieve.cli;

import java.sql.SQLException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.spectralsieve.SpectralSieveApplication;
import org.springframework.boot.Banner;
import org.springframework.boot.WebApplicationType;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * The application context a command works in: the server's beans and database (Flyway migration and
 * the first-start demo library included), without the web server, and quiet on stdout so that stdout
 * carries only the command's answer.
 */
final class LibraryContext {

    /** H2's "database may be already in use" (org.h2.api.ErrorCode.DATABASE_ALREADY_OPEN_1); H2 is runtime-only here. */
    private static final int H2_DATABASE_ALREADY_OPEN = 90020;

    /**
     * Passed as command-line properties, which outrank application.properties. Logback writes to stdout, so
     * only warnings pass, and the loggers that report a failed start are silenced: the command reports the
     * failure itself, in one line instead of a stack trace.
     */
    static final List<String> QUIET = List.of(
            "--logging.level.root=WARN",
            "--logging.level.org.springframework.boot.SpringApplication=OFF",
            "--logging.level.org.springframework.boot.diagnostics=OFF",
            // the context class logs the failed refresh under its own name
            "--logging.level.org.springframework.context.annotation.AnnotationConfigApplicationContext=OFF",
            "--logging.level.com.zaxxer.hikari=OFF");

    /** Spring Boot's BackgroundPreinitializer's own switch (a system property). */
    static final String IGNORE_BACKGROUND_PREINITIALISATION = "spring.backgroundpreinitializer.ignore";

    private LibraryContext() {
    }

    /**
     * The services of a read-only command: the plain wiring when it is sure to answer as the Spring context
     * would (see {@link PlainLibraryServices}), else the Spring context. The system property
     * {@value PlainWiringSettings#WIRING}{@code =spring} always takes the context (the earlier way, kept for
     * comparison in tests and the benchmark).
     *
     * @param dbUrl a JDBC URL, or null for the server's default (SIEVE_DB_URL, else the H2 file under ./data)
     */
    static LibraryServices open(String dbUrl) {
        if (!"spring".equals(System.getProperty(PlainWiringSettings.WIRING))) {
            Optional<LibraryServices> plain = PlainLibraryServices.open(settings(dbUrl, List.of()));
            if (plain.isPresent()) {
                return plain.get();
            }
        }
        return new SpringLibraryServices(start(dbUrl));
    }

    /** @param dbUrl a JDBC URL, or null for the server's default (SIEVE_DB_URL, else the H2 file under ./data) */
    static ConfigurableApplicationContext start(String dbUrl) {
        return start(dbUrl, List.of());
    }

    /** @param settings further {@code --name=value} settings, e.g. to keep the demo library out of a restore's target */
    static ConfigurableApplicationContext start(String dbUrl, List<String> settings) {
        skipBackgroundPreinitialisation();
        List<String> args = settings(dbUrl, settings);
        try {
            return new SpringApplicationBuilder(SpectralSieveApplication.class)
                    .web(WebApplicationType.NONE)
                    .bannerMode(Banner.Mode.OFF)
                    .logStartupInfo(false)
                    .run(args.toArray(String[]::new));
        } catch (RuntimeException e) {
            if (heldByAnotherProcess(e)) {
                throw new CliFailure(SieveCli.FAILED, List.of(
                        "the library database is in use by another process (is the Spectral Sieve server running?)",
                        "An H2 file database opens in one process at a time: stop the server, or use its HTTP API,"
                                + " or give another database with --db-url."));
            }
            throw new CliFailure(SieveCli.FAILED, "cannot open the library: " + rootMessage(e));
        }
    }

    /** The command-line settings the context is started with: quiet logging, then {@code settings}, then the URL. */
    private static List<String> settings(String dbUrl, List<String> settings) {
        List<String> args = new ArrayList<>(QUIET);
        args.addAll(settings);
        if (dbUrl != null) {
            args.add("--spring.datasource.url=" + dbUrl);
        }
        return args;
    }

    /**
     * Spring Boot warms Jackson, the validator, Tomcat's and other classes on a second thread while the
     * context starts, so that a web server's first request finds them ready. A command uses few of them and
     * exits within seconds: on a two-core machine that thread only competes with the command for the CPU
     * (about 0.1-0.2 s of CPU per call measured, docs/command-line-start-up.md). Spring reads this switch as a
     * system property only; a value the user set is kept.
     */
    private static void skipBackgroundPreinitialisation() {
        if (System.getProperty(IGNORE_BACKGROUND_PREINITIALISATION) == null) {
            System.setProperty(IGNORE_BACKGROUND_PREINITIALISATION, "true");
        }
    }

    private static boolean heldByAnotherProcess(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
            if (t instanceof SQLException sql && sql.getErrorCode() == H2_DATABASE_ALREADY_OPEN) {
                return true;
            }
        }
        return false;
    }

    static String rootMessage(Throwable e) {
        Throwable t = e;
        while (t.getCause() != null && t.getCause() != t) {
            t = t.getCause();
        }
        return t.getMessage() == null ? t.getClass().getSimpleName() : t.getMessage();
    }
}
