/**
 * Server mode ({@code sieve.server-mode}, on under the postgres profile): accounts, roles, sign-in and API
 * tokens, with Spring Security at the web edge. The embedded tool installs none of it; {@code access} guards it.
 *
 * <ul>
 *   <li>{@link org.spectralsieve.accounts.Role}: viewer &lt; editor &lt; admin, each including the one below.</li>
 *   <li>{@link org.spectralsieve.accounts.EndpointRoles}: the one table of which role each API request needs;
 *       a change it does not name needs admin.</li>
 *   <li>{@link org.spectralsieve.accounts.AccountAdministration}: the only place accounts and tokens change
 *       (create, role, disable, token create and revoke), where an audit trail is to be wired;
 *       {@link org.spectralsieve.accounts.AccountStore} holds the V11 tables, never deleting a row.</li>
 *   <li>{@code ServerSecurityConfiguration}: the token chain (stateless, {@code BearerTokenFilter}) and the
 *       page's chain (session, form sign-in, cookie CSRF token, {@code SignInLimitFilter});
 *       {@code CurrentRoleFilter} reads the role afresh on each request; {@code ApiRefusals} answers 401/403
 *       problems.</li>
 *   <li>{@link org.spectralsieve.accounts.SignInAttempts}: wrong passwords per name and per address in a
 *       window, in memory, with a cap on the keys tracked.</li>
 *   <li>{@code ServerModeGuard}: the postgres profile does not start without server mode.</li>
 * </ul>
 * Passwords: bcrypt. Tokens: SHA-256 of 256 random bits. Details and reasons: docs/accounts-and-roles.md.
 */
package org.spectralsieve.accounts;
