package org.spectralsieve.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import org.jooq.SQLDialect;
import org.springframework.boot.context.config.ConfigDataEnvironmentPostProcessor;
import org.springframework.boot.context.properties.bind.Binder;
import org.springframework.boot.context.properties.source.ConfigurationPropertySources;
import org.springframework.core.env.ConfigurableEnvironment;
import org.springframework.core.env.EnumerablePropertySource;
import org.springframework.core.env.PropertySource;
import org.springframework.core.env.SimpleCommandLinePropertySource;
import org.springframework.core.env.StandardEnvironment;
import org.springframework.core.env.SystemEnvironmentPropertySource;

/**
 * The settings a command reads on the plain wiring, found exactly where Spring Boot finds them: the command
 * line's {@code --name=value} settings, system properties, environment variables, then application.properties
 * (the jar's and the working folder's, and the active profile's, e.g. {@code postgres}) through Spring Boot's
 * own config-data loader, with its placeholders ({@code ${SIEVE_DB_URL:…}}) and relaxed names.
 *
 * <p>Why the rule {@link #unhonoured()}: the plain wiring builds only the data source, jOOQ and the library's
 * services, so a setting that would change what Spring's context does with them (a pool size, a jOOQ
 * settings file, a Flyway option, a log level, SPRING_APPLICATION_JSON...) is not honoured there. When any
 * such setting is present the command runs in the Spring context instead, as before; settings Spring itself
 * ignores for a command (the web server's, the API description's) do not count.
 */
final class PlainWiringSettings {

    /** System property: {@code spring} runs every command in the Spring context (the earlier way, kept to compare). */
    static final String WIRING = "sieve.cli.wiring";

    /** Read by this wiring (canonical form: lower case, without '.', '-' and '_', as relaxed binding compares). */
    private static final Set<String> HONOURED = Set.of(
            canonical("spring.datasource.url"), canonical("spring.datasource.username"),
            canonical("spring.datasource.password"), canonical("spring.jooq.sql-dialect"),
            canonical(LibraryContext.IGNORE_BACKGROUND_PREINITIALISATION));

    /** Read by Spring Boot's config-data loader itself (profiles, config locations), or only by the web server. */
    private static final List<String> HANDLED_OR_WEB_ONLY = List.of(
            "spring.profiles.", "spring.config.", "spring.mvc.", "spring.servlet.", "spring.web.");

    private final ConfigurableEnvironment environment;
    private final Binder binder;

    private PlainWiringSettings(ConfigurableEnvironment environment) {
        this.environment = environment;
        this.binder = Binder.get(environment);
    }

    /** @param commandLine {@code --name=value} settings, as the Spring context would receive them */
    static PlainWiringSettings read(List<String> commandLine) {
        StandardEnvironment environment = new StandardEnvironment();
        environment.getPropertySources().addFirst(new SimpleCommandLinePropertySource(commandLine.toArray(String[]::new)));
        ConfigDataEnvironmentPostProcessor.applyTo(environment);
        PlainWiringSettings settings = new PlainWiringSettings(environment);
        ConfigurationPropertySources.attach(environment); // relaxed names for @Value-style reads, as Spring Boot does
        return settings;
    }

    /**
     * The settings in effect that Spring's context would act on and this wiring would not: {@code spring.*}
     * and {@code logging.*} names beyond those read here, and Spring Boot's {@code debug} / {@code trace}.
     * The quiet log levels the command line passes itself are honoured ({@link #logLevels()}).
     */
    List<String> unhonoured() {
        List<String> found = new ArrayList<>();
        for (PropertySource<?> source : environment.getPropertySources()) {
            if (!(source instanceof EnumerablePropertySource<?> names)
                    || ConfigurationPropertySources.isAttachedConfigurationPropertySource(source)) {
                continue;
            }
            boolean variables = source instanceof SystemEnvironmentPropertySource;
            for (String name : names.getPropertyNames()) {
                String property = variables ? name.toLowerCase(Locale.ROOT).replace('_', '.') : name;
                if (actedOnBySpring(property) && !honoured(property) && !excludesOnlySecurity(property, names.getProperty(name))) {
                    found.add(name);
                }
            }
        }
        return found;
    }

    /**
     * application.properties excludes Spring Boot's security set-up (server mode installs its own, in the web
     * server only): the plain wiring builds no auto-configuration at all, so leaving those out changes nothing
     * for it. Any other exclusion still sends the command to the Spring context.
     */
    private static boolean excludesOnlySecurity(String property, Object value) {
        if (!canonical(property).equals(canonical("spring.autoconfigure.exclude")) || value == null) {
            return false;
        }
        return java.util.Arrays.stream(value.toString().split(",")).map(String::strip)
                .allMatch(c -> c.startsWith("org.springframework.boot.security.autoconfigure."));
    }

    private static boolean actedOnBySpring(String property) {
        return property.startsWith("spring.") || property.startsWith("logging.")
                || property.equals("debug") || property.equals("trace");
    }

    private static boolean honoured(String property) {
        if (HONOURED.contains(canonical(property)) || HANDLED_OR_WEB_ONLY.stream().anyMatch(property::startsWith)) {
            return true;
        }
        return LibraryContext.QUIET.stream().map(PlainWiringSettings::settingName).map(PlainWiringSettings::canonical)
                .anyMatch(canonical(property)::equals);
    }

    /** The quiet levels the command line sets: logger name to level. */
    static List<String[]> logLevels() {
        String prefix = "logging.level.";
        return LibraryContext.QUIET.stream().map(s -> s.substring(2).split("=", 2))
                .filter(kv -> kv[0].startsWith(prefix))
                .map(kv -> new String[] {kv[0].substring(prefix.length()), kv[1]}).toList();
    }

    private static String settingName(String argument) {
        return argument.substring(2, argument.indexOf('='));
    }

    private static String canonical(String name) {
        return name.toLowerCase(Locale.ROOT).replaceAll("[-_.]", "");
    }

    ConfigurableEnvironment environment() {
        return environment;
    }

    Optional<String> databaseUrl() {
        return Optional.ofNullable(environment.getProperty("spring.datasource.url")).filter(s -> !s.isBlank());
    }

    String databaseUser() {
        return environment.getProperty("spring.datasource.username");
    }

    String databasePassword() {
        return environment.getProperty("spring.datasource.password");
    }

    Optional<SQLDialect> dialect() {
        return binder.bind("spring.jooq.sql-dialect", SQLDialect.class).map(Optional::of).orElse(Optional.empty());
    }

    /** As {@code TextSearchConfiguration} reads it: {@code ${sieve.index.dir:}}. */
    String indexFolder() {
        return environment.getProperty("sieve.index.dir", "");
    }

    /** As {@code SearchConfiguration} reads it: {@code ${sieve.search.curve-cache-mb:128}}. */
    long curveCacheMb() {
        return environment.getProperty("sieve.search.curve-cache-mb", Long.class, 128L);
    }

    /** As {@code SearchConfiguration} reads it: {@code ${sieve.search.judgement-lanes:-1}}. */
    int judgementLanes() {
        return environment.getProperty("sieve.search.judgement-lanes", Integer.class, -1);
    }

    /** As {@code SeedProperties} binds it (default true). */
    boolean loadDemoLibraryWhenEmpty() {
        return binder.bind("sieve.seed.load-on-empty", Boolean.class).orElse(true);
    }
}
