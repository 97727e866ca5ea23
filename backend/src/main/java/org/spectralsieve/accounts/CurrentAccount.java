package org.spectralsieve.accounts;

import org.springframework.security.core.context.SecurityContextHolder;

/** The account a server-mode request runs as; the security chain admits no request to these endpoints without one. */
final class CurrentAccount {

    private CurrentAccount() {
    }

    static Account get() {
        if (SecurityContextHolder.getContext().getAuthentication() instanceof SignedIn signedIn) {
            return signedIn.account();
        }
        throw new AccountRequestException(401, "Authorization", "sign in first");
    }
}
