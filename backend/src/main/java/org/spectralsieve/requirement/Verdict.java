package org.spectralsieve.requirement;

/**
 * Meets: the data prove the clause. Misses: the data prove it fails. Unverified: the data cannot tell
 * (the band lies outside the measured range, or the question lies below the detection limit).
 */
public enum Verdict {
    MEETS, UNVERIFIED, MISSES
}
