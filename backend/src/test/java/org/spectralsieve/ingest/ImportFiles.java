package org.spectralsieve.ingest;

import java.util.LinkedHashMap;
import java.util.Map;
import org.spectralsieve.importers.jcamp.JcampWriter;

/**
 * Small illustrative files of every format, invented for tests (an invented workshop's bench readings;
 * no real product). Values are chosen so that the conversions can be checked by hand.
 */
public final class ImportFiles {

    private ImportFiles() {
    }

    /** Percent transmittance: 50 %T is T = 0.5 by the definition of percent (common practice, no source). */
    public static String percentCsv() {
        return """
                # sample: illustrative cast sheet, 3 mm
                # detection_limit: 0.001
                wavelength_nm,transmittance_percent
                350,0.05
                365,12.5
                380,50
                400,88
                450,91
                """;
    }

    /** A curve whose thickness the file gives itself. */
    public static String csvWithThickness(double mm) {
        return "# thickness_mm: " + mm + "\nwavelength_nm,T\n300,0.2\n400,0.6\n500,0.9\n";
    }

    /** JCAMP-DX written by the project's own writer: the reader must restore every value. */
    public static String jcamp() {
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put("TITLE", "illustrative film, invented workshop bench reading");
        meta.put("ORIGIN", "illustrative");
        meta.put("OWNER", "illustrative");
        return JcampWriter.write(meta, new double[] {300, 325, 350, 375, 400}, new double[] {0.0005, 0.02, 0.3, 0.7, 0.9},
                new boolean[] {true, false, false, false, false});
    }

    /** Optical density read off a log-axis graph: OD 2 is T = 10⁻² (A = −log10 T, IUPAC Gold Book A00028). */
    public static String datasheetPoints() {
        return """
                # axis: log
                # note: illustrative points read off an invented filter's datasheet graph
                wavelength_nm,OD
                350,4
                380,2
                400,0.1
                """;
    }

    /**
     * Counts with T = (S − D)/(R − D) (REFERENCE §11, dark and reference correction): at 400 nm
     * (20100 − 100)/(40100 − 100) = 0.5, at 410 nm (10100 − 100)/(40100 − 100) = 0.25.
     */
    public static String rawCounts() {
        return """
                # exposure_ms: 100
                # scans: 10
                wavelength_nm,dark,reference,sample
                380,100,40100,30100
                390,101,40101,26101
                400,100,40100,20100
                410,99,40099,10099
                420,100,40100,4100
                430,101,40101,2101
                440,100,40100,1100
                """;
    }
}
