package org.spectralsieve.ingest;

import static java.nio.charset.StandardCharsets.UTF_8;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;

/** The part of a file's axis a curve keeps: from/to as asked, else the axis without a noise region at its ends. */
class KeepRangeImportTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    /** 300–800 nm every 10 nm (51 points), an invented sheet (illustrative). */
    private static String steppedCsv() {
        StringBuilder csv = new StringBuilder("wavelength_nm,T\n");
        for (int nm = 300; nm <= 800; nm += 10) {
            csv.append(nm).append(',').append(0.5 + (nm - 300) / 2000.0).append('\n');
        }
        return csv.toString();
    }

    private FilePreview read(String text, ImportOptions options) throws ImportException {
        return reader.read("illustrative.csv", text.getBytes(UTF_8), options);
    }

    private static ImportOptions keep(Double from, Double to) {
        return ImportOptions.defaults().withKeepRange(from == null ? OptionalDouble.empty() : OptionalDouble.of(from),
                to == null ? OptionalDouble.empty() : OptionalDouble.of(to));
    }

    @Test
    void fromAndToKeepOnlyThatRangeAndSayHowManyPointsEachSideLeftOut() throws Exception {
        FilePreview p = read(steppedCsv(), keep(350.0, 700.0));

        // 300–340 nm is 5 points below 350; 710–800 nm is 10 points above 700; 36 remain (counted by hand)
        assertThat(p.curve().minWavelengthNm()).isEqualTo(350.0);
        assertThat(p.curve().maxWavelengthNm()).isEqualTo(700.0);
        assertThat(p.pointCount()).isEqualTo(36);
        assertThat(p.keptRange().leftOutBelow()).isEqualTo(5);
        assertThat(p.keptRange().leftOutAbove()).isEqualTo(10);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("from 350 nm", "5 points below it left out",
                "300–340 nm", "original file keeps them"));
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("to 700 nm", "10 points above it left out",
                "710–800 nm"));
    }

    @Test
    void fromBeforeTheFileStartsLeavesNothingOutAndSaysSo() throws Exception {
        FilePreview p = read(steppedCsv(), keep(250.0, null));

        assertThat(p.pointCount()).isEqualTo(51);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("no point left out", "starts at 300 nm"));
    }

    @Test
    void aRangeLeavingFewerThanTwoPointsIsRefusedNamingFrom() {
        assertThatThrownBy(() -> read(steppedCsv(), keep(801.0, 900.0))).isInstanceOf(ImportRequestException.class)
                .satisfies(e -> assertThat(((ImportRequestException) e).field()).isEqualTo("from"))
                .hasMessageContaining("leaves 0 of the file's 51 points").hasMessageContaining("300–800 nm");
    }

    @Test
    void aToBelowTheFileLeavingOnePointIsRefusedNamingTo() {
        assertThatThrownBy(() -> read(steppedCsv(), keep(null, 305.0))).isInstanceOf(ImportRequestException.class)
                .satisfies(e -> assertThat(((ImportRequestException) e).field()).isEqualTo("to"))
                .hasMessageContaining("leaves 1 of");
    }

    @Test
    void fromNotShorterThanToIsRefusedNamingFrom() {
        assertThatThrownBy(() -> OptionText.keepRange(ImportOptions.defaults(), "from", "700", "to", "350"))
                .isInstanceOf(ImportRequestException.class)
                .satisfies(e -> assertThat(((ImportRequestException) e).field()).isEqualTo("from"))
                .hasMessageContaining("shorter than to");
        assertThatThrownBy(() -> OptionText.keepRange(ImportOptions.defaults(), "from", "300", "to", "-5"))
                .isInstanceOf(ImportRequestException.class)
                .satisfies(e -> assertThat(((ImportRequestException) e).field()).isEqualTo("to"));
    }

    @Test
    void aDeepUvNoiseRegionIsLeftOutByDefaultWithItsRangeCountAndTheSuggestedFrom() throws Exception {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 190, 229, 7);

        FilePreview p = read(NoisyCurves.absorbanceCsv(t), ImportOptions.defaults());

        KeptRange k = p.keptRange();
        assertThat(k.noiseRegions()).singleElement().satisfies(r -> assertThat(r.fromNm()).isEqualTo(190.0));
        NoiseRegion r = k.noiseRegions().get(0);
        assertThat(p.curve().minWavelengthNm()).isEqualTo(r.toNm() + 1);
        assertThat(k.leftOutBelow()).isEqualTo(r.points());
        assertThat(p.pointCount() + r.points()).as("every point is either in the curve or counted as left out")
                .isEqualTo(NoisyCurves.wavelengths().length);
        assertThat(k.suggestedFromNm()).hasValue(r.toNm() + 1);
        assertThat(k.suggestedToNm()).hasValue(800.0);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("noise region", "190–", r.points() + " points",
                "left out", "from=190 to keep them"));
        // none of the noise's impossible readings reaches the curve
        assertThat(p.warnings()).noneSatisfy(w -> assertThat(w).contains("readings above 105 %T"));
    }

    @Test
    void anExplicitFromInsideTheNoiseRegionKeepsItsPointsFlagged() throws Exception {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 190, 229, 7);

        FilePreview p = read(NoisyCurves.absorbanceCsv(t), keep(210.0, null));

        NoiseRegion r = p.keptRange().noiseRegions().get(0);
        assertThat(p.curve().minWavelengthNm()).isEqualTo(210.0);
        assertThat(p.keptRange().keptOf(r)).isEqualTo((int) (r.toNm() - 210) + 1);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("kept as asked", "rest on noise",
                "from=" + (int) (r.toNm() + 1) + " leaves the region out"));
    }

    @Test
    void theSuggestedFromLeavesTheRegionOutWithoutTheKeptAsAskedFlag() throws Exception {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 190, 229, 7);
        String csv = NoisyCurves.absorbanceCsv(t);
        double suggested = read(csv, ImportOptions.defaults()).keptRange().suggestedFromNm().orElseThrow();

        FilePreview p = read(csv, keep(suggested, null));

        assertThat(p.curve().minWavelengthNm()).isEqualTo(suggested);
        assertThat(p.warnings()).noneSatisfy(w -> assertThat(w).contains("kept as asked"));
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("noise region", "outside the range asked for"));
    }

    @Test
    void aCleanCurveIsKeptWholeWithNoSuggestion() throws Exception {
        FilePreview p = read(NoisyCurves.absorbanceCsv(NoisyCurves.cleanTransmittance()), ImportOptions.defaults());

        assertThat(p.keptRange().isWhole()).isTrue();
        assertThat(p.keptRange().noiseRegions()).isEmpty();
        assertThat(p.keptRange().suggestedFromNm()).isEmpty();
        assertThat(p.warnings()).noneSatisfy(w -> assertThat(w).contains("noise region"));
    }

    @Test
    void rawCountsKeepTheRangeAskedFor() throws Exception {
        String counts = ImportFiles.rawCounts(); // 380–440 nm every 10 nm
        FilePreview p = read(counts, keep(395.0, 425.0));

        assertThat(p.format()).isEqualTo(ImportFormat.RAW_COUNTS);
        assertThat(p.curve().wavelengthsNm()).containsExactly(400, 410, 420);
        assertThat(p.keptRange().leftOutBelow()).isEqualTo(2);
        assertThat(p.keptRange().leftOutAbove()).isEqualTo(2);
    }
}
