package org.spectralsieve.importers;

import java.io.Reader;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads a sparse list of (wavelength, value) points read off a published graph, in the delimited layout
 * of {@link DelimitedTextReader} (header names give the kind: {@code %T}, {@code T}, {@code OD}, …):
 *
 * <pre>
 * # axis: log
 * # note: illustrative points read off an invented filter's datasheet graph
 * wavelength_nm,OD
 * 350,4
 * 380,2.5
 * 400,0.1
 * </pre>
 *
 * The points are stored exactly as given (no resampling), with metadata {@code provenance: datasheet}
 * and {@code interpolation: absorbance}. The backend interpolates between datasheet points in
 * absorbance (log T), not in T: a graph's curve between two read-off points on a blocking edge is
 * near-exponential in T, so linear T would overstate transmittance between them by orders of magnitude.
 * {@code # axis: log} (or {@code linear}) records how the graph's value axis was drawn; on a log axis
 * a transmittance of 0 cannot have been read, so such a value is refused.
 */
public final class DatasheetPointsReader {

    private final DelimitedTextReader reader = new DelimitedTextReader();

    public ParsedSpectrum read(String sourceName, String text) throws ImportException {
        return read(sourceName, new StringReader(text), ReadOptions.defaults());
    }

    /** @throws ImportException naming line and field, also for fewer than 2 points or a bad axis value */
    public ParsedSpectrum read(String sourceName, Reader in, ReadOptions options) throws ImportException {
        ParsedSpectrum s = reader.read(sourceName, in, options);
        String axis = s.metadata().getOrDefault("axis", "linear").strip().toLowerCase(Locale.ROOT);
        if (!axis.equals("log") && !axis.equals("linear")) {
            throw new ImportException(sourceName, 0, "axis", "must be 'log' or 'linear', was '" + axis + "'");
        }
        double[] v = s.values();
        if (axis.equals("log") && s.yKind() != YKind.ABSORBANCE) {
            for (int i = 0; i < v.length; i++) {
                if (!(v[i] > 0)) {
                    throw new ImportException(sourceName, 0, "point " + (i + 1), "transmittance " + v[i] + " at "
                            + s.wavelengthsNm()[i] + " nm cannot be read off a log axis (it must be above 0)");
                }
            }
        }
        Map<String, String> metadata = new LinkedHashMap<>(s.metadata());
        List<String> warnings = new ArrayList<>(s.warnings());
        String given = metadata.get("provenance");
        if (given != null && !given.equalsIgnoreCase("datasheet")) {
            warnings.add("metadata provenance '" + given + "' replaced by 'datasheet'");
        }
        metadata.put("provenance", "datasheet");
        metadata.put("axis", axis);
        metadata.put("interpolation", "absorbance");
        return ParsedSpectrum.of(sourceName, s.wavelengthsNm(), v, s.upperBounds(), s.yKind(), s.xUnit(), metadata,
                warnings).withLines(s.lines());
    }
}
