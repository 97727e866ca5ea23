package org.spectralsieve.audit;

import org.jooq.DSLContext;
import org.springframework.boot.autoconfigure.condition.ConditionalOnNotWebApplication;
import org.springframework.boot.autoconfigure.condition.ConditionalOnWebApplication;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/**
 * Who the library's writes are recorded as: the server (a web application) records the request's signed-in user or
 * {@code local}; the command line, which starts the same context without a web server, records
 * {@code command line (<OS user name>)}.
 */
@Configuration
class AuditConfiguration {

    @Bean
    @ConditionalOnWebApplication
    ActingUser requestActingUser() {
        return new RequestActingUser();
    }

    @Bean
    @ConditionalOnNotWebApplication
    ActingUser commandLineActingUser() {
        return ActingUser.commandLine();
    }

    @Bean
    AuditTrail auditTrail(DSLContext db) {
        return new AuditTrail(db);
    }
}
