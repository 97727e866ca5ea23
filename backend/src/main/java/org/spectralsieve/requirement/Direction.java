package org.spectralsieve.requirement;

/** Whether a clause wants light through ("passes": T at least the threshold) or kept out ("blocks": T at most it). */
public enum Direction {
    PASS, BLOCK
}
