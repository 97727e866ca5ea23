package org.spectralsieve.accounts;

import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.security.crypto.bcrypt.BCryptPasswordEncoder;
import org.springframework.security.crypto.password.PasswordEncoder;

/**
 * The accounts' store and administration, in every mode: the command line's {@code add-account} needs them
 * without a web server. What guards the web edge is {@link ServerSecurityConfiguration}, in server mode only.
 */
@Configuration(proxyBeanMethods = false)
class AccountsConfiguration {

    /**
     * bcrypt at cost 10 (Spring's default, about 2^10 rounds): an adaptive hash that needs no further library,
     * salted per password, and slow enough per guess against a stolen table; Argon2 would need BouncyCastle.
     */
    @Bean
    PasswordEncoder passwordEncoder() {
        return new BCryptPasswordEncoder();
    }

    @Bean
    AccountStore accountStore(DSLContext db) {
        return new AccountStore(db);
    }

    @Bean
    AccountAdministration accountAdministration(AccountStore store, PasswordEncoder passwords, DSLContext db,
                                                ActingUser actor) {
        return new AccountAdministration(store, passwords, db, actor);
    }
}
