package org.spectralsieve.library;

import java.time.Instant;

/**
 * Something asked for would act on a retired material, sample or spectrum (import into it, correct it); the
 * API answers 409 and says how to restore it. Reading a retired one by id is not refused.
 */
public class RetiredException extends RuntimeException {

    private final String what;
    private final String key;
    private final Instant retiredAt;

    public RetiredException(String what, long id, Instant retiredAt) {
        this(what, String.valueOf(id), retiredAt);
    }

    public RetiredException(String what, String key, Instant retiredAt) {
        super(what + " " + key + " was retired at " + retiredAt + "; restore it first");
        this.what = what;
        this.key = key;
        this.retiredAt = retiredAt;
    }

    public String what() {
        return what;
    }

    public String key() {
        return key;
    }

    public Instant retiredAt() {
        return retiredAt;
    }
}
