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
 * {@code /api/tokens} (server mode, any signed-in account, its own tokens only): list, create (the secret is in
 * that answer and never again), revoke.
 */
@RestController
@ConditionalOnBooleanProperty("sieve.server-mode")
class TokenController {

    private final AccountAdministration administration;

    TokenController(AccountAdministration administration) {
        this.administration = administration;
    }

    record NewToken(String label) {
    }

    @GetMapping("/api/tokens")
    List<ApiToken> list() {
        return administration.tokens(CurrentAccount.get());
    }

    @PostMapping("/api/tokens")
    @ResponseStatus(HttpStatus.CREATED)
    AccountAdministration.CreatedToken create(@RequestBody NewToken request) {
        return administration.createToken(CurrentAccount.get(), request.label());
    }

    @PostMapping("/api/tokens/{id}/revoke")
    ApiToken revoke(@PathVariable long id) {
        return administration.revokeToken(CurrentAccount.get(), id);
    }
}
