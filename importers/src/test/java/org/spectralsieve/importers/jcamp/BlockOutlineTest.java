package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;

/** What the preview lists of a block, and reading one block of several without a left-out warning; made-up files. */
class BlockOutlineTest {

    private static JcampBlock only(String text) throws ImportException {
        return new JcampReader().blocks(Jdx.SOURCE, new StringReader(text)).get(0);
    }

    @Test
    void aWavenumberBlocksRangeIsGivenInNanometresShortestFirst() throws ImportException {
        JcampBlock b = only(Jdx.text("##XUNITS= 1/CM", "##YUNITS= ABSORBANCE", "##XYPOINTS= (XY..XY)",
                "25000, 0.5", "20000, 0.4", "12500, 0.3"));

        BlockOutline o = BlockOutline.of(b);

        // λ = 10⁷/ν̃ nm for ν̃ in cm⁻¹ (definition of the wavenumber): 25000 cm⁻¹ is 400 nm, 12500 cm⁻¹ is 800 nm
        assertThat(o.fromNm()).isCloseTo(400, within(1e-9));
        assertThat(o.toNm()).isCloseTo(800, within(1e-9));
        assertThat(o.points()).isEqualTo(3);
        assertThat(o.number()).isZero();
        assertThat(o.title()).isEqualTo("illustrative curve");
        assertThat(o.xUnits()).isEqualTo("1/CM");
        assertThat(o.yUnits()).isEqualTo("ABSORBANCE");
    }

    @Test
    void anUnknownXUnitLeavesTheRangeUntold() throws ImportException {
        JcampBlock b = only(Jdx.text("##XUNITS= ARBITRARY", "##YUNITS= ABSORBANCE", "##XYPOINTS= (XY..XY)",
                "1, 0.5", "2, 0.4"));

        BlockOutline o = BlockOutline.of(b);

        assertThat(o.hasRange()).isFalse();
        assertThat(o.xUnits()).isEqualTo("ARBITRARY");
    }

    @Test
    void readingOneBlockOfSeveralLeavesOutNoWarningAboutTheOthers() throws ImportException {
        String link = "##TITLE= illustrative series\n##DATA TYPE= LINK\n##BLOCKS= 2\n"
                + Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= ABSORBANCE", "##XYPOINTS= (XY..XY)", "300, 1", "400, 0.5")
                + Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= ABSORBANCE", "##XYPOINTS= (XY..XY)", "300, 2", "400, 1")
                + "##END=\n";
        JcampReader reader = new JcampReader();
        List<JcampBlock> blocks = reader.blocks(Jdx.SOURCE, new StringReader(link));

        ParsedSpectrum second = reader.readOne(Jdx.SOURCE, blocks.get(2), JcampOptions.defaults());
        ParsedSpectrum chosen = reader.read(Jdx.SOURCE, blocks, JcampOptions.defaults().withBlock(2));

        assertThat(second.metadata()).containsEntry("jcamp block", "2");
        assertThat(second.warnings()).noneMatch(w -> w.contains("left out"));
        assertThat(chosen.warnings()).anySatisfy(w -> assertThat(w).contains("Imported block 2 only"));
        // A = 1 at 400 nm is T = 10^-1 (A = -log10 T, IUPAC Gold Book A00028)
        assertThat(second.transmittanceFractions()[1]).isCloseTo(0.1, within(1e-12));
    }
}
