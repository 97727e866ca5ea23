package org.spectralsieve.seedmodel;

import java.util.List;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.SellmeierIndex;
import org.spectralsieve.optics.TabulatedIndex;

/**
 * The refractive-index model of a catalogue material, in the three kinds the catalogue file can hold,
 * each backed by the optics core so that the generator and the application evaluate n identically
 * (Sellmeier is evaluated past its stated validity; a table holds its end values).
 */
public sealed interface IndexSpec {

    RefractiveIndex toRefractiveIndex();

    default double nAt(double nm) {
        return toRefractiveIndex().at(nm);
    }

    record Constant(double n) implements IndexSpec {
        @Override
        public RefractiveIndex toRefractiveIndex() {
            return new ConstantIndex(n);
        }
    }

    /** Sellmeier n² − 1 = Σ Bᵢλ²/(λ² − Cᵢ), λ in µm, Cᵢ in µm² (REFERENCE.md §8). */
    record Sellmeier(SellmeierIndex index) implements IndexSpec {
        @Override
        public RefractiveIndex toRefractiveIndex() {
            return index;
        }
    }

    /** Tabulated n, linear between points, held constant beyond the first and last point. */
    record Table(List<Double> wavelengthsNm, List<Double> n) implements IndexSpec {
        public Table {
            wavelengthsNm = List.copyOf(wavelengthsNm);
            n = List.copyOf(n);
            new TabulatedIndex(wavelengthsNm, n); // validates, quoting the bad index
        }

        @Override
        public RefractiveIndex toRefractiveIndex() {
            return new TabulatedIndex(wavelengthsNm, n);
        }
    }
}
