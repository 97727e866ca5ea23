package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.MATERIAL;

import org.flywaydb.core.Flyway;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.h2.jdbcx.JdbcDataSource;

class MigrationTest {

    @Test
    void freshDatabaseMigratesAndAnswersATypedQuery() {
        JdbcDataSource ds = new JdbcDataSource();
        ds.setURL("jdbc:h2:mem:migration-test;DB_CLOSE_DELAY=-1");
        int applied = Flyway.configure().dataSource(ds).load().migrate().migrationsExecuted;
        assertThat(applied).isPositive();

        DSLContext db = DSL.using(ds, SQLDialect.H2);
        assertThat(db.fetchCount(MATERIAL)).isZero();
    }
}
