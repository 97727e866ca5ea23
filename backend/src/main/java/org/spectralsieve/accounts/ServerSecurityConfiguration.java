package org.spectralsieve.accounts;

import java.time.Clock;
import java.time.Duration;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.boot.autoconfigure.condition.ConditionalOnBooleanProperty;
import org.springframework.boot.autoconfigure.condition.ConditionalOnWebApplication;
import org.springframework.boot.web.servlet.DelegatingFilterProxyRegistrationBean;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.security.access.hierarchicalroles.RoleHierarchy;
import org.springframework.security.access.hierarchicalroles.RoleHierarchyImpl;
import org.springframework.security.authentication.ProviderManager;
import org.springframework.security.authentication.dao.DaoAuthenticationProvider;
import org.springframework.security.config.annotation.web.builders.HttpSecurity;
import org.springframework.security.config.annotation.web.configuration.EnableWebSecurity;
import org.springframework.security.config.annotation.web.configuration.WebSecurityCustomizer;
import org.springframework.security.config.http.SessionCreationPolicy;
import org.springframework.security.core.userdetails.User;
import org.springframework.security.core.userdetails.UserDetailsService;
import org.springframework.security.core.userdetails.UsernameNotFoundException;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.security.web.SecurityFilterChain;
import org.springframework.security.web.access.intercept.AuthorizationFilter;
import org.springframework.security.web.authentication.UsernamePasswordAuthenticationFilter;
import org.springframework.security.web.authentication.www.BasicAuthenticationFilter;
import org.springframework.security.web.csrf.CookieCsrfTokenRepository;
import org.springframework.security.web.csrf.CsrfFilter;
import org.springframework.security.web.firewall.HttpStatusRequestRejectedHandler;

/**
 * Server mode ({@code sieve.server-mode=true}): every request needs a signed-in account, and each API request
 * the role {@link EndpointRoles} names. Two chains: a script's request with a bearer token (stateless, no
 * session, no CSRF), and everything else (the page: a session from the sign-in form, CSRF token from a cookie
 * sent back as a header). In the embedded default none of this exists: Spring Boot's own security set-up is
 * switched off in application.properties, so no filter, password or login page is added there.
 */
@Configuration(proxyBeanMethods = false)
@ConditionalOnBooleanProperty("sieve.server-mode")
@ConditionalOnWebApplication(type = ConditionalOnWebApplication.Type.SERVLET)
@EnableWebSecurity
class ServerSecurityConfiguration {

    /** Pages and files anyone may fetch: the sign-in page and what it needs. */
    private static final String[] OPEN = {ApiRefusals.SIGN_IN_PAGE, "/sign-in.js", "/sign-in.css", "/favicon.svg", "/error"};

    @Bean
    RoleHierarchy roleHierarchy() {
        return RoleHierarchyImpl.withDefaultRolePrefix()
                .role("ADMIN").implies("EDITOR")
                .role("EDITOR").implies("VIEWER")
                .build();
    }

    @Bean
    SignInLimits signInLimits(@Value("${sieve.accounts.sign-in.failures-per-name:5}") int perName,
                              @Value("${sieve.accounts.sign-in.failures-per-address:20}") int perAddress,
                              @Value("${sieve.accounts.sign-in.window-seconds:900}") long windowSeconds,
                              @Value("${sieve.accounts.sign-in.tracked-keys:10000}") int trackedKeys) {
        Duration window = Duration.ofSeconds(windowSeconds);
        return new SignInLimits(new SignInAttempts(perName, window, trackedKeys, Clock.systemUTC()),
                new SignInAttempts(perAddress, window, trackedKeys, Clock.systemUTC()));
    }

    /** Installs Spring Security's chains on the servlet container, right after the access filters. */
    @Bean
    DelegatingFilterProxyRegistrationBean securityFilterChainRegistration() {
        DelegatingFilterProxyRegistrationBean registration =
                new DelegatingFilterProxyRegistrationBean("springSecurityFilterChain");
        registration.setOrder(Ordered.HIGHEST_PRECEDENCE + 10);
        return registration;
    }

    /** A path the firewall refuses (encoded slashes, "..", ";") is the client's mistake: 400, not 500. */
    @Bean
    WebSecurityCustomizer rejectedRequestsAreBadRequests() {
        return web -> web.requestRejectedHandler(new HttpStatusRequestRejectedHandler());
    }

    @Bean
    @Order(1)
    SecurityFilterChain tokenRequests(HttpSecurity http, AccountStore store, RoleHierarchy hierarchy) throws Exception {
        ApiRefusals refusals = new ApiRefusals(true);
        http.securityMatcher(BearerTokenFilter::carriesBearer)
                .csrf(csrf -> csrf.disable())
                .sessionManagement(s -> s.sessionCreationPolicy(SessionCreationPolicy.STATELESS))
                .requestCache(cache -> cache.disable())
                .formLogin(form -> form.disable())
                .httpBasic(basic -> basic.disable())
                .logout(logout -> logout.disable())
                .addFilterBefore(new BearerTokenFilter(store), BasicAuthenticationFilter.class)
                .authorizeHttpRequests(a -> a
                        .requestMatchers("/api/**").access(new RoleAccess(hierarchy))
                        .anyRequest().authenticated())
                .exceptionHandling(e -> e.authenticationEntryPoint(refusals).accessDeniedHandler(refusals));
        return http.build();
    }

    @Bean
    @Order(2)
    SecurityFilterChain pageRequests(HttpSecurity http, AccountStore store, PasswordEncoder passwords,
                                     SignInLimits limits, RoleHierarchy hierarchy) throws Exception {
        ApiRefusals refusals = new ApiRefusals(false);
        SignInResponses signIn = new SignInResponses(limits, store);
        DaoAuthenticationProvider provider = new DaoAuthenticationProvider(userDetails(store));
        provider.setPasswordEncoder(passwords);
        http.authenticationManager(new ProviderManager(provider))
                .csrf(csrf -> csrf.csrfTokenRepository(CookieCsrfTokenRepository.withHttpOnlyFalse())
                        .csrfTokenRequestHandler(new HeaderCsrfToken()))
                .addFilterAfter(new CsrfCookieFilter(), CsrfFilter.class)
                .addFilterBefore(new SignInLimitFilter(limits), UsernamePasswordAuthenticationFilter.class)
                .addFilterBefore(new CurrentRoleFilter(store), AuthorizationFilter.class)
                .formLogin(form -> form.loginPage(ApiRefusals.SIGN_IN_PAGE)
                        .loginProcessingUrl(SignInLimits.SIGN_IN)
                        .successHandler(signIn).failureHandler(signIn).permitAll())
                .httpBasic(basic -> basic.disable())
                .logout(logout -> logout.logoutUrl("/sign-out")
                        .logoutSuccessHandler((request, response, auth) -> response.setStatus(204)))
                .authorizeHttpRequests(a -> a
                        .requestMatchers(OPEN).permitAll()
                        .requestMatchers("/api/**").access(new RoleAccess(hierarchy))
                        .anyRequest().authenticated())
                .exceptionHandling(e -> e.authenticationEntryPoint(refusals).accessDeniedHandler(refusals));
        return http.build();
    }

    private static UserDetailsService userDetails(AccountStore store) {
        return name -> store.credentials(name)
                .map(c -> User.withUsername(c.account().name())
                        .password(c.passwordHash())
                        .authorities(c.account().role().authority())
                        .disabled(!c.account().active())
                        .build())
                .orElseThrow(() -> new UsernameNotFoundException("no such account"));
    }
}
