package org.spectralsieve.accounts;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.Collections;
import java.util.Enumeration;
import java.util.LinkedHashSet;
import java.util.Set;
import org.jooq.DSLContext;
import org.springframework.boot.test.context.TestConfiguration;
import org.springframework.boot.web.servlet.FilterRegistrationBean;
import org.springframework.context.annotation.Bean;
import org.springframework.core.Ordered;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * For the API tests that run a second time on PostgreSQL, where the {@code postgres} profile turns server mode on:
 * every request that carries no {@code Authorization} gets an admin's API token before the security chain reads it,
 * so the same test code runs through the real token check. Those runs check the SQL; which role may do what is
 * {@code ServerModeAccessTest}'s. Import it with {@code @Import(AdminTokenOnEveryRequest.class)}.
 */
@TestConfiguration(proxyBeanMethods = false)
public class AdminTokenOnEveryRequest {

    /** Between the edge filters (loopback host, cross-site writes) and the security chain (HIGHEST + 10). */
    static final int ORDER = Ordered.HIGHEST_PRECEDENCE + 5;

    @Bean
    FilterRegistrationBean<OncePerRequestFilter> adminTokenOnEveryRequest(DSLContext db) {
        FilterRegistrationBean<OncePerRequestFilter> registration = new FilterRegistrationBean<>(new TokenAdding(db));
        registration.setOrder(ORDER);
        return registration;
    }

    private static final class TokenAdding extends OncePerRequestFilter {

        private final DSLContext db;
        private volatile String token;

        TokenAdding(DSLContext db) {
            this.db = db;
        }

        @Override
        protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
                throws ServletException, IOException {
            chain.doFilter(request.getHeader("Authorization") == null ? withToken(request) : request, response);
        }

        private HttpServletRequest withToken(HttpServletRequest request) {
            String bearer = "Bearer " + token();
            return new HttpServletRequestWrapper(request) {
                @Override
                public String getHeader(String name) {
                    return "Authorization".equalsIgnoreCase(name) ? bearer : super.getHeader(name);
                }

                @Override
                public Enumeration<String> getHeaders(String name) {
                    return "Authorization".equalsIgnoreCase(name) ? Collections.enumeration(Set.of(bearer))
                            : super.getHeaders(name);
                }

                @Override
                public Enumeration<String> getHeaderNames() {
                    Set<String> names = new LinkedHashSet<>(Collections.list(super.getHeaderNames()));
                    names.add("Authorization");
                    return Collections.enumeration(names);
                }
            };
        }

        /** Made on the first request, once the schema is migrated. */
        private String token() {
            if (token == null) {
                synchronized (this) {
                    if (token == null) {
                        token = TestTokens.adminToken(db);
                    }
                }
            }
            return token;
        }
    }
}
