package org.spectralsieve.importers.jcamp;

import java.io.StringReader;
import java.util.List;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;

/** Builds small illustrative JCAMP-DX texts: line 1 is ##TITLE, line 2 ##JCAMP-DX, the given lines from 3. */
final class Jdx {

    static final String SOURCE = "made-up.jdx";

    private Jdx() {
    }

    static String text(String... lines) {
        StringBuilder b = new StringBuilder("##TITLE= illustrative curve\n##JCAMP-DX= 4.24\n");
        for (String l : lines) {
            b.append(l).append('\n');
        }
        return b.append("##END=\n").toString();
    }

    /** An XYDATA block on the grid FIRSTX…LASTX with n points, in nm and absorbance. */
    static String xydata(int firstX, int lastX, int n, String... dataLines) {
        String[] all = new String[6 + dataLines.length];
        all[0] = "##XUNITS= NANOMETERS";
        all[1] = "##YUNITS= ABSORBANCE";
        all[2] = "##FIRSTX= " + firstX;
        all[3] = "##LASTX= " + lastX;
        all[4] = "##NPOINTS= " + n;
        all[5] = "##XYDATA= (X++(Y..Y))";
        System.arraycopy(dataLines, 0, all, 6, dataLines.length);
        return text(all);
    }

    static double[] rawY(String text) throws ImportException {
        List<JcampBlock> blocks = new JcampReader().blocks(SOURCE, new StringReader(text));
        return blocks.get(0).rawY();
    }

    static ParsedSpectrum read(String text) throws ImportException {
        return new JcampReader().read(SOURCE, new StringReader(text));
    }

    static ParsedSpectrum read(String text, JcampOptions options) throws ImportException {
        return new JcampReader().read(SOURCE, new StringReader(text), options);
    }
}
