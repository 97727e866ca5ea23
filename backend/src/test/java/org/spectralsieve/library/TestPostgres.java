package org.spectralsieve.library;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Locale;
import org.springframework.test.context.DynamicPropertyRegistry;

/**
 * The PostgreSQL database the shared-server tests run on: named by {@code SIEVE_TEST_POSTGRES_URL} (CI
 * creates a fresh one), with {@code SIEVE_TEST_POSTGRES_USER} / {@code _PASSWORD} defaulting to sieve/sieve.
 * The tests using it are enabled only when the URL is set.
 *
 * <p>Tests that need an empty library, or count rows, take a schema of their own ({@link #freshSchema}): the
 * same database is shared by every test class of a run, and by earlier runs on a developer's machine.
 */
public final class TestPostgres {

    public static final String URL_VARIABLE = "SIEVE_TEST_POSTGRES_URL";

    private TestPostgres() {
    }

    /** Points the application's data source at that database. */
    public static void register(DynamicPropertyRegistry registry) {
        registry.add("spring.datasource.url", TestPostgres::url);
        credentialsAndSmallPool(registry);
    }

    /**
     * The test's user, and a pool that gives its connections back when idle: Spring keeps every test context
     * of a run open (its context cache), and a dozen contexts holding the default ten connections each would
     * take most of a PostgreSQL server's hundred, which the tests of a shared machine share.
     */
    private static void credentialsAndSmallPool(DynamicPropertyRegistry registry) {
        registry.add("spring.datasource.username", TestPostgres::user);
        registry.add("spring.datasource.password", TestPostgres::password);
        registry.add("spring.datasource.hikari.maximum-pool-size", () -> "4");
        registry.add("spring.datasource.hikari.minimum-idle", () -> "0");
        registry.add("spring.datasource.hikari.idle-timeout", () -> "10000");
    }

    /**
     * Points the application's data source at a new, empty schema of that database (Flyway migrates it on
     * start, the demo library loads as on a fresh H2 file): a Spring context of its own, whatever other tests
     * left in the database.
     */
    public static void registerFreshSchema(DynamicPropertyRegistry registry, String prefix) {
        String url = freshSchema(prefix);
        registry.add("spring.datasource.url", () -> url);
        credentialsAndSmallPool(registry);
    }

    /**
     * Creates a schema named after {@code prefix} and the clock, and returns the JDBC URL whose connections
     * use it ({@code currentSchema}). Left in place after the run: CI drops the whole database next time.
     */
    public static String freshSchema(String prefix) {
        String schema = (prefix + "_" + Long.toString(System.nanoTime(), 36)).toLowerCase(Locale.ROOT)
                .replaceAll("[^a-z0-9_]", "_");
        execute("CREATE SCHEMA " + schema);
        String base = url();
        return base + (base.contains("?") ? "&" : "?") + "currentSchema=" + schema;
    }

    /** One statement on the test database, outside any application (schemas, databases). */
    public static void execute(String statement) {
        try (Connection c = DriverManager.getConnection(url(), user(), password()); Statement s = c.createStatement()) {
            s.execute(statement);
        } catch (SQLException e) {
            throw new IllegalStateException("on the test PostgreSQL: " + statement, e);
        }
    }

    public static String url() {
        String url = System.getenv(URL_VARIABLE);
        if (url == null || url.isBlank()) {
            throw new IllegalStateException(URL_VARIABLE + " is not set; the test should have been skipped");
        }
        return url;
    }

    public static String user() {
        return envOr("SIEVE_TEST_POSTGRES_USER", "sieve");
    }

    public static String password() {
        return envOr("SIEVE_TEST_POSTGRES_PASSWORD", "sieve");
    }

    private static String envOr(String name, String fallback) {
        String value = System.getenv(name);
        return value == null ? fallback : value;
    }
}
