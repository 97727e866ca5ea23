package org.spectralsieve.accounts;

import java.time.Instant;

/**
 * An API token as its owner sees it in the list: its label and dates, never the secret (shown once, at creation)
 * and never its hash.
 */
public record ApiToken(long id, String label, Instant createdAt, Instant revokedAt) {
}
