package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import org.h2.jdbcx.JdbcDataSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The write delay an H2 file database runs with, after the start-up check. H2's documented default is
 * 500 ms (H2 reference, "SET WRITE_DELAY"); 0 makes each commit store the file before it returns. The
 * crash test (crash.AnsweredImportsSurviveKillTest) shows what each value means for a killed process.
 */
class H2CommitOnAnswerTest {

    @TempDir
    Path dir;

    private JdbcDataSource fileDatabase(String settings) {
        JdbcDataSource ds = new JdbcDataSource();
        ds.setURL(url(settings));
        ds.setUser("sa");
        return ds;
    }

    private String url(String settings) {
        return "jdbc:h2:file:" + dir.resolve("db") + settings;
    }

    @Test
    void aFileDatabaseWithoutAStatedDelayCommitsAtOnce() throws SQLException {
        JdbcDataSource ds = fileDatabase("");
        try (Connection c = ds.getConnection()) {
            assertThat(H2CommitOnAnswer.currentWriteDelay(c)).as("H2's own default").isEqualTo(500);
            new H2CommitOnAnswer(ds, ds.getURL()).afterPropertiesSet();
            assertThat(H2CommitOnAnswer.currentWriteDelay(c)).isZero();
        }
    }

    @Test
    void theSettingIsReappliedOverAnEarlierStoredDelay() throws SQLException {
        try (Connection c = fileDatabase(";WRITE_DELAY=800").getConnection()) {
            assertThat(H2CommitOnAnswer.currentWriteDelay(c)).isEqualTo(800);
        }
        JdbcDataSource ds = fileDatabase("");
        try (Connection c = ds.getConnection()) {
            new H2CommitOnAnswer(ds, ds.getURL()).afterPropertiesSet();
            assertThat(H2CommitOnAnswer.currentWriteDelay(c)).isZero();
        }
    }

    @Test
    void aDelayStatedInTheUrlIsKeptAsTheUsersChoice() throws SQLException {
        JdbcDataSource ds = fileDatabase(";WRITE_DELAY=500");
        try (Connection c = ds.getConnection()) {
            new H2CommitOnAnswer(ds, ds.getURL()).afterPropertiesSet();
            assertThat(H2CommitOnAnswer.currentWriteDelay(c)).isEqualTo(500);
        }
    }

    @Test
    void inMemoryDatabasesAndOtherDatabasesAreLeftAlone() {
        assertThat(H2CommitOnAnswer.isH2FileDatabase("jdbc:h2:mem:x;DB_CLOSE_DELAY=-1")).isFalse();
        assertThat(H2CommitOnAnswer.isH2FileDatabase("jdbc:postgresql://localhost/sieve")).isFalse();
        assertThat(H2CommitOnAnswer.isH2FileDatabase("jdbc:h2:file:./data/sieve")).isTrue();
        assertThat(H2CommitOnAnswer.isH2FileDatabase("jdbc:h2:./data/sieve")).isTrue();
        assertThat(H2CommitOnAnswer.writeDelayStatedIn("jdbc:h2:file:./d;AUTO_SERVER=FALSE;write_delay=0")).hasValue(0);
        assertThat(H2CommitOnAnswer.writeDelayStatedIn("jdbc:h2:file:./d;AUTO_SERVER=FALSE")).isEmpty();
    }
}
