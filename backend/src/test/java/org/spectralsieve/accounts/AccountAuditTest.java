package org.spectralsieve.accounts;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.audit.AuditTrail;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.test.context.TestPropertySource;

/**
 * Every account change is in the audit trail (docs/audit.md): who, what, and the account before and after — never a
 * password hash nor a token's secret; a refused change leaves no entry. Without a web server the context records the
 * command line's operating-system user, as {@code add-account} does.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.NONE)
@TestPropertySource(properties = {"spring.datasource.url=jdbc:h2:mem:account-audit-test;DB_CLOSE_DELAY=-1",
        "sieve.seed.load-on-empty=false"})
class AccountAuditTest {

    @Autowired
    AccountAdministration accounts;

    @Autowired
    AuditTrail trail;

    @Test
    void eachAccountChangeIsRecordedWithItsBeforeAndAfterAndNoSecret() {
        Account admin = TestAccounts.create(accounts, "juniper-admin", Role.ADMIN);
        Account wren = TestAccounts.create(accounts, "wren", Role.VIEWER);
        accounts.changeRole(wren.id(), Role.EDITOR);
        AccountAdministration.CreatedToken token = accounts.createToken(wren, "fernhollow plate script");
        accounts.revokeToken(wren, token.token().id());
        accounts.disable(wren.id());

        List<AuditTrail.Stored> entries = new ArrayList<>(trail.page(new AuditTrail.Query(null, 6, null, null)));
        Collections.reverse(entries); // oldest first
        assertThat(entries).extracting(AuditTrail.Stored::action).containsExactly("account-create", "account-create",
                "account-role", "token-create", "token-revoke", "account-disable");
        assertThat(entries).allSatisfy(e -> {
            assertThat(e.subjectKind()).isEqualTo("account");
            assertThat(e.actor()).startsWith("command line (");
        });
        assertThat(entries.get(0).subjectId()).isEqualTo(admin.id());
        AuditTrail.Stored role = entries.get(2);
        assertThat(role.subjectId()).isEqualTo(wren.id());
        assertThat(role.beforeJson()).contains("\"role\":\"viewer\"");
        assertThat(role.afterJson()).contains("\"role\":\"editor\"");
        assertThat(entries.get(4).afterJson()).contains("\"revokedAt\":\"");
        assertThat(entries.get(5).beforeJson()).contains("\"disabledAt\":null");
        assertThat(entries.get(5).afterJson()).doesNotContain("\"disabledAt\":null");
        String everything = entries.toString();
        assertThat(everything).doesNotContain(token.secret()).doesNotContain("$2a$").doesNotContain(TestAccounts.PASSWORD);
    }

    @Test
    void aRefusedAccountChangeLeavesNoEntry() {
        Account hazel = TestAccounts.create(accounts, "hazel", Role.VIEWER);
        long newest = trail.page(new AuditTrail.Query(null, 1, null, null)).get(0).id();
        // refused inside the transaction, after its reads: no such account, another's token
        assertThatThrownBy(() -> accounts.changeRole(Long.MAX_VALUE, Role.VIEWER)).isInstanceOf(AccountRequestException.class);
        assertThatThrownBy(() -> accounts.revokeToken(hazel, Long.MAX_VALUE)).isInstanceOf(AccountRequestException.class);
        // refused before it
        assertThatThrownBy(() -> accounts.createAccount("not a name!", Role.VIEWER, TestAccounts.PASSWORD))
                .isInstanceOf(AccountRequestException.class);
        assertThat(trail.page(new AuditTrail.Query(null, 1, null, null)).get(0).id()).isEqualTo(newest);
    }
}
