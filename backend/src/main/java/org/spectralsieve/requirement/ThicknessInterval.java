package org.spectralsieve.requirement;

/** A closed range of thicknesses in mm, {@code 0 < loMm <= hiMm}, both finite. */
public record ThicknessInterval(double loMm, double hiMm) {

    public ThicknessInterval {
        if (!(loMm > 0) || !Double.isFinite(hiMm) || !(hiMm >= loMm)) {
            throw new IllegalArgumentException("thickness interval must run from a positive thickness up to one not below it, got "
                    + loMm + " to " + hiMm + " mm");
        }
    }

    public boolean contains(double mm) {
        return mm >= loMm && mm <= hiMm;
    }
}
