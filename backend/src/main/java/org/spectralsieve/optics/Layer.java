package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;

/** One part of a {@link LightPath}, given by its measured curve. */
public sealed interface Layer permits Layer.Bulk, Layer.Fixed {

    /** Measured curve of the part as it will sit in the path, on {@code grid}. */
    Curve transmittanceOn(WavelengthGrid grid);

    /** Measured curve of the part as it will sit in the path, at increasing wavelengths inside its range. */
    Curve transmittanceAt(double[] wavelengthsNm);

    /** The part's curve as measured (before any change of thickness). */
    Curve measured();

    RefractiveIndex index();

    static Bulk bulk(Curve measured, double measuredThicknessMm, double targetThicknessMm, RefractiveIndex index) {
        return new Bulk(measured, measuredThicknessMm, targetThicknessMm, index);
    }

    static Fixed fixed(Curve measured, RefractiveIndex index) {
        return new Fixed(measured, index);
    }

    /** A sheet or window of absorbing material, measured at one thickness and used at another. */
    record Bulk(Curve measured, double measuredThicknessMm, double targetThicknessMm, RefractiveIndex index)
            implements Layer {

        public Bulk {
            requireNonNull(measured, index);
            BeerLambert.requireThickness("measuredThicknessMm", measuredThicknessMm);
            BeerLambert.requireThickness("targetThicknessMm", targetThicknessMm);
        }

        @Override
        public Curve transmittanceOn(WavelengthGrid grid) {
            // rescale on the measured points, then resample: equal to ThicknessRescaler followed by
            // Curve.resample, so a one-layer path reproduces the rescaler exactly
            return ThicknessRescaler.rescale(measured, measuredThicknessMm, targetThicknessMm, index)
                    .resample(grid);
        }

        @Override
        public Curve transmittanceAt(double[] wavelengthsNm) {
            return ThicknessRescaler.rescale(measured, measuredThicknessMm, targetThicknessMm, index)
                    .resampleAt(wavelengthsNm);
        }
    }

    /**
     * A part used exactly as measured (a coated window, a laminate, a film): its thickness is not changed.
     * Its reflectance is modelled as that of a slab of the given index with the measured T.
     */
    record Fixed(Curve measured, RefractiveIndex index) implements Layer {

        public Fixed {
            requireNonNull(measured, index);
        }

        @Override
        public Curve transmittanceOn(WavelengthGrid grid) {
            return measured.resample(grid);
        }

        @Override
        public Curve transmittanceAt(double[] wavelengthsNm) {
            return measured.resampleAt(wavelengthsNm);
        }
    }

    private static void requireNonNull(Curve measured, RefractiveIndex index) {
        if (measured == null) {
            throw new IllegalArgumentException("layer curve must not be null");
        }
        if (index == null) {
            throw new IllegalArgumentException("layer refractive index must not be null");
        }
    }
}
