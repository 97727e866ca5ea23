package org.spectralsieve.library;

import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Locale;
import java.util.OptionalInt;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.sql.DataSource;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.InitializingBean;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * Makes an H2 file database write every commit to its file before the commit returns, so an import the
 * service has answered survives a killed process (see docs/durability.md).
 *
 * <p>Why: H2's MVStore keeps committed changes in memory and writes them to the file from a background
 * thread up to {@code WRITE_DELAY} milliseconds later (500 by default). A process killed in that window
 * loses imports it had already answered with 201, and since the identity counters are lost with them, the
 * next imports are handed the same ids. With {@code WRITE_DELAY} 0 every committing transaction stores the
 * MVStore itself (rows and counters together) before the commit call returns.
 *
 * <p>The default JDBC URL already says {@code WRITE_DELAY=0}; this also covers a URL given through
 * SIEVE_DB_URL or the command line's {@code --db-url}. A URL that names a {@code WRITE_DELAY} itself is an
 * explicit choice and is kept, with a warning when it can lose answered imports. The setting is persistent
 * in the database file, so it is set on every start rather than trusted from an earlier one.
 */
@Component
public class H2CommitOnAnswer implements InitializingBean {

    private static final Logger LOG = LoggerFactory.getLogger(H2CommitOnAnswer.class);
    private static final Pattern WRITE_DELAY_IN_URL = Pattern.compile("(?i);\\s*WRITE_DELAY\\s*=\\s*(-?\\d+)");

    private final DataSource dataSource;
    private final String configuredUrl;

    /**
     * @param configuredUrl the URL as configured (H2's connection metadata drops the settings after ';', so
     *                      whether the user stated a write delay is read from here); null when not known
     */
    H2CommitOnAnswer(DataSource dataSource, @Value("${spring.datasource.url:}") String configuredUrl) {
        this.dataSource = dataSource;
        this.configuredUrl = configuredUrl == null ? "" : configuredUrl;
    }

    @Override
    public void afterPropertiesSet() throws SQLException {
        makeCommitsDurable(dataSource, configuredUrl);
    }

    /** What the bean does at start, for a data source made without Spring (the command line's plain wiring). */
    public static void makeCommitsDurable(DataSource dataSource, String configuredUrl) throws SQLException {
        try (Connection c = dataSource.getConnection()) {
            String url = c.getMetaData().getURL();
            if (!isH2FileDatabase(url)) {
                return; // PostgreSQL syncs its own log at commit; an in-memory H2 has no file to lose
            }
            OptionalInt stated = writeDelayStatedIn(configuredUrl);
            if (stated.isPresent()) {
                if (stated.getAsInt() != 0) {
                    LOG.warn("The database URL sets WRITE_DELAY={}: imports answered in the last {} ms before a crash"
                            + " or kill can be lost and their ids handed out again. Leave WRITE_DELAY out (or set 0)"
                            + " to keep every answered import.", stated.getAsInt(), stated.getAsInt());
                }
                return;
            }
            try (Statement s = c.createStatement()) {
                s.execute("SET WRITE_DELAY 0");
            }
        }
    }

    static boolean isH2FileDatabase(String url) {
        String u = url == null ? "" : url.toLowerCase(Locale.ROOT);
        return u.startsWith("jdbc:h2:") && !u.startsWith("jdbc:h2:mem:");
    }

    static OptionalInt writeDelayStatedIn(String url) {
        Matcher m = WRITE_DELAY_IN_URL.matcher(url);
        return m.find() ? OptionalInt.of(Integer.parseInt(m.group(1))) : OptionalInt.empty();
    }

    /** The database's current write delay in ms, as H2 reports it. */
    static int currentWriteDelay(Connection c) throws SQLException {
        try (Statement s = c.createStatement();
             ResultSet r = s.executeQuery(
                     "SELECT SETTING_VALUE FROM INFORMATION_SCHEMA.SETTINGS WHERE SETTING_NAME = 'WRITE_DELAY'")) {
            if (!r.next()) {
                throw new SQLException("H2 reports no WRITE_DELAY setting");
            }
            return Integer.parseInt(r.getString(1).strip());
        }
    }
}
