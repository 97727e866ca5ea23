package org.spectralsieve.accounts;

import static org.spectralsieve.library.db.Tables.ACCOUNT;
import static org.spectralsieve.library.db.Tables.API_TOKEN;

import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Optional;
import org.jooq.DSLContext;
import org.jooq.Record;

/**
 * The {@code account} and {@code api_token} tables (V11), through jOOQ. Nothing is deleted: disabling and
 * revoking set a timestamp. Callers outside this package go through {@link AccountAdministration}, the one place
 * where accounts change.
 */
public class AccountStore {

    private final DSLContext db;

    public AccountStore(DSLContext db) {
        this.db = db;
    }

    /** The same store on a transaction's context: a change and its audit entry commit together. */
    AccountStore within(DSLContext tx) {
        return new AccountStore(tx);
    }

    /** A stored account with the hash its password is checked against. */
    record Credentials(Account account, String passwordHash) {
    }

    /** A live token's owner, as the token stands now (the owner's current role). */
    record TokenOwner(Account account, long tokenId) {
    }

    /** @throws AccountRequestException 409 when the name is taken (also by a disabled account) */
    Account insert(String name, Role role, String passwordHash) {
        if (findByName(name).isPresent()) {
            throw nameTaken(name);
        }
        OffsetDateTime now = now();
        try {
            long id = db.insertInto(ACCOUNT)
                    .set(ACCOUNT.NAME, name)
                    .set(ACCOUNT.ROLE, role.label())
                    .set(ACCOUNT.PASSWORD_HASH, passwordHash)
                    .set(ACCOUNT.CREATED_AT, now)
                    .returningResult(ACCOUNT.ID)
                    .fetchOne().value1();
            return new Account(id, name, role, now.toInstant(), null);
        } catch (RuntimeException e) {
            // another request took the name between the look-up and the insert (the unique constraint refused);
            // jOOQ's or Spring's translation of that refusal, depending on the wiring
            if (findByName(name).isPresent()) {
                throw nameTaken(name);
            }
            throw e;
        }
    }

    private static AccountRequestException nameTaken(String name) {
        return new AccountRequestException(409, "name", "an account named '" + name
                + "' exists already (names are never reused, also after an account is disabled)");
    }

    List<Account> list() {
        return db.selectFrom(ACCOUNT).orderBy(ACCOUNT.ID).fetch(AccountStore::toAccount);
    }

    Optional<Account> find(long id) {
        return db.selectFrom(ACCOUNT).where(ACCOUNT.ID.eq(id)).fetchOptional(AccountStore::toAccount);
    }

    Optional<Account> findByName(String name) {
        return db.selectFrom(ACCOUNT).where(ACCOUNT.NAME.eq(name)).fetchOptional(AccountStore::toAccount);
    }

    Optional<Credentials> credentials(String name) {
        return db.selectFrom(ACCOUNT).where(ACCOUNT.NAME.eq(name))
                .fetchOptional(r -> new Credentials(toAccount(r), r.get(ACCOUNT.PASSWORD_HASH)));
    }

    /** @return false when no account has that id */
    boolean setRole(long id, Role role) {
        return db.update(ACCOUNT).set(ACCOUNT.ROLE, role.label()).set(ACCOUNT.ROLE_CHANGED_AT, now())
                .where(ACCOUNT.ID.eq(id)).execute() == 1;
    }

    /** Sets the disabled time once; a disabled account stays as it was disabled. */
    void disable(long id) {
        db.update(ACCOUNT).set(ACCOUNT.DISABLED_AT, now()).where(ACCOUNT.ID.eq(id)).and(ACCOUNT.DISABLED_AT.isNull())
                .execute();
    }

    int countActiveAdmins() {
        return db.fetchCount(ACCOUNT, ACCOUNT.ROLE.eq(Role.ADMIN.label()).and(ACCOUNT.DISABLED_AT.isNull()));
    }

    int countAccounts() {
        return db.fetchCount(ACCOUNT);
    }

    ApiToken insertToken(long accountId, String label, String tokenHash) {
        OffsetDateTime now = now();
        long id = db.insertInto(API_TOKEN)
                .set(API_TOKEN.ACCOUNT_ID, accountId)
                .set(API_TOKEN.LABEL, label)
                .set(API_TOKEN.TOKEN_HASH, tokenHash)
                .set(API_TOKEN.CREATED_AT, now)
                .returningResult(API_TOKEN.ID)
                .fetchOne().value1();
        return new ApiToken(id, label, now.toInstant(), null);
    }

    List<ApiToken> tokens(long accountId) {
        return db.selectFrom(API_TOKEN).where(API_TOKEN.ACCOUNT_ID.eq(accountId)).orderBy(API_TOKEN.ID)
                .fetch(r -> new ApiToken(r.get(API_TOKEN.ID), r.get(API_TOKEN.LABEL), instant(r.get(API_TOKEN.CREATED_AT)),
                        instant(r.get(API_TOKEN.REVOKED_AT))));
    }

    /** @return false when the owner has no token with that id */
    boolean revokeToken(long accountId, long tokenId) {
        boolean owned = db.fetchExists(API_TOKEN, API_TOKEN.ID.eq(tokenId).and(API_TOKEN.ACCOUNT_ID.eq(accountId)));
        if (owned) {
            db.update(API_TOKEN).set(API_TOKEN.REVOKED_AT, now())
                    .where(API_TOKEN.ID.eq(tokenId)).and(API_TOKEN.REVOKED_AT.isNull()).execute();
        }
        return owned;
    }

    /** The owner of an unrevoked token with this hash, if the owner is not disabled. */
    Optional<TokenOwner> liveTokenOwner(String tokenHash) {
        return db.select(ACCOUNT.fields()).select(API_TOKEN.ID)
                .from(API_TOKEN).join(ACCOUNT).on(ACCOUNT.ID.eq(API_TOKEN.ACCOUNT_ID))
                .where(API_TOKEN.TOKEN_HASH.eq(tokenHash))
                .and(API_TOKEN.REVOKED_AT.isNull())
                .and(ACCOUNT.DISABLED_AT.isNull())
                .fetchOptional(r -> new TokenOwner(toAccount(r), r.get(API_TOKEN.ID)));
    }

    private static Account toAccount(Record r) {
        return new Account(r.get(ACCOUNT.ID), r.get(ACCOUNT.NAME),
                Role.parse(r.get(ACCOUNT.ROLE)).orElseThrow(), instant(r.get(ACCOUNT.CREATED_AT)),
                instant(r.get(ACCOUNT.DISABLED_AT)));
    }

    private static Instant instant(OffsetDateTime t) {
        return t == null ? null : t.toInstant();
    }

    private static OffsetDateTime now() {
        return OffsetDateTime.now(ZoneOffset.UTC).truncatedTo(ChronoUnit.MICROS);
    }
}
