/**
 * The HTTP API (Spring MVC): controllers, the JSON shapes of their answers, and {@link
 * org.spectralsieve.api.ApiProblems}, which turns every refusal into an RFC 9457 problem detail naming the
 * parameter, or the file, line and field, so a user's mistake is a 4xx with a reason and never a 500.
 *
 * <p>An edge package: it may use Spring; the numbers come from the framework-free core. {@link
 * org.spectralsieve.api.RequirementJson} and {@link org.spectralsieve.api.ShortlistJson} are also what the
 * command line prints with {@code --json}. Endpoints: the README's table; detail in
 * {@code docs/requirement-search.md}, {@code docs/weighting.md}, {@code docs/importing.md} and
 * {@code docs/imported-spectra.md}.
 */
package org.spectralsieve.api;
