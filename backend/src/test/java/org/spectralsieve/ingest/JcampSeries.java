package org.spectralsieve.ingest;

import java.util.List;
import java.util.Locale;

/**
 * Generated multi-block JCAMP-DX files (LINK files, JCAMP-DX 5.01 §4 compound files) for tests: an
 * illustrative exposure series of an invented amber film at the invented Fernhollow Print &amp; Cure
 * Workshop. Values are absorbance (decadic), so that T = 10^−A (IUPAC Gold Book A00028) checks the import
 * by hand: A = 1 is T = 0.1, A = 0.5 is T = 0.316…, A = 0.3 is T = 0.501….
 */
public final class JcampSeries {

    /** One block: a title, the YUNITS word, and x,y pairs in nm. */
    public record Block(String title, String yUnits, double[][] points) {
    }

    private JcampSeries() {
    }

    /** Block 1 'amber film, unexposed' 300–400 nm, block 2 'amber film, 10 min under the 365 nm lamp' 300–500 nm. */
    public static Block unexposed() {
        return new Block("amber film, unexposed", "ABSORBANCE", new double[][] {{300, 1.0}, {350, 0.5}, {400, 0.3}});
    }

    public static Block exposed() {
        return new Block("amber film, 10 min under the 365 nm lamp", "ABSORBANCE",
                new double[][] {{300, 2.0}, {400, 1.0}, {450, 0.5}, {500, 0.3}});
    }

    /** A block whose ordinates are a variance, not a transmittance or absorbance. */
    public static Block variance() {
        return new Block("amber film, variance of the scans", "VARIANCE", new double[][] {{300, 0.01}, {400, 0.02}});
    }

    /** The two-spectrum series: blocks 1 and 2 behind the LINK block 0. */
    public static String twoBlocks() {
        return link(List.of(unexposed(), exposed()));
    }

    /** A LINK file holding {@code blocks} as blocks 1, 2, … (block 0 is the LINK block, without data). */
    public static String link(List<Block> blocks) {
        StringBuilder s = new StringBuilder();
        s.append("##TITLE= illustrative amber film exposure series, Fernhollow Print & Cure Workshop\n")
                .append("##JCAMP-DX= 5.01\n##DATA TYPE= LINK\n##BLOCKS= ").append(blocks.size()).append('\n');
        for (int i = 0; i < blocks.size(); i++) {
            Block b = blocks.get(i);
            s.append("##TITLE= ").append(b.title()).append('\n')
                    .append("##JCAMP-DX= 5.01\n##DATA TYPE= UV/VIS SPECTRUM\n##BLOCK_ID= ").append(i + 1).append('\n')
                    .append("##XUNITS= NANOMETERS\n##YUNITS= ").append(b.yUnits()).append('\n')
                    .append("##XYPOINTS= (XY..XY)\n");
            for (double[] p : b.points()) {
                s.append(String.format(Locale.ROOT, "%s, %s%n", p[0], p[1]));
            }
            s.append("##END=\n");
        }
        return s.append("##END=\n").toString();
    }
}
