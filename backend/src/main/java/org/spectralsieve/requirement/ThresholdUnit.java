package org.spectralsieve.requirement;

/** How the user wrote the threshold; kept so that explanations speak the user's language back. */
public enum ThresholdUnit {
    PERCENT, FRACTION, OPTICAL_DENSITY
}
