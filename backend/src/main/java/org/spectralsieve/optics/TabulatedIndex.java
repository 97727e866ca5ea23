package org.spectralsieve.optics;

import java.util.List;

/**
 * n(λ) from a table, interpolated linearly between entries.
 *
 * <p>Beyond the first and last entry the end value is held (a clamp, not an extrapolation). Index varies
 * slowly away from absorption bands — a few thousandths over 100 nm — and enters only through surface
 * reflectance, where 0.01 in n moves R by about 0.1 %; a clamp cannot run away the way a linear
 * extrapolation of a steep UV slope can.
 */
public record TabulatedIndex(List<Double> wavelengthsNm, List<Double> n) implements RefractiveIndex {

    public TabulatedIndex {
        wavelengthsNm = List.copyOf(wavelengthsNm);
        n = List.copyOf(n);
        if (wavelengthsNm.isEmpty() || wavelengthsNm.size() != n.size()) {
            throw new IllegalArgumentException("index table needs as many n as wavelengths, at least one; got "
                    + wavelengthsNm.size() + " wavelengths and " + n.size() + " n");
        }
        for (int i = 0; i < n.size(); i++) {
            double nm = wavelengthsNm.get(i);
            PhysicalRanges.requireWavelengthNm("index table wavelength at index " + i, nm);
            if (i > 0 && !(nm > wavelengthsNm.get(i - 1))) {
                throw new IllegalArgumentException("index table wavelength at index " + i + " (" + nm
                        + " nm) is not greater than the previous one (" + wavelengthsNm.get(i - 1) + " nm)");
            }
            PhysicalRanges.requireIndex("index table n at index " + i + " (" + nm + " nm)", n.get(i));
        }
    }

    @Override
    public double at(double wavelengthNm) {
        int last = n.size() - 1;
        if (wavelengthNm <= wavelengthsNm.get(0)) {
            return n.get(0);
        }
        if (wavelengthNm >= wavelengthsNm.get(last)) {
            return n.get(last);
        }
        int upper = 1;
        while (wavelengthsNm.get(upper) < wavelengthNm) {
            upper++;
        }
        double x0 = wavelengthsNm.get(upper - 1);
        double x1 = wavelengthsNm.get(upper);
        double f = (wavelengthNm - x0) / (x1 - x0);
        return n.get(upper - 1) * (1 - f) + n.get(upper) * f;
    }
}
