/**
 * The embedded tool is private to its machine: it listens on the loopback interface unless told
 * otherwise ({@link ListeningAddressReport} warns when it is opened), answers only to loopback host
 * names while it listens there ({@link LoopbackHostFilter}, against DNS rebinding), and refuses
 * state-changing requests sent by another site's page ({@link CrossSiteWriteFilter}). Both filters stand
 * at the servlet edge, before any body is read, and answer with an RFC 9457 problem detail
 * ({@link EdgeProblems}). Why Origin and {@code Sec-Fetch-Site} rather than a CSRF token: see
 * docs/privacy-of-the-local-tool.md. A shared library runs in server mode instead, with accounts and a CSRF
 * token for its sessions (package {@code accounts}); these filters stay in place there too.
 */
package org.spectralsieve.access;
