package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Band;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;

/**
 * The store picks the materials the exact judgement ranks; rows of equal margin are ordered there by
 * confidence, which the store's model does not know, so it must hand over every material tied with its
 * last row rather than choose among them by name (illustrative materials, flat curves).
 */
class StoreTiesTest {

    private static final WavelengthGrid GRID = SpectralStore.DEFAULT_GRID;

    @Test
    void materialsTiedWithTheLastPlaceAllReachTheExactRanking() {
        SpectralStore.Builder b = SpectralStore.builder(GRID, 4);
        b.add(1, new StoredMaterial(1, "alder sheet", "plastic sheet"), 2, true, false, new ConstantIndex(1.5), flat(0.9));
        b.add(2, new StoredMaterial(2, "birch sheet", "plastic sheet"), 2, true, false, new ConstantIndex(1.5), flat(0.9));
        b.add(3, new StoredMaterial(3, "cedar sheet", "plastic sheet"), 2, true, false, new ConstantIndex(1.5), flat(0.9));
        b.add(4, new StoredMaterial(4, "dune sheet", "plastic sheet"), 2, true, false, new ConstantIndex(1.5), flat(0.85));
        Requirement passes = new Requirement(List.of(new TransmittanceClause(Direction.PASS, Aggregate.EVERY_POINT,
                Band.at(365), 0.8, ThresholdUnit.PERCENT, "passes over 80% at 365 nm")),
                ThicknessSpec.AS_MEASURED, Optional.empty(), Optional.empty(), "illustrative");

        StoreResult one = StoreSearch.search(b.build(), passes, 1);

        // three materials read 90 % (margin log10(0.9/0.8)); the one at 85 % ranks below them and stays out
        assertThat(one.hits()).extracting(h -> h.material().name())
                .containsExactlyInAnyOrder("alder sheet", "birch sheet", "cedar sheet");
    }

    private static Curve flat(double t) {
        double[] values = new double[GRID.size()];
        Arrays.fill(values, t);
        return Curve.of(GRID.points(), values, 1e-6);
    }
}
