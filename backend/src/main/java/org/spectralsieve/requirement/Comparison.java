package org.spectralsieve.requirement;

/** Which side of a threshold a figure that is not a transmittance must lie on (a wavelength, for instance). */
public enum Comparison {
    AT_LEAST, AT_MOST
}
