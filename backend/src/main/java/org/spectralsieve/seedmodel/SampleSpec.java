package org.spectralsieve.seedmodel;

import java.math.BigDecimal;
import java.util.List;

/**
 * One modelled specimen: its layers (one for bulk stock), geometry, detection floor and grid start.
 *
 * @param layers         the layers in the light path; their thicknesses add up to the sample thickness
 * @param geometry       regular (direct beam) or total (with forward-scattered light)
 * @param lot            an invented lot label
 * @param detectionLimit the modelled instrument floor; values at or below it are written as upper bounds
 * @param startNm        first wavelength of the modelled grid: 190 nm, or 250 nm to mimic a narrower instrument
 */
public record SampleSpec(List<Layer> layers, Geometry geometry, String lot, double detectionLimit, int startNm) {

    /** Last wavelength of every modelled grid, nm. */
    public static final int END_NM = 1100;

    public SampleSpec {
        layers = List.copyOf(layers);
        if (layers.isEmpty()) {
            throw new IllegalArgumentException("a sample needs at least one layer");
        }
        if (!(detectionLimit > 0 && detectionLimit < 0.1)) {
            throw new IllegalArgumentException("detectionLimit must be in (0, 0.1), was " + detectionLimit);
        }
        if (startNm != 190 && startNm != 250) {
            throw new IllegalArgumentException("startNm must be 190 or 250, was " + startNm);
        }
    }

    /** A bulk sheet of one material, {@code thicknessMm} thick, on the full 190–1100 nm grid at floor 0.001. */
    public static SampleSpec bulk(double thicknessMm, Absorption absorption, String lot) {
        return new SampleSpec(List.of(new Layer("sheet", thicknessMm, absorption)), Geometry.REGULAR, lot, 0.001, 190);
    }

    public SampleSpec withGeometry(Geometry newGeometry) {
        return new SampleSpec(layers, newGeometry, lot, detectionLimit, startNm);
    }

    public SampleSpec withDetectionLimit(double newLimit) {
        return new SampleSpec(layers, geometry, lot, newLimit, startNm);
    }

    public SampleSpec withLot(String newLot) {
        return new SampleSpec(layers, geometry, newLot, detectionLimit, startNm);
    }

    public SampleSpec startingAt(int newStartNm) {
        return new SampleSpec(layers, geometry, lot, detectionLimit, newStartNm);
    }

    /** Total thickness, rounded to 0.001 mm so that layer sums like 3 + 0.38 + 3 print as 6.38. */
    public double thicknessMm() {
        BigDecimal sum = BigDecimal.ZERO;
        for (Layer layer : layers) {
            sum = sum.add(BigDecimal.valueOf(layer.thicknessMm()));
        }
        return sum.setScale(3, java.math.RoundingMode.HALF_EVEN).doubleValue();
    }

    /** Thickness as written in file names and metadata: plain decimal, no trailing zeros ("4", "0.125"). */
    public String thicknessLabel() {
        return BigDecimal.valueOf(thicknessMm()).stripTrailingZeros().toPlainString();
    }
}
