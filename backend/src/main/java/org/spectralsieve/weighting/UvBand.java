package org.spectralsieve.weighting;

/** The CIE / ISO 21348 ultraviolet bands, nm (reference sheet §10; IUPAC Gold Book "ultraviolet"). */
public enum UvBand {
    UVC(100, 280),
    UVB(280, 315),
    UVA(315, 400);

    private final double fromNm;
    private final double toNm;

    UvBand(double fromNm, double toNm) {
        this.fromNm = fromNm;
        this.toNm = toNm;
    }

    public double fromNm() {
        return fromNm;
    }

    public double toNm() {
        return toNm;
    }
}
