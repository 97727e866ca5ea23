package org.spectralsieve.library;

import java.util.UUID;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;

/** A fresh in-memory H2 database with every migration applied, for tests of the stores without Spring. */
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
}
