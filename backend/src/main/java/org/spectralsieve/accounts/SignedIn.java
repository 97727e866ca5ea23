package org.spectralsieve.accounts;

import java.util.List;
import org.springframework.security.authentication.AbstractAuthenticationToken;
import org.springframework.security.core.authority.SimpleGrantedAuthority;

/**
 * Who a request runs as in server mode, with the role the account holds now (read from the database on every
 * request, so a lowered role or a disabled account takes effect at once, for sessions and tokens alike).
 *
 * @param via {@code session} or {@code token}
 */
public final class SignedIn extends AbstractAuthenticationToken {

    private final Account account;
    private final String via;

    SignedIn(Account account, String via) {
        super(List.of(new SimpleGrantedAuthority(account.role().authority())));
        this.account = account;
        this.via = via;
        setAuthenticated(true);
    }

    public Account account() {
        return account;
    }

    public String via() {
        return via;
    }

    @Override
    public Object getCredentials() {
        return null;
    }

    @Override
    public Object getPrincipal() {
        return account.name();
    }

    @Override
    public String getName() {
        return account.name();
    }
}
