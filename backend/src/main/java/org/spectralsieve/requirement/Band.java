package org.spectralsieve.requirement;

/** A wavelength interval in nm; a single wavelength is a band with {@code fromNm == toNm}. */
public record Band(double fromNm, double toNm) {

    public Band {
        if (!Double.isFinite(fromNm) || !Double.isFinite(toNm) || fromNm <= 0 || toNm < fromNm) {
            throw new IllegalArgumentException("band must run from a positive wavelength up to a wavelength not below it, got "
                    + fromNm + " to " + toNm + " nm");
        }
    }

    public static Band at(double nm) {
        return new Band(nm, nm);
    }

    public boolean isPoint() {
        return fromNm == toNm;
    }
}
