package org.spectralsieve.requirement;

/** How a band is judged: at every point of it (the worst point decides), or by its mean transmittance. */
public enum Aggregate {
    EVERY_POINT, MEAN
}
