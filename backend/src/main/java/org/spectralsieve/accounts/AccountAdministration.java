package org.spectralsieve.accounts;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.regex.Pattern;
import org.springframework.security.crypto.password.PasswordEncoder;

/**
 * The one place where accounts and tokens change: create an account, change its role, disable it, create and
 * revoke a token. Every change an audit trail must record passes here (and only here), so it is wired once.
 * The command line's {@code add-account} and the admin's API both use it.
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

    public AccountAdministration(AccountStore store, PasswordEncoder passwords) {
        this.store = store;
        this.passwords = passwords;
    }

    public Account createAccount(String name, Role role, String password) {
        checkName(name);
        checkPassword(password);
        if (role == null) {
            throw new AccountRequestException(400, "role", "give a role: " + Role.labels());
        }
        return store.insert(name, role, passwords.encode(password));
    }

    public Account changeRole(long accountId, Role role) {
        Account account = existing(accountId);
        if (role == null) {
            throw new AccountRequestException(400, "role", "give a role: " + Role.labels());
        }
        if (account.role() == Role.ADMIN && role != Role.ADMIN && account.active() && store.countActiveAdmins() <= 1) {
            throw new AccountRequestException(409, "role", "'" + account.name()
                    + "' is the last admin; make another account admin first");
        }
        store.setRole(accountId, role);
        return existing(accountId);
    }

    public Account disable(long accountId) {
        Account account = existing(accountId);
        if (account.role() == Role.ADMIN && account.active() && store.countActiveAdmins() <= 1) {
            throw new AccountRequestException(409, "id", "'" + account.name()
                    + "' is the last admin; make another account admin first");
        }
        store.disable(accountId);
        return existing(accountId);
    }

    /** A new token of {@code owner}: its secret is in the answer and nowhere else. */
    public CreatedToken createToken(Account owner, String label) {
        String text = label == null ? "" : label.strip();
        if (text.isEmpty() || text.length() > MAX_LABEL_CHARS) {
            throw new AccountRequestException(400, "label", "give the token a label of 1 to " + MAX_LABEL_CHARS
                    + " characters saying what uses it");
        }
        String secret = TokenSecrets.newSecret();
        return new CreatedToken(store.insertToken(owner.id(), text, TokenSecrets.hash(secret)), secret);
    }

    public ApiToken revokeToken(Account owner, long tokenId) {
        if (!store.revokeToken(owner.id(), tokenId)) {
            throw new AccountRequestException(404, "id", "you have no token " + tokenId);
        }
        return store.tokens(owner.id()).stream().filter(t -> t.id() == tokenId).findFirst().orElseThrow();
    }

    public List<ApiToken> tokens(Account owner) {
        return store.tokens(owner.id());
    }

    public List<Account> accounts() {
        return store.list();
    }

    private Account existing(long accountId) {
        return store.find(accountId).orElseThrow(() -> new AccountRequestException(404, "id", "no account " + accountId));
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
