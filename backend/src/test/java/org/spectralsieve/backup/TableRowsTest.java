package org.spectralsieve.backup;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.util.ArrayList;
import java.util.List;
import org.jooq.DSLContext;
import org.jooq.Record;
import org.jooq.SQLDialect;
import org.jooq.Table;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;

/**
 * Paging by primary key visits every row once, in key order, also for a key of two columns (as a revisions
 * table has) and across page boundaries inside one value of the first column.
 */
class TableRowsTest {

    @Test
    void everyRowOfATwoColumnKeyIsVisitedOnceInKeyOrder() throws Exception {
        try (Connection connection = DriverManager.getConnection("jdbc:h2:mem:table-rows-test", "sa", "")) {
            DSLContext db = DSL.using(connection, SQLDialect.H2);
            db.execute("CREATE TABLE pair (owner BIGINT NOT NULL, revision INTEGER NOT NULL, note VARCHAR(20),"
                    + " PRIMARY KEY (owner, revision))");
            List<String> expected = new ArrayList<>();
            for (int owner = 3; owner >= 1; owner--) { // inserted out of order on purpose
                for (int revision = 7; revision >= 1; revision--) {
                    db.execute("INSERT INTO pair VALUES (?, ?, ?)", owner, revision, owner + "." + revision);
                }
            }
            for (int owner = 1; owner <= 3; owner++) {
                for (int revision = 1; revision <= 7; revision++) {
                    expected.add(owner + "." + revision);
                }
            }
            Table<?> pair = db.meta().getTables("PAIR").get(0);

            List<String> seen = new ArrayList<>();
            TableRows.forEach(db, pair, (Record row) -> seen.add(row.get("NOTE", String.class)));

            assertThat(expected.size()).isGreaterThan(2 * TableRows.PAGE_ROWS);
            assertThat(seen).isEqualTo(expected);
        }
    }
}
