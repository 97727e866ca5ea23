package org.spectralsieve.accounts;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.security.SecureRandom;
import java.util.Base64;
import java.util.HexFormat;

/**
 * API token secrets: 256 random bits, written as {@code sieve_} and 43 base64url characters; stored as their
 * SHA-256. A fast hash suffices here, unlike for passwords: a password is guessable, so its hash must be slow
 * to try guesses against, but a 256-bit random secret cannot be guessed at any speed, and checking a token on
 * every script request must stay cheap (bcrypt costs tens of milliseconds a check, and needs the account first
 * since its salt makes the hash unsearchable).
 */
final class TokenSecrets {

    static final String PREFIX = "sieve_";
    private static final SecureRandom RANDOM = new SecureRandom();

    private TokenSecrets() {
    }

    static String newSecret() {
        byte[] bytes = new byte[32];
        RANDOM.nextBytes(bytes);
        return PREFIX + Base64.getUrlEncoder().withoutPadding().encodeToString(bytes);
    }

    static String hash(String secret) {
        try {
            byte[] digest = MessageDigest.getInstance("SHA-256").digest(secret.getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(digest);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }
}
