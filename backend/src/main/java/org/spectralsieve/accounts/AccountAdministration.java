package org.spectralsieve.accounts;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.regex.Pattern;
import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditEntry;
import org.spectralsieve.audit.AuditTrail;
import org.springframework.security.crypto.password.PasswordEncoder;

/**
 * The one place where accounts and tokens change: create an account, change its role, disable it, create and
 * revoke a token. Each change runs in one transaction with its audit entry (docs/audit.md): who made it, and the
 * account's name, role and state before and after (never a password hash nor a token's secret). The command line's
 * {@code add-account} and the admin's API both use it.
 */
public class AccountAdministration {

    /** Short enough to stay clear of guessing by length, long enough for a passphrase (docs/accounts-and-roles.md). */
    public static final int MIN_PASSWORD_CHARS = 12;
    /** bcrypt reads at most 72 bytes; a longer password would be cut silently, so it is refused instead. */
    public static final int MAX_PASSWORD_BYTES = 72;
    private static final Pattern NAME = Pattern.compile("[A-Za-z0-9][A-Za-z0-9._-]{0,63}");
    private static final int MAX_LABEL_CHARS = 100;

    private final AccountStore store;
    private final PasswordEncoder passwords;
    private final DSLContext db;
    private final ActingUser actor;

    /**
     * @param db    where each change and its audit entry are written, in one transaction
     * @param actor who makes the change (the signed-in user, or the command line's operating-system user)
     */
    public AccountAdministration(AccountStore store, PasswordEncoder passwords, DSLContext db, ActingUser actor) {
        this.store = store;
        this.passwords = passwords;
        this.db = db;
        this.actor = actor;
    }

    public Account createAccount(String name, Role role, String password) {
        checkName(name);
        checkPassword(password);
        if (role == null) {
            throw new AccountRequestException(400, "role", "give a role: " + Role.labels());
        }
        String hash = passwords.encode(password); // slow on purpose: outside the transaction
        return db.transactionResult(cfg -> {
            Account created = store.within(cfg.dsl()).insert(name, role, hash);
            audit(cfg.dsl(), "account-create", created, "account '" + created.name() + "' created as "
                    + created.role().label(), null, AccountValues.of(created));
            return created;
        });
    }

    public Account changeRole(long accountId, Role role) {
        if (role == null) {
            throw new AccountRequestException(400, "role", "give a role: " + Role.labels());
        }
        return db.transactionResult(cfg -> {
            AccountStore tx = store.within(cfg.dsl());
            Account account = existing(tx, accountId);
            if (account.role() == Role.ADMIN && role != Role.ADMIN && account.active() && tx.countActiveAdmins() <= 1) {
                throw new AccountRequestException(409, "role", "'" + account.name()
                        + "' is the last admin; make another account admin first");
            }
            tx.setRole(accountId, role);
            Account changed = existing(tx, accountId);
            audit(cfg.dsl(), "account-role", changed, "account '" + changed.name() + "': role "
                    + account.role().label() + " → " + changed.role().label(), AccountValues.of(account),
                    AccountValues.of(changed));
            return changed;
        });
    }

    public Account disable(long accountId) {
        return db.transactionResult(cfg -> {
            AccountStore tx = store.within(cfg.dsl());
            Account account = existing(tx, accountId);
            if (account.role() == Role.ADMIN && account.active() && tx.countActiveAdmins() <= 1) {
                throw new AccountRequestException(409, "id", "'" + account.name()
                        + "' is the last admin; make another account admin first");
            }
            tx.disable(accountId);
            Account disabled = existing(tx, accountId);
            audit(cfg.dsl(), "account-disable", disabled, "account '" + disabled.name() + "' disabled",
                    AccountValues.of(account), AccountValues.of(disabled));
            return disabled;
        });
    }

    /** A new token of {@code owner}: its secret is in the answer and nowhere else. */
    public CreatedToken createToken(Account owner, String label) {
        String text = label == null ? "" : label.strip();
        if (text.isEmpty() || text.length() > MAX_LABEL_CHARS) {
            throw new AccountRequestException(400, "label", "give the token a label of 1 to " + MAX_LABEL_CHARS
                    + " characters saying what uses it");
        }
        String secret = TokenSecrets.newSecret();
        return db.transactionResult(cfg -> {
            ApiToken token = store.within(cfg.dsl()).insertToken(owner.id(), text, TokenSecrets.hash(secret));
            audit(cfg.dsl(), "token-create", owner, "token " + token.id() + " ('" + token.label() + "') created for '"
                    + owner.name() + "'", null, TokenValues.of(token));
            return new CreatedToken(token, secret);
        });
    }

    public ApiToken revokeToken(Account owner, long tokenId) {
        return db.transactionResult(cfg -> {
            AccountStore tx = store.within(cfg.dsl());
            ApiToken before = tx.tokens(owner.id()).stream().filter(t -> t.id() == tokenId).findFirst().orElse(null);
            if (!tx.revokeToken(owner.id(), tokenId)) {
                throw new AccountRequestException(404, "id", "you have no token " + tokenId);
            }
            ApiToken revoked = tx.tokens(owner.id()).stream().filter(t -> t.id() == tokenId).findFirst().orElseThrow();
            audit(cfg.dsl(), "token-revoke", owner, "token " + tokenId + " ('" + revoked.label() + "') of '"
                    + owner.name() + "' revoked", before == null ? null : TokenValues.of(before), TokenValues.of(revoked));
            return revoked;
        });
    }

    public List<ApiToken> tokens(Account owner) {
        return store.tokens(owner.id());
    }

    public List<Account> accounts() {
        return store.list();
    }

    private static Account existing(AccountStore tx, long accountId) {
        return tx.find(accountId).orElseThrow(() -> new AccountRequestException(404, "id", "no account " + accountId));
    }

    private void audit(DSLContext tx, String action, Account subject, String summary, Object before, Object after) {
        AuditTrail.record(tx, AuditEntry.by(actor, action, AuditEntry.SUBJECT_ACCOUNT, subject.id(), null, summary,
                before, after));
    }

    /** What the audit trail keeps of an account: never its password hash. */
    record AccountValues(String name, String role, String disabledAt) {
        static AccountValues of(Account a) {
            return new AccountValues(a.name(), a.role().label(),
                    a.disabledAt() == null ? null : a.disabledAt().toString());
        }
    }

    /** What the audit trail keeps of a token: never its secret nor its hash. */
    record TokenValues(long tokenId, String label, String revokedAt) {
        static TokenValues of(ApiToken t) {
            return new TokenValues(t.id(), t.label(), t.revokedAt() == null ? null : t.revokedAt().toString());
        }
    }

    static void checkName(String name) {
        if (name == null || !NAME.matcher(name).matches()) {
            throw new AccountRequestException(400, "name", "a name is 1 to 64 letters, digits, '.', '_' or '-',"
                    + " starting with a letter or digit");
        }
    }

    public static void checkPassword(String password) {
        if (password == null || password.codePointCount(0, password.length()) < MIN_PASSWORD_CHARS) {
            throw new AccountRequestException(400, "password", "a password has at least " + MIN_PASSWORD_CHARS
                    + " characters");
        }
        if (password.getBytes(StandardCharsets.UTF_8).length > MAX_PASSWORD_BYTES) {
            throw new AccountRequestException(400, "password", "a password has at most " + MAX_PASSWORD_BYTES
                    + " bytes (bcrypt reads no further)");
        }
    }

    /** @param secret the token itself, shown to its owner once */
    public record CreatedToken(ApiToken token, String secret) {
    }
}
