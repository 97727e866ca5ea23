package org.spectralsieve.accounts;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.autoconfigure.condition.ConditionalOnBooleanProperty;
import org.springframework.boot.autoconfigure.condition.ConditionalOnWebApplication;
import org.springframework.boot.context.event.ApplicationReadyEvent;
import org.springframework.context.ApplicationListener;
import org.springframework.stereotype.Component;

/**
 * There is no default account and no default password: a server started with no active admin says in its log
 * how to create the first one from the command line.
 */
@Component
@ConditionalOnBooleanProperty("sieve.server-mode")
@ConditionalOnWebApplication(type = ConditionalOnWebApplication.Type.SERVLET)
class FirstAdminReminder implements ApplicationListener<ApplicationReadyEvent> {

    private static final Logger log = LoggerFactory.getLogger(FirstAdminReminder.class);

    private final AccountStore store;

    FirstAdminReminder(AccountStore store) {
        this.store = store;
    }

    @Override
    public void onApplicationEvent(ApplicationReadyEvent event) {
        if (store.countActiveAdmins() == 0) {
            log.warn("Server mode has no admin account yet, so nobody can sign in to manage accounts. Create the"
                    + " first one with: java -jar backend-*.jar add-account --name NAME --role admin --db-url"
                    + " JDBC-URL (it asks for the password; --password-stdin reads it from standard input)");
        }
    }
}
