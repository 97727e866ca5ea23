package org.spectralsieve.library;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.util.UUID;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;

/**
 * A fresh in-memory H2 database with every migration applied, for tests of the stores without Spring; or, for
 * their second run on PostgreSQL, a fresh schema of the test database.
 */
public final class MigratedDatabase {

    private MigratedDatabase() {
    }

    /** A new database of its own (a random name), kept while the JVM runs, migrated to the latest version. */
    public static DSLContext freshH2() {
        JdbcDataSource ds = new JdbcDataSource();
        ds.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(ds).load().migrate();
        return DSL.using(ds, SQLDialect.H2);
    }

    /** The pool of the last PostgreSQL schema handed out: closed when the next is asked for (one test at a time). */
    private static HikariDataSource lastPostgres;

    /**
     * A new schema of the PostgreSQL test database ({@link TestPostgres}), migrated to the latest version, behind a
     * small pool of its own. Each call closes the previous call's pool, so a test class that takes one per test
     * holds at most four connections of the shared server.
     */
    public static synchronized DSLContext freshPostgres(String prefix) {
        if (lastPostgres != null) {
            lastPostgres.close();
        }
        HikariConfig config = new HikariConfig();
        config.setJdbcUrl(TestPostgres.freshSchema(prefix));
        config.setUsername(TestPostgres.user());
        config.setPassword(TestPostgres.password());
        config.setMaximumPoolSize(4);
        config.setMinimumIdle(0);
        lastPostgres = new HikariDataSource(config);
        Flyway.configure().dataSource(lastPostgres).load().migrate();
        DSLContext db = DSL.using(lastPostgres, SQLDialect.POSTGRES);
        LibraryConfiguration.renderNamesUnquoted(db.configuration()); // as the application runs on PostgreSQL
        return db;
    }
}
