package org.spectralsieve.accounts;

import java.security.SecureRandom;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.util.HexFormat;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.conf.RenderQuotedNames;
import org.jooq.conf.Settings;
import org.jooq.impl.DSL;
import org.spectralsieve.audit.ActingUser;
import org.springframework.security.crypto.bcrypt.BCryptPasswordEncoder;

/**
 * An API token of a fresh admin account, made straight in a migrated database, for tests whose services run in server
 * mode in other processes (two nodes, the crash test on PostgreSQL): their clients send it on every request. The
 * account is made through {@link AccountAdministration}, as the command line's {@code add-account} makes one, with
 * a random password nobody needs (the token is what the clients use).
 */
public final class TestTokens {

    private static final SecureRandom RANDOM = new SecureRandom();

    private TestTokens() {
    }

    /** The secret of a new admin's token in the PostgreSQL database (schema) at {@code jdbcUrl}. */
    public static String adminToken(String jdbcUrl, String user, String password) {
        try (Connection connection = DriverManager.getConnection(jdbcUrl, user, password)) {
            // as the application renders names (LibraryConfiguration): the code is generated from H2's upper-case names
            return adminToken(DSL.using(connection, SQLDialect.POSTGRES,
                    new Settings().withRenderQuotedNames(RenderQuotedNames.NEVER)));
        } catch (SQLException e) {
            throw new IllegalStateException("cannot reach " + jdbcUrl + " to make a test token", e);
        }
    }

    static String adminToken(DSLContext db) {
        // cost 4: the lowest bcrypt allows; this password is never used to sign in
        AccountAdministration accounts = new AccountAdministration(new AccountStore(db), new BCryptPasswordEncoder(4),
                db, ActingUser.named("test set-up"));
        byte[] bytes = new byte[12];
        RANDOM.nextBytes(bytes);
        Account admin = accounts.createAccount("fernhollow-admin-" + HexFormat.of().formatHex(bytes, 0, 4), Role.ADMIN,
                HexFormat.of().formatHex(bytes));
        return accounts.createToken(admin, "test clients").secret();
    }
}
