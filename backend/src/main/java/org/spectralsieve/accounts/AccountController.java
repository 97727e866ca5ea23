package org.spectralsieve.accounts;

import java.util.List;
import org.springframework.boot.autoconfigure.condition.ConditionalOnBooleanProperty;
import org.springframework.http.HttpStatus;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

/**
 * {@code /api/accounts} (server mode, admin only): list, create with an initial password, change a role,
 * disable. Accounts are never deleted; a disabled one keeps its name and id.
 */
@RestController
@ConditionalOnBooleanProperty("sieve.server-mode")
class AccountController {

    private final AccountAdministration administration;

    AccountController(AccountAdministration administration) {
        this.administration = administration;
    }

    record NewAccount(String name, String role, String password) {
    }

    record RoleChange(String role) {
    }

    @GetMapping("/api/accounts")
    List<Account> list() {
        return administration.accounts();
    }

    @PostMapping("/api/accounts")
    @ResponseStatus(HttpStatus.CREATED)
    Account create(@RequestBody NewAccount request) {
        return administration.createAccount(request.name(), role(request.role()), request.password());
    }

    @PostMapping("/api/accounts/{id}/role")
    Account changeRole(@PathVariable long id, @RequestBody RoleChange request) {
        return administration.changeRole(id, role(request.role()));
    }

    @PostMapping("/api/accounts/{id}/disable")
    Account disable(@PathVariable long id) {
        return administration.disable(id);
    }

    private static Role role(String text) {
        return Role.parse(text).orElseThrow(() -> new AccountRequestException(400, "role",
                "'" + text + "' is not a role: give " + Role.labels()));
    }
}
