package org.spectralsieve.library;

import org.springframework.test.context.DynamicPropertyRegistry;

/**
 * The PostgreSQL database the shared-server tests run on: named by {@code SIEVE_TEST_POSTGRES_URL} (CI
 * creates a fresh one), with {@code SIEVE_TEST_POSTGRES_USER} / {@code _PASSWORD} defaulting to sieve/sieve.
 * The tests using it are enabled only when the URL is set.
 */
public final class TestPostgres {

    public static final String URL_VARIABLE = "SIEVE_TEST_POSTGRES_URL";

    private TestPostgres() {
    }

    /** Points the application's data source at that database. */
    public static void register(DynamicPropertyRegistry registry) {
        registry.add("spring.datasource.url", () -> System.getenv(URL_VARIABLE));
        registry.add("spring.datasource.username", () -> envOr("SIEVE_TEST_POSTGRES_USER", "sieve"));
        registry.add("spring.datasource.password", () -> envOr("SIEVE_TEST_POSTGRES_PASSWORD", "sieve"));
    }

    private static String envOr(String name, String fallback) {
        String value = System.getenv(name);
        return value == null ? fallback : value;
    }
}
