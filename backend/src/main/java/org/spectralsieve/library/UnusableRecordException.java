package org.spectralsieve.library;

/**
 * A request needs a stored record whose numbers fail today's checks (stored before they existed, or by
 * another tool), e.g. as the part in front of a stack. Not the asker's mistake: the record must be
 * corrected; the message says which and why.
 */
public final class UnusableRecordException extends RuntimeException {

    public UnusableRecordException(String message) {
        super(message);
    }
}
